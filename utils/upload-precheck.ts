/**
 * What the upload form can tell before sending anything: the same rules the server applies
 * (extensions, refusal codes and sizes from shared/types/uploads.ts),
 * so a refusal is shown inline, file by file, with its reason. The server still decides.
 *
 *   precheckUpload([{ path: 'main.tex', size: 120 }, { path: 'main.aux', size: 80 }])
 *   // → main.tex accepted, main.aux refused with 'file-type'
 */
import { KNOWN_ARCHIVE_EXTENSIONS, UPLOAD_ARCHIVE_EXTENSIONS, UPLOAD_FILE_EXTENSIONS, UPLOAD_SIZE_LIMITS as UPLOAD_LIMITS, type UploadRefusalCode } from '#shared/types/uploads'

const MAX_UPLOAD_REQUEST_BYTES = UPLOAD_LIMITS.maxRequestBytes

export interface ChosenFile { path: string, size: number }

export type FileVerdict
  = | { path: string, size: number, status: 'accepted' }
    | { path: string, size: number, status: 'left-out', reason: string }
    | { path: string, size: number, status: 'refused', code: UploadRefusalCode, reason: string }

export interface Precheck {
  files: FileVerdict[]
  /** A refusal of the upload as a whole (too many files, too large in all, an archive with other files, no .tex). */
  refusal: { code: UploadRefusalCode, reason: string } | null
  /** What would be sent: the accepted files. */
  accepted: ChosenFile[]
}

const MB = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`

const lower = (path: string) => path.toLowerCase()
const archiveExtension = (path: string) => UPLOAD_ARCHIVE_EXTENSIONS.find(ext => lower(path).endsWith(ext))

/** The shared top folder of dropped paths (`paper/` of `paper/main.tex`, `paper/a/b.tex`), removed like an archive's. */
export function withoutTopFolder(files: readonly ChosenFile[]): ChosenFile[] {
  const tops = new Set(files.map(f => (f.path.includes('/') ? f.path.slice(0, f.path.indexOf('/')) : null)))
  if (files.length === 0 || tops.size !== 1 || tops.has(null)) return [...files]
  const top = [...tops][0]!
  return files.map(f => ({ ...f, path: f.path.slice(top.length + 1) }))
}

export function precheckUpload(chosen: readonly ChosenFile[]): Precheck {
  const files: FileVerdict[] = chosen.map((f): FileVerdict => {
    const segments = f.path.split('/')
    const name = segments[segments.length - 1] ?? ''
    // Left out as the command line leaves them out of a folder: dotfiles and dot-folders (.git, .DS_Store), macOS forks.
    if (segments.some(s => s.startsWith('.')) || segments[0] === '__MACOSX') return { ...f, status: 'left-out', reason: 'hidden or system file, not part of the manuscript' }
    if (f.path.includes('\\') || segments.includes('..') || f.path.startsWith('/')) return { ...f, status: 'refused', code: 'path-unsafe', reason: 'the path leaves the folder or uses backslashes' }
    if (segments.length > UPLOAD_LIMITS.maxPathDepth) return { ...f, status: 'refused', code: 'path-too-long', reason: `more than ${UPLOAD_LIMITS.maxPathDepth} folders deep` }
    const archive = archiveExtension(name)
    if (archive) {
      return f.size > MAX_UPLOAD_REQUEST_BYTES ? { ...f, status: 'refused', code: 'too-large', reason: `an archive may be at most ${MB(MAX_UPLOAD_REQUEST_BYTES)}` } : { ...f, status: 'accepted' }
    }
    const other = KNOWN_ARCHIVE_EXTENSIONS.find(ext => lower(name).endsWith(ext))
    if (other) return { ...f, status: 'refused', code: 'file-type', reason: `${other} archives are not read; use ${UPLOAD_ARCHIVE_EXTENSIONS.join(', ')}` }
    const dot = name.lastIndexOf('.')
    const extension = dot > 0 ? lower(name.slice(dot)) : ''
    if (!UPLOAD_FILE_EXTENSIONS.includes(extension)) return { ...f, status: 'refused', code: 'file-type', reason: extension ? `${extension} files are not part of a LaTeX source` : 'a file without an extension' }
    if (f.size > UPLOAD_LIMITS.maxFileBytes) return { ...f, status: 'refused', code: 'too-large', reason: `larger than ${MB(UPLOAD_LIMITS.maxFileBytes)}` }
    return { ...f, status: 'accepted' }
  })
  const accepted = files.filter(f => f.status === 'accepted').map(f => ({ path: f.path, size: f.size }))
  const archives = accepted.filter(f => archiveExtension(f.path))
  const total = accepted.reduce((sum, f) => sum + f.size, 0)
  let refusal: Precheck['refusal'] = null
  if (chosen.length === 0) refusal = { code: 'empty', reason: 'nothing was chosen' }
  else if (archives.length > 0 && accepted.length > 1) refusal = { code: 'mixed-upload', reason: 'send either one archive or plain files, not both' }
  else if (accepted.length > UPLOAD_LIMITS.maxFiles) refusal = { code: 'too-many-files', reason: `at most ${UPLOAD_LIMITS.maxFiles} files` }
  else if (archives.length === 0 && total > UPLOAD_LIMITS.maxTotalBytes) refusal = { code: 'too-large', reason: `at most ${MB(UPLOAD_LIMITS.maxTotalBytes)} in all` }
  else if (archives.length === 0 && !accepted.some(f => lower(f.path).endsWith('.tex'))) refusal = { code: 'no-tex', reason: 'no .tex file among the files that can be sent' }
  return { files, refusal, accepted }
}
