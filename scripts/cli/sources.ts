/**
 * Reads what `scholium check` is pointed at into manuscript files with their SHA-256:
 * - a .tex file: read alone (its siblings are not guessed at; point at the folder for a bundle);
 * - a folder: every file under it, dotfiles and dot-folders left out, links leaving it refused;
 * - an archive (.zip, .tar, .tar.gz, .tgz): through the server's own upload reader, with its limits.
 * Folder files go through the same upload reader, so limits and path rules are written once.
 * Files the upload reader would refuse by type (.aux, .log, …) are left out of a folder and
 * listed in `skipped`, so that nothing disappears silently.
 */
import { lstat, readdir, readFile, realpath, stat } from 'node:fs/promises'
import { basename, isAbsolute, join, relative, sep } from 'node:path'
// The upload reader's own modules, not its index: the index also brings the multipart receiver
// (busboy), which the command never uses. The arXiv client is loaded only for arxiv:<id>.
import { readUploadBundle, type BundleFile } from '../../server/uploads/bundle'
import { archiveKindOf } from '../../server/uploads/paths'
import { UploadRefusedError } from '../../server/uploads/refusal'
import { KNOWN_ARCHIVE_EXTENSIONS, UPLOAD_ARCHIVE_EXTENSIONS, UPLOAD_FILE_EXTENSIONS } from '../../shared/types/uploads'

export interface SourceFiles {
  files: BundleFile[]
  /** Left out on purpose, with the reason (shown to the user and added to the report's warnings). */
  skipped: { path: string, reason: string }[]
  /** The file to read first when the source is a single .tex file. */
  main?: string
  /** What the user pointed at, so that outputs can name files in the user's own tree. */
  origin: 'file' | 'folder' | 'archive'
}

/** Bad input: the message is for the user, the exit code is 2. */
export class SourceProblem extends Error {
  override readonly name = 'SourceProblem'
}

/** Archives recognised but not unpacked, so that the message can say which ones are. */
const OTHER_ARCHIVES = KNOWN_ARCHIVE_EXTENSIONS.filter(ext => !UPLOAD_ARCHIVE_EXTENSIONS.includes(ext))

/** Read `source` (a path as given on the command line, or `arxiv:<id>`). Throws SourceProblem on bad input. */
export async function readSource(source: string): Promise<SourceFiles> {
  if (/^arxiv:/i.test(source)) return readArxiv(source)
  const info = await stat(source).catch((error: NodeJS.ErrnoException) => {
    throw new SourceProblem(error.code === 'ENOENT' ? `${source}: no such file or folder.` : `${source}: cannot be read (${error.code ?? error.message}).`)
  })
  try {
    if (info.isDirectory()) return await readFolder(source)
    if (!info.isFile()) throw new SourceProblem(`${source}: not a file or a folder.`)
    const name = basename(source)
    const lower = name.toLowerCase()
    const data = await readFile(source)
    if (archiveKindOf(name)) return { files: (await readUploadBundle([{ filename: name, data }])).files, skipped: [], origin: 'archive' }
    if (OTHER_ARCHIVES.some(ext => lower.endsWith(ext))) throw new SourceProblem(`${source}: this kind of archive is not read; use ${UPLOAD_ARCHIVE_EXTENSIONS.join(', ')}.`)
    if (!lower.endsWith('.tex')) throw new SourceProblem(`${source}: not a .tex file, a folder or a .zip / .tar / .tar.gz / .tgz archive.`)
    const { files } = await readUploadBundle([{ filename: name, data }])
    return { files, skipped: [], main: files[0]?.path, origin: 'file' }
  }
  catch (error) {
    if (error instanceof UploadRefusedError) throw new SourceProblem(`${source}: ${error.message} (${error.code})`)
    throw error
  }
}

async function readFolder(root: string): Promise<SourceFiles> {
  const rootReal = await realpath(root)
  const found: { path: string, data: Buffer }[] = []
  const skipped: SourceFiles['skipped'] = []
  const visited = new Set<string>([rootReal])
  const walk = async (dir: string, prefix: string): Promise<void> => {
    const entries = (await readdir(dir)).sort()
    for (const name of entries) {
      const path = prefix === '' ? name : `${prefix}/${name}`
      if (name.startsWith('.')) continue // dotfiles and dot-folders (.git, .latexmkrc) are not part of the manuscript
      const full = join(dir, name)
      const link = await lstat(full)
      let target = full
      if (link.isSymbolicLink()) {
        target = await realpath(full).catch(() => { throw new SourceProblem(`${path}: a link whose target does not exist.`) })
        const inside = relative(rootReal, target)
        if (inside.split(sep)[0] === '..' || isAbsolute(inside)) {
          throw new SourceProblem(`${path}: a link that leaves the folder; copy the file in instead.`)
        }
      }
      const info = await stat(target)
      if (info.isDirectory()) {
        const real = await realpath(target)
        if (visited.has(real)) continue // a link back to a folder already read
        visited.add(real)
        await walk(target, path)
      }
      else if (info.isFile()) {
        if (isAcceptedFile(name)) found.push({ path, data: await readFile(target) })
        else skipped.push({ path, reason: 'not a manuscript file (its type is not among the accepted ones)' })
      }
      else skipped.push({ path, reason: 'not a regular file' })
    }
  }
  await walk(root, '')
  if (found.length === 0) throw new SourceProblem(`${root}: the folder has no manuscript files.`)
  const { files } = await readUploadBundle(found.map(f => ({ filename: f.path, data: f.data })))
  return { files, skipped, origin: 'folder' }
}

function isAcceptedFile(name: string): boolean {
  const lower = name.toLowerCase()
  const dot = lower.lastIndexOf('.')
  return dot > 0 && UPLOAD_FILE_EXTENSIONS.includes(lower.slice(dot))
}

/**
 * `arxiv:<id>`: the e-print from NUXT_ARXIV_BASE_URL (default https://arxiv.org), read like an
 * uploaded file. Files are named as inside the e-print.
 */
async function readArxiv(source: string): Promise<SourceFiles> {
  const { ArxivClient, ArxivError } = await import('../../server/arxiv/client')
  const client = new ArxivClient({
    baseUrl: process.env.NUXT_ARXIV_BASE_URL || 'https://arxiv.org',
    userAgent: 'scholium-cli/0.1 (checks worked examples in manuscripts)',
    maxWaitMs: 30_000,
  })
  try {
    const eprint = await client.fetchEprint(source.slice('arxiv:'.length))
    const { files } = await readUploadBundle([{ filename: eprint.filename, data: eprint.data }])
    return { files, skipped: [], ...(eprint.kind === 'tex' ? { main: files[0]?.path } : {}), origin: 'archive' }
  }
  catch (error) {
    if (error instanceof ArxivError) throw new SourceProblem(`${source}: ${error.message} (${error.code}).`)
    if (error instanceof UploadRefusedError) throw new SourceProblem(`${source}: ${error.message} (${error.code})`)
    throw error
  }
}
