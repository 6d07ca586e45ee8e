/**
 * The reading run: the orchestrator of the reader's stages.
 *
 * Stages, each with a typed hand-off: files (decoded, masked, tagged: `LoadedFile`) → expanded
 * tokens (macros.ts) → math regions (regions.ts: `MathRegion`) → statements (statements.ts:
 * `ReadStatement`) → claims (claims.ts: `Claim`, "not read" entries). This class walks the files
 * in document order and keeps the state that flows through them (macros, bindings, conventions,
 * notation), as TeX does through \input. Content problems become warnings or error claims; only
 * programmer misuse throws.
 */
import type { ReadFileInfo, ReaderWarning, WarningCode } from '../types/claims'
import { axisOfConvention, type ConventionAxis, type ConventionId } from '../types/conventions'
import { decodeSource, lineStarts, positionAt } from './decode'
import { maskSource } from './mask'
import { resolveInclude } from './paths'
import { Tokenizer, type Token } from './tokens'
import { DEFINING_COMMANDS, Expander, ExpansionError, readDefinition, type MacroDefinition } from './macros'
import { isTagComment, parseTag, type NotationObject, type TagDirective } from './tags'
import type { ReaderLimits } from './limits'
import { MATH_ENVIRONMENTS, TABLE_ENVIRONMENTS, collectMath, readEnvName, skipTableArguments, type Closer, type MathRegion } from './regions'
import { textTableGrid } from './tables'
import { ClaimOutput, ClaimReader } from './claims'
import { BindingScopes, SCOPING_ENVIRONMENTS, declaredTheoremNames } from './bindings'

interface LoadedFile {
  path: string
  original: string
  masked: string
  starts: number[]
  encoding: ReadFileInfo['encoding']
  /** Tags attached to a line (skip, claim, use). */
  lineTags: Map<number, TagDirective[]>
  /** Tags that act from their position on (set, means), by offset. */
  events: { offset: number; directive: TagDirective }[]
}

const SECTIONING = new Set(['section', 'subsection', 'chapter', 'part'])
const INCLUDES = new Set(['input', 'include', 'subfile', 'InputIfFileExists'])
const TEX_EXTENSIONS = /\.(tex|ltx|latex)$/i

export class ReaderRun {
  readonly warnings: ReaderWarning[] = []
  private readonly loaded = new Map<string, LoadedFile | null>()
  private readonly roles = new Map<string, ReadFileInfo['role']>()
  private readonly macros = new Map<string, MacroDefinition>()
  private readonly notation = new Map<string, NotationObject>()
  private readonly protectedNames = new Set<string>()
  private readonly bindings = new BindingScopes()
  /** Environments that end the bindings made inside them (see bindings.ts). */
  private readonly scopingEnvironments = new Set(SCOPING_ENVIRONMENTS)
  private readonly conventions = new Map<ConventionAxis, ConventionId>()
  private readonly budget = { produced: 0 }
  private readonly output: ClaimOutput
  private readonly claimReader: ClaimReader
  private totalChars = 0
  private definitionCount = 0
  private mainFile = ''

  constructor(
    private readonly files: Record<string, string | Uint8Array>,
    private readonly limits: ReaderLimits,
  ) {
    this.output = new ClaimOutput(limits.maxClaims, (code, message) => this.warn(code, message))
    this.claimReader = new ClaimReader(this.output, { bindings: this.bindings, notation: this.notation, conventions: this.conventions })
  }

  get claims() {
    return this.output.claims
  }

  get notRead() {
    return this.output.notRead
  }

  warn(code: WarningCode, message: string, file?: string, offset?: number): void {
    const w: ReaderWarning = { code, message }
    if (file !== undefined) {
      w.file = file
      const f = this.loaded.get(file)
      if (f && offset !== undefined) w.line = positionAt(f.starts, offset).line
    }
    this.warnings.push(w)
  }

  /** Decode, mask and index a file once; null when it is binary or over the size budget. */
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

  private readTags(file: LoadedFile, comments: { offset: number; text: string; wholeLine: boolean }[]): void {
    for (const c of comments) {
      if (!isTagComment(c.text)) continue
      const tag = parseTag(c.text)
      for (const e of tag.errors) this.warn('tag', `tag not understood: ${e}`, file.path, c.offset)
      const line = positionAt(file.starts, c.offset).line
      const target = c.wholeLine ? this.nextContentLine(file, line) : line
      for (const d of tag.directives) {
        if (d.type === 'set' || d.type === 'means') file.events.push({ offset: c.offset, directive: d })
        else {
          const list = file.lineTags.get(target) ?? []
          list.push(d)
          file.lineTags.set(target, list)
        }
      }
    }
  }

  private nextContentLine(file: LoadedFile, line: number): number {
    for (let l = line + 1; l <= file.starts.length; l++) {
      const from = file.starts[l - 1]!
      const to = l < file.starts.length ? file.starts[l]! : file.masked.length
      if (file.masked.slice(from, to).trim() !== '') return l
    }
    return line + 1
  }

  /** Choose the root file(s): the configured one, else those with \documentclass, else unincluded .tex files. */
  chooseRoots(main: string | undefined): string[] {
    const paths = Object.keys(this.files).sort()
    if (main !== undefined) {
      if (this.files[main] !== undefined) return [main]
      this.warn('main-file', `the configured main file "${main}" is not in the input; looking for \\documentclass instead`)
    }
    const texPaths = paths.filter(p => TEX_EXTENSIONS.test(p))
    const candidates = texPaths.length ? texPaths : paths.filter(p => !/\.(sty|cls|bib|bbl|png|jpe?g|pdf|eps)$/i.test(p))
    const withClass = candidates.filter(p => {
      const f = this.load(p)
      return !!f && /\\documentclass\b/.test(f.masked) && !/\\documentclass\s*(\[[^\]]*\])?\s*\{subfiles\}/.test(f.masked)
    })
    if (withClass.length === 1) return withClass
    if (withClass.length > 1) {
      const ranked = [...withClass].sort((a, b) => rank(a, this.load(a)) - rank(b, this.load(b)) || a.localeCompare(b))
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
        const r = resolveInclude(m[1]!, p, p, q => this.files[q] !== undefined)
        if ('path' in r) included.add(r.path)
      }
    }
    return candidates.filter(p => !included.has(p))
  }

  run(main: string | undefined): ReadFileInfo[] {
    const roots = this.chooseRoots(main)
    if (!roots.length) this.warn('main-file', 'no LaTeX file in the input')
    for (const root of roots) {
      this.mainFile = root
      this.roles.set(root, 'main')
      this.bindings.clear()
      this.processFile(root, 0, [])
    }
    return Object.keys(this.files).sort().map(path => {
      const f = this.loaded.get(path)
      return {
        path,
        encoding: f ? f.encoding : f === null ? 'binary' : decodeGuess(this.files[path]!),
        lines: f ? f.starts.length : 0,
        role: this.roles.get(path) ?? 'unused',
      }
    })
  }

  private processFile(path: string, depth: number, stack: string[]): void {
    const file = this.load(path)
    if (!file) return
    const x = new Expander(new Tokenizer(file.masked), this.macros, this.protectedNames, this.limits, this.budget)
    for (const name of declaredTheoremNames(file.masked)) this.scopingEnvironments.add(name)
    let nextEvent = 0
    const applyEvents = (upTo: number) => {
      while (nextEvent < file.events.length && file.events[nextEvent]!.offset < upTo) {
        this.applyEvent(file.events[nextEvent++]!.directive)
      }
    }
    const chain = [...stack, path]
    for (;;) {
      let t: Token | undefined
      try {
        t = x.next()
      } catch (e) {
        if (!(e instanceof ExpansionError)) throw e
        this.warn('macro', e.message, path, e.pos)
        x.clearPending()
        continue
      }
      if (!t) break
      applyEvents(t.pos)
      if (t.k === 'par') {
        if (isBlankLineBetween(file.original, t)) this.bindings.endParagraph()
        continue
      }
      if (t.k === 'ch') {
        if (t.v === '$') this.readRegion(file, x, t, { kind: '$' }, false)
        else if (t.v === '$$') this.readRegion(file, x, t, { kind: '$$' }, true)
        continue
      }
      if (t.k !== 'cs') continue
      const name = t.v
      if (DEFINING_COMMANDS.has(name)) this.define(file, x, t)
      else if (name === '[') this.readRegion(file, x, t, { kind: 'cs', name: ']' }, true)
      else if (name === '(') this.readRegion(file, x, t, { kind: 'cs', name: ')' }, false)
      else if (name === 'begin') {
        const env = readEnvName(x)
        if (env && MATH_ENVIRONMENTS.has(env)) {
          if (env.startsWith('alignat')) {
            const arg = x.nextRawNonSpace()
            if (arg && arg.v === '{') x.readGroupBody(arg, t)
          }
          this.readRegion(file, x, t, { kind: 'env', name: env }, env !== 'math')
        } else if (env && TABLE_ENVIRONMENTS.has(env)) this.readTextTable(file, x, t, env)
        else if (env && this.isScoping(env)) this.bindings.openEnvironment(env)
      } else if (name === 'end') {
        const env = readEnvName(x)
        if (env && this.isScoping(env)) this.bindings.closeEnvironment(env)
      } else if (name === 'par') this.bindings.endParagraph()
      else if (SECTIONING.has(name)) this.bindings.clear()
      else if (INCLUDES.has(name)) this.include(file, x, t, depth, chain)
      else if (name === 'usepackage' || name === 'RequirePackage') this.usePackage(file, x, t, depth, chain)
    }
    applyEvents(Infinity)
  }

  /** `example`, `example*`, or a name the paper declared with \\newtheorem. */
  private isScoping(env: string): boolean {
    return this.scopingEnvironments.has(env.replace(/\*$/, ''))
  }

  private applyEvent(d: TagDirective): void {
    if (d.type === 'set') {
      for (const id of d.conventions) this.conventions.set(axisOfConvention(id)!, id)
    } else if (d.type === 'means') {
      this.notation.set(d.macro, d.object)
      this.protectedNames.add(d.macro)
    }
  }

  private define(file: LoadedFile, x: Expander, cmd: Token): void {
    const saved = x.atFileLevel ? x.tokenizer.pos : undefined
    try {
      const def = readDefinition(cmd, x, file.path)
      if (!def) return
      if (this.definitionCount >= this.limits.maxDefinitions) {
        if (this.definitionCount === this.limits.maxDefinitions) {
          this.warn('limit', `more than ${this.limits.maxDefinitions} macro definitions; later ones are ignored`, file.path, cmd.pos)
        }
        this.definitionCount++
        return
      }
      this.definitionCount++
      this.macros.set(def.name, def)
    } catch (e) {
      if (!(e instanceof ExpansionError)) throw e
      this.warn('macro', `${e.message} (definition ignored)`, file.path, e.pos)
      x.clearPending()
      if (saved !== undefined) x.tokenizer.pos = saved
    }
  }

  private readFileArgument(x: Expander, cmd: Token): string | undefined {
    const t = x.nextRawNonSpace()
    if (!t) return undefined
    if (t.k === 'ch' && t.v === '{') {
      const toks = x.readGroupBody(t, cmd)
      return toks.map(u => (u.k === 'cs' ? '\\' + u.v : u.k === 'sp' ? ' ' : u.v)).join('').trim()
    }
    // \input file: characters up to the next space.
    let s = ''
    let u: Token | undefined = t
    while (u && u.k === 'ch' && u.v !== '{' && u.v !== '}') {
      s += u.v
      u = x.nextRaw()
    }
    if (u) x.pushBack([u])
    return s || undefined
  }

  private include(file: LoadedFile, x: Expander, cmd: Token, depth: number, chain: string[]): void {
    let target: string | undefined
    try {
      target = this.readFileArgument(x, cmd)
    } catch (e) {
      if (!(e instanceof ExpansionError)) throw e
      this.warn('syntax', e.message, file.path, e.pos)
      return
    }
    if (!target) {
      this.warn('missing-file', `\\${cmd.v} without a file name`, file.path, cmd.pos)
      return
    }
    const r = resolveInclude(target, file.path, this.mainFile, p => this.files[p] !== undefined)
    if ('escapes' in r) {
      this.warn('path-escape', `\\${cmd.v}{${target}} points outside the manuscript; it was not read`, file.path, cmd.pos)
      return
    }
    if ('missing' in r) {
      this.warn('missing-file', `\\${cmd.v}{${target}}: no such file in the manuscript (tried ${r.missing.join(', ')})`, file.path, cmd.pos)
      return
    }
    if (chain.includes(r.path)) {
      this.warn('include-cycle', `\\${cmd.v}{${target}} would read ${r.path} again inside itself (${[...chain, r.path].join(' → ')}); skipped`, file.path, cmd.pos)
      return
    }
    if (depth + 1 > this.limits.maxIncludeDepth) {
      this.warn('limit', `\\${cmd.v}{${target}} nests files more than ${this.limits.maxIncludeDepth} deep; skipped`, file.path, cmd.pos)
      return
    }
    if (!this.roles.has(r.path)) this.roles.set(r.path, 'included')
    this.processFile(r.path, depth + 1, chain)
  }

  /** \usepackage{mymacros}: read mymacros.sty from the bundle for its definitions. */
  private usePackage(file: LoadedFile, x: Expander, cmd: Token, depth: number, chain: string[]): void {
    try {
      x.readOptional(cmd)
      const arg = this.readFileArgument(x, cmd)
      if (!arg) return
      for (const name of arg.split(',').map(s => s.trim()).filter(Boolean)) {
        const r = resolveInclude(`${name}.sty`, file.path, this.mainFile, p => this.files[p] !== undefined)
        if (!('path' in r) || chain.includes(r.path) || depth + 1 > this.limits.maxIncludeDepth) continue
        if (!this.roles.has(r.path)) this.roles.set(r.path, 'included')
        this.processFile(r.path, depth + 1, chain)
      }
    } catch (e) {
      if (!(e instanceof ExpansionError)) throw e
      this.warn('syntax', e.message, file.path, e.pos)
    }
  }

  /** Collect a piece of math up to its closer and turn it into claims. */
  private readRegion(file: LoadedFile, expander: Expander, open: Token, closer: Closer, display: boolean): void {
    const collected = collectMath(expander, open, closer, this.limits.maxMathTokens)
    const region: MathRegion = {
      file, tokens: collected.tokens, pos: open.pos, end: collected.end, display, env: closer.kind === 'env' ? closer.name : undefined,
    }
    if (collected.failure) this.claimReader.pushErrorClaim(region, collected.failure.message, collected.failure.pos)
    else this.claimReader.readRegion(region)
  }

  /**
   * A tabular or longtable: its rows may be claims (tables.ts). When the table cannot be taken
   * whole (never closed, a runaway macro, inside a macro's expansion), it is read as ordinary
   * text instead, so that nothing in it is lost.
   */
  private readTextTable(file: LoadedFile, expander: Expander, open: Token, env: string): void {
    if (!expander.atFileLevel) return
    const savedPos = expander.tokenizer.pos
    try {
      skipTableArguments(expander, env, open)
    } catch (e) {
      if (!(e instanceof ExpansionError)) throw e
      expander.clearPending()
      expander.tokenizer.pos = savedPos
      return
    }
    // A long table is many pieces of math: it may hold ten times the tokens of one.
    const collected = collectMath(expander, open, { kind: 'env', name: env }, 10 * this.limits.maxMathTokens)
    if (collected.failure) {
      expander.clearPending()
      expander.tokenizer.pos = savedPos
      return
    }
    this.claimReader.readTable(textTableGrid(file, collected.tokens, open.pos, collected.end))
  }
}

/** A paragraph break in the source: a line with nothing on it (not a line holding only a comment). */
function isBlankLineBetween(original: string, token: Token): boolean {
  const lines = original.slice(token.pos, token.end).split('\n')
  return lines.slice(1, -1).some(line => line.trim() === '')
}

function rank(path: string, f: LoadedFile | null): number {
  let score = path.split('/').length * 10
  if (f && /\\begin\s*\{document\}/.test(f.masked)) score -= 100
  if (/^(main|ms|paper|article)\.tex$/i.test(path.split('/').pop() ?? '')) score -= 5
  return score
}

function decodeGuess(raw: string | Uint8Array): ReadFileInfo['encoding'] {
  return decodeSource(typeof raw === 'string' ? raw : raw.subarray(0, 4096)).encoding
}
