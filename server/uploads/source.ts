/** Where an uploaded file's bytes are: in memory (CLI, tests) or in a temporary file (the web server). */
import { createReadStream } from 'node:fs'
import { open, readFile } from 'node:fs/promises'
import { Readable } from 'node:stream'

/** One uploaded file as the client named it, e.g. `{ filename: 'paper.zip', tempPath: '/tmp/…/0', size: 1234 }`. */
export type UploadedFile
  = | { filename: string, data: Buffer }
    | { filename: string, tempPath: string, size: number }

/** The file's size in bytes. */
export function uploadSize(upload: UploadedFile): number {
  return 'data' in upload ? upload.data.length : upload.size
}

/** All of the file's bytes (only for plain files, whose size the limits have already bounded). */
export async function uploadBytes(upload: UploadedFile): Promise<Buffer> {
  return 'data' in upload ? upload.data : readFile(upload.tempPath)
}

/** The file's bytes as a stream, read in chunks. */
export function uploadStream(upload: UploadedFile): Readable {
  return 'data' in upload ? Readable.from([upload.data]) : createReadStream(upload.tempPath)
}

/** The first `n` bytes of the file (fewer if it is shorter). */
export async function uploadHead(upload: UploadedFile, n: number): Promise<Buffer> {
  if ('data' in upload) return upload.data.subarray(0, n)
  const handle = await open(upload.tempPath, 'r')
  try {
    const buffer = Buffer.alloc(n)
    const { bytesRead } = await handle.read(buffer, 0, n, 0)
    return buffer.subarray(0, bytesRead)
  }
  finally {
    await handle.close()
  }
}
