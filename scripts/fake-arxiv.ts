/**
 * A stand-in for arXiv's e-print endpoint, on loopback, for `npm start` and `npm test` only
 * (started by scripts/fakes.ts; tests of the client start their own with `startFakeArxiv`).
 * Its identifiers are invented; the bundles are made from the demo manuscripts (server/assets/demo/):
 *
 *   2612.00001v1, v2     vexillary-flags rev1 / rev2 as a gzipped tar (no version: v2, the newest)
 *   2612.00002           bumpless-tilings as one gzipped .tex file
 *   2612.00003           a PDF-only submission
 *   2612.00004           rate-limited: every other request is 503 with Retry-After: 1
 *   2612.00005           always 429 with Retry-After: 3600
 *   math/0613001         an old-style identifier: bumpless-tilings as a gzipped tar
 *
 * GET /requests answers how many times each path was asked for and the last User-Agent, so tests
 * can see the client's cache and manners. Everything else is 404.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http'
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { gzipSync } from 'node:zlib'
import tarStream from 'tar-stream'

const DEMO = join(import.meta.dirname, '../server/assets/demo')

function filesUnder(dir: string): { path: string, data: Buffer }[] {
  const out: { path: string, data: Buffer }[] = []
  const walk = (d: string) => {
    for (const name of readdirSync(d).sort()) {
      const full = join(d, name)
      if (statSync(full).isDirectory()) walk(full)
      else out.push({ path: relative(dir, full).split('\\').join('/'), data: readFileSync(full) })
    }
  }
  walk(dir)
  return out
}

async function tarGz(dir: string): Promise<Buffer> {
  const pack = tarStream.pack()
  const chunks: Buffer[] = []
  pack.on('data', (c: unknown) => { chunks.push(c as Buffer) })
  const done = new Promise<void>(resolve => pack.on('end', () => resolve()))
  for (const f of filesUnder(dir)) pack.entry({ name: f.path, size: f.data.length, mode: 0o644, mtime: new Date(Date.UTC(2026, 11, 1)) }, f.data)
  pack.finalize()
  await done
  return gzipSync(Buffer.concat(chunks))
}

/** A tiny, valid-looking PDF with no source behind it. */
const PDF = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n', 'latin1')

export interface FakeArxiv {
  server: Server
  url: string
  close: () => Promise<void>
}

/** The bundles, by identifier with version; `latest` maps an identifier to its newest version. */
async function bundles(): Promise<{ byVersion: Map<string, Buffer>, latest: Map<string, string> }> {
  const vexillary1 = await tarGz(join(DEMO, 'vexillary-flags/rev1'))
  const vexillary2 = await tarGz(join(DEMO, 'vexillary-flags/rev2'))
  const bumplessTex = gzipSync(readFileSync(join(DEMO, 'bumpless-tilings/rev1/tilings.tex')))
  const bumplessTar = await tarGz(join(DEMO, 'bumpless-tilings/rev1'))
  const byVersion = new Map<string, Buffer>([
    ['2612.00001v1', vexillary1],
    ['2612.00001v2', vexillary2],
    ['2612.00002v1', bumplessTex],
    ['2612.00003v1', PDF],
    ['2612.00004v1', bumplessTex],
    ['math/0613001v1', bumplessTar],
  ])
  const latest = new Map<string, string>([
    ['2612.00001', '2612.00001v2'], ['2612.00002', '2612.00002v1'], ['2612.00003', '2612.00003v1'],
    ['2612.00004', '2612.00004v1'], ['math/0613001', 'math/0613001v1'],
  ])
  return { byVersion, latest }
}

export async function fakeArxivHandler(): Promise<(req: IncomingMessage, res: ServerResponse) => void> {
  const { byVersion, latest } = await bundles()
  const requests = new Map<string, { count: number, userAgent: string }>()
  return (req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1')
    if (req.method !== 'GET') {
      res.writeHead(405).end()
      return
    }
    if (url.pathname === '/requests') {
      res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(Object.fromEntries(requests)))
      return
    }
    const m = /^\/e-print\/(.+)$/.exec(url.pathname)
    if (!m) {
      res.writeHead(404).end()
      return
    }
    const asked = decodeURIComponent(m[1]!)
    const seen = requests.get(asked) ?? { count: 0, userAgent: '' }
    seen.count++
    seen.userAgent = String(req.headers['user-agent'] ?? '')
    requests.set(asked, seen)
    const unversioned = asked.replace(/v\d+$/, '')
    if (unversioned === '2612.00005') {
      res.writeHead(429, { 'retry-after': '3600' }).end('slow down')
      return
    }
    if (unversioned === '2612.00004' && seen.count % 2 === 1) {
      res.writeHead(503, { 'retry-after': '1' }).end('busy')
      return
    }
    const body = byVersion.get(latest.get(asked) ?? asked)
    if (!body) {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('no such e-print')
      return
    }
    const type = body === PDF ? 'application/pdf' : 'application/x-eprint-tar'
    res.writeHead(200, { 'content-type': type, 'content-length': body.length }).end(body)
  }
}

/** Starts the fake on 127.0.0.1:`port` (0: any free port). */
export async function startFakeArxiv(port = 0): Promise<FakeArxiv> {
  const handler = await fakeArxivHandler()
  const server = createServer(handler)
  await new Promise<void>(resolve => server.listen(port, '127.0.0.1', () => resolve()))
  const address = server.address()
  const actual = typeof address === 'object' && address ? address.port : port
  return {
    server,
    url: `http://127.0.0.1:${actual}`,
    close: () => new Promise<void>(resolve => server.close(() => resolve())),
  }
}
