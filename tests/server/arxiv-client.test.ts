/**
 * The arXiv e-print client (server/arxiv/client.ts) against the fake endpoint (scripts/fake-arxiv.ts),
 * started here on a free loopback port: every case the client handles, one test each.
 * The expected files are the demo manuscripts the fake builds its bundles from.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { gzipSync } from 'node:zlib'
import { ArxivClient, ArxivError, classify, parseArxivId, retryAfterMs } from '../../server/arxiv/client'
import { readUploadBundle } from '../../server/uploads'
import { startFakeArxiv, type FakeArxiv } from '../../scripts/fake-arxiv'

const DEMO = join(import.meta.dirname, '../../server/assets/demo')
const USER_AGENT = 'Scholium-test/1 (+http://127.0.0.1)'

let fake: FakeArxiv
beforeAll(async () => { fake = await startFakeArxiv() })
afterAll(async () => { await fake.close() })

function client(extra: Partial<ConstructorParameters<typeof ArxivClient>[0]> = {}) {
  const waits: number[] = []
  const c = new ArxivClient({ baseUrl: fake.url, userAgent: USER_AGENT, sleep: async (ms) => { waits.push(ms) }, ...extra })
  return { c, waits }
}

async function requests(): Promise<Record<string, { count: number, userAgent: string }>> {
  return (await fetch(`${fake.url}/requests`)).json() as Promise<Record<string, { count: number, userAgent: string }>>
}

async function failure(promise: Promise<unknown>): Promise<ArxivError> {
  const error = await promise.then(() => null, (e: unknown) => e)
  expect(error).toBeInstanceOf(ArxivError)
  return error as ArxivError
}

describe('identifiers', () => {
  it('reads new-style and old-style identifiers, with or without a version or an arXiv: prefix', () => {
    expect(parseArxivId('2612.00001')).toEqual({ id: '2612.00001' })
    expect(parseArxivId(' arXiv:2612.00001v2 ')).toEqual({ id: '2612.00001', version: 2 })
    expect(parseArxivId('0706.1234')).toEqual({ id: '0706.1234' })
    expect(parseArxivId('math/0613001')).toEqual({ id: 'math/0613001' })
    expect(parseArxivId('math.AG/0613001v3')).toEqual({ id: 'math.AG/0613001', version: 3 })
    expect(parseArxivId('hep-th/0613001')).toEqual({ id: 'hep-th/0613001' })
  })
  it('refuses what is not one', () => {
    for (const bad of ['', '2612', '2612.1', '2612.00001v0', 'math/061300', '../etc/passwd', '2612.00001/../x', 'https://example.org/abs/2612.00001']) {
      expect(parseArxivId(bad)).toBeNull()
    }
  })
  it('reads Retry-After as seconds or as a date', () => {
    expect(retryAfterMs('3', 0)).toBe(3000)
    expect(retryAfterMs('Wed, 02 Dec 2026 10:00:05 GMT', Date.parse('Wed, 02 Dec 2026 10:00:00 GMT'))).toBe(5000)
    expect(retryAfterMs('soon', 0)).toBeNull()
    expect(retryAfterMs(null, 0)).toBeNull()
  })
})

describe('fetching e-prints', () => {
  it('a gzipped tar is handed on whole and unpacks to the demo manuscript', async () => {
    const { c } = client()
    const eprint = await c.fetchEprint('2612.00001v1')
    expect(eprint.kind).toBe('tar.gz')
    expect(eprint.filename).toBe('2612.00001v1.tar.gz')
    const bundle = await readUploadBundle([{ filename: eprint.filename, data: eprint.data }])
    expect(bundle.files.map(f => f.path).sort()).toEqual(['main.tex', 'sections/double.tex'])
    expect(Buffer.from(bundle.files.find(f => f.path === 'main.tex')!.bytes).toString('utf8')).toBe(readFileSync(join(DEMO, 'vexillary-flags/rev1/main.tex'), 'utf8'))
  })

  it('without a version, the newest one', async () => {
    const eprint = await client().c.fetchEprint('2612.00001')
    const bundle = await readUploadBundle([{ filename: eprint.filename, data: eprint.data }])
    expect(Buffer.from(bundle.files.find(f => f.path === 'main.tex')!.bytes).toString('utf8')).toBe(readFileSync(join(DEMO, 'vexillary-flags/rev2/main.tex'), 'utf8'))
  })

  it('a single gzipped .tex is unpacked into one .tex file', async () => {
    const eprint = await client().c.fetchEprint('2612.00002')
    expect(eprint.kind).toBe('tex')
    expect(eprint.filename).toBe('2612.00002.tex')
    expect(eprint.data.toString('utf8')).toBe(readFileSync(join(DEMO, 'bumpless-tilings/rev1/tilings.tex'), 'utf8'))
  })

  it('an old-style identifier is fetched, its slash kept out of the file name', async () => {
    const eprint = await client().c.fetchEprint('math/0613001')
    expect(eprint).toMatchObject({ kind: 'tar.gz', filename: 'math-0613001.tar.gz' })
  })

  it('a PDF-only submission is a clear refusal', async () => {
    const error = await failure(client().c.fetchEprint('2612.00003'))
    expect(error.code).toBe('pdf-only')
    expect(error.message).toContain('only a PDF')
  })

  it('an unknown identifier or version is not found', async () => {
    expect((await failure(client().c.fetchEprint('2612.09999'))).code).toBe('not-found')
    const version = await failure(client().c.fetchEprint('2612.00002v7'))
    expect(version.code).toBe('not-found')
    expect(version.message).toContain('check the version')
  })

  it('a malformed identifier is refused before any request', async () => {
    const before = await requests()
    expect((await failure(client().c.fetchEprint('2612.00001/../../x'))).code).toBe('invalid-id')
    expect(await requests()).toEqual(before)
  })

  it('a rate limit is waited out as long as Retry-After says, then the e-print comes', async () => {
    const { c, waits } = client()
    const eprint = await c.fetchEprint('2612.00004')
    expect(eprint.kind).toBe('tex')
    expect(waits).toEqual([1000])
    expect((await requests())['2612.00004']!.count).toBe(2)
  })

  it('a rate limit longer than the client will wait gives up at once, saying how long to wait', async () => {
    const { c, waits } = client({ maxWaitMs: 5000 })
    const error = await failure(c.fetchEprint('2612.00005'))
    expect(error.code).toBe('rate-limited')
    expect(error.retryAfterSeconds).toBe(3600)
    expect(waits).toEqual([])
    expect((await requests())['2612.00005']!.count).toBe(1)
  })

  it('every request says who is asking', async () => {
    await client().c.fetchEprint('2612.00002v1')
    expect((await requests())['2612.00002v1']!.userAgent).toBe(USER_AGENT)
  })

  it('caches by identifier and version: a versioned e-print is fetched once, the newest again after its time', async () => {
    let now = 1_000_000
    const { c } = client({ now: () => now, latestTtlMs: 60_000 })
    const count = async (path: string) => (await requests())[path]?.count ?? 0
    const versioned = await count('2612.00001v2')
    await c.fetchEprint('2612.00001v2')
    await c.fetchEprint('arXiv:2612.00001v2')
    expect(await count('2612.00001v2')).toBe(versioned + 1)

    const latest = await count('2612.00001')
    await c.fetchEprint('2612.00001')
    now += 30_000
    await c.fetchEprint('2612.00001')
    expect(await count('2612.00001')).toBe(latest + 1)
    now += 60_000
    await c.fetchEprint('2612.00001')
    expect(await count('2612.00001')).toBe(latest + 2)
  })

  it('an endpoint that cannot be reached is a clear error', async () => {
    const gone = new ArxivClient({ baseUrl: 'http://127.0.0.1:9', userAgent: USER_AGENT })
    expect((await failure(gone.fetchEprint('2612.00002'))).code).toBe('unavailable')
  })
})

describe('telling e-prints apart by their bytes', () => {
  it('a gzipped PDF is still PDF-only, an empty answer and a broken gzip are unreadable', () => {
    const id = { id: '2612.00009' }
    expect(() => classify(id, gzipSync(Buffer.from('%PDF-1.5\n')))).toThrow(expect.objectContaining({ code: 'pdf-only' }))
    expect(() => classify(id, Buffer.alloc(0))).toThrow(expect.objectContaining({ code: 'unreadable' }))
    expect(() => classify(id, Buffer.from([0x1f, 0x8b, 8, 0, 1, 2, 3]))).toThrow(expect.objectContaining({ code: 'unreadable' }))
  })
  it('a plain .tex answer is one .tex file', () => {
    expect(classify({ id: '2612.00009', version: 1 }, Buffer.from('\\documentclass{article}'))).toMatchObject({ kind: 'tex', filename: '2612.00009v1.tex' })
  })
})
