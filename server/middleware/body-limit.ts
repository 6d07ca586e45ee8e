/**
 * A body limit on every API route except the upload route (which streams to disk with its own
 * limit): bodies over 1 MiB are refused with 413 'body-too-large' as soon as the limit is crossed,
 * whether or not Content-Length was sent. The bytes read are handed to h3 as `req.rawBody`, so `readBody` and
 * `readValidatedBody` later read this buffer instead of the request stream.
 */
import type { IncomingMessage } from 'node:http'
import type { H3Event } from 'h3'

/** The largest JSON (or any non-upload) request body read, in bytes. */
export const MAX_JSON_BODY_BYTES = 1024 * 1024

const UPLOAD_ROUTE = /^\/api\/manuscripts\/[^/]+\/revisions\/?$/
const BODY_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

function tooLarge(): never {
  // Nothing more is parsed or kept. Node discards the rest of the body after the answer; closing
  // the socket with unread bytes instead would reset it and the client would lose the 413.
  fail(413, 'body-too-large', 'The request body is larger than 1 MB')
}

/**
 * How much of a refused body is still read and thrown away before the 413, and for how long. A
 * server that closes its socket while request bytes are unread makes the kernel reset the
 * connection, and the client may lose the 413 it was sent (it saw EPIPE instead). Reading a
 * body of a few MiB to its end first avoids that; a larger one is cut off at these bounds.
 */
const DISCARD_AFTER_REFUSAL_BYTES = 4 * 1024 * 1024
const DISCARD_AFTER_REFUSAL_MS = 2000

/** Read and throw away the rest of a refused body, within the bounds above. */
async function discardRest(req: IncomingMessage, alreadySeen: number): Promise<void> {
  const started = Date.now()
  let seen = alreadySeen
  for await (const chunk of req.iterator({ destroyOnReturn: false })) {
    seen += (chunk as Buffer).length
    if (seen > MAX_JSON_BODY_BYTES + DISCARD_AFTER_REFUSAL_BYTES || Date.now() - started > DISCARD_AFTER_REFUSAL_MS) return
  }
}

async function readLimited(event: H3Event): Promise<Buffer> {
  const req = event.node.req
  const chunks: Buffer[] = []
  let seen = 0
  // destroyOnReturn: false, because destroying the request would drop the socket before the 413 is sent.
  for await (const chunk of req.iterator({ destroyOnReturn: false })) {
    seen += (chunk as Buffer).length
    if (seen > MAX_JSON_BODY_BYTES) {
      chunks.length = 0
      await discardRest(req, seen)
      tooLarge()
    }
    chunks.push(chunk as Buffer)
  }
  return Buffer.concat(chunks)
}

export default defineEventHandler(async (event) => {
  if (!BODY_METHODS.has(event.method)) return
  const path = event.path.split('?')[0] ?? ''
  if (!path.startsWith('/api/')) return
  if (event.method === 'POST' && UPLOAD_ROUTE.test(path)) return
  const headers = event.node.req.headers
  const declared = Number(headers['content-length'] ?? '0')
  if (declared > MAX_JSON_BODY_BYTES) {
    await discardRest(event.node.req, 0)
    tooLarge()
  }
  const chunked = /\bchunked\b/i.test(String(headers['transfer-encoding'] ?? ''))
  if (!(declared > 0) && !chunked) return
  const body = await readLimited(event)
  // h3's readRawBody takes `req.rawBody` before the stream, which is already consumed here.
  ;(event.node.req as IncomingMessage & { rawBody?: Buffer }).rawBody = body
})
