/**
 * A small client for an arXiv-style e-print endpoint (`GET <base>/e-print/<id>[vN]`), shared by the
 * web server and the command line (plain imports, no Nitro auto-imports).
 *
 * What comes back is decided from the bytes, not the content type:
 * - a gzipped tar: handed on as `<id>.tar.gz`, for the upload reader to unpack with its limits;
 * - a single gzipped .tex: unpacked here (with the upload reader's per-file limit) into `<id>.tex`;
 * - a plain tar or plain LaTeX: handed on as they are;
 * - a PDF: the submission has no source, a clear `pdf-only` error.
 * 404 is `not-found`. 429 and 503 are rate limits: the client waits as long as Retry-After says (or
 * 1 s, 2 s, 4 s when it says nothing), at most `maxWaitMs` per wait and `maxAttempts` in all, then
 * gives up with `rate-limited` and the wait the server asked for. Every request carries a User-Agent
 * that names Scholium and where to reach its operator.
 * Answers are cached by identifier and version: a versioned e-print never changes; the newest
 * version (no version asked for) is kept for `latestTtlMs`.
 */
import { constants, gunzipSync } from 'node:zlib'
import { UPLOAD_LIMITS, MAX_UPLOAD_REQUEST_BYTES } from '../uploads'

export type ArxivErrorCode = 'invalid-id' | 'not-found' | 'pdf-only' | 'rate-limited' | 'unavailable' | 'unreadable' | 'too-large'

/** A failure to fetch an e-print; `message` is for people and never contains the server's text. */
export class ArxivError extends Error {
  override readonly name = 'ArxivError'
  constructor(readonly code: ArxivErrorCode, message: string, readonly retryAfterSeconds?: number) {
    super(message)
  }
}

/** An identifier as arXiv writes it: `2401.01234`, `2401.01234v2`, `math/0601001`, `math.AG/0601001v1`. */
export interface ArxivId {
  /** Without version, e.g. `2401.01234` or `math/0601001`. */
  id: string
  version?: number
}

/** Reads an identifier with or without `arXiv:` in front and with or without a version; null if it is not one. */
export function parseArxivId(text: string): ArxivId | null {
  const s = text.trim().replace(/^arxiv:\s*/i, '')
  const m = /^(\d{4}\.\d{4,5}|[a-z]+(?:-[a-z]+)*(?:\.[A-Z]{2})?\/\d{7})(?:v(\d{1,3}))?$/.exec(s)
  if (!m) return null
  const version = m[2] === undefined ? undefined : Number(m[2])
  if (version === 0) return null
  return version === undefined ? { id: m[1]! } : { id: m[1]!, version }
}

export function formatArxivId(id: ArxivId): string {
  return `${id.id}${id.version !== undefined ? `v${id.version}` : ''}`
}

/** What the upload module receives: one file, named by its kind. */
export interface Eprint {
  id: ArxivId
  /** `<id>.tar.gz`, `<id>.tar` or `<id>.tex`, with `/` in old-style ids replaced by `-`. */
  filename: string
  data: Buffer
  kind: 'tar.gz' | 'tar' | 'tex'
}

export interface ArxivClientOptions {
  /** e.g. `https://arxiv.org` or the fake on loopback; `/e-print/<id>` is appended. */
  baseUrl: string
  /** Who is asking, with a way to reach them (arXiv asks automated clients to say so). */
  userAgent: string
  maxAttempts?: number
  /** The longest single wait the client accepts; a longer Retry-After gives up at once. */
  maxWaitMs?: number
  /** How long the newest version of an unversioned identifier is kept. */
  latestTtlMs?: number
  /** How long one request may take. */
  timeoutMs?: number
  /** Tests replace the clock's waits. */
  sleep?: (ms: number) => Promise<void>
  now?: () => number
}

interface CacheEntry { eprint: Eprint, storedAt: number }

/** Most bytes kept in the cache; the oldest entries go first. */
const CACHE_BYTES = 200 * 1024 * 1024

export class ArxivClient {
  private readonly cache = new Map<string, CacheEntry>()
  private cachedBytes = 0
  private readonly options: Required<ArxivClientOptions>

  constructor(options: ArxivClientOptions) {
    this.options = {
      maxAttempts: 4,
      maxWaitMs: 10_000,
      latestTtlMs: 10 * 60_000,
      timeoutMs: 60_000,
      sleep: ms => new Promise(resolve => setTimeout(resolve, ms)),
      now: () => Date.now(),
      ...options,
      baseUrl: options.baseUrl.replace(/\/+$/, ''),
    }
  }

  /** Fetches the e-print of `text` (an identifier); throws ArxivError. */
  async fetchEprint(text: string): Promise<Eprint> {
    const id = parseArxivId(text)
    if (!id) throw new ArxivError('invalid-id', 'That is not an arXiv identifier; write it like 2401.01234, 2401.01234v2 or math/0601001')
    const key = formatArxivId(id)
    const cached = this.cache.get(key)
    if (cached && (id.version !== undefined || this.options.now() - cached.storedAt < this.options.latestTtlMs)) {
      // Refresh its place: the cache drops the least recently used first.
      this.cache.delete(key)
      this.cache.set(key, cached)
      return cached.eprint
    }
    const eprint = classify(id, await this.download(id))
    this.remember(key, eprint)
    return eprint
  }

  private remember(key: string, eprint: Eprint): void {
    const old = this.cache.get(key)
    if (old) this.cachedBytes -= old.eprint.data.length
    this.cache.set(key, { eprint, storedAt: this.options.now() })
    this.cachedBytes += eprint.data.length
    for (const [k, entry] of this.cache) {
      if (this.cachedBytes <= CACHE_BYTES) break
      this.cache.delete(k)
      this.cachedBytes -= entry.eprint.data.length
    }
  }

  private async download(id: ArxivId): Promise<Buffer> {
    const url = `${this.options.baseUrl}/e-print/${formatArxivId(id)}`
    let lastWait: number | undefined
    for (let attempt = 1; attempt <= this.options.maxAttempts; attempt++) {
      let response: Response
      try {
        response = await fetch(url, {
          headers: { 'user-agent': this.options.userAgent, 'accept': '*/*' },
          redirect: 'follow',
          signal: AbortSignal.timeout(this.options.timeoutMs),
        })
      }
      catch {
        throw new ArxivError('unavailable', 'The arXiv e-print service could not be reached; try again later')
      }
      if (response.status === 404 || response.status === 410) {
        await response.body?.cancel()
        throw new ArxivError('not-found', `arXiv has no e-print ${formatArxivId(id)}${id.version !== undefined ? ' (check the version)' : ''}`)
      }
      if (response.status === 429 || response.status === 503) {
        await response.body?.cancel()
        const wait = retryAfterMs(response.headers.get('retry-after'), this.options.now()) ?? 1000 * 2 ** (attempt - 1)
        lastWait = wait
        if (wait > this.options.maxWaitMs || attempt === this.options.maxAttempts) break
        await this.options.sleep(wait)
        continue
      }
      if (!response.ok) {
        await response.body?.cancel()
        throw new ArxivError('unavailable', `The arXiv e-print service answered ${response.status}; try again later`)
      }
      return readCapped(response, MAX_UPLOAD_REQUEST_BYTES)
    }
    const seconds = lastWait === undefined ? undefined : Math.ceil(lastWait / 1000)
    throw new ArxivError('rate-limited', `arXiv asks us to slow down${seconds !== undefined ? `; try again in ${seconds} s` : ''}`, seconds)
  }
}

/** Retry-After as milliseconds from now: delta-seconds or an HTTP date; null when absent or unreadable. */
export function retryAfterMs(header: string | null, now: number): number | null {
  if (header === null) return null
  const trimmed = header.trim()
  if (/^\d+$/.test(trimmed)) return Number(trimmed) * 1000
  const at = Date.parse(trimmed)
  return Number.isNaN(at) ? null : Math.max(0, at - now)
}

async function readCapped(response: Response, limit: number): Promise<Buffer> {
  const declared = Number(response.headers.get('content-length') ?? NaN)
  if (declared > limit) {
    await response.body?.cancel()
    throw new ArxivError('too-large', `The e-print is larger than ${Math.round(limit / 1024 / 1024)} MB`)
  }
  const chunks: Buffer[] = []
  let total = 0
  if (!response.body) return Buffer.alloc(0)
  const reader = response.body.getReader()
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    total += value.length
    if (total > limit) {
      await reader.cancel()
      throw new ArxivError('too-large', `The e-print is larger than ${Math.round(limit / 1024 / 1024)} MB`)
    }
    chunks.push(Buffer.from(value))
  }
  return Buffer.concat(chunks)
}

const isGzip = (b: Buffer) => b.length >= 2 && b[0] === 0x1f && b[1] === 0x8b
const isPdf = (b: Buffer) => b.subarray(0, 5).toString('latin1') === '%PDF-'
const isTar = (b: Buffer) => b.length >= 262 && b.subarray(257, 262).toString('latin1') === 'ustar'

/** Decides from the bytes what the e-print is; see the module comment. */
export function classify(id: ArxivId, body: Buffer): Eprint {
  const base = formatArxivId(id).replace(/\//g, '-')
  if (body.length === 0) throw new ArxivError('unreadable', 'The e-print is empty')
  if (isPdf(body)) throw new ArxivError('pdf-only', `arXiv has only a PDF for ${formatArxivId(id)}: the authors did not submit LaTeX source, so there is nothing to check`)
  if (isGzip(body)) {
    let inner: Buffer
    try {
      // Only the head is needed to tell a tar from a single file; the whole of a single file is bounded by the per-file limit.
      inner = gunzipSync(body, { maxOutputLength: UPLOAD_LIMITS.maxFileBytes + 1 })
    }
    catch (error) {
      const code = (error as NodeJS.ErrnoException).code
      if (code === 'ERR_BUFFER_TOO_LARGE' || (error as Error).message?.includes('maxOutputLength')) {
        // Too large to be one .tex file: if it is a tar, the upload reader unpacks it with its own limits.
        const head = gunzipHead(body)
        if (head && isTar(head)) return { id, filename: `${base}.tar.gz`, data: body, kind: 'tar.gz' }
        throw new ArxivError('too-large', 'The e-print unpacks to a single file larger than the per-file limit')
      }
      throw new ArxivError('unreadable', 'The e-print is not a readable gzip file')
    }
    if (isTar(inner)) return { id, filename: `${base}.tar.gz`, data: body, kind: 'tar.gz' }
    if (isPdf(inner)) throw new ArxivError('pdf-only', `arXiv has only a PDF for ${formatArxivId(id)}: the authors did not submit LaTeX source, so there is nothing to check`)
    return { id, filename: `${base}.tex`, data: inner, kind: 'tex' }
  }
  if (isTar(body)) return { id, filename: `${base}.tar`, data: body, kind: 'tar' }
  return { id, filename: `${base}.tex`, data: body, kind: 'tex' }
}

/** The first bytes of a gzip stream, from its first 4 KiB (at most about 4 MB unpacked). */
function gunzipHead(body: Buffer): Buffer | null {
  try {
    return gunzipSync(body.subarray(0, 4096), { finishFlush: constants.Z_SYNC_FLUSH })
  }
  catch {
    return null
  }
}
