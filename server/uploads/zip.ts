/** Reading a .zip upload entry by entry, from memory or from its temporary file (never loaded whole). */
import yauzl from 'yauzl'
import type { Entry as ZipEntry, Options as ZipOptions, ZipFile } from 'yauzl'
import { BundleCollector, collectChunks, ExpansionMeter } from './collector'
import { refuse, UploadRefusedError } from './refusal'
import { uploadSize, type UploadedFile } from './source'

// Unix file-type bits (st_mode & S_IFMT) as stored in the high 16 bits of a zip entry's
// external attributes by Unix and macOS zip tools.
const S_IFMT = 0o170000
const S_IFREG = 0o100000
const S_IFDIR = 0o040000
const S_IFLNK = 0o120000
// MS-DOS directory attribute in the low byte of the external attributes.
const DOS_DIRECTORY = 0x10

// decodeStrings: false so that unsafe names reach our own checks (and their own refusal
// codes) instead of a generic library error; names are decoded in readZipEntry.
const ZIP_OPTIONS: ZipOptions = { lazyEntries: true, decodeStrings: false, validateEntrySizes: true, strictFileNames: true, autoClose: false }

/** A library failure becomes 'archive-corrupt'; refusals pass through. The library's message may quote entry names: it is kept as the cause, not shown. */
export function corruptArchive(kind: string, error: unknown): UploadRefusedError {
  if (error instanceof UploadRefusedError) return error
  return new UploadRefusedError('archive-corrupt', `The ${kind} archive is damaged or incomplete and could not be read. Please create it again and re-upload.`, null, { cause: error })
}

/** Reads every entry of a zip upload into `collector`. */
export async function readZip(upload: UploadedFile, collector: BundleCollector): Promise<void> {
  let zip: ZipFile
  try {
    zip = 'data' in upload ? await yauzl.fromBufferPromise(upload.data, ZIP_OPTIONS) : await yauzl.openPromise(upload.tempPath, ZIP_OPTIONS)
  }
  catch (error) {
    throw corruptArchive('zip', error)
  }
  try {
    if (zip.entryCount > collector.limits.maxEntries) {
      throw refuse('too-many-files', `the archive has ${zip.entryCount} entries, more than ${collector.limits.maxEntries}.`)
    }
    const meter = new ExpansionMeter(uploadSize(upload), collector.limits)
    for await (const entry of zip.eachEntry()) {
      collector.countEntry()
      await readZipEntry(zip, entry, collector, meter)
    }
  }
  catch (error) {
    throw corruptArchive('zip', error)
  }
  finally {
    zip.close()
  }
}

async function readZipEntry(zip: ZipFile, entry: ZipEntry, collector: BundleCollector, meter: ExpansionMeter): Promise<void> {
  const rawName = yauzl.getFileNameLowLevel(entry.generalPurposeBitFlag, entry.fileNameRaw, entry.extraFields, true)
  // Checked whatever the "made by" host says: a link or device bit pattern has no
  // innocent use in a manuscript bundle.
  const fileType = ((entry.externalFileAttributes >>> 16) & S_IFMT)
  if (fileType === S_IFLNK) throw refuse('link-entry', 'symbolic links are not accepted in archives.', rawName)
  if (fileType !== 0 && fileType !== S_IFREG && fileType !== S_IFDIR) {
    throw refuse('special-entry', 'only regular files and folders are accepted in archives.', rawName)
  }
  const isDirectory = fileType === S_IFDIR || (fileType === 0 && (entry.externalFileAttributes & DOS_DIRECTORY) !== 0)
  const decision = collector.admit(rawName, isDirectory, entry.uncompressedSize)
  if (decision.skip) return
  if (entry.isEncrypted()) throw refuse('archive-unsupported', 'encrypted archive entries are not accepted.', rawName)
  if (!entry.canDecodeFileData()) {
    throw refuse('archive-unsupported', `compression method ${entry.compressionMethod} is not supported; use deflate or store.`, rawName)
  }
  const stream = await zip.openReadStreamPromise(entry)
  const bytes = await collectChunks(stream, (n) => {
    collector.countFileBytes(n)
    meter.add(n)
  })
  collector.addFile(decision.path, rawName, bytes)
}
