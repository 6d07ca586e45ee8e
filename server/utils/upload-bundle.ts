/**
 * Safe reading of uploaded manuscript sources: one or more plain files, or a single
 * .zip / .tar / .tar.gz / .tgz bundle, turned into a flat list of files with their SHA-256.
 * Reading and validation only: storing and HTTP handling live elsewhere.
 *
 * Conventions of this module:
 * - A path in a result is relative, uses forward slashes, is NFC-normalised and has no
 *   empty, '.' or '..' segments (e.g. `sections/intro.tex`).
 * - Sizes are in bytes. Limits are enforced on the bytes actually read or inflated, while
 *   reading; sizes claimed by archive headers are only used to refuse earlier, never trusted.
 * - Every refusal is an `UploadRefusedError` with a stable `code`. Its message names the
 *   offending entry only through `describeEntryName` (printable ASCII, escaped, truncated),
 *   because entry names come from the uploader and may be hostile.
 * - Only a single archive upload is expanded, and only one level: an archive inside an
 *   archive is refused ('nested-archive'), never opened and never kept as an opaque file.
 * - macOS metadata (`__MACOSX/`, `.DS_Store`, `._*`) is left out, and reported in
 *   `UploadBundle.skipped` so that nothing disappears silently. Directory entries are dropped
 *   (they carry no content; their paths are still checked).
 */
import { createHash } from 'node:crypto'
import { Readable, Transform } from 'node:stream'
import zlib from 'node:zlib'
import tarStream from 'tar-stream'
import type { Header as TarHeader } from 'tar-stream'
import yauzl from 'yauzl'
import type { Entry as ZipEntry, ZipFile } from 'yauzl'

/** Why an upload was refused; stable strings the client may map to its own wording. */
export type UploadRefusalCode =
  | 'empty' // nothing to read: no uploads, or no files in the archive
  | 'too-large' // a file or the whole upload is over the size limits
  | 'too-many-files' // over the file or archive-entry count limits
  | 'file-type' // file extension not in the allowed list
  | 'path-unsafe' // absolute, drive letter, '..', backslash, control characters
  | 'path-too-long' // over the path length or folder depth limits
  | 'link-entry' // symbolic or hard link inside an archive
  | 'special-entry' // device, fifo or other non-file entry inside an archive
  | 'compression-ratio' // the archive inflates too much compared to its own size
  | 'archive-corrupt' // the archive cannot be read to the end
  | 'archive-unsupported' // encrypted zip entries, unknown compression methods
  | 'nested-archive' // an archive inside the archive
  | 'mixed-upload' // an archive sent together with other files
  | 'duplicate-path' // two entries with the same path, or a path used as file and folder
  | 'no-tex' // no .tex file at all

/** Limits applied while reading an upload. */
export interface UploadLimits {
  /** Sum of the sizes of all kept files, after unpacking. */
  maxTotalBytes: number
  /** Number of kept files. */
  maxFiles: number
  /** Number of archive entries of any kind (directories and skipped metadata included). */
  maxEntries: number
  /** Size of one file, after unpacking. */
  maxFileBytes: number
  /** Bytes inflated from a compressed archive divided by the archive's own size. */
  maxCompressionRatio: number
  /** The ratio is only enforced once this many bytes have been inflated (tiny archives of text compress very well). */
  compressionRatioGraceBytes: number
  /** Length of a path in UTF-8 bytes (before the common top folder is removed). */
  maxPathLength: number
  /** Number of segments of a path, file name included (before the common top folder is removed). */
  maxPathDepth: number
  /** Accepted file extensions, lower case with the dot. Matching ignores case. */
  allowedExtensions: readonly string[]
}

/** One file read from an upload. */
export interface BundleFile {
  /** Relative path with forward slashes, e.g. `sections/intro.tex`. */
  path: string
  bytes: Buffer
  /** Lower-case hex SHA-256 of `bytes`. */
  sha256: string
  /** `bytes.length`. */
  size: number
}

/** A file left out on purpose, with the reason (macOS metadata only). */
export interface SkippedEntry {
  /** Sanitised with `describeEntryName`, safe to show. */
  name: string
  reason: string
}

export interface UploadBundle {
  files: BundleFile[]
  skipped: SkippedEntry[]
  /** The single top folder removed from every path of an archive, sanitised; null if none. */
  strippedTopFolder: string | null
}

export interface UploadedFile {
  /** Name given by the client: a plain file name or a relative path. */
  filename: string
  data: Buffer
}

const MiB = 1024 * 1024

/**
 * Accepted extensions. TeX sources and their support files (classes, class options, styles,
 * configuration, bibliography data and styles, index styles, TikZ/PGF pictures and their
 * plain data tables), short notes (.txt .md), and figures a TeX engine can include
 * (.png .jpg .jpeg .gif .pdf .eps .ps .svg). Everything else, executables and fonts
 * included, is refused with 'file-type' so that authors see the rule instead of a silent drop.
 */
const ALLOWED_EXTENSIONS: readonly string[] = Object.freeze([
  '.tex', '.sty', '.cls', '.clo', '.cfg', '.def',
  '.bib', '.bbl', '.bst', '.bbx', '.cbx', '.ist',
  '.tikz', '.pgf', '.csv', '.dat',
  '.txt', '.md',
  '.png', '.jpg', '.jpeg', '.gif', '.pdf', '.eps', '.ps', '.svg',
])

/** Default limits, e.g. `readUploadedFiles(uploads, { ...UPLOAD_LIMITS, maxFiles: 50 })`. */
export const UPLOAD_LIMITS: Readonly<UploadLimits> = Object.freeze({
  maxTotalBytes: 50 * MiB,
  maxFiles: 500,
  maxEntries: 2000,
  maxFileBytes: 20 * MiB,
  maxCompressionRatio: 100,
  compressionRatioGraceBytes: 1 * MiB,
  maxPathLength: 255,
  maxPathDepth: 10,
  allowedExtensions: ALLOWED_EXTENSIONS,
})

/** Extensions recognised as archives, longest first so that `.tar.gz` wins over `.gz`. */
const ARCHIVE_EXTENSIONS = ['.tar.gz', '.tar.bz2', '.tar.xz', '.tgz', '.tbz2', '.txz', '.zip', '.tar', '.gz', '.bz2', '.xz', '.7z', '.rar', '.zst'] as const

type ArchiveKind = 'zip' | 'tar' | 'tar.gz'

/** An upload was refused; `code` says why, `message` is safe to show to the author. */
export class UploadRefusedError extends Error {
  override readonly name = 'UploadRefusedError'
  readonly code: UploadRefusalCode
  /** The offending entry, already sanitised with `describeEntryName`, when there is one. */
  readonly entry: string | null

  constructor(code: UploadRefusalCode, message: string, entry: string | null = null, options?: { cause?: unknown }) {
    super(message, options)
    this.code = code
    this.entry = entry
  }
}

/** True when `error` is an upload refusal, e.g. `if (isUploadRefusedError(e)) fail(422, ...)`. */
export function isUploadRefusedError(error: unknown): error is UploadRefusedError {
  return error instanceof UploadRefusedError
}

const SHOWN_NAME_MAX = 80
// Characters shown as they are; everything else (quotes, angle brackets, ampersands,
// control and non-ASCII characters) is escaped so that a name cannot inject markup or
// fake text into a message.
const PLAIN_NAME_CHAR = /^[A-Za-z0-9 ._\-/+()[\],=~@#%!$^]$/

/**
 * A hostile-safe rendering of an entry name for messages: printable ASCII, escaped, truncated.
 * Example: `describeEntryName('a<b>\u0000.tex')` → `a\x3cb\x3e\x00.tex`.
 */
export function describeEntryName(raw: string): string {
  let shown = ''
  for (const ch of raw) {
    if (PLAIN_NAME_CHAR.test(ch)) {
      shown += ch
    } else {
      const code = ch.codePointAt(0) ?? 0
      shown += code <= 0xff ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u{${code.toString(16)}}`
    }
  }
  if (shown.length <= SHOWN_NAME_MAX) return shown
  // Keep both ends: the start locates the entry, the end shows its extension.
  const head = Math.floor((SHOWN_NAME_MAX - 3) / 2)
  const tail = SHOWN_NAME_MAX - 3 - head
  return `${shown.slice(0, head)}...${shown.slice(shown.length - tail)}`
}

function refuse(code: UploadRefusalCode, message: string, rawName?: string): UploadRefusedError {
  const entry = rawName === undefined ? null : describeEntryName(rawName)
  const text = entry === null ? message : `"${entry}": ${message}`
  return new UploadRefusedError(code, text, entry)
}

function formatBytes(bytes: number): string {
  if (bytes >= MiB) return `${(bytes / MiB).toFixed(bytes % MiB === 0 ? 0 : 1)} MiB`
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(bytes % 1024 === 0 ? 0 : 1)} KiB`
  return `${bytes} bytes`
}

/** The archive kind named by a file name's extension, or null. Example: `archiveKindOf('paper.TGZ')` → 'tar.gz'. */
export function archiveKindOf(filename: string): ArchiveKind | null {
  const lower = filename.toLowerCase()
  if (lower.endsWith('.zip')) return 'zip'
  if (lower.endsWith('.tar.gz') || lower.endsWith('.tgz')) return 'tar.gz'
  if (lower.endsWith('.tar')) return 'tar'
  return null
}

function archiveExtensionOf(lowerName: string): string | null {
  return ARCHIVE_EXTENSIONS.find((ext) => lowerName.endsWith(ext)) ?? null
}

function extensionOf(lowerName: string): string {
  const base = lowerName.slice(lowerName.lastIndexOf('/') + 1)
  const dot = base.lastIndexOf('.')
  return dot <= 0 ? '' : base.slice(dot)
}

// Control characters (C0, DEL, C1) and invisible format characters (bidirectional
// overrides, zero-width joiners): they make a name display as something it is not.
const UNSAFE_PATH_CHAR = /[\p{Cc}\p{Cf}]/u
const DRIVE_LETTER = /^[A-Za-z]:/

interface CheckedPath {
  path: string
  /** The name ended with '/', i.e. names a directory. */
  endsWithSlash: boolean
}

/**
 * Checks an entry or file name and returns its normalised relative path.
 * Example: `normaliseUploadPath('./paper//main.tex')` → 'paper/main.tex'.
 */
export function normaliseUploadPath(raw: string, limits: Pick<UploadLimits, 'maxPathLength' | 'maxPathDepth'> = UPLOAD_LIMITS): string {
  return checkPath(raw, limits).path
}

function checkPath(raw: string, limits: Pick<UploadLimits, 'maxPathLength' | 'maxPathDepth'>): CheckedPath {
  if (raw.length === 0) throw refuse('path-unsafe', 'an entry has an empty name.')
  if (raw.includes('\0')) throw refuse('path-unsafe', 'the name contains a NUL byte.', raw)
  if (UNSAFE_PATH_CHAR.test(raw)) throw refuse('path-unsafe', 'the name contains control or invisible formatting characters.', raw)
  if (raw.includes('\\')) throw refuse('path-unsafe', 'the name contains a backslash; paths must use forward slashes.', raw)
  if (raw.startsWith('/')) throw refuse('path-unsafe', 'absolute paths are not accepted; use paths relative to the project.', raw)
  if (DRIVE_LETTER.test(raw)) throw refuse('path-unsafe', 'paths with a drive letter are not accepted; use paths relative to the project.', raw)
  if (Buffer.byteLength(raw, 'utf8') > limits.maxPathLength) {
    throw refuse('path-too-long', `the path is longer than ${limits.maxPathLength} bytes.`, raw)
  }
  const segments: string[] = []
  for (const segment of raw.normalize('NFC').split('/')) {
    if (segment === '' || segment === '.') continue
    if (segment === '..') throw refuse('path-unsafe', "paths may not contain '..' segments.", raw)
    segments.push(segment)
  }
  if (segments.length === 0) throw refuse('path-unsafe', 'the name has no file or folder part.', raw)
  if (segments.length > limits.maxPathDepth) {
    throw refuse('path-too-long', `the path is more than ${limits.maxPathDepth} levels deep.`, raw)
  }
  return { path: segments.join('/'), endsWithSlash: raw.endsWith('/') }
}

function isMacMetadata(path: string): boolean {
  const segments = path.split('/')
  const base = segments[segments.length - 1] ?? ''
  return segments[0] === '__MACOSX' || base === '.DS_Store' || base.startsWith('._')
}

function sha256Hex(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex')
}

/**
 * Everything read so far, and the counters behind the limits. Archive readers and the
 * plain-file path both go through it so that the rules are written once.
 */
class BundleCollector {
  readonly files: { path: string, rawName: string, bytes: Buffer }[] = []
  readonly skipped: SkippedEntry[] = []
  private entries = 0
  private totalBytes = 0
  private currentFileBytes = 0
  private currentRawName = ''

  constructor(readonly limits: UploadLimits, private readonly insideArchive: boolean) {}

  /** Counts one archive entry of any kind against `maxEntries`. */
  countEntry(): void {
    this.entries += 1
    if (this.entries > this.limits.maxEntries) {
      throw refuse('too-many-files', `the archive has more than ${this.limits.maxEntries} entries.`)
    }
  }

  /**
   * Decides what to do with a named entry: 'skip' (directory or metadata) or the normalised
   * path of a file to read. Refuses unsafe names, archives and disallowed types.
   */
  admit(rawName: string, isDirectory: boolean, declaredSize: number | null): { skip: true } | { skip: false, path: string } {
    const checked = checkPath(rawName, this.limits)
    if (isDirectory || checked.endsWithSlash) return { skip: true }
    if (isMacMetadata(checked.path)) {
      this.skipped.push({ name: describeEntryName(rawName), reason: 'macOS metadata, not part of the manuscript' })
      return { skip: true }
    }
    const lower = checked.path.toLowerCase()
    const archiveExt = archiveExtensionOf(lower)
    if (archiveExt !== null) {
      throw this.insideArchive
        ? refuse('nested-archive', `archives inside the archive are not opened (${archiveExt}); unpack it and include its files directly.`, rawName)
        : refuse('mixed-upload', 'send either a single archive or plain files, not both.', rawName)
    }
    const ext = extensionOf(lower)
    if (!this.limits.allowedExtensions.includes(ext)) {
      const what = ext === '' ? 'files without an extension are' : `the file type ${ext} is`
      throw refuse('file-type', `${what} not accepted. Accepted: ${this.limits.allowedExtensions.join(' ')}.`, rawName)
    }
    if (this.files.length + 1 > this.limits.maxFiles) {
      throw refuse('too-many-files', `more than ${this.limits.maxFiles} files.`)
    }
    if (declaredSize !== null) this.checkSizes(rawName, declaredSize, 0)
    this.currentFileBytes = 0
    this.currentRawName = rawName
    return { skip: false, path: checked.path }
  }

  /** Counts bytes of the file being read; called for every chunk so that limits bite early. */
  countFileBytes(n: number): void {
    this.checkSizes(this.currentRawName, this.currentFileBytes + n, n)
    this.currentFileBytes += n
    this.totalBytes += n
  }

  private checkSizes(rawName: string, fileBytes: number, addedBytes: number): void {
    if (fileBytes > this.limits.maxFileBytes) {
      throw refuse('too-large', `the file is larger than ${formatBytes(this.limits.maxFileBytes)}.`, rawName)
    }
    // `addedBytes` is 0 for a size claimed by a header: then the claim is what would be added.
    const projected = this.totalBytes + (addedBytes === 0 ? fileBytes : addedBytes)
    if (projected > this.limits.maxTotalBytes) {
      throw refuse('too-large', `the files add up to more than ${formatBytes(this.limits.maxTotalBytes)}.`)
    }
  }

  addFile(path: string, rawName: string, bytes: Buffer): void {
    this.files.push({ path, rawName, bytes })
  }
}

/**
 * Watches the bytes inflated from a compressed archive and stops the reading as soon as they
 * exceed `maxCompressionRatio` times the archive size (past the grace amount), so that a
 * decompression bomb costs at most about ratio × archive size of work.
 */
class ExpansionMeter {
  private inflated = 0
  private readonly ceiling: number

  constructor(archiveBytes: number, private readonly limits: UploadLimits, extraAllowance = 0) {
    this.ceiling = Math.max(limits.compressionRatioGraceBytes, archiveBytes * limits.maxCompressionRatio) + extraAllowance
  }

  add(n: number): void {
    this.inflated += n
    if (this.inflated > this.ceiling) {
      throw refuse('compression-ratio', `the archive expands more than ${this.limits.maxCompressionRatio} times its own size `
        + `(stopped after ${formatBytes(this.inflated)}); it looks like a decompression bomb and was not unpacked.`)
    }
  }
}

function corrupt(kind: ArchiveKind, error: unknown): UploadRefusedError {
  if (error instanceof UploadRefusedError) return error
  // The library's message may quote entry names; it is kept as the cause, not shown.
  const refusal = new UploadRefusedError('archive-corrupt', `The ${kind} archive is damaged or incomplete and could not be read. Please create it again and re-upload.`, null, { cause: error })
  return refusal
}

/** The part of a readable stream used here; Node streams (yauzl) and streamx streams (tar-stream) both fit. */
interface ChunkStream {
  // `any[]`: the two stream libraries type their listeners differently; chunks are Buffers in both.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  on(event: string, listener: (...args: any[]) => void): unknown
  resume(): unknown
  destroy(): unknown
}

/** Reads a stream to the end, reporting each chunk's size first so that the caller may stop it. */
function collectStream(stream: ChunkStream, onChunk: (n: number) => void): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let settled = false
    stream.on('data', (chunk: Buffer) => {
      if (settled) return
      try {
        onChunk(chunk.length)
      } catch (error) {
        settled = true
        stream.destroy()
        reject(error)
        return
      }
      chunks.push(chunk)
    })
    stream.on('end', () => {
      if (settled) return
      settled = true
      resolve(Buffer.concat(chunks))
    })
    stream.on('error', (error: unknown) => {
      if (settled) return
      settled = true
      reject(error)
    })
  })
}

// Unix file-type bits (st_mode & S_IFMT) as stored in the high 16 bits of a zip entry's
// external attributes by Unix and macOS zip tools.
const S_IFMT = 0o170000
const S_IFREG = 0o100000
const S_IFDIR = 0o040000
const S_IFLNK = 0o120000
// MS-DOS directory attribute in the low byte of the external attributes.
const DOS_DIRECTORY = 0x10

async function readZip(data: Buffer, collector: BundleCollector): Promise<void> {
  let zip: ZipFile
  try {
    // decodeStrings: false so that unsafe names reach our own checks (and their own
    // refusal codes) instead of a generic library error; names are decoded below.
    zip = await yauzl.fromBufferPromise(data, { lazyEntries: true, decodeStrings: false, validateEntrySizes: true, strictFileNames: true })
  } catch (error) {
    throw corrupt('zip', error)
  }
  if (zip.entryCount > collector.limits.maxEntries) {
    throw refuse('too-many-files', `the archive has ${zip.entryCount} entries, more than ${collector.limits.maxEntries}.`)
  }
  const meter = new ExpansionMeter(data.length, collector.limits)
  try {
    for await (const entry of zip.eachEntry()) {
      collector.countEntry()
      await readZipEntry(zip, entry, collector, meter)
    }
  } catch (error) {
    throw corrupt('zip', error)
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
  const bytes = await collectStream(stream, (n) => {
    collector.countFileBytes(n)
    meter.add(n)
  })
  collector.addFile(decision.path, rawName, bytes)
}

// Headers, long-name records and padding: the tar stream may exceed the file contents by
// this much per entry before the reading is stopped as too large.
const TAR_OVERHEAD_PER_ENTRY = 4096

async function readTar(data: Buffer, gzipped: boolean, collector: BundleCollector): Promise<void> {
  const kind: ArchiveKind = gzipped ? 'tar.gz' : 'tar'
  if (gzipped && !(data[0] === 0x1f && data[1] === 0x8b)) {
    throw new UploadRefusedError('archive-corrupt', 'The file is named .tar.gz or .tgz but is not gzip-compressed. Please check the file and re-upload.')
  }
  const limits = collector.limits
  const tarBytesCeiling = limits.maxTotalBytes + (limits.maxEntries + 2) * TAR_OVERHEAD_PER_ENTRY
  const meter = gzipped ? new ExpansionMeter(data.length, limits) : null
  let tarBytes = 0

  const source = Readable.from([data])
  const gunzip = gzipped ? zlib.createGunzip() : null
  const extract = tarStream.extract()
  // Counts the tar stream itself (not just file contents) so that padding, skipped entries
  // and long headers cannot be used to make us inflate without bound.
  const counter = new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      try {
        tarBytes += chunk.length
        if (tarBytes > tarBytesCeiling) {
          throw refuse('too-large', `the archive unpacks to more than ${formatBytes(tarBytesCeiling)} of tar data.`)
        }
        meter?.add(chunk.length)
        callback(null, chunk)
      } catch (error) {
        callback(error as Error)
      }
    },
  })

  await new Promise<void>((resolve, reject) => {
    let settled = false
    const fail = (error: unknown): void => {
      if (settled) return
      settled = true
      source.destroy()
      gunzip?.destroy()
      counter.destroy()
      extract.destroy()
      reject(corrupt(kind, error))
    }

    extract.on('entry', (header: TarHeader, stream: ChunkStream, next: (error?: Error | null) => void) => {
      if (settled) return
      let decision: ReturnType<BundleCollector['admit']>
      try {
        collector.countEntry()
        decision = admitTarEntry(header, collector)
      } catch (error) {
        fail(error)
        return
      }
      if (decision.skip) {
        stream.on('end', () => next())
        stream.on('error', fail)
        stream.resume()
        return
      }
      const path = decision.path
      collectStream(stream, (n) => collector.countFileBytes(n)).then((bytes) => {
        if (settled) return
        collector.addFile(path, header.name, bytes)
        next()
      }, fail)
    })
    extract.on('finish', () => {
      if (settled) return
      settled = true
      resolve()
    })
    extract.on('error', fail)
    source.on('error', fail)
    gunzip?.on('error', fail)
    counter.on('error', fail)

    const inflated = gunzip ? source.pipe(gunzip) : source
    inflated.pipe(counter).pipe(extract)
  })
}

function admitTarEntry(header: TarHeader, collector: BundleCollector): ReturnType<BundleCollector['admit']> {
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

/**
 * The single first segment shared by every file path, or null. A lone file at the top
 * level (no folder) means there is nothing to strip.
 */
function commonTopFolder(paths: readonly string[]): string | null {
  let top: string | null = null
  for (const path of paths) {
    const slash = path.indexOf('/')
    if (slash < 0) return null
    const first = path.slice(0, slash)
    if (top === null) top = first
    else if (top !== first) return null
  }
  return top
}

function checkNoCollisions(files: readonly { path: string, rawName: string }[]): void {
  const seen = new Set<string>()
  for (const file of files) {
    if (seen.has(file.path)) throw refuse('duplicate-path', 'this path appears more than once in the upload.', file.rawName)
    seen.add(file.path)
  }
  // A path that is a file and also the folder of another file cannot be stored as a tree.
  for (const file of files) {
    const segments = file.path.split('/')
    for (let depth = 1; depth < segments.length; depth += 1) {
      const folder = segments.slice(0, depth).join('/')
      if (seen.has(folder)) throw refuse('duplicate-path', `"${describeEntryName(folder)}" is used both as a file and as a folder.`, file.rawName)
    }
  }
}

/**
 * Reads an upload (plain files, or one archive) into checked files and the list of what was
 * left out. Example: `const { files } = await readUploadBundle([{ filename: 'paper.zip', data }])`.
 */
export async function readUploadBundle(uploads: readonly UploadedFile[], limits: Partial<UploadLimits> = {}): Promise<UploadBundle> {
  const effective: UploadLimits = { ...UPLOAD_LIMITS, ...limits }
  if (uploads.length === 0) throw new UploadRefusedError('empty', 'Nothing was uploaded.')

  const single = uploads.length === 1 ? uploads[0] : undefined
  const kind = single ? archiveKindOf(single.filename) : null
  let collector: BundleCollector
  let strippedTopFolder: string | null = null

  if (single && kind) {
    collector = new BundleCollector(effective, true)
    if (single.data.length === 0) throw new UploadRefusedError('archive-corrupt', 'The archive is empty (0 bytes).')
    if (kind === 'zip') await readZip(single.data, collector)
    else await readTar(single.data, kind === 'tar.gz', collector)
    const top = commonTopFolder(collector.files.map((file) => file.path))
    if (top !== null) {
      for (const file of collector.files) file.path = file.path.slice(top.length + 1)
      strippedTopFolder = describeEntryName(top)
    }
  } else {
    if (uploads.length > effective.maxFiles) throw refuse('too-many-files', `more than ${effective.maxFiles} files were sent.`)
    collector = new BundleCollector(effective, false)
    for (const upload of uploads) {
      const decision = collector.admit(upload.filename, false, upload.data.length)
      if (decision.skip) continue
      collector.countFileBytes(upload.data.length)
      collector.addFile(decision.path, upload.filename, upload.data)
    }
  }

  if (collector.files.length === 0) {
    throw new UploadRefusedError('empty', kind ? 'The archive contains no files.' : 'No files were uploaded.')
  }
  checkNoCollisions(collector.files)
  if (!collector.files.some((file) => file.path.toLowerCase().endsWith('.tex'))) {
    throw new UploadRefusedError('no-tex', 'The upload contains no .tex file; at least one LaTeX source is needed.')
  }

  const files = collector.files.map(({ path, bytes }): BundleFile => ({ path, bytes, sha256: sha256Hex(bytes), size: bytes.length }))
  return { files, skipped: collector.skipped, strippedTopFolder }
}

/**
 * Reads an upload into a flat list of checked files (see `readUploadBundle` for what is skipped).
 * Example: `await readUploadedFiles([{ filename: 'main.tex', data }])` → `[{ path: 'main.tex', sha256, size, bytes }]`.
 */
export async function readUploadedFiles(uploads: readonly UploadedFile[], limits: Partial<UploadLimits> = {}): Promise<BundleFile[]> {
  return (await readUploadBundle(uploads, limits)).files
}
