import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'

let client: S3Client | undefined

function s3(): { client: S3Client, bucket: string } {
  const { s3: config } = useRuntimeConfig()
  client ??= new S3Client({
    endpoint: config.endpoint || undefined,
    region: config.region,
    forcePathStyle: Boolean(config.forcePathStyle),
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
  })
  return { client, bucket: config.bucket }
}

/** Source files are content-addressed: the key is derived from the SHA-256 alone. */
export function sourceKey(sha256: string): string {
  return `sources/sha256/${sha256.slice(0, 2)}/${sha256}`
}

/**
 * Stores bytes under their content key unless they are already there.
 * Returns whether this call created the object (so a failed upload can
 * remove only what it added). Example: `await putSource(bytes, sha)`
 */
export async function putSource(bytes: Uint8Array, sha256: string): Promise<{ key: string, created: boolean }> {
  const { client, bucket } = s3()
  const key = sourceKey(sha256)
  try {
    await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }))
    return { key, created: false }
  }
  catch (error) {
    if (!isNotFound(error)) throw error
  }
  await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: bytes, ContentType: 'application/octet-stream' }))
  return { key, created: true }
}

export async function getSource(key: string): Promise<Uint8Array> {
  const { client, bucket } = s3()
  const result = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }))
  if (!result.Body) throw new Error('empty object body')
  return result.Body.transformToByteArray()
}

export async function deleteSource(key: string): Promise<void> {
  const { client, bucket } = s3()
  await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }))
}

function isNotFound(error: unknown): boolean {
  const e = error as { name?: string, $metadata?: { httpStatusCode?: number } }
  return e?.name === 'NotFound' || e?.name === 'NoSuchKey' || e?.$metadata?.httpStatusCode === 404
}
