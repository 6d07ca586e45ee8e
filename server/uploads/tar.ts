/** Reading a .tar or .tar.gz upload as one stream pipeline, entry by entry. */
import { Transform } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import zlib from 'node:zlib'
import tarStream from 'tar-stream'
import type { Header as TarHeader } from 'tar-stream'
import { BundleCollector, collectChunks, ExpansionMeter, type Admission } from './collector'
import { formatBytes, refuse, UploadRefusedError } from './refusal'
import { uploadHead, uploadSize, uploadStream, type UploadedFile } from './source'
import { corruptArchive } from './zip'

// Headers, long-name records and padding: the tar stream may exceed the file contents by
// this much per entry before the reading is stopped as too large.
const TAR_OVERHEAD_PER_ENTRY = 4096

/**
 * Counts the tar stream itself (not just file contents) so that padding, skipped entries and
 * long headers cannot be used to make us inflate without bound.
 */
function tarByteCounter(ceiling: number, meter: ExpansionMeter | null): Transform {
  let seen = 0
  return new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      try {
        seen += chunk.length
        if (seen > ceiling) throw refuse('too-large', `the archive unpacks to more than ${formatBytes(ceiling)} of tar data.`)
        meter?.add(chunk.length)
        callback(null, chunk)
      }
      catch (error) {
        callback(error as Error)
      }
    },
  })
}

/** Reads every entry of a tar (optionally gzipped) upload into `collector`. */
export async function readTar(upload: UploadedFile, gzipped: boolean, collector: BundleCollector): Promise<void> {
  const kind = gzipped ? 'tar.gz' : 'tar'
  if (gzipped) {
    const head = await uploadHead(upload, 2)
    if (!(head[0] === 0x1f && head[1] === 0x8b)) {
      throw new UploadRefusedError('archive-corrupt', 'The file is named .tar.gz or .tgz but is not gzip-compressed. Please check the file and re-upload.')
    }
  }
  const limits = collector.limits
  const ceiling = limits.maxTotalBytes + (limits.maxEntries + 2) * TAR_OVERHEAD_PER_ENTRY
  const counter = tarByteCounter(ceiling, gzipped ? new ExpansionMeter(uploadSize(upload), limits) : null)
  const extract = tarStream.extract()
  const stages = gzipped ? [uploadStream(upload), zlib.createGunzip(), counter] as const : [uploadStream(upload), counter] as const
  // The pipeline feeds `extract` while the loop below consumes its entries; whichever fails
  // first destroys the rest. Its rejection is awaited (or superseded) below, never left unhandled.
  const feeding = pipeline([...stages, extract])
  feeding.catch(() => {})
  try {
    for await (const entry of extract) {
      collector.countEntry()
      const decision = admitTarEntry(entry.header, collector)
      if (decision.skip) {
        for await (const _ of entry) { /* drain: directories and metadata carry nothing we keep */ }
        continue
      }
      const bytes = await collectChunks(entry, n => collector.countFileBytes(n))
      collector.addFile(decision.path, entry.header.name, bytes)
    }
    await feeding
  }
  catch (error) {
    extract.destroy()
    // The first failure is the meaningful one: a refusal raised in the pipeline wins over the
    // "destroyed" error the loop then sees.
    const fed = await feeding.then(() => null, (e: unknown) => e)
    throw corruptArchive(kind, fed instanceof UploadRefusedError ? fed : error)
  }
}

function admitTarEntry(header: TarHeader, collector: BundleCollector): Admission {
  const rawName = header.name
  switch (header.type) {
    case 'file':
    case 'contiguous-file':
      return collector.admit(rawName, false, header.size ?? 0)
    case 'directory':
      return collector.admit(rawName, true, null)
    case 'symlink':
      throw refuse('link-entry', 'symbolic links are not accepted in archives.', rawName)
    case 'link':
      throw refuse('link-entry', 'hard links are not accepted in archives.', rawName)
    case 'character-device':
    case 'block-device':
    case 'fifo':
      throw refuse('special-entry', 'device and fifo entries are not accepted in archives.', rawName)
    default:
      // Unknown type flags (tar-stream reports them as null) and anything else.
      throw refuse('special-entry', 'the archive contains an entry of an unsupported kind; only regular files and folders are accepted.', rawName)
  }
}
