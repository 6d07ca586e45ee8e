/**
 * Path rules of an upload. A path in a result is relative, uses forward slashes, is
 * NFC-normalised and has no empty, '.' or '..' segments (e.g. `sections/intro.tex`).
 */
import { KNOWN_ARCHIVE_EXTENSIONS } from '../../shared/types/uploads'
import type { UploadLimits } from './limits'
import { UPLOAD_LIMITS } from './limits'
import { describeEntryName, refuse } from './refusal'

/** The archive kinds that are unpacked. */
export type ArchiveKind = 'zip' | 'tar' | 'tar.gz'

/** The archive kind named by a file name's extension, or null. Example: `archiveKindOf('paper.TGZ')` → 'tar.gz'. */
export function archiveKindOf(filename: string): ArchiveKind | null {
  const lower = filename.toLowerCase()
  if (lower.endsWith('.zip')) return 'zip'
  if (lower.endsWith('.tar.gz') || lower.endsWith('.tgz')) return 'tar.gz'
  if (lower.endsWith('.tar')) return 'tar'
  return null
}

/** The archive extension a lower-case name ends with, read or not, e.g. '.7z'; null if none. */
export function archiveExtensionOf(lowerName: string): string | null {
  return KNOWN_ARCHIVE_EXTENSIONS.find(ext => lowerName.endsWith(ext)) ?? null
}

/** The last extension of a lower-case path, with the dot; '' for none or a dotfile. Example: 'a/b.tex' → '.tex'. */
export function extensionOf(lowerName: string): string {
  const base = lowerName.slice(lowerName.lastIndexOf('/') + 1)
  const dot = base.lastIndexOf('.')
  return dot <= 0 ? '' : base.slice(dot)
}

// Control characters (C0, DEL, C1) and invisible format characters (bidirectional
// overrides, zero-width joiners): they make a name display as something it is not.
const UNSAFE_PATH_CHAR = /[\p{Cc}\p{Cf}]/u
const DRIVE_LETTER = /^[A-Za-z]:/

/** A checked name. */
export interface CheckedPath {
  path: string
  /** The name ended with '/', i.e. names a directory. */
  endsWithSlash: boolean
}

type PathLimits = Pick<UploadLimits, 'maxPathLength' | 'maxPathDepth'>

/**
 * Checks an entry or file name and returns its normalised relative path.
 * Example: `normaliseUploadPath('./paper//main.tex')` → 'paper/main.tex'.
 */
export function normaliseUploadPath(raw: string, limits: PathLimits = UPLOAD_LIMITS): string {
  return checkPath(raw, limits).path
}

/** Checks a name (see `normaliseUploadPath`) and says whether it names a directory. */
export function checkPath(raw: string, limits: PathLimits): CheckedPath {
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
    if (segment === '..') throw refuse('path-unsafe', 'paths may not contain \'..\' segments.', raw)
    segments.push(segment)
  }
  if (segments.length === 0) throw refuse('path-unsafe', 'the name has no file or folder part.', raw)
  if (segments.length > limits.maxPathDepth) {
    throw refuse('path-too-long', `the path is more than ${limits.maxPathDepth} levels deep.`, raw)
  }
  return { path: segments.join('/'), endsWithSlash: raw.endsWith('/') }
}

/** True for macOS metadata (`__MACOSX/`, `.DS_Store`, `._*`), left out of every upload. */
export function isMacMetadata(path: string): boolean {
  const segments = path.split('/')
  const base = segments[segments.length - 1] ?? ''
  return segments[0] === '__MACOSX' || base === '.DS_Store' || base.startsWith('._')
}

/**
 * The single first segment shared by every file path, or null. A lone file at the top
 * level (no folder) means there is nothing to strip. Example: ['p/a.tex', 'p/b.tex'] → 'p'.
 */
export function commonTopFolder(paths: readonly string[]): string | null {
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

/** Refuses two files with one path, and a path used both as a file and as a folder. */
export function checkNoCollisions(files: readonly { path: string, rawName: string }[]): void {
  const seen = new Set<string>()
  for (const file of files) {
    if (seen.has(file.path)) throw refuse('duplicate-path', 'this path appears more than once in the upload.', file.rawName)
    seen.add(file.path)
  }
  for (const file of files) {
    const segments = file.path.split('/')
    for (let depth = 1; depth < segments.length; depth += 1) {
      const folder = segments.slice(0, depth).join('/')
      if (seen.has(folder)) throw refuse('duplicate-path', `"${describeEntryName(folder)}" is used both as a file and as a folder.`, file.rawName)
    }
  }
}
