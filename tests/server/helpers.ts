/**
 * Helpers for API tests. scripts/test.sh starts the built server against the
 * test cluster, s3rver and the mail fake, and passes their addresses here.
 * Tests talk HTTP to the server and read the database directly to check the
 * rows left behind. Every test makes its own users (unique e-mails), so tests
 * do not depend on each other's data.
 */
import { randomUUID } from 'node:crypto'
import { connectDatabase } from '../../server/database/connect'
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../server/services/demo-people'

function required(name: string): string {
  const value = process.env[name]
  if (!value) throw new Error(`${name} is not set: run the server tests through \`npm test\` (scripts/test.sh)`)
  return value
}

export const baseUrl = required('SCHOLIUM_TEST_BASE_URL')
export const db = connectDatabase(required('NUXT_DATABASE_URL'), 3)
export const inboxUrl = required('NUXT_MAIL_INBOX_URL')

export interface ApiResponse<T = unknown> { status: number, body: T, text: string }

/** An HTTP client with its own cookie jar, i.e. one browser. */
export class Client {
  private cookies = new Map<string, string>()

  async request<T = any>(method: string, path: string, body?: unknown): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') }
    let payload: BodyInit | undefined
    if (body instanceof FormData) payload = body
    else if (body !== undefined) {
      headers['content-type'] = 'application/json'
      payload = JSON.stringify(body)
    }
    const response = await fetch(new URL(path, baseUrl), { method, headers, body: payload, redirect: 'manual' })
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(';')
      const eq = pair!.indexOf('=')
      this.cookies.set(pair!.slice(0, eq), pair!.slice(eq + 1))
    }
    const text = await response.text()
    let parsed: unknown = text
    try {
      parsed = JSON.parse(text)
    }
    catch { /* not JSON: keep the text */ }
    return { status: response.status, body: parsed as T, text }
  }

  /** The Cookie header this client sends, for requests made by hand. */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  }

  /** A second browser holding a copy of this one's cookies (a stolen or copied session). */
  copy(): Client {
    const other = new Client()
    for (const [k, v] of this.cookies) other.cookies.set(k, v)
    return other
  }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.request<T>('POST', path, body) }
  delete<T = any>(path: string) { return this.request<T>('DELETE', path) }
}

/** A new member account, signed in. */
export async function newMember(label = 'member'): Promise<{ client: Client, id: string, email: string, displayName: string }> {
  const client = new Client()
  const email = `${label}-${randomUUID().slice(0, 8)}@tests.scholium.example`
  const displayName = `Test ${label} ${email.slice(label.length + 1, label.length + 5)}`
  const signUp = await client.post('/api/auth/sign-up', { email, displayName, password: 'correct horse battery' })
  if (signUp.status !== 202) throw new Error(`sign-up failed: ${signUp.status} ${signUp.text}`)
  const response = await client.post('/api/auth/sign-in', { email, password: 'correct horse battery' })
  if (response.status !== 200) throw new Error(`sign-in after sign-up failed: ${response.status} ${response.text}`)
  return { client, id: response.body.user.id, email, displayName }
}

/** Signs in as one of the seeded demo people. */
export async function demoClient(person: keyof typeof DEMO_PEOPLE): Promise<Client> {
  const client = new Client()
  const response = await client.post('/api/auth/sign-in', { email: DEMO_PEOPLE[person].email, password: DEMO_PASSWORD })
  if (response.status !== 200) throw new Error(`demo sign-in failed for ${person}: ${response.status} ${response.text}`)
  return client
}

/** A multipart body with the given files, as a browser's upload form sends it. */
export function filesForm(files: { name: string, content: string | Uint8Array }[], note = ''): FormData {
  const form = new FormData()
  for (const file of files) form.append('files', new Blob([typeof file.content === 'string' ? file.content : new Uint8Array(file.content)]), file.name)
  form.append('note', note)
  return form
}

export const SMALL_TEX = '\\documentclass{article}\n\\begin{document}\n$\\mathfrak{S}_{132} = x_1 + x_2$\n\\end{document}\n'

/** Polls `probe` until it returns a value (not undefined), or fails after `timeoutMs` with `what`. */
export async function eventually<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs = 60_000, intervalMs = 100): Promise<T> {
  const started = Date.now()
  for (;;) {
    const value = await probe()
    if (value !== undefined) return value
    if (Date.now() - started > timeoutMs) throw new Error(`${what}: not after ${timeoutMs} ms`)
    await new Promise(resolve => setTimeout(resolve, intervalMs))
  }
}

/** A check run's row once `until` holds (default: it has ended, finished or failed). */
export function waitForRun(checkRunId: string, until: (status: string, claimsDone: number) => boolean = status => status === 'finished' || status === 'failed', timeoutMs = 60_000) {
  return eventually(`run ${checkRunId}`, async () => {
    const run = await db.selectFrom('check_runs').selectAll().where('id', '=', checkRunId).executeTakeFirstOrThrow()
    return until(run.status, run.claims_done) ? run : undefined
  }, timeoutMs)
}

export interface InboxMail { id: string, receivedAt: string, from: string, to: string[], subject: string, text: string, html: string | null }

/** Every message the mail fake holds for `address` (case-insensitive), newest first. */
export async function mailsTo(address: string): Promise<InboxMail[]> {
  const all = await (await fetch(new URL('/messages', inboxUrl))).json() as InboxMail[]
  return all.filter(m => m.to.some(to => to.toLowerCase() === address.toLowerCase()))
}

/** The newest message to `address` whose subject matches, once it has arrived. */
export function waitForMail(address: string, subject: RegExp, timeoutMs = 15_000): Promise<InboxMail> {
  return eventually(`mail to ${address} matching ${subject}`, async () => (await mailsTo(address)).find(m => subject.test(m.subject)), timeoutMs, 150)
}
