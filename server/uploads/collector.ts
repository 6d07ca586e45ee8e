/**
 * What has been read so far and the counters behind the limits. Archive readers and the
 * plain-file path all go through `BundleCollector`, so that the rules are written once.
 * Sizes are enforced on the bytes actually read or inflated, while reading; sizes claimed by
 * archive headers are only used to refuse earlier, never trusted.
 */
import type { UploadLimits } from './limits'
import { archiveExtensionOf, checkPath, extensionOf, isMacMetadata } from './paths'
import { describeEntryName, formatBytes, refuse } from './refusal'

/** A file left out on purpose, with the reason (macOS metadata only). */
export interface SkippedEntry {
  /** Sanitised with `describeEntryName`, safe to show. */
  name: string
  reason: string
}

/** What `BundleCollector.admit` decided for an entry. */
export type Admission = { skip: true } | { skip: false, path: string }

/** Files read so far, with the counters behind every limit. */
export class BundleCollector {
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
   * Decides what to do with a named entry: skip it (directory or metadata) or read it under
   * its normalised path. Refuses unsafe names, archives and disallowed types.
   */
  admit(rawName: string, isDirectory: boolean, declaredSize: number | null): Admission {
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

  /** Keeps a file that was admitted and read. */
  addFile(path: string, rawName: string, bytes: Buffer): void {
    this.files.push({ path, rawName, bytes })
  }
}

/**
 * Watches the bytes inflated from a compressed archive and stops the reading as soon as they
 * exceed `maxCompressionRatio` times the archive size (past the grace amount), so that a
 * decompression bomb costs at most about ratio × archive size of work.
 */
export class ExpansionMeter {
  private inflated = 0
  private readonly ceiling: number

  constructor(archiveBytes: number, private readonly limits: UploadLimits) {
    this.ceiling = Math.max(limits.compressionRatioGraceBytes, archiveBytes * limits.maxCompressionRatio)
  }

  /** Counts `n` inflated bytes; throws 'compression-ratio' past the ceiling. */
  add(n: number): void {
    this.inflated += n
    if (this.inflated > this.ceiling) {
      throw refuse('compression-ratio', `the archive expands more than ${this.limits.maxCompressionRatio} times its own size `
        + `(stopped after ${formatBytes(this.inflated)}); it looks like a decompression bomb and was not unpacked.`)
    }
  }
}

/**
 * Reads a stream to the end, reporting each chunk's size first so that the caller may stop it
 * by throwing (leaving the loop destroys the stream). Example: `await collectChunks(entry, n => meter.add(n))`.
 */
export async function collectChunks(stream: AsyncIterable<unknown>, onChunk: (n: number) => void): Promise<Buffer> {
  const chunks: Buffer[] = []
  // Both yauzl's Node streams and tar-stream's streamx entries yield Buffers; tar-stream's types say unknown.
  for await (const item of stream) {
    const chunk = item as Buffer
    onChunk(chunk.length)
    chunks.push(chunk)
  }
  return Buffer.concat(chunks)
}
