/**
 * Uploads of manuscript sources, shared by the web server and the CLI: receiving a multipart
 * request (receive.ts), then reading and checking plain files or one archive (bundle.ts).
 * Plain imports only (no Nitro auto-imports), so the CLI and the worker can use it.
 */
export { readUploadBundle, readUploadedFiles, type BundleFile, type UploadBundle } from './bundle'
export type { SkippedEntry } from './collector'
export { MAX_UPLOAD_REQUEST_BYTES, MiB, UPLOAD_LIMITS, type UploadLimits } from './limits'
export { archiveKindOf, normaliseUploadPath, type ArchiveKind } from './paths'
export { describeEntryName, isUploadRefusedError, UploadRefusedError } from './refusal'
export { MalformedUploadError, receiveMultipartUpload, type ReceivedUpload, type ReceiveOptions } from './receive'
export type { UploadedFile } from './source'
export type { UploadRefusalCode } from '../../shared/types/uploads'
