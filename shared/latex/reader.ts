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
import type { GrassmannianSetting, ReadFileInfo, ReaderWarning, WarningCode } from '../types/claims'
import { axisOfConvention, type ConventionAxis, type ConventionId } from '../types/conventions'
import { ManuscriptFiles, type LoadedFile } from './files'
import { Tokenizer, type Token } from './tokens'
import { DEFINING_COMMANDS, Expander, ExpansionError, MacroTable, readDefinition } from './macros'
import type { NotationObject, TagDirective } from './tags'
import { splitRows, type MathNode } from './math-tree'
import { proseBefore } from './precision'
import { proseSaysGrassmannian, settingInMath, trailingSetting } from './notation/grassmannian'
import type { ChernFamily } from './notation/back-stable'
import type { ReaderLimits } from './limits'
import { MATH_ENVIRONMENTS, TABLE_ENVIRONMENTS, collectMath, readEnvName, skipTableArguments, type Closer, type MathRegion } from './regions'
import { textTableGrid } from './tables'
import { ClaimOutput, ClaimReader } from './claims'
import { BindingScopes, SCOPING_ENVIRONMENTS, declaredTheoremNames } from './bindings'

const SECTIONING = new Set(['section', 'subsection', 'chapter', 'part'])
const INCLUDES = new Set(['input', 'include', 'subfile', 'InputIfFileExists'])

export class ReaderRun {
  readonly warnings: ReaderWarning[] = []
  /** The FILES stage: loading, roots, includes and packages. */
  readonly sources: ManuscriptFiles
  /** Macros, user environments and theorem-like environment names, as defined so far. */
  readonly macroTable = new MacroTable()
  private readonly notation = new Map<string, NotationObject>()
  /** Parameters declared by `parameters` tags (notation/k-theory.ts). */
  private readonly parameters = new Set<string>()
  /** Chern-class letters declared by `chern` tags (notation/back-stable.ts). */
  private readonly chern = new Map<string, ChernFamily>()
  private readonly protectedNames = new Set<string>()
  private readonly bindings = new BindingScopes()
  /** Environments that end the bindings made inside them (see bindings.ts). */
  private readonly scopingEnvironments = new Set(SCOPING_ENVIRONMENTS)
  private readonly conventions = new Map<ConventionAxis, ConventionId>()
  /**
   * Grassmannian named by the text (ends with its environment or section; null when the text named
   * two, which also hides the tag's) and by a tag (until the next tag).
   */
  private textSetting: { setting: GrassmannianSetting | null, depth: number } | undefined
  private tagSetting: GrassmannianSetting | undefined
  /** Depth of open non-math environments, for the end of a text setting. */
  private envDepth = 0
  private readonly budget = { produced: 0 }
  private readonly output: ClaimOutput
  private readonly claimReader: ClaimReader
  private definitionCount = 0
  private mainFile = ''

  constructor(
    files: Record<string, string | Uint8Array>,
    private readonly limits: ReaderLimits,
  ) {
    this.sources = new ManuscriptFiles(files, limits, (code, message, file, offset) => this.warn(code, message, file, offset))
    this.output = new ClaimOutput(limits.maxClaims, (code, message) => this.warn(code, message))
    this.claimReader = new ClaimReader(this.output, {
      bindings: this.bindings, notation: this.notation, conventions: this.conventions, parameters: this.parameters, chern: this.chern,
      grassmannian: () => this.grassmannian,
      noteSetting: (region, tree) => this.noteSetting(region, tree),
    })
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
      const line = offset === undefined ? undefined : this.sources.lineOf(file, offset)
      if (line !== undefined) w.line = line
    }
    this.warnings.push(w)
  }

  run(main: string | undefined): ReadFileInfo[] {
    const roots = this.sources.chooseRoots(main)
    if (!roots.length) this.warn('main-file', 'no LaTeX file in the input')
    for (const root of roots) {
      this.mainFile = root
      this.sources.roles.set(root, 'main')
      this.bindings.clear()
      this.processFile(root, 0, [])
    }
    return this.sources.fileInfo()
  }

  private processFile(path: string, depth: number, stack: string[]): void {
    const file = this.sources.load(path)
    if (!file) return
    const x = new Expander(new Tokenizer(file.masked), this.macroTable, this.protectedNames, this.limits, this.budget)
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
      }
      catch (e) {
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
        }
        else if (env && TABLE_ENVIRONMENTS.has(env)) this.readTextTable(file, x, t, env)
        else if (env) {
          this.envDepth++
          if (this.isScoping(env)) this.bindings.openEnvironment(env)
        }
      }
      else if (name === 'end') {
        const env = readEnvName(x)
        if (env && !MATH_ENVIRONMENTS.has(env) && !TABLE_ENVIRONMENTS.has(env)) this.endEnvironment()
        if (env && this.isScoping(env)) this.bindings.closeEnvironment(env)
      }
      else if (name === 'par') this.bindings.endParagraph()
      else if (SECTIONING.has(name)) {
        this.bindings.clear()
        this.textSetting = undefined
      }
      else if (INCLUDES.has(name)) this.include(file, x, t, depth, chain)
      else if (name === 'usepackage' || name === 'RequirePackage') this.usePackage(file, x, t, depth, chain, 'sty')
      else if (name === 'documentclass' || name === 'LoadClass') this.usePackage(file, x, t, depth, chain, 'cls')
    }
    applyEvents(Infinity)
  }

  /** A setting made inside an environment ends with it. */
  private endEnvironment(): void {
    this.envDepth = Math.max(0, this.envDepth - 1)
    if (this.textSetting && this.envDepth < this.textSetting.depth) this.textSetting = undefined
  }

  private get grassmannian(): GrassmannianSetting | undefined {
    return this.textSetting ? this.textSetting.setting ?? undefined : this.tagSetting
  }

  /** Math that names a Grassmannian (or a claim followed by "in $H^*(Gr(k,n))$") makes it the setting. */
  private noteSetting(region: MathRegion, tree: MathNode[]): void {
    const named = settingInMath(splitRows(tree).map(r => r.nodes), proseSaysGrassmannian(proseBefore(region.file.masked, region.pos)))
      ?? trailingSetting(region.file.masked, region.end)
    if (named) this.textSetting = { setting: named === 'ambiguous' ? null : named, depth: this.envDepth }
  }

  /** `example`, `example*`, or a name the paper declared with \\newtheorem. */
  private isScoping(env: string): boolean {
    return this.scopingEnvironments.has(env.replace(/\*$/, ''))
  }

  private applyEvent(d: TagDirective): void {
    if (d.type === 'grassmannian') {
      this.tagSetting = d.setting ?? undefined
      this.textSetting = undefined
    }
    else if (d.type === 'set') {
      for (const id of d.conventions) this.conventions.set(axisOfConvention(id)!, id)
    }
    else if (d.type === 'means') {
      this.notation.set(d.macro, d.object)
      this.protectedNames.add(d.macro)
    }
    else if (d.type === 'parameters') {
      for (const name of d.names) this.parameters.add(name)
    }
    else if (d.type === 'chern') {
      this.chern.set(d.letter, d.family)
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
      this.macroTable.add(def)
    }
    catch (e) {
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
    }
    catch (e) {
      if (!(e instanceof ExpansionError)) throw e
      this.warn('syntax', e.message, file.path, e.pos)
      return
    }
    const included = this.sources.openInclude(cmd.v, target, file.path, this.mainFile, chain, depth, cmd.pos)
    if (included) this.processFile(included, depth + 1, chain)
  }

  /** \usepackage{mymacros} or \documentclass{myclass}: read mymacros.sty or myclass.cls from the bundle for its definitions. */
  private usePackage(file: LoadedFile, x: Expander, cmd: Token, depth: number, chain: string[], extension: 'sty' | 'cls'): void {
    try {
      x.readOptional(cmd)
      const arg = this.readFileArgument(x, cmd)
      if (!arg) return
      for (const name of arg.split(',').map(s => s.trim()).filter(Boolean)) {
        const path = this.sources.openPackage(name, extension, file.path, this.mainFile, chain, depth)
        if (path) this.processFile(path, depth + 1, chain)
      }
    }
    catch (e) {
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
    }
    catch (e) {
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
