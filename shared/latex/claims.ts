/**
 * Stage "claims": statements turned into claims, bindings and "not read" entries.
 *
 * Conventions: one `ClaimReader` per reading run. It reads each side with the bindings, notation and
 * conventions in force at that point of the document (the orchestrator keeps them in document
 * order) and asks the precision rules (precision.ts) whether a step is a claim at all. What it
 * produces goes to a `ClaimOutput`, which numbers claims and applies the claim limit.
 */
import type { Claim, ClaimKind, ContextValue, GrassmannianSetting, NotReadMath, WarningCode } from '../types/claims'
import { axisOfConvention, type ConventionAxis, type ConventionId } from '../types/conventions'
import { positionAt } from './decode'
import { renderTokens } from './tokens'
import type { NotationObject, TagDirective } from './tags'
import { MathSyntaxError, buildMathTree, renderNodes, spanOf, type MathNode, type Statement } from './math-tree'
import { SideParser, bindableSymbol, readPartition, readPermutation, ParseFail, type ParseContext, type SideResult } from './expression'
import { classifyClaim, containsObject, exprTypes } from './classify'
import { isDefiningLeadIn, judgeStep, proseBefore, shortReason, surroundingsOf, type Surroundings } from './precision'
import type { MathRegion, SourceFile } from './regions'
import { readStatements, type ReadStatement } from './statements'
import type { BindingScopes } from './bindings'
import { arrayTableGrid, readTable, type TableGrid } from './tables'
import { isSpaceBinding, settingForClaim } from './notation/grassmannian'
import { readCompositionBinding } from './notation/k-theory'
import type { ChernFamily } from './notation/back-stable'
import { statedSupersymmetry, type StatedSupersymmetry } from './notation/supersymmetry'

/** A line that shows its content on some slides only: `\only<2>{`, `\uncover<3->{`, `\item<2->`, `\onslide<2>`. */
const OVERLAY_LINE = /\\(only|uncover|onslide|visible|item|alt)\s*<[^>\n]{1,16}>/

/** Claims and not-read entries of a run, numbered and bounded by the claim limit. */
export class ClaimOutput {
  readonly claims: Claim[] = []
  readonly notRead: NotReadMath[] = []
  private readonly claimsPerLine = new Map<string, number>()
  private claimLimitWarned = false

  constructor(
    private readonly maxClaims: number,
    private readonly warn: (code: WarningCode, message: string) => void,
  ) {}

  /**
   * Add a claim; its id is `file:line:n`, n counting the claims that start on that line. Given the
   * file, a claim on a beamer overlay line that repeats one of the 40 lines before is dropped.
   */
  pushClaim(claim: Omit<Claim, 'id'>, file?: SourceFile): void {
    if (file && this.repeatsOnOverlay(claim, file)) return
    if (this.claims.length >= this.maxClaims) {
      if (!this.claimLimitWarned) this.warn('limit', `more than ${this.maxClaims} claims; later ones are dropped`)
      this.claimLimitWarned = true
      return
    }
    const lineKey = `${claim.file}:${claim.line}`
    const count = (this.claimsPerLine.get(lineKey) ?? 0) + 1
    this.claimsPerLine.set(lineKey, count)
    this.claims.push({ id: `${lineKey}:${count}`, ...claim })
  }

  /** `\only<2>{…}` showing again what `\only<1>{…}` showed: same source, question and bindings, on an overlay line. */
  private repeatsOnOverlay(claim: Omit<Claim, 'id'>, file: SourceFile): boolean {
    const text = file.original.slice(file.starts[claim.line - 1] ?? 0, file.starts[claim.line] ?? file.original.length)
    if (!OVERLAY_LINE.test(text)) return false
    const same = (other: Claim) => other.file === claim.file && other.source === claim.source && Math.abs(other.line - claim.line) < 40
      && JSON.stringify(other.question) === JSON.stringify(claim.question) && JSON.stringify(other.context) === JSON.stringify(claim.context)
    for (let j = this.claims.length - 1; j >= 0 && j >= this.claims.length - 50; j--) if (same(this.claims[j]!)) return true
    return false
  }

  /** Add math the reader did not understand; beamer overlays repeat the same math, so it is listed once. */
  pushNotRead(file: SourceFile, pos: number, end: number, reason: string): void {
    const line = positionAt(file.starts, pos).line
    const source = excerpt(file.original.slice(pos, end))
    if (this.notRead.some(entry => entry.file === file.path && entry.source === source && Math.abs(entry.line - line) < 40)) return
    if (this.notRead.length >= this.maxClaims) return
    this.notRead.push({ file: file.path, line, source, reason: shortReason(reason) })
  }
}

/** The state of the document at the point being read, kept up to date by the orchestrator. */
export interface ReadingState {
  /** Values bound by the text ("Let $w = 2143$"), with the scopes that end them. */
  bindings: BindingScopes
  /** Macros a tag declared to mean an object. */
  notation: ReadonlyMap<string, NotationObject>
  /** Conventions set by tags so far, one per axis. */
  conventions: ReadonlyMap<ConventionAxis, ConventionId>
  /** Parameters declared by `parameters` tags so far (notation/k-theory.ts). */
  parameters?: ReadonlySet<string>
  /** Chern-class letters declared by `chern` tags so far (notation/back-stable.ts). */
  chern?: ReadonlyMap<string, ChernFamily>
  /** The Grassmannian the text or a tag named, where σ_λ classes live. */
  grassmannian?: () => GrassmannianSetting | undefined
  /** Sees each region's math first, so that math naming a Grassmannian makes it the setting. */
  noteSetting?: (region: MathRegion, tree: MathNode[]) => void
}

/** Where a step sits: its region, its row label and the prose before it. */
interface StepPlace {
  region: MathRegion
  label: string | undefined
  /** Line of the region's opener (a tag there applies to every claim inside). */
  regionLine: number
  /** The prose before inline math introduces a setting or definition ("Setting $x_2 = -y_2$"). */
  definingLeadIn: boolean
  /** What the sentence and paragraph before the region say (letters made general, group or Schur topic). */
  surroundings: Surroundings
}

/** A step whose place is not its sides' (a table row: the header gives the left side). */
interface StepPlacement {
  pos: number
  end: number
  source: string
  bindings?: ReadonlyMap<string, ContextValue>
}

/** One `lhs relation rhs` step of a relation chain. */
interface StepInput {
  place: StepPlace
  lhs: MathNode[]
  rhs: MathNode[]
  relation: Statement['relations'][number]
  /** The step starts with its relation ("&= C"): its line is the relation's. */
  continued: boolean
  /** Kind of the chain's latest claim: later steps of a chain are checked even without objects of their own. */
  chainKind?: ClaimKind
  placement?: StepPlacement
}

const EQUALS = (at: number): Statement['relations'][number] => ({ rel: '=', node: { k: 'ch', v: '=', pos: at, end: at }, name: '=' })
const TABLE_REASONS = {
  unknownHeader: 'a table whose header names no object Scholium knows',
  unreadRow: 'a table row whose index could not be read',
}

export class ClaimReader {
  constructor(
    private readonly output: ClaimOutput,
    private readonly state: ReadingState,
  ) {}

  /** Turn one math region into claims. */
  readRegion(region: MathRegion): void {
    let tree: MathNode[]
    try {
      tree = buildMathTree(region.tokens)
    }
    catch (e) {
      if (!(e instanceof MathSyntaxError)) throw e
      this.pushErrorClaim(region, e.message, e.pos)
      return
    }
    this.state.noteSetting?.(region, tree)
    const regionLine = positionAt(region.file.starts, region.pos).line
    const definingLeadIn = !region.display && isDefiningLeadIn(proseBefore(region.file.masked, region.pos))
    const surroundings = surroundingsOf(region.file.masked, region.pos)
    // One piece of math `P \text{ is supersymmetric in } x_1,x_2; y_1,y_2` (the statements stage would cut it at \text).
    const stated = isOneExpression(tree) ? statedSupersymmetry(tree, undefined) : undefined
    if (stated) {
      const line = positionAt(region.file.starts, region.pos).line
      const endLine = positionAt(region.file.starts, region.end).line
      this.emitSupersymmetry({ region, label: undefined, regionLine, definingLeadIn, surroundings }, stated, tagsFor(region.file, line, endLine, regionLine))
      return
    }
    this.readStatementList(readStatements(tree, region.env), { region, regionLine, definingLeadIn, surroundings })
  }

  /**
   * A table (tabular, longtable, or an array that is a whole display): claims from its rows when
   * its header names an object Scholium knows. Otherwise the math in its cells is read as usual
   * (a cell may hold an equation of its own), and the table is listed as not read.
   */
  readTable(grid: TableGrid): boolean {
    const reading = readTable(grid, this.parseContext())
    if (reading.kind === 'none') {
      for (const row of grid.rows) for (const cell of row.cells) for (const region of cell.regions) this.readRegion(region)
      const rowsWithMath = grid.rows.filter(row => row.cells.filter(cell => cell.nodes || cell.regions.length).length >= 2)
      if (rowsWithMath.length >= 2) this.output.pushNotRead(grid.file, grid.pos, grid.end, TABLE_REASONS.unknownHeader)
      return false
    }
    const region: MathRegion = { file: grid.file, tokens: [], pos: grid.pos, end: grid.end, display: grid.display }
    const surroundings = surroundingsOf(grid.file.masked, grid.pos)
    // In document order: the table's claims, its unread rows, and the math of its other cells.
    const actions: { pos: number, run: () => void }[] = [
      ...reading.steps.map(step => ({
        pos: step.pos,
        run: () => {
          const place: StepPlace = { region, label: undefined, regionLine: positionAt(grid.file.starts, step.pos).line, definingLeadIn: false, surroundings }
          this.emitStep({ place, lhs: step.lhs, rhs: step.rhs, relation: EQUALS(step.pos), continued: false, placement: step })
        },
      })),
      ...reading.unreadRows.map(row => ({ pos: row.pos, run: () => this.output.pushNotRead(grid.file, row.pos, row.end, TABLE_REASONS.unreadRow) })),
      ...reading.otherCells.flatMap(cell => cell.regions.map(cellRegion => ({ pos: cellRegion.pos, run: () => this.readRegion(cellRegion) }))),
    ]
    for (const action of actions.sort((a, b) => a.pos - b.pos)) action.run()
    return true
  }

  private parseContext(): ParseContext {
    const setting = this.state.grassmannian?.()
    return {
      bindings: this.state.bindings.visible, notation: this.state.notation,
      ...(this.state.parameters ? { parameters: this.state.parameters } : {}), ...(this.state.chern?.size ? { chern: this.state.chern } : {}),
      ...(setting ? { grassmannian: setting } : {}),
    }
  }

  /** An error claim for a region that could not be read (unclosed, unbalanced, runaway macro). */
  pushErrorClaim(region: MathRegion, message: string, pos: number): void {
    const file = region.file
    const at = positionAt(file.starts, Math.max(region.pos, Math.min(pos, file.original.length)))
    const endAt = positionAt(file.starts, Math.max(region.pos, Math.min(region.end, file.original.length)))
    const source = file.original.slice(region.pos, Math.min(region.end, region.pos + 2000))
    this.output.pushClaim({
      file: file.path, line: at.line, endLine: Math.max(at.line, endAt.line), column: at.column,
      source, expandedSource: renderTokens(region.tokens.slice(0, 2000)), kind: 'unknown', status: 'error',
      reason: message, conventions: this.activeConventions([]), display: region.display,
    })
  }

  /**
   * Statements in order. A relation chain runs through the statements of a display: `&= C` on a
   * new row is checked against the last expression before it, and keeps the chain's kind.
   */
  private readStatementList(statements: ReadStatement[], where: Omit<StepPlace, 'label'>): void {
    // The chain's last expression and kind; undefined after a binding, which ends the chain.
    let chain: { lastSide: MathNode[], kind?: ClaimKind } | undefined
    for (const statement of statements) {
      const place: StepPlace = { ...where, label: statement.label }
      if (statement.array && this.readTable(arrayTableGrid(where.region.file, statement.array))) {
        chain = undefined
        continue
      }
      const lastSide = statement.parts[statement.parts.length - 1]!
      if (statement.continuesChain && chain) {
        const first = this.emitStep({
          place, lhs: chain.lastSide, rhs: statement.parts[1]!, relation: statement.relations[0]!, continued: true, chainKind: chain.kind,
        })
        chain = { lastSide, kind: this.emitChain(place, statement, 1, first ?? chain.kind) }
        continue
      }
      if (this.tryBinding(statement)) {
        chain = undefined
        continue
      }
      chain = { lastSide, kind: this.emitChain(place, statement, 0, undefined) }
    }
  }

  /** The steps of one statement from part `from` on; returns the kind of the chain after them. */
  private emitChain(place: StepPlace, statement: Statement, from: number, chainKind: ClaimKind | undefined): ClaimKind | undefined {
    let kind = chainKind
    for (let index = from; index + 1 < statement.parts.length; index++) {
      if (statement.parts[index]!.length === 0) continue
      const stepKind = this.emitStep({
        place, lhs: statement.parts[index]!, rhs: statement.parts[index + 1]!, relation: statement.relations[index]!, continued: false, chainKind: kind,
      })
      if (stepKind) kind = stepKind
    }
    if (statement.parts.length === 1) this.emitLone(place, statement.parts[0]!)
    return kind
  }

  /** Math without a relation is a claim only when a tag says so. */
  private emitLone(place: StepPlace, nodes: MathNode[]): void {
    const span = spanOf(nodes)
    if (!span) return
    const { region, label } = place
    const file = region.file
    const at = positionAt(file.starts, span.pos)
    const endLine = positionAt(file.starts, span.end).line
    const tags = tagsFor(file, at.line, endLine, place.regionLine)
    const stated = statedSupersymmetry(nodes, region.display ? undefined : file.masked.slice(region.end, region.end + 300))
    if (stated) {
      this.emitSupersymmetry(place, stated, tags)
      return
    }
    const claimTag = tags.find(d => d.type === 'claim') as { kind?: ClaimKind } | undefined
    if (!claimTag) return
    this.output.pushClaim({
      file: file.path, line: at.line, endLine, column: at.column,
      source: file.original.slice(span.pos, span.end), expandedSource: renderNodes(nodes),
      kind: claimTag.kind ?? 'unknown', status: 'unsupported', reason: 'tagged as a claim, but there is no equation to check',
      conventions: this.activeConventions(useIds(tags)), display: region.display, tagged: true,
      ...(label ? { label } : {}),
    })
  }

  /** "$P$ is supersymmetric in $x_1,x_2;y_1,y_2$" (notation/supersymmetry.ts): a claim when P is written out. */
  private emitSupersymmetry(place: StepPlace, stated: StatedSupersymmetry, tags: TagDirective[]): void {
    const { region, label } = place
    const file = region.file
    const span = spanOf(stated.polynomial)
    if (!span) return
    const read = SideParser.parseSide(stated.polynomial, this.parseContext())
    if (!read.ok || (!containsObject(read.expr) && !exprTypes(read.expr).has('variable'))) {
      this.output.pushNotRead(file, span.pos, span.end, read.ok ? 'a stated supersymmetry of a polynomial that is not written out' : read.reason)
      return
    }
    const at = positionAt(file.starts, span.pos)
    const context: Record<string, ContextValue> = Object.fromEntries(read.used)
    const skip = tags.some(d => d.type === 'skip')
    this.output.pushClaim({
      file: file.path, line: at.line, endLine: positionAt(file.starts, span.end).line, column: at.column,
      source: `${sliceTrim(file.original, span)} is supersymmetric in x_1..x_${stated.k}; y_1..y_${stated.k}`,
      expandedSource: renderNodes(stated.polynomial), kind: 'supersymmetry', status: skip ? 'skipped' : 'ready',
      question: { type: 'equality', lhs: { type: 'supersymmetric', arg: read.expr, k: stated.k }, rhs: { type: 'integer', value: '1' } },
      conventions: this.activeConventions(useIds(tags)), display: region.display,
      ...(skip ? { reason: 'a tag asks to skip this claim' } : {}),
      ...(label ? { label } : {}),
      ...(Object.keys(context).length ? { context } : {}),
    })
  }

  /** "Let $w = 3142$": a lone bindable symbol set to a value binds it; true if it did. */
  private tryBinding(statement: Statement): boolean {
    if (statement.parts.length !== 2 || statement.relations[0]!.rel === 'other') return false
    // "X = \mathrm{Gr}(3,7)" names the space; the region's setting scan has already made it the setting.
    if (isSpaceBinding(statement.parts)) return true
    const symbol = bindableSymbol(statement.parts[0]!)
    if (!symbol) return false
    const valueNodes = statement.parts[1]!
    const ctx = this.parseContext()
    try {
      const used = new Map<string, ContextValue>()
      let value: ContextValue
      if (symbol.family === 'permutation') value = { kind: 'permutation', perm: readPermutation(valueNodes, ctx, used) }
      else if (symbol.family === 'partition') {
        value = readCompositionBinding(symbol.name, valueNodes) ?? { kind: 'partition', parts: readPartition(valueNodes, ctx, used) }
      }
      else {
        const text = valueNodes.map(n => (n.k === 'ch' ? n.v : '?')).join('')
        if (!/^[0-9]{1,6}$/.test(text)) return false
        value = { kind: 'integer', value: Number(text) }
      }
      this.state.bindings.bind(symbol.name, value)
      return true
    }
    catch (e) {
      if (e instanceof ParseFail) return false
      throw e
    }
  }

  /** Turn one step into a claim, a not-read entry, or nothing; returns the claim's kind. */
  private emitStep(input: StepInput): ClaimKind | undefined {
    const { place: { region, label, regionLine, definingLeadIn, surroundings }, lhs, rhs, relation, continued, chainKind, placement } = input
    const file = region.file
    const lhsSpan = spanOf(lhs)
    const rhsSpan = spanOf(rhs)
    if (!lhsSpan || !rhsSpan) return undefined
    const anchor = placement ? placement.pos : continued ? relation.node.pos : lhsSpan.pos
    const position = positionAt(file.starts, anchor)
    const endLine = positionAt(file.starts, Math.max((placement?.end ?? rhsSpan.end) - 1, anchor)).line
    const tags = tagsFor(file, position.line, endLine, regionLine)
    const ctx: ParseContext = placement?.bindings ? { ...this.parseContext(), bindings: placement.bindings } : this.parseContext()
    const [lhsRead, rhsRead] = SideParser.parseEquation(lhs, rhs, ctx)
    const claimTag = tags.find(d => d.type === 'claim') as { type: 'claim', kind?: ClaimKind } | undefined
    const skip = tags.some(d => d.type === 'skip')
    if (relation.rel !== '=' && !claimTag) return undefined
    let judgement = judgeStep({ lhs: lhsRead, rhs: rhsRead, lhsNodes: lhs, rhsNodes: rhs, definingLeadIn, inObjectChain: !!chainKind, surroundings })
    if (relation.rel !== '=') judgement = { type: 'unsupported', reason: `the relation ${relation.name} is not checked; only equalities are` }
    else if (judgement.type === 'claim' && lhsRead.ok && rhsRead.ok && settingForClaim(lhsRead.expr, rhsRead.expr, ctx.grassmannian) === 'mixed') {
      judgement = { type: 'notRead', reason: 'σ_λ next to polynomials or other objects (a presentation of the ring?) is not read' }
    }
    if (!claimTag && judgement.type === 'silent') return undefined
    if (!claimTag && judgement.type === 'notRead') {
      if (placement) this.output.pushNotRead(file, placement.pos, placement.end, judgement.reason)
      else this.output.pushNotRead(file, Math.min(lhsSpan.pos, rhsSpan.pos), Math.max(lhsSpan.end, rhsSpan.end), judgement.reason)
      return undefined
    }
    const context: Record<string, ContextValue> = {}
    for (const [name, value] of [...lhsRead.used, ...rhsRead.used]) context[name] = value
    const base = {
      file: file.path, line: position.line, endLine: Math.max(endLine, position.line), column: position.column,
      // Sides that overlap come from one macro call: its text is the claim as written.
      source: placement
        ? placement.source
        : rhsSpan.pos < lhsSpan.end && lhsSpan.pos < rhsSpan.end
          ? sliceTrim(file.original, { pos: Math.min(lhsSpan.pos, rhsSpan.pos), end: Math.max(lhsSpan.end, rhsSpan.end) })
          : `${sliceTrim(file.original, lhsSpan)} = ${sliceTrim(file.original, rhsSpan)}`,
      expandedSource: `${renderNodes(lhs)} = ${renderNodes(rhs)}`,
      conventions: this.activeConventions(useIds(tags)), display: region.display,
      ...(label ? { label } : {}),
      ...(Object.keys(context).length ? { context } : {}),
      ...(claimTag ? { tagged: true } : {}),
    }
    let kind: ClaimKind
    if (judgement.type === 'claim' && lhsRead.ok && rhsRead.ok) {
      const found = settingForClaim(lhsRead.expr, rhsRead.expr, ctx.grassmannian)
      const setting = found === 'mixed' ? undefined : found
      const own = setting ? (setting.ring === 'quantum' ? 'quantumGrassmannian' : 'grassmannian') : classifyClaim(lhsRead.expr, rhsRead.expr)
      // A step of plain numbers ("= 1 + 2") in a chain about ℓ(w) is still about ℓ(w).
      const numbersOnly = own === 'polynomial' && !exprTypes(lhsRead.expr).has('variable') && !exprTypes(rhsRead.expr).has('variable')
      kind = claimTag?.kind ?? (numbersOnly && chainKind ? chainKind : own)
      this.output.pushClaim({
        ...base, kind, status: skip ? 'skipped' : 'ready', question: { type: 'equality', lhs: lhsRead.expr, rhs: rhsRead.expr, ...(setting ? { setting } : {}) },
        ...(skip ? { reason: 'a tag asks to skip this claim' } : {}),
      }, file)
    }
    else {
      kind = claimTag?.kind ?? guessKind(lhsRead, rhsRead)
      const reason = judgement.type === 'unsupported'
        ? judgement.reason
        : judgement.type === 'claim'
          ? 'unreadable'
          : `tagged as a claim, but ${judgement.type === 'notRead' ? judgement.reason : 'it holds no recognised object'}`
      this.output.pushClaim({ ...base, kind, status: skip ? 'skipped' : 'unsupported', reason: shortReason(reason) })
    }
    return kind
  }

  private activeConventions(use: ConventionId[]): ConventionId[] {
    const byAxis = new Map(this.state.conventions)
    for (const id of use) byAxis.set(axisOfConvention(id)!, id)
    return [...byAxis.values()]
  }
}

/** Math with no relation and no row break at its top level. */
function isOneExpression(tree: MathNode[]): boolean {
  return !tree.some(n => (n.k === 'ch' && (n.v === '=' || n.v === '&')) || (n.k === 'cs' && (n.v === '\\' || n.v === 'cr')))
}

/** Tags on the lines of a claim, and on the line of its region's opener. */
function tagsFor(file: SourceFile, line: number, endLine: number, regionLine: number): TagDirective[] {
  const out: TagDirective[] = []
  if (!file.lineTags.size) return out
  const lines = new Set<number>([regionLine])
  for (let l = line; l <= endLine; l++) lines.add(l)
  for (const l of lines) out.push(...(file.lineTags.get(l) ?? []))
  return out
}

/** A short excerpt of LaTeX for the not-read list. */
function excerpt(source: string, max = 120): string {
  const flat = source.replace(/\s+/g, ' ').trim()
  return flat.length <= max ? flat : flat.slice(0, max - 1).trimEnd() + '…'
}

function useIds(tags: TagDirective[]): ConventionId[] {
  return tags.flatMap(d => (d.type === 'use' ? d.conventions : []))
}

function sliceTrim(text: string, span: { pos: number, end: number }): string {
  return text.slice(span.pos, span.end).trim()
}

/** The kind of a claim that could not be read whole: from the side that could. */
function guessKind(lhs: SideResult, rhs: SideResult): ClaimKind {
  if (lhs.ok && rhs.ok) return classifyClaim(lhs.expr, rhs.expr)
  const good = lhs.ok ? lhs : rhs.ok ? rhs : undefined
  if (good && good.ok && containsObject(good.expr)) return classifyClaim(good.expr, good.expr)
  return 'unknown'
}
