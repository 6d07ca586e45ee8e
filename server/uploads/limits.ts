/** Limits applied while receiving and reading an upload. */
import { UPLOAD_FILE_EXTENSIONS, UPLOAD_SIZE_LIMITS } from '../../shared/types/uploads'

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

/** One mebibyte, for writing limits. */
export const MiB = 1024 * 1024

/** Default limits, e.g. `readUploadedFiles(uploads, { ...UPLOAD_LIMITS, maxFiles: 50 })`. */
export const UPLOAD_LIMITS: Readonly<UploadLimits> = Object.freeze({
  maxTotalBytes: UPLOAD_SIZE_LIMITS.maxTotalBytes,
  maxFiles: UPLOAD_SIZE_LIMITS.maxFiles,
  maxEntries: 2000,
  maxFileBytes: UPLOAD_SIZE_LIMITS.maxFileBytes,
  maxCompressionRatio: 100,
  compressionRatioGraceBytes: 1 * MiB,
  maxPathLength: 255,
  maxPathDepth: UPLOAD_SIZE_LIMITS.maxPathDepth,
  allowedExtensions: UPLOAD_FILE_EXTENSIONS,
})

/**
 * The most bytes of a multipart request body that are read, counted on the stream whatever
 * Content-Length says: the files' limit plus room for the form's own framing.
 */
export const MAX_UPLOAD_REQUEST_BYTES = UPLOAD_SIZE_LIMITS.maxRequestBytes
