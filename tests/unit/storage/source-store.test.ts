import { createHash } from 'node:crypto'
import { createServer, type IncomingHttpHeaders } from 'node:http'
import type { AddressInfo } from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSourceStore } from '../../../server/storage/source-store'

// A stand-in S3 endpoint on loopback that records each request: HEAD says "not found", PUT says OK.
const seen: { method: string, url: string, headers: IncomingHttpHeaders, body: Buffer }[] = []
const server = createServer((req, res) => {
  const chunks: Buffer[] = []
  req.on('data', (chunk: Buffer) => chunks.push(chunk))
  req.on('end', () => {
    seen.push({ method: req.method!, url: req.url!, headers: req.headers, body: Buffer.concat(chunks) })
    res.statusCode = req.method === 'HEAD' ? 404 : 200
    res.end()
  })
})
let endpoint = ''
beforeAll(async () => {
  await new Promise<void>(resolve => server.listen(0, '127.0.0.1', resolve))
  endpoint = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
})
afterAll(() => new Promise<void>(resolve => server.close(() => resolve())))

describe('source store put (issue 11: no whole-body hashing on the main thread)', () => {
  it('sends the known SHA-256 as the checksum and as the signed payload hash, and the bytes unchanged', async () => {
    const store = createSourceStore({ endpoint, region: 'us-east-1', bucket: 'b', accessKeyId: 'k', secretAccessKey: 's', forcePathStyle: true })
    const bytes = Buffer.from('\\documentclass{article}\n% a file stored under its own hash\n'.repeat(2000))
    const sha256 = createHash('sha256').update(bytes).digest('hex')
    expect(await store.put(bytes, sha256)).toEqual({ key: `sources/sha256/${sha256.slice(0, 2)}/${sha256}`, created: true })
    const put = seen.find(r => r.method === 'PUT')!
    expect(put.url.split('?')[0]).toBe(`/b/sources/sha256/${sha256.slice(0, 2)}/${sha256}`)
    expect(put.body.equals(bytes)).toBe(true)
    // The SDK would otherwise add a CRC32 of its own and hash the body again for the signature.
    expect(put.headers['x-amz-checksum-sha256']).toBe(Buffer.from(sha256, 'hex').toString('base64'))
    expect(put.headers['x-amz-checksum-crc32']).toBeUndefined()
    expect(put.headers['x-amz-content-sha256']).toBe(sha256)
    expect(String(put.headers.authorization)).toMatch(/^AWS4-HMAC-SHA256 .*SignedHeaders=[^,]*x-amz-content-sha256/)
  })
})
