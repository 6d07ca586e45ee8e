/**
 * Local stand-ins for S3 and SMTP, for `npm start` and `npm test` only.
 *
 * - s3rver on 127.0.0.1:S3_PORT, buckets under S3_DIR;
 * - an SMTP server on 127.0.0.1:SMTP_PORT that keeps every message it receives
 *   as a JSON file under MAIL_DIR;
 * - a small read-only HTTP inbox on 127.0.0.1:INBOX_PORT (GET /messages,
 *   GET /messages/:id) that the admin mail page and the tests read;
 * - an arXiv-style e-print endpoint on 127.0.0.1:ARXIV_PORT (scripts/fake-arxiv.ts), serving
 *   bundles made from the demo manuscripts under invented identifiers.
 *
 * Pointing Scholium at a real S3, a real SMTP relay and arXiv needs none of this.
 */
import { createServer } from 'node:http'
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import S3rver from 's3rver'
import { SMTPServer } from 'smtp-server'
import { simpleParser, type AddressObject } from 'mailparser'
import type { InboxMessage } from '../shared/types/api'
import { startFakeArxiv } from './fake-arxiv'

const env = (name: string, fallback: string) => process.env[name] ?? fallback
const S3_PORT = Number(env('S3_PORT', '4569'))
const S3_DIR = env('S3_DIR', 'storage/demo/s3')
const S3_BUCKET = env('S3_BUCKET', 'scholium-sources')
const SMTP_PORT = Number(env('SMTP_PORT', '2525'))
const MAIL_DIR = env('MAIL_DIR', 'storage/demo/mail')
const INBOX_PORT = Number(env('INBOX_PORT', '2526'))
const ARXIV_PORT = Number(env('ARXIV_PORT', '2527'))
const HOST = '127.0.0.1'

/** What the inbox serves: the shape the admin page reads, plus the HTML part. */
export interface StoredMail extends InboxMessage {
  html: string | null
}

function addressList(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return []
  const list = Array.isArray(value) ? value : [value]
  return list.flatMap(group => group.value.map(a => a.address ?? '')).filter(Boolean)
}

function listMail(): StoredMail[] {
  return readdirSync(MAIL_DIR)
    .filter(name => name.endsWith('.json'))
    .map(name => JSON.parse(readFileSync(join(MAIL_DIR, name), 'utf8')) as StoredMail)
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))
}

async function main() {
  mkdirSync(S3_DIR, { recursive: true })
  mkdirSync(MAIL_DIR, { recursive: true })

  const s3 = new S3rver({
    address: HOST,
    port: S3_PORT,
    directory: S3_DIR,
    silent: true,
    configureBuckets: [{ name: S3_BUCKET }],
  })
  await s3.run()

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Scholium local mail fake',
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const mail: StoredMail = {
            id: `${Date.now().toString(36)}-${randomUUID().slice(0, 8)}`,
            receivedAt: new Date().toISOString(),
            from: addressList(parsed.from)[0] ?? '',
            to: addressList(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          }
          writeFileSync(join(MAIL_DIR, `${mail.id}.json`), JSON.stringify(mail, null, 2))
          callback()
        })
        .catch((error: Error) => callback(error))
    },
  })
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject)
    smtp.listen(SMTP_PORT, HOST, () => resolve())
  })

  const inbox = createServer((req, res) => {
    const url = new URL(req.url ?? '/', `http://${HOST}`)
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { 'content-type': 'application/json' })
      res.end(JSON.stringify(body))
    }
    if (req.method !== 'GET') return send(405, { error: 'read-only' })
    if (url.pathname === '/messages') return send(200, listMail())
    const match = /^\/messages\/([\w-]+)$/.exec(url.pathname)
    if (match) {
      const found = listMail().find(m => m.id === match[1])
      return found ? send(200, found) : send(404, { error: 'not-found' })
    }
    send(404, { error: 'not-found' })
  })
  // Before the inbox: callers wait for the inbox's port, so everything is up once it answers.
  const arxiv = await startFakeArxiv(ARXIV_PORT)
  await new Promise<void>(resolve => inbox.listen(INBOX_PORT, HOST, () => resolve()))

  console.log(`fakes ready: s3 http://${HOST}:${S3_PORT} (bucket ${S3_BUCKET}), smtp ${HOST}:${SMTP_PORT}, inbox http://${HOST}:${INBOX_PORT}/messages, arXiv e-prints ${arxiv.url}/e-print/`)

  const stop = async () => {
    inbox.close()
    await arxiv.close()
    smtp.close(() => {})
    await s3.close()
    process.exit(0)
  }
  process.on('SIGINT', stop)
  process.on('SIGTERM', stop)
}

main().catch((error) => {
  console.error('fakes failed to start:', error)
  process.exit(1)
})
