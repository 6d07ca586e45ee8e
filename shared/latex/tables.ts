/**
 * Tables: `tabular`/`longtable` in text and `array` in displays, cut into rows and cells, and read
 * as claims when their header says what the cells are.
 *
 * Two shapes are read (see /shared/NOTATION.md, "Tables"):
 * - an index table: one header cell is a bindable letter (`$w$`, `$\lambda$`) and another an
 *   object written in it (`$\mathfrak{S}_w$`, `$s_\lambda(x_1,x_2)$`, `$\#\mathrm{PD}(w)$`); each row
 *   then claims "object at this row's index = this row's cell";
 * - a transposed index table: the letter and the indices in the first row (`$w$ & $132$ & $213$`),
 *   objects written in the letter in the first column; each cell claims "row's object at this
 *   column's index = cell". Every filled cell of the first row must read as an index;
 * - a two-letter table: an object in two letters in the corner (`$c^{(3,2,1)}_{\lambda\mu}$`),
 *   values of one letter as row heads and of the other as column heads; at least one side writes
 *   its letter (`$\mu = (2,1)$`), so that which letter runs along the rows is never guessed. Each
 *   cell claims "corner at this row's and this column's value = cell";
 * - a multiplication table: an empty (or ·, ×) corner, objects as column heads and row heads;
 *   each cell claims "row head · column head = cell".
 * A table whose header names no object Scholium knows yields no claim: it is never guessed at.
 *
 * Conventions: the grid builders are syntactic; `readTable` reads the header and the index cells
 * with the bindings and notation in force (a `ParseContext`), and hands the claims stage steps
 * with the place each claim has in the file.
 */
import type { ContextValue } from '../types/claims'
import { containsObject } from './classify'
import { ParseFail, SideParser, bindableSymbol, readPartition, readPermutation, type ParseContext } from './expression'
import { MathSyntaxError, buildMathTree, isChar, renderNodes, spanOf, splitStatements, type MathNode } from './math-tree'
import type { MathRegion, SourceFile } from './regions'
import type { Token } from './tokens'

export interface TableCell {
  /**
   * The cell as math: all of an `array` cell; for a text cell, the math of a cell that is one
   * `$…$` and nothing else, or a bare index such as `132` or `(2,1)`. Undefined otherwise.
   */
  nodes?: MathNode[]
  /** The inline math of a text cell, read on its own when the cell is not part of a table claim. */
  regions: MathRegion[]
  /** True when the cell holds anything but spaces and rules. */
  filled: boolean
  pos: number
  end: number
}

export interface TableRow {
  cells: TableCell[]
  pos: number
  end: number
}

export interface TableGrid {
  file: SourceFile
  rows: TableRow[]
  pos: number
  end: number
  display: boolean
}

/** One claim a table makes, with its place: the cell it stands in. */
export interface TableStep {
  lhs: MathNode[]
  rhs: MathNode[]
  /** Where the claim is: from the row's first cell used to the value cell. */
  pos: number
  end: number
  /** The LaTeX of the row as written, for the claim's source. */
  source: string
  /** The row's index bound to the header's letter (index tables). */
  bindings?: ReadonlyMap<string, ContextValue>
}

export type TableReading
  = | {
    kind: 'index' | 'multiplication'
    steps: TableStep[]
    /** Rows with math that could not be read (an index that is not a permutation, …). */
    unreadRows: TableRow[]
    /** Cells that are not part of a table claim; their own math is read as usual. */
    otherCells: TableCell[]
  }
  | { kind: 'none' }

// ---------------------------------------------------------------- grids

/** Commands between rows that are not content (rules, longtable heads), with how many arguments they take. */
const ROW_COMMANDS: Record<string, number> = {
  hline: 0, toprule: 0, midrule: 0, bottomrule: 0, hdashline: 0, endhead: 0, endfirsthead: 0, endfoot: 0,
  endlastfoot: 0, addlinespace: 0, cline: 1, cmidrule: 1, noalign: 1, rowcolor: 1, caption: 1, label: 1,
  morecmidrules: 0, specialrule: 3, arrayrulecolor: 1, tabucline: 1,
}
/** Row commands that may take [..] or (..) before their braced arguments. */
const OPTIONAL_ARGUMENTS = new Set(['cmidrule', 'addlinespace', 'rowcolor', 'specialrule'])
const ROW_ENDS = new Set(['\\', 'tabularnewline', 'cr'])

/** Cut the body of a text-mode tabular/longtable into rows and cells. */
export function textTableGrid(file: SourceFile, tokens: Token[], pos: number, end: number): TableGrid {
  const rows: TableRow[] = []
  let cells: Token[][] = []
  let cell: Token[] = []
  let braceDepth = 0
  let envDepth = 0
  let inMath = false
  const endRow = () => {
    cells.push(cell)
    const built = cells.map(cellTokens => textCell(file, cellTokens))
    if (built.some(c => c.filled)) rows.push({ cells: built, pos: built[0]!.pos, end: built[built.length - 1]!.end })
    cells = []
    cell = []
  }
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i]!
    if (token.k === 'ch' && token.v === '{') braceDepth++
    else if (token.k === 'ch' && token.v === '}') braceDepth--
    else if (token.k === 'ch' && token.v === '$') inMath = !inMath
    else if (token.k === 'cs' && token.v === '(') inMath = true
    else if (token.k === 'cs' && token.v === ')') inMath = false
    else if (token.k === 'cs' && token.v === 'begin') envDepth++
    else if (token.k === 'cs' && token.v === 'end') envDepth--
    const atTop = braceDepth === 0 && envDepth === 0 && !inMath
    if (atTop && token.k === 'ch' && token.v === '&') {
      cells.push(cell)
      cell = []
    }
    else if (atTop && token.k === 'cs' && ROW_ENDS.has(token.v)) {
      endRow()
      i = skipRowEndArguments(tokens, i)
    }
    else cell.push(token)
  }
  endRow()
  return { file, rows, pos, end, display: false }
}

/** After `\\`: skip `*` and a `[3pt]` spacing argument; returns the index of the last token skipped. */
function skipRowEndArguments(tokens: Token[], at: number): number {
  let i = at
  const nextNonSpace = (from: number) => {
    let j = from
    while (tokens[j]?.k === 'sp') j++
    return j
  }
  let j = nextNonSpace(i + 1)
  if (tokens[j]?.k === 'ch' && tokens[j]!.v === '*') {
    i = j
    j = nextNonSpace(j + 1)
  }
  if (tokens[j]?.k === 'ch' && tokens[j]!.v === '[') {
    let k = j
    while (k < tokens.length && !(tokens[k]!.k === 'ch' && tokens[k]!.v === ']')) k++
    if (k < tokens.length) i = k
  }
  return i
}

/** Remove rules and other row commands (with their arguments) from a cell's tokens. */
function withoutRowCommands(tokens: Token[]): Token[] {
  const out: Token[] = []
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i]!
    const argumentCount = token.k === 'cs' ? ROW_COMMANDS[token.v] : undefined
    if (argumentCount === undefined) {
      out.push(token)
      continue
    }
    // Optional arguments ([..] and the (..) of \cmidrule), then the braced ones.
    let j = i + 1
    while (OPTIONAL_ARGUMENTS.has(token.v)) {
      while (tokens[j]?.k === 'sp') j++
      const open = tokens[j]
      const close = open?.k === 'ch' ? (open.v === '[' ? ']' : open.v.startsWith('(') ? ')' : undefined) : undefined
      if (!close) break
      while (j < tokens.length && !(tokens[j]!.k === 'ch' && tokens[j]!.v.includes(close))) j++
      j++
    }
    for (let argument = 0; argument < argumentCount; argument++) {
      while (tokens[j]?.k === 'sp') j++
      if (!(tokens[j]?.k === 'ch' && tokens[j]!.v === '{')) break
      let depth = 0
      for (; j < tokens.length; j++) {
        if (tokens[j]!.k === 'ch' && tokens[j]!.v === '{') depth++
        if (tokens[j]!.k === 'ch' && tokens[j]!.v === '}' && --depth === 0) break
      }
      j++
    }
    i = j - 1
  }
  return out
}

/** `\multicolumn{2}{c}{content}`: the content. */
function multicolumnContent(tokens: Token[]): Token[] {
  const start = tokens.findIndex(t => t.k !== 'sp')
  if (start < 0 || !(tokens[start]!.k === 'cs' && tokens[start]!.v === 'multicolumn')) return tokens
  let j = start + 1
  let content: Token[] = []
  for (let argument = 0; argument < 3; argument++) {
    while (tokens[j]?.k === 'sp') j++
    if (!(tokens[j]?.k === 'ch' && tokens[j]!.v === '{')) return tokens
    const from = j + 1
    let depth = 0
    for (; j < tokens.length; j++) {
      if (tokens[j]!.k === 'ch' && tokens[j]!.v === '{') depth++
      if (tokens[j]!.k === 'ch' && tokens[j]!.v === '}' && --depth === 0) break
    }
    content = tokens.slice(from, j)
    j++
  }
  return [...content, ...tokens.slice(j)]
}

/** A bare index written as text in a cell: digits, parentheses, commas. */
const BARE_INDEX = /^[0-9(),[\]]+$/

/** Declarations that only style a cell (`\bfseries $w$`). */
const STYLE_DECLARATIONS = new Set(['bfseries', 'itshape', 'mdseries', 'normalfont', 'centering', 'raggedright', 'raggedleft', 'small', 'footnotesize', 'scriptsize', 'large', 'hfill', 'strut', 'displaystyle'])
/** Commands that style their argument (`\textbf{$w$}`). */
const STYLE_COMMANDS = new Set(['textbf', 'textit', 'emph', 'textrm', 'textsf', 'textup', 'mbox', 'textnormal', 'underline'])

/** A cell without its styling: `\textbf{$w$}` and `\bfseries $w$` are `$w$`. */
function withoutStyle(tokens: Token[]): Token[] {
  let out = tokens.filter(t => !(t.k === 'cs' && STYLE_DECLARATIONS.has(t.v)))
  for (;;) {
    const content = out.filter(t => t.k !== 'sp')
    const [command, open] = content
    const close = content[content.length - 1]
    if (!(command?.k === 'cs' && STYLE_COMMANDS.has(command.v) && open?.k === 'ch' && open.v === '{' && close?.k === 'ch' && close.v === '}')) return out
    // The group must close only at the end.
    let depth = 0
    let closesAtEnd = true
    for (let i = 1; i < content.length; i++) {
      if (content[i]!.k === 'ch' && content[i]!.v === '{') depth++
      if (content[i]!.k === 'ch' && content[i]!.v === '}' && --depth === 0 && i < content.length - 1) closesAtEnd = false
    }
    if (!closesAtEnd) return out
    out = content.slice(2, -1)
  }
}

function textCell(file: SourceFile, raw: Token[]): TableCell {
  const tokens = withoutStyle(multicolumnContent(withoutRowCommands(raw)))
  const content = tokens.filter(t => t.k !== 'sp' && t.k !== 'par')
  const pos = content[0]?.pos ?? raw[0]?.pos ?? 0
  const end = content[content.length - 1]?.end ?? pos
  const regions: MathRegion[] = []
  const outside: Token[] = []
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i]!
    const opensDollar = token.k === 'ch' && token.v === '$'
    const opensParen = token.k === 'cs' && token.v === '('
    if (!opensDollar && !opensParen) {
      if (token.k !== 'sp' && token.k !== 'par') outside.push(token)
      continue
    }
    let j = i + 1
    while (j < tokens.length && !(opensDollar ? tokens[j]!.k === 'ch' && tokens[j]!.v === '$' : tokens[j]!.k === 'cs' && tokens[j]!.v === ')')) j++
    if (j >= tokens.length) {
      outside.push(token)
      continue
    }
    regions.push({ file, tokens: tokens.slice(i + 1, j), pos: token.pos, end: tokens[j]!.end, display: false })
    i = j
  }
  let nodes: MathNode[] | undefined
  try {
    if (regions.length === 1 && outside.length === 0) nodes = buildMathTree(regions[0]!.tokens)
    else if (regions.length === 0 && outside.length > 0 && outside.every(t => t.k === 'ch' && BARE_INDEX.test(t.v))) nodes = buildMathTree(outside)
  }
  catch (e) {
    if (!(e instanceof MathSyntaxError)) throw e
  }
  return { nodes: nodes?.length ? nodes : undefined, regions, filled: content.length > 0, pos, end }
}

/** Commands of an array body that are rules, not content. */
const ARRAY_RULES = new Set(['hline', 'hdashline', 'toprule', 'midrule', 'bottomrule'])

/** Cut an `array` environment of a display into rows and cells. */
export function arrayTableGrid(file: SourceFile, env: MathNode & { k: 'env' }): TableGrid {
  const rows: TableRow[] = []
  let cells: MathNode[][] = [[]]
  const endRow = () => {
    const built = cells.map((nodes) => {
      const span = spanOf(nodes)
      return { nodes: nodes.length ? nodes : undefined, regions: [], filled: nodes.length > 0, pos: span?.pos ?? env.pos, end: span?.end ?? env.pos }
    })
    if (built.some(c => c.filled)) {
      const filled = built.filter(c => c.filled)
      rows.push({ cells: built, pos: filled[0]!.pos, end: filled[filled.length - 1]!.end })
    }
    cells = [[]]
  }
  const children = env.children
  for (let i = 0; i < children.length; i++) {
    const node = children[i]!
    if (node.k === 'cs' && ROW_ENDS.has(node.v)) {
      endRow()
      if (isChar(children[i + 1], '*')) i++
      if (isChar(children[i + 1], '[')) {
        let j = i + 2
        while (j < children.length && !isChar(children[j], ']')) j++
        if (j < children.length) i = j
      }
    }
    else if (isChar(node, '&')) cells.push([])
    else if (node.k === 'cs' && ARRAY_RULES.has(node.v)) continue
    else if (node.k === 'cs' && node.v === 'cline' && children[i + 1]?.k === 'group') i++
    else cells[cells.length - 1]!.push(node)
  }
  endRow()
  return { file, rows, pos: env.pos, end: env.end, display: true }
}

// ---------------------------------------------------------------- reading

/** Corner symbols of a multiplication table. */
const CORNER_COMMANDS = new Set(['cdot', 'times', 'ast', 'star', 'circ', 'bullet', 'odot'])

/** Read a table's header and rows into claims; `none` when the header names no object Scholium knows. */
export function readTable(grid: TableGrid, ctx: ParseContext): TableReading {
  const headerAt = grid.rows.findIndex(row => row.cells.filter(c => c.filled).length >= 2)
  if (headerAt < 0) return { kind: 'none' }
  const header = grid.rows[headerAt]!
  const body = grid.rows.slice(headerAt + 1).filter(row => !sameCells(row, header))
  return readIndexTable(grid, header, body, ctx) ?? readTransposedIndexTable(grid, header, body, ctx) ?? readTwoLetterTable(grid, header, body, ctx)
    ?? readMultiplicationTable(grid, header, body, ctx) ?? { kind: 'none' }
}

function readIndexTable(grid: TableGrid, header: TableRow, body: TableRow[], ctx: ParseContext): TableReading | undefined {
  const indexColumn = header.cells.findIndex(c => !!c.nodes && !!bindableSymbol(c.nodes))
  if (indexColumn < 0) return undefined
  const symbol = bindableSymbol(header.cells[indexColumn]!.nodes!)!
  const valueColumns = header.cells
    .map((cell, column) => ({ cell, column }))
    .filter(({ cell, column }) => column !== indexColumn && !!cell.nodes && mentionsSymbol(cell.nodes, symbol.name))
  if (!valueColumns.length) return undefined

  const rowIndex = (row: TableRow): ContextValue | undefined => {
    const nodes = row.cells[indexColumn]?.nodes
    return nodes ? readIndexValue(nodes, symbol.family, ctx) : undefined
  }
  // A column counts when its header, at the first row's index, is an object Scholium knows.
  const firstIndex = body.map(rowIndex).find(value => value !== undefined)
  if (!firstIndex) return undefined
  const known = valueColumns.filter(({ cell }) => {
    const parsed = SideParser.parseSide(cell.nodes!, { ...ctx, bindings: withBinding(ctx.bindings, symbol.name, firstIndex) })
    return parsed.ok && containsObject(parsed.expr)
  })
  if (!known.length) return undefined
  const knownColumns = new Set(known.map(k => k.column))

  const steps: TableStep[] = []
  const unreadRows: TableRow[] = []
  const otherCells: TableCell[] = [...header.cells.filter((_, column) => column !== indexColumn && !knownColumns.has(column))]
  for (const row of body) {
    const index = rowIndex(row)
    if (!index) {
      if (row.cells.some(c => c.nodes || c.regions.length)) unreadRows.push(row)
      continue
    }
    row.cells.forEach((cell, column) => {
      if (column === indexColumn) return
      if (!knownColumns.has(column) || !cell.nodes || hasRelation(cell.nodes)) {
        otherCells.push(cell)
        return
      }
      const from = row.cells[indexColumn]!
      steps.push({
        lhs: header.cells[column]!.nodes!, rhs: cell.nodes,
        pos: Math.min(from.pos, cell.pos), end: Math.max(from.end, cell.end),
        source: rowSource(grid.file, from, cell),
        bindings: withBinding(ctx.bindings, symbol.name, index),
      })
    })
  }
  return { kind: 'index', steps, unreadRows, otherCells }
}

/** `$w$ & $132$ & $213$` over rows `$\mathfrak{S}_w$ & $x_1+x_2$ & $x_1$`: the index table turned on its side. */
function readTransposedIndexTable(grid: TableGrid, header: TableRow, body: TableRow[], ctx: ParseContext): TableReading | undefined {
  const first = header.cells[0]
  const symbol = first?.nodes ? bindableSymbol(first.nodes) : undefined
  if (!symbol || ctx.bindings.has(symbol.name)) return undefined
  const indices = header.cells.map((cell, column) => (column === 0 || !cell.filled ? undefined : cell.nodes ? readIndexValue(cell.nodes, symbol.family, ctx) : undefined))
  const filled = header.cells.filter((cell, column) => column > 0 && cell.filled).length
  // Every filled head of the first row is an index: a row of anything else is not this shape.
  if (!filled || indices.filter(v => v !== undefined).length !== filled) return undefined
  const firstIndex = indices.find(v => v !== undefined)!
  const isObjectRow = (row: TableRow) => {
    const head = row.cells[0]?.nodes
    if (!head || !mentionsSymbol(head, symbol.name)) return false
    const parsed = SideParser.parseSide(head, { ...ctx, bindings: withBinding(ctx.bindings, symbol.name, firstIndex) })
    return parsed.ok && containsObject(parsed.expr)
  }
  if (!body.some(isObjectRow)) return undefined

  const steps: TableStep[] = []
  const unreadRows: TableRow[] = []
  const otherCells: TableCell[] = []
  for (const row of body) {
    if (!isObjectRow(row)) {
      if (row.cells.some(c => c.nodes || c.regions.length)) unreadRows.push(row)
      continue
    }
    const head = row.cells[0]!
    row.cells.forEach((cell, column) => {
      if (column === 0 || !cell.filled) return
      const index = indices[column]
      if (!index || !cell.nodes || hasRelation(cell.nodes)) {
        otherCells.push(cell)
        return
      }
      steps.push({
        lhs: head.nodes!, rhs: cell.nodes,
        pos: cell.pos, end: cell.end,
        source: `${mathSource(grid.file, head)} = ${mathSource(grid.file, cell)} at ${symbol.name} = ${mathSource(grid.file, header.cells[column]!)}`,
        bindings: withBinding(ctx.bindings, symbol.name, index),
      })
    })
  }
  return { kind: 'index', steps, unreadRows, otherCells }
}

/** A head cell `$\mu = (2,1)$`: the letter and its value's nodes; a bare `$(2,1)$` gives only the value. */
function headValue(nodes: MathNode[] | undefined): { letter?: string, value: MathNode[] } | undefined {
  if (!nodes) return undefined
  const statements = splitStatements(nodes)
  if (statements.length !== 1) return undefined
  const [statement] = statements
  if (statement!.relations.length === 0) return { value: nodes }
  if (statement!.relations.length !== 1 || statement!.relations[0]!.rel !== '=') return undefined
  const symbol = bindableSymbol(statement!.parts[0]!)
  return symbol && statement!.parts[1]!.length ? { letter: symbol.name, value: statement!.parts[1]! } : undefined
}

/** The letters of permutations and partitions a corner mentions that the text has not bound. */
function freeIndexLetters(nodes: MathNode[], ctx: ParseContext, out = new Set<string>()): Set<string> {
  for (const node of nodes) {
    if (node.k === 'group' || node.k === 'env') freeIndexLetters(node.children, ctx, out)
    else {
      const symbol = bindableSymbol([node])
      if (symbol && symbol.family !== 'integer' && !ctx.bindings.has(symbol.name)) out.add(symbol.name)
    }
  }
  return out
}

/**
 * A table of an object in two letters: `$c^{321}_{\lambda\mu}$` in the corner, `$\mu = (2,1)$`
 * heading the columns and `$\lambda = (2,1)$` (or a bare `$(2,1)$`) heading the rows.
 */
function readTwoLetterTable(grid: TableGrid, header: TableRow, body: TableRow[], ctx: ParseContext): TableReading | undefined {
  const corner = header.cells[0]
  if (!corner?.nodes || hasRelation(corner.nodes)) return undefined
  const letters = [...freeIndexLetters(corner.nodes, ctx)]
  if (letters.length !== 2) return undefined
  const columnHeads = header.cells.map((cell, column) => (column === 0 || !cell.filled ? undefined : headValue(cell.nodes)))
  const rowHeads = body.map(row => headValue(row.cells[0]?.nodes))
  const filledColumns = header.cells.filter((cell, column) => column > 0 && cell.filled).length
  if (!filledColumns || columnHeads.filter(h => h).length !== filledColumns || !rowHeads.some(h => h)) return undefined
  // Which letter runs along which side: written on at least one side, the same on every head of it.
  const sideLetter = (heads: ({ letter?: string } | undefined)[]): string | null | undefined => {
    const written = new Set(heads.filter(h => h).map(h => h!.letter ?? ''))
    if (written.size !== 1) return written.size === 0 ? undefined : null
    const [only] = written
    return only === '' ? undefined : only
  }
  const columnWritten = sideLetter(columnHeads)
  const rowWritten = sideLetter(rowHeads)
  if (columnWritten === null || rowWritten === null || (!columnWritten && !rowWritten)) return undefined
  const other = (letter: string) => letters.find(l => l !== letter)
  const columnLetter = columnWritten ?? other(rowWritten!)
  const rowLetter = rowWritten ?? other(columnWritten!)
  if (!columnLetter || !rowLetter || columnLetter === rowLetter || !letters.includes(columnLetter) || !letters.includes(rowLetter)) return undefined
  const familyOf = (letter: string) => bindableSymbol([{ k: letter.startsWith('\\') ? 'cs' : 'ch', v: letter.replace(/^\\/, ''), pos: 0, end: 0 }])!.family
  const columnValues = columnHeads.map(h => (h ? readIndexValue(h.value, familyOf(columnLetter), ctx) : undefined))
  if (columnValues.filter(v => v).length !== filledColumns) return undefined
  const rowValues = rowHeads.map(h => (h ? readIndexValue(h.value, familyOf(rowLetter), ctx) : undefined))
  const bindingsAt = (row: ContextValue, column: ContextValue) => withBinding(withBinding(ctx.bindings, rowLetter, row), columnLetter, column)
  const firstRow = rowValues.find(v => v)
  if (!firstRow) return undefined
  const parsed = SideParser.parseSide(corner.nodes, { ...ctx, bindings: bindingsAt(firstRow, columnValues.find(v => v)!) })
  if (!parsed.ok || !containsObject(parsed.expr)) return undefined

  const steps: TableStep[] = []
  const unreadRows: TableRow[] = []
  const otherCells: TableCell[] = []
  body.forEach((row, r) => {
    const rowValue = rowValues[r]
    if (!rowValue) {
      if (row.cells.some(c => c.nodes || c.regions.length)) unreadRows.push(row)
      return
    }
    const rowHead = row.cells[0]!
    row.cells.forEach((cell, column) => {
      if (column === 0 || !cell.filled) return
      const columnValue = columnValues[column]
      if (!columnValue || !cell.nodes || hasRelation(cell.nodes)) {
        otherCells.push(cell)
        return
      }
      const at = (letter: string, head: TableCell) => `${headValue(head.nodes)!.letter ? '' : `${letter} = `}${mathSource(grid.file, head)}`
      steps.push({
        lhs: corner.nodes!, rhs: cell.nodes,
        pos: cell.pos, end: cell.end,
        source: `${mathSource(grid.file, corner)} = ${mathSource(grid.file, cell)} at ${at(rowLetter, rowHead)}, ${at(columnLetter, header.cells[column]!)}`,
        bindings: bindingsAt(rowValue, columnValue),
      })
    })
  })
  return { kind: 'index', steps, unreadRows, otherCells }
}

function readMultiplicationTable(grid: TableGrid, header: TableRow, body: TableRow[], ctx: ParseContext): TableReading | undefined {
  const corner = header.cells[0]
  if (!corner || (corner.filled && !isCorner(corner.nodes))) return undefined
  const isObject = (nodes: MathNode[] | undefined) => {
    if (!nodes) return false
    const parsed = SideParser.parseSide(nodes, ctx)
    return parsed.ok && containsObject(parsed.expr)
  }
  const columnHeads = header.cells.slice(1)
  if (!columnHeads.length || !columnHeads.every(cell => !cell.filled || isObject(cell.nodes)) || !columnHeads.some(cell => cell.filled)) return undefined
  const rowHeadsKnown = body.filter(row => isObject(row.cells[0]?.nodes))
  if (!rowHeadsKnown.length) return undefined

  const steps: TableStep[] = []
  const unreadRows: TableRow[] = []
  const otherCells: TableCell[] = []
  for (const row of body) {
    const rowHead = row.cells[0]!
    if (!isObject(rowHead.nodes)) {
      if (row.cells.some(c => c.nodes || c.regions.length)) unreadRows.push(row)
      continue
    }
    row.cells.slice(1).forEach((cell, offset) => {
      const columnHead = columnHeads[offset]
      if (!cell.filled) return
      if (!columnHead?.nodes || !cell.nodes || hasRelation(cell.nodes)) {
        otherCells.push(cell)
        return
      }
      steps.push({
        lhs: productOf(rowHead.nodes!, columnHead.nodes),
        rhs: cell.nodes,
        pos: cell.pos, end: cell.end,
        source: `${mathSource(grid.file, rowHead)} \\cdot ${mathSource(grid.file, columnHead)} = ${mathSource(grid.file, cell)}`,
      })
    })
  }
  return { kind: 'multiplication', steps, unreadRows, otherCells }
}

function isCorner(nodes: MathNode[] | undefined): boolean {
  if (!nodes || nodes.length !== 1) return false
  const node = nodes[0]!
  return (node.k === 'cs' && CORNER_COMMANDS.has(node.v)) || isChar(node, '*') || isChar(node, '·')
}

/** `a · b` as nodes: each factor in braces, so that `s_1 + s_2` in a head stays one factor. */
function productOf(left: MathNode[], right: MathNode[]): MathNode[] {
  const group = (nodes: MathNode[]): MathNode => {
    const span = spanOf(nodes)!
    return { k: 'group', children: nodes, pos: span.pos, end: span.end }
  }
  const at = spanOf(left)!.end
  return [group(left), { k: 'cs', v: 'cdot', pos: at, end: at }, group(right)]
}

function readIndexValue(nodes: MathNode[], family: 'permutation' | 'partition' | 'integer', ctx: ParseContext): ContextValue | undefined {
  try {
    if (family === 'permutation') return { kind: 'permutation', perm: readPermutation(nodes, ctx, new Map()) }
    if (family === 'partition') return { kind: 'partition', parts: readPartition(nodes, ctx, new Map()) }
    const text = nodes.map(n => (n.k === 'ch' ? n.v : '?')).join('')
    return /^[0-9]{1,6}$/.test(text) ? { kind: 'integer', value: Number(text) } : undefined
  }
  catch (e) {
    if (e instanceof ParseFail) return undefined
    throw e
  }
}

function withBinding(bindings: ReadonlyMap<string, ContextValue>, name: string, value: ContextValue): Map<string, ContextValue> {
  return new Map(bindings).set(name, value)
}

/** True if the letter (`w`, `\lambda`) occurs anywhere in the nodes. */
function mentionsSymbol(nodes: MathNode[], name: string): boolean {
  return nodes.some((node) => {
    if (node.k === 'group' || node.k === 'env') return mentionsSymbol(node.children, name)
    return node.k === 'cs' ? '\\' + node.v === name : node.v === name
  })
}

/** A cell holding an equation of its own is read as one, not as a table value. */
function hasRelation(nodes: MathNode[]): boolean {
  return splitStatements(nodes).some(statement => statement.relations.length > 0)
}

/** Rows repeating the header (a longtable's head on every page). */
function sameCells(row: TableRow, header: TableRow): boolean {
  const render = (r: TableRow) => r.cells.map(c => (c.nodes ? renderNodes(c.nodes) : c.filled ? '?' : '')).join('&')
  return row.cells.length === header.cells.length && render(row) === render(header)
}

function rowSource(file: SourceFile, from: TableCell, to: TableCell): string {
  return file.original.slice(Math.min(from.pos, to.pos), Math.max(from.end, to.end)).replace(/\s+/g, ' ').trim()
}

/** The math of a cell as written, without its dollars. */
function mathSource(file: SourceFile, cell: TableCell): string {
  const span = cell.nodes ? spanOf(cell.nodes) : undefined
  return span ? file.original.slice(span.pos, span.end).trim() : file.original.slice(cell.pos, cell.end).trim()
}
