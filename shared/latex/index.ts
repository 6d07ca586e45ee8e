/**
 * Scholium's LaTeX reader: finds the checkable claims of a manuscript and turns each into a
 * question for the engine. Pure TypeScript (no file system): the caller passes file contents.
 *
 * Example:
 *   const { claims } = readManuscript({ files: { 'main.tex': '\\documentclass{article}…' } })
 */
import type { ReadResult } from '../types/claims'
import { DEFAULT_LIMITS, type ReaderLimits } from './limits'
import { ReaderRun } from './reader'
import { katexMacros } from './macros'
import { normalizeBundlePath } from './paths'

export type { ReaderLimits } from './limits'
export type { Claim, ClaimKind, ClaimStatus, Expr, PermutationSpec, ReadResult, ReaderWarning } from '../types/claims'
export { DEFAULT_LIMITS } from './limits'
export { parseTag, isTagComment } from './tags'
export type { TagDirective, NotationObject } from './tags'

export interface ReadManuscriptInput {
  /** Relative path → content (text, or bytes decoded as UTF-8 with a Latin-1 fallback). */
  files: Record<string, string | Uint8Array>
  /** The main file; by default the one with \documentclass. */
  main?: string
  /** Overrides of the capacity limits. */
  limits?: Partial<ReaderLimits>
}

/**
 * Read a manuscript (one file, several files, or an unpacked bundle) and list its claims.
 * Never throws on content: problems become warnings or claims with status 'error'/'unsupported'.
 * Throws only on misuse (no `files` object, or a limit that is not a positive number).
 * Example: `readManuscript({ files: { 'a.tex': '$\\ell(2143) = 2$' } }).claims[0].kind === 'length'`.
 */
export function readManuscript(input: ReadManuscriptInput): ReadResult {
  if (!input || typeof input.files !== 'object' || input.files === null) {
    throw new TypeError('readManuscript: input.files must be an object mapping paths to contents')
  }
  const limits: ReaderLimits = { ...DEFAULT_LIMITS }
  for (const [key, value] of Object.entries(input.limits ?? {})) {
    if (!(key in DEFAULT_LIMITS)) throw new TypeError(`readManuscript: unknown limit "${key}"`)
    if (typeof value !== 'number' || !(value > 0)) throw new TypeError(`readManuscript: limit "${key}" must be a positive number`)
    ;(limits as unknown as Record<string, number>)[key] = value
  }
  const files: Record<string, string | Uint8Array> = {}
  const outside: string[] = []
  for (const [path, content] of Object.entries(input.files)) {
    if (typeof content !== 'string' && !(content instanceof Uint8Array)) {
      throw new TypeError(`readManuscript: content of "${path}" must be a string or a Uint8Array`)
    }
    const norm = normalizeBundlePath(path)
    if (norm === undefined) outside.push(path)
    else files[norm] = content
  }
  const run = new ReaderRun(files, limits)
  for (const p of outside) run.warn('path-escape', `file name "${p}" is absolute or leaves the manuscript folder; it was not read`)
  const main = input.main === undefined ? undefined : normalizeBundlePath(input.main) ?? input.main
  const fileInfo = run.run(main)
  return { claims: run.claims, warnings: run.warnings, files: fileInfo, notRead: run.notRead, macros: katexMacros(run.macroTable.macros.values()) }
}

/**
 * The reader's own choice of main file, for callers that must name it before reading (the upload
 * service). Example: `chooseMainFile({ 'a.tex': '\\documentclass{article}', 'b.tex': 'x' }) === 'a.tex'`.
 * Undefined when the bundle holds no LaTeX file, or when the reader would read several roots (no
 * file has \documentclass and several are included by none): naming one would read only that one.
 */
export function chooseMainFile(files: Record<string, string | Uint8Array>): string | undefined {
  const normalized: Record<string, string | Uint8Array> = {}
  for (const [path, content] of Object.entries(files)) {
    const norm = normalizeBundlePath(path)
    if (norm !== undefined) normalized[norm] = content
  }
  const roots = new ReaderRun(normalized, { ...DEFAULT_LIMITS }).sources.chooseRoots(undefined)
  return roots.length === 1 ? roots[0] : undefined
}
