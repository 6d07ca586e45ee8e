/**
 * The reading run: files in document order, macros, context, tags, and math turned into claims.
 *
 * Conventions: one `ReaderRun` per call of `readManuscript`; state (macros, bindings, conventions,
 * notation) flows through \input in document order, as in TeX. Content problems become warnings or
 * error claims; only programmer misuse throws.
 */
import type {
  Claim, ClaimKind, ContextValue, NotReadMath, ReadFileInfo, ReaderWarning, WarningCode,
} from '../types/claims'
import { axisOfConvention, type ConventionAxis, type ConventionId } from '../types/conventions'
import { decodeSource, lineStarts, positionAt } from './decode'
import { maskSource } from './mask'
import { resolveInclude } from './paths'
import { Tokenizer, renderTokens, type Token } from './tokens'
import { DEFINING_COMMANDS, Expander, ExpansionError, readDefinition, type MacroDefinition } from './macros'
import { isTagComment, parseTag, type NotationObject, type TagDirective } from './tags'
import {
  MathSyntaxError, buildMathTree, renderNodes, spanOf, splitRows, splitStatements, type MathNode, type Statement,
} from './math-tree'
import { SideParser, bindableSymbol, readPartition, readPermutation, ParseFail, type SideResult } from './expression'
import { classifyClaim, containsObject, exprTypes } from './classify'
import { isDefiningLeadIn, judgeStep, proseBefore, shortReason } from './precision'
import type { ReaderLimits } from './limits'

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

const MATH_ENVIRONMENTS = new Set([
  'equation', 'equation*', 'align', 'align*', 'gather', 'gather*', 'multline', 'multline*', 'flalign', 'flalign*',
  'alignat', 'alignat*', 'eqnarray', 'eqnarray*', 'displaymath', 'math', 'dmath', 'dmath*',
])
/** Environments holding one equation (a \label anywhere in them names every claim inside). */
const SINGLE_EQUATION_ENVS = new Set(['equation', 'equation*', 'multline', 'multline*', 'displaymath', 'dmath', 'dmath*'])
const SECTIONING = new Set(['section', 'subsection', 'chapter', 'part'])
const INCLUDES = new Set(['input', 'include', 'subfile', 'InputIfFileExists'])
const TEX_EXTENSIONS = /\.(tex|ltx|latex)$/i

type Closer = { kind: '$' } | { kind: '$$' } | { kind: 'cs'; name: string } | { kind: 'env'; name: string }

interface Region {
  file: LoadedFile
  tokens: Token[]
  pos: number
  end: number
  display: boolean
  env?: string
}

interface Part {
  nodes: MathNode[]
}

export class ReaderRun {
  readonly claims: Claim[] = []
  readonly warnings: ReaderWarning[] = []
  readonly notRead: NotReadMath[] = []
  private readonly loaded = new Map<string, LoadedFile | null>()
  private readonly roles = new Map<string, ReadFileInfo['role']>()
  readonly macros = new Map<string, MacroDefinition>()
  private readonly notation = new Map<string, NotationObject>()
  private readonly protectedNames = new Set<string>()
  private readonly bindings = new Map<string, ContextValue>()
  private readonly conventions = new Map<ConventionAxis, ConventionId>()
  private readonly budget = { produced: 0 }
  private readonly idCounts = new Map<string, number>()
  private totalChars = 0
  private definitionCount = 0
  private claimLimitWarned = false
  private mainFile = ''

  constructor(
    private readonly files: Record<string, string | Uint8Array>,
    private readonly limits: ReaderLimits,
  ) {}

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
        }
      } else if (SECTIONING.has(name)) this.bindings.clear()
      else if (INCLUDES.has(name)) this.include(file, x, t, depth, chain)
      else if (name === 'usepackage' || name === 'RequirePackage') this.usePackage(file, x, t, depth, chain)
    }
    applyEvents(Infinity)
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
  private readRegion(file: LoadedFile, x: Expander, open: Token, closer: Closer, display: boolean): void {
    const saved = x.atFileLevel ? x.tokenizer.pos : undefined
    const tokens: Token[] = []
    let braces = 0
    let envNest = 0
    let failure: { message: string; pos: number } | undefined
    let expand = true
    let end = open.end
    const what = closer.kind === 'env' ? `\\begin{${closer.name}}` : closer.kind === 'cs' ? (closer.name === ']' ? '\\[' : '\\(') : closer.kind
    for (;;) {
      let u: Token | undefined
      try {
        u = expand ? x.next() : x.nextRaw()
      } catch (e) {
        if (!(e instanceof ExpansionError)) throw e
        failure ??= { message: e.message, pos: e.pos }
        x.clearPending()
        expand = false
        continue
      }
      if (!u) {
        failure = { message: `${what} is never closed`, pos: open.pos }
        if (saved !== undefined) x.tokenizer.pos = saved
        break
      }
      if (u.k === 'ch' && u.v === '{') braces++
      else if (u.k === 'ch' && u.v === '}') braces--
      if (closer.kind === '$' || closer.kind === '$$') {
        if (u.k === 'par') {
          failure = { message: `${what} math is not closed before the end of the paragraph`, pos: open.pos }
          break
        }
        if (u.k === 'ch' && braces <= 0 && (u.v === '$' || u.v === '$$')) {
          if (closer.kind === '$' && u.v === '$$') x.pushBack([{ ...u, v: '$', pos: u.pos + 1 }])
          end = closer.kind === '$' && u.v === '$$' ? u.pos + 1 : u.end
          break
        }
      } else if (closer.kind === 'cs') {
        if (u.k === 'cs' && u.v === closer.name) {
          end = u.end
          break
        }
      } else if (u.k === 'cs' && (u.v === 'end' || u.v === 'begin')) {
        const nameToks: Token[] = []
        const env = readEnvName(x, nameToks)
        if (env === closer.name && u.v === 'begin') envNest++
        if (env === closer.name && u.v === 'end') {
          if (envNest === 0) {
            end = nameToks[nameToks.length - 1]?.end ?? u.end
            break
          }
          envNest--
        }
        tokens.push(u, ...nameToks)
        continue
      }
      tokens.push(u)
      if (tokens.length > this.limits.maxMathTokens) {
        failure = { message: `${what} is not closed within ${this.limits.maxMathTokens} tokens`, pos: open.pos }
        x.clearPending()
        if (saved !== undefined) x.tokenizer.pos = saved
        break
      }
    }
    const region: Region = { file, tokens, pos: open.pos, end, display, env: closer.kind === 'env' ? closer.name : undefined }
    if (failure) {
      this.pushErrorClaim(region, failure.message, failure.pos)
      return
    }
    this.analyzeRegion(region)
  }

  private pushErrorClaim(region: Region, message: string, pos: number): void {
    const file = region.file
    const at = positionAt(file.starts, Math.max(region.pos, Math.min(pos, file.original.length)))
    const endAt = positionAt(file.starts, Math.max(region.pos, Math.min(region.end, file.original.length)))
    const source = file.original.slice(region.pos, Math.min(region.end, region.pos + 2000))
    this.pushClaim({
      file: file.path, line: at.line, endLine: Math.max(at.line, endAt.line), column: at.column,
      source, expandedSource: renderTokens(region.tokens.slice(0, 2000)), kind: 'unknown', status: 'error',
      reason: message, conventions: this.activeConventions([]), display: region.display,
    })
  }

  private pushClaim(c: Omit<Claim, 'id'>): void {
    if (this.claims.length >= this.limits.maxClaims) {
      if (!this.claimLimitWarned) this.warn('limit', `more than ${this.limits.maxClaims} claims; later ones are dropped`)
      this.claimLimitWarned = true
      return
    }
    const key = `${c.file}:${c.line}`
    const n = (this.idCounts.get(key) ?? 0) + 1
    this.idCounts.set(key, n)
    this.claims.push({ id: `${key}:${n}`, ...c })
  }

  private activeConventions(use: ConventionId[]): ConventionId[] {
    const m = new Map(this.conventions)
    for (const id of use) m.set(axisOfConvention(id)!, id)
    return [...m.values()]
  }

  private analyzeRegion(region: Region): void {
    let tree: MathNode[]
    try {
      tree = buildMathTree(region.tokens)
    } catch (e) {
      if (!(e instanceof MathSyntaxError)) throw e
      this.pushErrorClaim(region, e.message, e.pos)
      return
    }
    const rows = splitRows(tree)
    const regionLabel = region.env && SINGLE_EQUATION_ENVS.has(region.env) ? rows.find(r => r.label)?.label : undefined
    const startLine = positionAt(region.file.starts, region.pos).line
    const definingLeadIn = !region.display && isDefiningLeadIn(proseBefore(region.file.masked, region.pos))
    let chain: ChainState | undefined
    for (const row of rows) {
      const label = row.label ?? regionLabel
      const statements = splitStatements(row.nodes)
      statements.forEach((st, j) => {
        const first = st.parts[0]!
        const at = { region, label, startLine, definingLeadIn }
        if (j === 0 && chain && first.length === 0 && st.parts.length > 1) {
          // "&= C" continues the previous row: C is checked against its last expression.
          const step = this.emitStep({ at, lhs: chain.lastSide, rhs: { nodes: st.parts[1]! }, relation: st.relations[0]!, continued: true, chainKind: chain.kind })
          const kind = this.emitChain(at, st, 1, step?.kind ?? chain.kind)
          chain = { lastSide: { nodes: st.parts[st.parts.length - 1]! }, kind: kind.kind, lastStep: kind.lastStep ?? step }
          return
        }
        if (j === 0 && chain && st.parts.length === 1 && (first[0]?.k === 'ch' && (first[0].v === '+' || first[0].v === '-'))) {
          // "& + x_3": a long right-hand side continued on this row. Re-read the last step.
          this.extendLastClaim(chain, first)
          return
        }
        if (this.tryBinding(st)) {
          chain = undefined
          return
        }
        const made = this.emitChain(at, st, 0, undefined)
        chain = { lastSide: { nodes: st.parts[st.parts.length - 1]! }, kind: made.kind, lastStep: made.lastStep }
      })
    }
  }

  /** A right-hand side continued on the next row ("& + x_3"): grow it and redo the step that ended with it. */
  private extendLastClaim(chain: ChainState, extra: MathNode[]): void {
    const step = chain.lastStep
    const matches = !!step && step.rhs.nodes === chain.lastSide.nodes
    chain.lastSide = { nodes: [...chain.lastSide.nodes, ...extra] }
    if (!step || !matches) return
    if (step.claimIndex !== undefined) {
      const old = this.claims[step.claimIndex]
      if (!old || step.claimIndex !== this.claims.length - 1) return
      this.claims.pop()
      const key = `${old.file}:${old.line}`
      this.idCounts.set(key, (this.idCounts.get(key) ?? 1) - 1)
    }
    if (step.notReadIndex !== undefined && step.notReadIndex === this.notRead.length - 1) this.notRead.pop()
    const redone = this.emitStep({ ...step.input, rhs: chain.lastSide, relation: { ...step.input.relation, rel: '=', name: '=' } })
    chain.lastStep = redone
  }

  private emitChain(at: StepPlace, st: Statement, from: number, chainKind: ClaimKind | undefined): { kind?: ClaimKind; lastStep?: EmittedStep } {
    let kind = chainKind
    let lastStep: EmittedStep | undefined
    for (let k = from; k + 1 < st.parts.length; k++) {
      if (st.parts[k]!.length === 0) continue
      lastStep = this.emitStep({ at, lhs: { nodes: st.parts[k]! }, rhs: { nodes: st.parts[k + 1]! }, relation: st.relations[k]!, continued: false, chainKind: kind })
      if (lastStep?.kind) kind = lastStep.kind
    }
    if (st.parts.length === 1) this.emitLone(at.region, st.parts[0]!, at.label, at.startLine)
    return { kind, lastStep }
  }

  /** Math without a relation is a claim only when a tag says so. */
  private emitLone(region: Region, nodes: MathNode[], label: string | undefined, startLine: number): void {
    const span = spanOf(nodes)
    if (!span) return
    const file = region.file
    const at = positionAt(file.starts, span.pos)
    const tags = this.tagsFor(file, at.line, positionAt(file.starts, span.end).line, startLine)
    if (!tags.some(d => d.type === 'claim')) return
    const claimTag = tags.find(d => d.type === 'claim') as { kind?: ClaimKind } | undefined
    this.pushClaim({
      file: file.path, line: at.line, endLine: positionAt(file.starts, span.end).line, column: at.column,
      source: file.original.slice(span.pos, span.end), expandedSource: renderNodes(nodes),
      kind: claimTag?.kind ?? 'unknown', status: 'unsupported', reason: 'tagged as a claim, but there is no equation to check',
      conventions: this.activeConventions(useIds(tags)), display: region.display, tagged: true,
      ...(label ? { label } : {}),
    })
  }

  private tagsFor(file: LoadedFile, line: number, endLine: number, regionLine: number): TagDirective[] {
    const out: TagDirective[] = []
    if (!file.lineTags.size) return out
    const lines = new Set<number>([regionLine])
    for (let l = line; l <= endLine; l++) lines.add(l)
    for (const l of lines) out.push(...(file.lineTags.get(l) ?? []))
    return out
  }

  private tryBinding(st: Statement): boolean {
    if (st.parts.length !== 2 || st.relations[0]!.rel === 'other') return false
    const sym = bindableSymbol(st.parts[0]!)
    if (!sym) return false
    const ctx = { bindings: this.bindings, notation: this.notation }
    try {
      const used = new Map<string, ContextValue>()
      let value: ContextValue
      if (sym.family === 'permutation') value = { kind: 'permutation', perm: readPermutation(st.parts[1]!, ctx, used) }
      else if (sym.family === 'partition') value = { kind: 'partition', parts: readPartition(st.parts[1]!, ctx, used) }
      else {
        const text = st.parts[1]!.map(n => (n.k === 'ch' ? n.v : '?')).join('')
        if (!/^[0-9]{1,6}$/.test(text)) return false
        value = { kind: 'integer', value: Number(text) }
      }
      this.bindings.set(sym.name, value)
      return true
    } catch (e) {
      if (e instanceof ParseFail) return false
      throw e
    }
  }

  private pushNotRead(file: LoadedFile, pos: number, end: number, reason: string): number {
    const line = positionAt(file.starts, pos).line
    const source = excerpt(file.original.slice(pos, end))
    // Beamer overlays repeat the same math: list it once.
    if (this.notRead.some(n => n.file === file.path && n.source === source && Math.abs(n.line - line) < 40)) return -1
    if (this.notRead.length >= this.limits.maxClaims) return -1
    this.notRead.push({ file: file.path, line, source, reason: shortReason(reason) })
    return this.notRead.length - 1
  }

  /** Turn one `lhs rel rhs` step into a claim, a not-read entry, or nothing. */
  private emitStep(input: StepInput): EmittedStep | undefined {
    const { at: { region, label, startLine, definingLeadIn }, lhs, rhs, relation, continued, chainKind } = input
    const file = region.file
    const lspan = spanOf(lhs.nodes)
    const rspan = spanOf(rhs.nodes)
    if (!lspan || !rspan) return undefined
    const anchor = continued ? relation.node.pos : lspan.pos
    const position = positionAt(file.starts, anchor)
    const endLine = positionAt(file.starts, Math.max(rspan.end - 1, anchor)).line
    const tags = this.tagsFor(file, position.line, endLine, startLine)
    const ctx = { bindings: this.bindings, notation: this.notation }
    const [l, r] = SideParser.parseEquation(lhs.nodes, rhs.nodes, ctx)
    const claimTag = tags.find(d => d.type === 'claim') as { type: 'claim'; kind?: ClaimKind } | undefined
    const skip = tags.some(d => d.type === 'skip')
    const emitted: EmittedStep = { input, rhs }
    if (relation.rel !== '=' && !claimTag) return undefined
    let judgement = judgeStep({ lhs: l, rhs: r, lhsNodes: lhs.nodes, rhsNodes: rhs.nodes, definingLeadIn, inObjectChain: !!chainKind })
    if (relation.rel !== '=') judgement = { type: 'unsupported', reason: `the relation ${relation.name} is not checked; only equalities are` }
    if (!claimTag && judgement.type === 'silent') return emitted
    if (!claimTag && judgement.type === 'notRead') {
      const index = this.pushNotRead(file, Math.min(lspan.pos, rspan.pos), Math.max(lspan.end, rspan.end), judgement.reason)
      return index >= 0 ? { ...emitted, notReadIndex: index } : emitted
    }
    const context: Record<string, ContextValue> = {}
    for (const [name, value] of [...l.used, ...r.used]) context[name] = value
    let kind: ClaimKind
    const base = {
      file: file.path, line: position.line, endLine: Math.max(endLine, position.line), column: position.column,
      // Sides that overlap come from one macro call: its text is the claim as written.
      source: rspan.pos < lspan.end && lspan.pos < rspan.end
        ? sliceTrim(file.original, { pos: Math.min(lspan.pos, rspan.pos), end: Math.max(lspan.end, rspan.end) })
        : `${sliceTrim(file.original, lspan)} = ${sliceTrim(file.original, rspan)}`,
      expandedSource: `${renderNodes(lhs.nodes)} = ${renderNodes(rhs.nodes)}`,
      conventions: this.activeConventions(useIds(tags)), display: region.display,
      ...(label ? { label } : {}),
      ...(Object.keys(context).length ? { context } : {}),
      ...(claimTag ? { tagged: true } : {}),
    }
    if (judgement.type === 'claim' && l.ok && r.ok) {
      const own = classifyClaim(l.expr, r.expr)
      // A step of plain numbers ("= 1 + 2") in a chain about ℓ(w) is still about ℓ(w).
      const numbersOnly = own === 'polynomial' && !exprTypes(l.expr).has('variable') && !exprTypes(r.expr).has('variable')
      kind = claimTag?.kind ?? (numbersOnly && chainKind ? chainKind : own)
      this.pushClaim({
        ...base, kind, status: skip ? 'skipped' : 'ready', question: { type: 'equality', lhs: l.expr, rhs: r.expr },
        ...(skip ? { reason: 'a tag asks to skip this claim' } : {}),
      })
    } else {
      kind = claimTag?.kind ?? guessKind(l, r)
      const reason = judgement.type === 'unsupported' ? judgement.reason
        : judgement.type === 'claim' ? 'unreadable'
          : `tagged as a claim, but ${judgement.type === 'notRead' ? judgement.reason : 'it holds no recognised object'}`
      this.pushClaim({ ...base, kind, status: skip ? 'skipped' : 'unsupported', reason: shortReason(reason) })
    }
    return { ...emitted, kind, claimIndex: this.claims.length - 1 }
  }
}

/** Where a step sits: its region, its row label and the prose before it. */
interface StepPlace {
  region: Region
  label: string | undefined
  startLine: number
  definingLeadIn: boolean
}

/** Everything one step needs; kept so that a continued right-hand side can redo the step. */
interface StepInput {
  at: StepPlace
  lhs: Part
  rhs: Part
  relation: Statement['relations'][number]
  /** The step starts with its relation ("&= C"): its line is the relation's. */
  continued: boolean
  /** Kind of the chain's latest claim: later steps of a chain are checked even without objects of their own. */
  chainKind?: ClaimKind
}

/** What a step produced, so the row after it can extend it. */
interface EmittedStep {
  input: StepInput
  rhs: Part
  kind?: ClaimKind
  claimIndex?: number
  notReadIndex?: number
}

/** The running relation chain of a display: its last expression and the step that ended with it. */
interface ChainState {
  lastSide: Part
  kind?: ClaimKind
  lastStep?: EmittedStep
}

/** A short excerpt of LaTeX for the not-read list. */
function excerpt(source: string, max = 120): string {
  const flat = source.replace(/\s+/g, ' ').trim()
  return flat.length <= max ? flat : flat.slice(0, max - 1).trimEnd() + '…'
}

function useIds(tags: TagDirective[]): ConventionId[] {
  return tags.flatMap(d => (d.type === 'use' ? d.conventions : []))
}

function sliceTrim(text: string, span: { pos: number; end: number }): string {
  return text.slice(span.pos, span.end).trim()
}

function guessKind(l: SideResult, r: SideResult): ClaimKind {
  if (l.ok && r.ok) return classifyClaim(l.expr, r.expr)
  const good = l.ok ? l : r.ok ? r : undefined
  if (good && good.ok && containsObject(good.expr)) return classifyClaim(good.expr, good.expr)
  return 'unknown'
}

function readEnvName(x: Expander, into?: Token[]): string | undefined {
  const open = x.nextRawNonSpace()
  if (!open) return undefined
  if (!(open.k === 'ch' && open.v === '{')) {
    x.pushBack([open])
    return undefined
  }
  into?.push(open)
  let name = ''
  for (let i = 0; i < 40; i++) {
    const t = x.nextRaw()
    if (!t) return undefined
    into?.push(t)
    if (t.k === 'ch' && t.v === '}') return name.trim()
    name += t.k === 'cs' ? '\\' + t.v : t.v
  }
  return undefined
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
