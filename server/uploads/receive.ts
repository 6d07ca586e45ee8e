/**
 * Receiving a multipart upload without holding it in memory: each file part is streamed to a
 * temporary folder while a byte counter on the request stream enforces a hard limit, whether or
 * not a Content-Length was sent. The limit stops the reading at once; nothing is parsed past it.
 */
import type { IncomingMessage } from 'node:http'
import { createWriteStream } from 'node:fs'
import { mkdtemp, rm, stat } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { Transform } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import busboy from 'busboy'
import { formatBytes, UploadRefusedError } from './refusal'
import type { UploadedFile } from './source'

/** A request that is not a well-formed multipart form (a client error, not a refusal of the files). */
export class MalformedUploadError extends Error {
  override readonly name = 'MalformedUploadError'
}

/** What a multipart request carried: its files on disk and its small text fields. */
export interface ReceivedUpload {
  /** Parts sent under the field name the caller asked for, in order, each in a temporary file. */
  files: Extract<UploadedFile, { tempPath: string }>[]
  /** Text fields, each cut to `maxFieldBytes`. */
  fields: Record<string, string>
  /** Removes the temporary files; call it once the files have been read, whatever happened. */
  dispose(): Promise<void>
}

/** Limits of `receiveMultipartUpload`. */
export interface ReceiveOptions {
  /** Field name of the file parts, e.g. 'files'; other file parts are read past and dropped. */
  fileField: string
  /** Bytes of request body read at most, framing included. */
  maxRequestBytes: number
  /** Number of file parts. */
  maxFiles: number
  /** Size of one text field. */
  maxFieldBytes: number
}

function tooLarge(limit: number): UploadRefusedError {
  return new UploadRefusedError('too-large', `The request is larger than ${formatBytes(limit)}.`)
}

/**
 * Streams a multipart request's file parts to a temporary folder.
 * Example: `const upload = await receiveMultipartUpload(event.node.req, { fileField: 'files', maxRequestBytes: 60 * MiB, maxFiles: 500, maxFieldBytes: 4096 })`.
 * Throws `UploadRefusedError` ('too-large', 'too-many-files') or `MalformedUploadError`; the
 * temporary folder is then already removed. On a refusal the rest of the request is left unread:
 * answer it with `Connection: close`.
 */
export async function receiveMultipartUpload(req: IncomingMessage, options: ReceiveOptions): Promise<ReceivedUpload> {
  const declared = Number(req.headers['content-length'] ?? '0')
  if (declared > options.maxRequestBytes) throw tooLarge(options.maxRequestBytes)
  let parser: busboy.Busboy
  try {
    parser = busboy({
      headers: req.headers,
      // A dropped folder sends each file under its path inside the folder ("sections/one.tex");
      // the path is checked like an archive entry's when the files are read (paths.ts).
      preservePath: true,
      limits: { files: options.maxFiles, fields: 20, fieldSize: options.maxFieldBytes, parts: options.maxFiles + 20 },
    })
  }
  catch {
    throw new MalformedUploadError('Send the files as multipart/form-data')
  }

  const folder = await mkdtemp(join(tmpdir(), 'scholium-upload-'))
  const dispose = () => rm(folder, { recursive: true, force: true })
  const files: ReceivedUpload['files'] = []
  const fields: Record<string, string> = {}
  const writes: Promise<void>[] = []
  let seen = 0
  const counter = new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      seen += chunk.length
      callback(seen > options.maxRequestBytes ? tooLarge(options.maxRequestBytes) : null, chunk)
    },
  })

  parser.on('file', (name, stream, info) => {
    if (name !== options.fileField || !info.filename) {
      stream.resume()
      return
    }
    const tempPath = join(folder, String(files.length))
    const file = { filename: info.filename, tempPath, size: 0 }
    files.push(file)
    const write = pipeline(stream, createWriteStream(tempPath)).then(async () => {
      file.size = (await stat(tempPath)).size
    })
    write.catch(() => {}) // awaited below; a failure there is reported once, by Promise.all
    writes.push(write)
  })
  parser.on('field', (name, value) => {
    fields[name] = value
  })
  parser.on('filesLimit', () => {
    parser.destroy(new UploadRefusedError('too-many-files', `More than ${options.maxFiles} files were sent.`))
  })

  // The request is piped, not passed to `pipeline`: on a refusal pipeline would destroy the
  // request and its socket, and the client would never see the 413.
  req.pipe(counter)
  try {
    await pipeline(counter, parser)
    await Promise.all(writes)
  }
  catch (error) {
    req.unpipe(counter)
    req.pause()
    await dispose()
    if (error instanceof UploadRefusedError) throw error
    throw new MalformedUploadError('The multipart form could not be read to the end', { cause: error })
  }
  return { files, fields, dispose }
}
