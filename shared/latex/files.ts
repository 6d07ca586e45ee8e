/**
 * The FILES stage: which files of a bundle are read, in which role, and each file decoded, masked
 * and indexed once, with the tags found in its comments.
 *
 * Conventions: paths are bundle paths (see paths.ts). The stage never reads math; later stages ask
 * it to load a file, to resolve an \input or a package, and finally for the role of every file.
 * Problems (binary data, a missing \input, a cycle) are reported through the `warn` callback.
 */
import type { ReadFileInfo, WarningCode } from '../types/claims'
import { decodeSource, lineStarts, positionAt } from './decode'
import { maskSource, type SourceComment } from './mask'
import { resolveInclude } from './paths'
import { isTagComment, parseTag, type TagDirective } from './tags'
import type { ReaderLimits } from './limits'

/** One file as later stages see it. */
export interface LoadedFile {
  path: string
  /** Decoded text, line endings normalised. */
  original: string
  /** The same text with comments, verbatim and drawings blanked (see mask.ts). */
  masked: string
  starts: number[]
  encoding: ReadFileInfo['encoding']
  /** Tags attached to a line (skip, claim, use). */
  lineTags: Map<number, TagDirective[]>
  /** Tags that act from their position on (set, means, in Gr(k,n), parameters), by offset. */
  events: { offset: number, directive: TagDirective }[]
}

export type WarnFn = (code: WarningCode, message: string, file?: string, offset?: number) => void

const TEX_EXTENSIONS = /\.(tex|ltx|latex)$/i
const NOT_SOURCE = /\.(sty|cls|bib|bbl|bst|png|jpe?g|gif|pdf|eps|ps|svg|json|txt|md|log|aux)$/i
/** Names authors give the main file; among equals, the earlier name wins. */
const MAIN_NAMES = ['main', 'ms', 'paper', 'article', 'manuscript']

/**
 * A \documentclass outside comments, \iffalse and verbatim (the text is masked), and not a class
 * for parts of a document: subfiles (a chapter compiled alone) or standalone (a figure).
 */
function hasDocumentClass(masked: string): boolean {
  return /\\documentclass\b/.test(masked) && !/\\documentclass\s*(\[[^\]]*\])?\s*\{\s*(subfiles|standalone)\s*\}/.test(masked)
}

export class ManuscriptFiles {
  private readonly loaded = new Map<string, LoadedFile | null>()
  readonly roles = new Map<string, ReadFileInfo['role']>()
  private totalChars = 0

  constructor(
    private readonly files: Record<string, string | Uint8Array>,
    private readonly limits: ReaderLimits,
    private readonly warn: WarnFn,
  ) {}

  exists(path: string): boolean {
    return this.files[path] !== undefined
  }

  /** 1-based line of an offset in a loaded file, if it is loaded. */
  lineOf(path: string, offset: number): number | undefined {
    const f = this.loaded.get(path)
    return f ? positionAt(f.starts, offset).line : undefined
  }

  /** Decode, mask and index a file once; null when it is binary or missing. */
  load(path: string): LoadedFile | null {
    const cached = this.loaded.get(path)
    if (cached !== undefined) return cached
    const raw = this.files[path]
    if (raw === undefined) return null
    const decoded = decodeSource(raw)
    if (decoded.encoding === 'binary') {
      this.loaded.set(path, null)
      this.warn('binary', `${path} looks like binary data, not LaTeX; it was not read`, path)
      return null
    }
    let text = decoded.text
    if (this.totalChars + text.length > this.limits.maxTotalChars) {
      const keep = Math.max(0, this.limits.maxTotalChars - this.totalChars)
      this.warn('limit', `${path}: input exceeds ${this.limits.maxTotalChars} characters in total; only the first ${keep} were read`, path)
      text = text.slice(0, keep)
    }
    this.totalChars += text.length
    const masked = maskSource(text)
    const file: LoadedFile = {
      path, original: text, masked: masked.text, starts: lineStarts(text), encoding: decoded.encoding,
      lineTags: new Map(), events: [],
    }
    this.loaded.set(path, file)
    if (decoded.encoding === 'latin-1') this.warn('encoding', `${path} is not valid UTF-8; it was read as Latin-1`, path)
    for (const p of masked.problems) this.warn('syntax', p.message, path, p.offset)
    this.readTags(file, masked.comments)
    return file
  }

  private readTags(file: LoadedFile, comments: SourceComment[]): void {
    for (const c of comments) {
      if (!isTagComment(c.text)) continue
      const tag = parseTag(c.text)
      for (const e of tag.errors) this.warn('tag', `tag not understood: ${e}`, file.path, c.offset)
      const line = positionAt(file.starts, c.offset).line
      const target = c.wholeLine ? nextContentLine(file, line) : line
      for (const d of tag.directives) {
        if (d.type === 'set' || d.type === 'means' || d.type === 'grassmannian' || d.type === 'parameters' || d.type === 'chern') file.events.push({ offset: c.offset, directive: d })
        else {
          const list = file.lineTags.get(target) ?? []
          list.push(d)
          file.lineTags.set(target, list)
        }
      }
    }
  }

  /**
   * The root file(s): the configured one; else the toplevel file an arXiv-style 00README names;
   * else the one file with \documentclass (ranked when several); else every .tex file that no
   * other includes.
   */
  chooseRoots(main: string | undefined): string[] {
    const paths = Object.keys(this.files).sort()
    if (main !== undefined) {
      if (this.files[main] !== undefined) return [main]
      this.warn('main-file', `the configured main file "${main}" is not in the input; looking for \\documentclass instead`)
    }
    const named = this.readmeToplevel()
    if (named) return [named]
    const texPaths = paths.filter(p => TEX_EXTENSIONS.test(p))
    const candidates = texPaths.length ? texPaths : paths.filter(p => !NOT_SOURCE.test(p) && !/^00README/i.test(p))
    const withClass = candidates.filter((p) => {
      const f = this.load(p)
      return !!f && hasDocumentClass(f.masked)
    })
    if (withClass.length === 1) return withClass
    if (withClass.length > 1) {
      const ranked = this.rankMainCandidates(withClass)
      this.warn('main-file', `several files have \\documentclass (${withClass.join(', ')}); reading ${ranked[0]} as the main file`)
      return [ranked[0]!]
    }
    if (candidates.length > 1) {
      this.warn('main-file', `no file has \\documentclass; reading every file not included by another, in name order`)
    }
    const included = new Set<string>()
    for (const p of candidates) {
      const f = this.load(p)
      if (!f) continue
      for (const m of f.masked.matchAll(/\\(?:input|include|subfile)\s*\{([^{}]*)\}/g)) {
        const r = resolveInclude(m[1]!, p, p, q => this.exists(q))
        if ('path' in r) included.add(r.path)
      }
    }
    return candidates.filter(p => !included.has(p))
  }

  /** Bundle files a file reads with \\input, \\include, \\subfile or \\usepackage (masked text only). */
  private filesReadBy(path: string): string[] {
    const f = this.load(path)
    if (!f) return []
    const out = new Set<string>()
    for (const m of f.masked.matchAll(/\\(input|include|subfile|usepackage|RequirePackage)\s*(?:\[[^\]]*\])?\s*\{([^{}]*)\}/g)) {
      const pkg = m[1] === 'usepackage' || m[1] === 'RequirePackage'
      for (const name of pkg ? m[2]!.split(',') : [m[2]!]) {
        const r = resolveInclude(pkg ? `${name.trim()}.sty` : name, path, path, q => this.exists(q))
        if ('path' in r) out.add(r.path)
      }
    }
    return [...out]
  }

  private rankMainCandidates(paths: string[]): string[] {
    const reads = new Map(paths.map(p => [p, this.filesReadBy(p)]))
    const candidates: MainCandidate[] = paths.map((path) => {
      const base = (path.split('/').pop() ?? '').replace(TEX_EXTENSIONS, '').toLowerCase()
      const named = MAIN_NAMES.indexOf(base)
      return {
        path,
        hasBody: /\\begin\s*\{document\}/.test(this.load(path)?.masked ?? ''),
        includedByOther: paths.some(q => q !== path && reads.get(q)!.includes(path)),
        depth: path.split('/').length,
        readsFiles: reads.get(path)!.length,
        nameRank: named < 0 ? MAIN_NAMES.length : named,
      }
    })
    return candidates.sort(compareMainCandidates).map(c => c.path)
  }

  /**
   * The toplevel file named by 00README.json (`"sources": [{"filename": …, "usage": "toplevel"}]`)
   * or by a line `name.tex toplevelfile` of an older 00README.XXX; only a file that is in the bundle.
   */
  private readmeToplevel(): string | undefined {
    const readmes = Object.keys(this.files).filter(p => /^00README(\.[A-Za-z]+)?$/i.test(p)).sort()
    for (const path of readmes) {
      const decoded = decodeSource(this.files[path]!)
      if (decoded.encoding === 'binary') continue
      const text = decoded.text
      let names: string[] = []
      if (/\.json$/i.test(path) || text.trimStart().startsWith('{')) {
        try {
          const parsed: unknown = JSON.parse(text)
          const sources = (parsed as { sources?: unknown }).sources
          if (Array.isArray(sources)) {
            names = sources
              .filter((s): s is { filename: string, usage: string } => !!s && typeof s === 'object' && typeof (s as { filename?: unknown }).filename === 'string' && (s as { usage?: unknown }).usage === 'toplevel')
              .map(s => s.filename)
          }
        }
        catch {
          this.warn('main-file', `${path} is not valid JSON; its toplevel file is not used`)
        }
      }
      else {
        for (const line of text.split('\n')) {
          const m = /^\s*(\S+)\s+toplevelfile\s*$/i.exec(line)
          if (m) names.push(m[1]!)
        }
      }
      for (const name of names) {
        const r = resolveInclude(name, '', '', p => this.exists(p))
        if ('path' in r) return r.path
        this.warn('main-file', `${path} names ${name} as the toplevel file, but it is not in the input`)
      }
    }
    return undefined
  }

  /**
   * Resolve an \input-like command's file for reading, with a warning when it cannot be read
   * (missing, outside the bundle, a cycle, too deep). Marks the file as included.
   */
  openInclude(command: string, target: string | undefined, from: string, mainFile: string, chain: string[], depth: number, offset: number): string | undefined {
    if (!target) {
      this.warn('missing-file', `\\${command} without a file name`, from, offset)
      return undefined
    }
    const r = resolveInclude(target, from, mainFile, p => this.exists(p))
    if ('escapes' in r) {
      this.warn('path-escape', `\\${command}{${target}} points outside the manuscript; it was not read`, from, offset)
      return undefined
    }
    if ('missing' in r) {
      this.warn('missing-file', `\\${command}{${target}}: no such file in the manuscript (tried ${r.missing.join(', ')})`, from, offset)
      return undefined
    }
    if (chain.includes(r.path)) {
      this.warn('include-cycle', `\\${command}{${target}} would read ${r.path} again inside itself (${[...chain, r.path].join(' → ')}); skipped`, from, offset)
      return undefined
    }
    if (depth + 1 > this.limits.maxIncludeDepth) {
      this.warn('limit', `\\${command}{${target}} nests files more than ${this.limits.maxIncludeDepth} deep; skipped`, from, offset)
      return undefined
    }
    if (!this.roles.has(r.path)) this.roles.set(r.path, 'included')
    return r.path
  }

  /**
   * A package or class that ships in the bundle (`mynotes` → mynotes.sty beside the paper), or
   * undefined, silently: packages not in the bundle are ordinary installed ones.
   */
  openPackage(name: string, extension: 'sty' | 'cls', from: string, mainFile: string, chain: string[], depth: number): string | undefined {
    if (!/^[A-Za-z0-9@_.\-/]+$/.test(name)) return undefined
    const r = resolveInclude(`${name}.${extension}`, from, mainFile, p => this.exists(p))
    if (!('path' in r) || chain.includes(r.path) || depth + 1 > this.limits.maxIncludeDepth) return undefined
    if (!this.roles.has(r.path)) this.roles.set(r.path, 'included')
    return r.path
  }

  /** Every file of the bundle with its encoding, line count and role, in name order. */
  fileInfo(): ReadFileInfo[] {
    return Object.keys(this.files).sort().map((path) => {
      const f = this.loaded.get(path)
      return {
        path,
        encoding: f ? f.encoding : f === null ? 'binary' : decodeGuess(this.files[path]!),
        lines: f ? f.starts.length : 0,
        role: this.roles.get(path) ?? 'unused',
      }
    })
  }
}

function nextContentLine(file: LoadedFile, line: number): number {
  for (let l = line + 1; l <= file.starts.length; l++) {
    const from = file.starts[l - 1]!
    const to = l < file.starts.length ? file.starts[l]! : file.masked.length
    if (file.masked.slice(from, to).trim() !== '') return l
  }
  return line + 1
}

/**
 * Order of several files with \documentclass, best first: one with \begin{document}; one no other
 * candidate \inputs; nearer the bundle root; one that reads more files of the bundle; a usual
 * main-file name (main.tex before ms.tex before paper.tex …); then name order.
 */
function compareMainCandidates(a: MainCandidate, b: MainCandidate): number {
  return (
    Number(b.hasBody) - Number(a.hasBody)
    || Number(a.includedByOther) - Number(b.includedByOther)
    || a.depth - b.depth
    || b.readsFiles - a.readsFiles
    || a.nameRank - b.nameRank
    || a.path.localeCompare(b.path)
  )
}

interface MainCandidate {
  path: string
  hasBody: boolean
  includedByOther: boolean
  depth: number
  readsFiles: number
  nameRank: number
}

function decodeGuess(raw: string | Uint8Array): ReadFileInfo['encoding'] {
  return decodeSource(typeof raw === 'string' ? raw : raw.subarray(0, 4096)).encoding
}
