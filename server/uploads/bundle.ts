/**
 * Safe reading of uploaded manuscript sources: one or more plain files, or a single
 * .zip / .tar / .tar.gz / .tgz bundle, turned into a flat list of files with their SHA-256.
 * Reading and validation only: receiving the request and storing live elsewhere.
 *
 * - Every refusal is an `UploadRefusedError` with a stable `code` (shared/types/uploads.ts).
 * - Only a single archive upload is expanded, and only one level: an archive inside an
 *   archive is refused ('nested-archive'), never opened and never kept as an opaque file.
 * - macOS metadata (`__MACOSX/`, `.DS_Store`, `._*`) is left out, and reported in
 *   `UploadBundle.skipped` so that nothing disappears silently. Directory entries are dropped
 *   (they carry no content; their paths are still checked).
 */
import { createHash } from 'node:crypto'
import { BundleCollector, type SkippedEntry } from './collector'
import { UPLOAD_LIMITS, type UploadLimits } from './limits'
import { archiveKindOf, checkNoCollisions, commonTopFolder } from './paths'
import { describeEntryName, refuse, UploadRefusedError } from './refusal'
import { uploadBytes, uploadSize, type UploadedFile } from './source'

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

/** The checked files of an upload and what was left out. */
export interface UploadBundle {
  files: BundleFile[]
  skipped: SkippedEntry[]
  /** The single top folder removed from every path of an archive, sanitised; null if none. */
  strippedTopFolder: string | null
}

/** SHA-256 in 1 MiB steps, yielding between them, so that hashing a 20 MiB file does not hold the event loop. */
async function sha256Hex(bytes: Buffer): Promise<string> {
  const hash = createHash('sha256')
  const CHUNK = 1024 * 1024
  for (let at = 0; at < bytes.length; at += CHUNK) {
    hash.update(bytes.subarray(at, at + CHUNK))
    if (at + CHUNK < bytes.length) await new Promise<void>(resolve => setImmediate(resolve))
  }
  return hash.digest('hex')
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
    if (uploadSize(single) === 0) throw new UploadRefusedError('archive-corrupt', 'The archive is empty (0 bytes).')
    // Loaded on demand: the archive readers and their stream libraries are most of what a
    // command-line check of a plain .tex file would otherwise parse at start-up.
    if (kind === 'zip') await (await import('./zip')).readZip(single, collector)
    else await (await import('./tar')).readTar(single, kind === 'tar.gz', collector)
    const top = commonTopFolder(collector.files.map(file => file.path))
    if (top !== null) {
      for (const file of collector.files) file.path = file.path.slice(top.length + 1)
      strippedTopFolder = describeEntryName(top)
    }
  }
  else {
    if (uploads.length > effective.maxFiles) throw refuse('too-many-files', `more than ${effective.maxFiles} files were sent.`)
    collector = new BundleCollector(effective, false)
    for (const upload of uploads) {
      const size = uploadSize(upload)
      const decision = collector.admit(upload.filename, false, size)
      if (decision.skip) continue
      collector.countFileBytes(size)
      collector.addFile(decision.path, upload.filename, await uploadBytes(upload))
    }
  }

  if (collector.files.length === 0) {
    throw new UploadRefusedError('empty', kind ? 'The archive contains no files.' : 'No files were uploaded.')
  }
  checkNoCollisions(collector.files)
  if (!collector.files.some(file => file.path.toLowerCase().endsWith('.tex'))) {
    throw new UploadRefusedError('no-tex', 'The upload contains no .tex file; at least one LaTeX source is needed.')
  }

  const files: BundleFile[] = []
  for (const { path, bytes } of collector.files) files.push({ path, bytes, sha256: await sha256Hex(bytes), size: bytes.length })
  return { files, skipped: collector.skipped, strippedTopFolder }
}

/**
 * Reads an upload into a flat list of checked files (see `readUploadBundle` for what is skipped).
 * Example: `await readUploadedFiles([{ filename: 'main.tex', data }])` → `[{ path: 'main.tex', sha256, size, bytes }]`.
 */
export async function readUploadedFiles(uploads: readonly UploadedFile[], limits: Partial<UploadLimits> = {}): Promise<BundleFile[]> {
  return (await readUploadBundle(uploads, limits)).files
}
