/**
 * Stage "statements": a math region's tree cut into rows and statements, with the structure a
 * display gives them (row labels, rows that continue the one before).
 *
 * Conventions: this stage is purely syntactic. It does not read objects or bindings; it says which
 * nodes stand on either side of which relation, and whether a statement continues the relation
 * chain of the statement before it (`&= C` on a new row).
 */
import { isChar, plainText, splitRows, splitStatements, type MathNode, type MathRow, type Statement } from './math-tree'
import { SINGLE_EQUATION_ENVS } from './regions'

/** A statement of a display, in reading order. */
export interface ReadStatement extends Statement {
  /** \label of its row, or of its single-equation environment. */
  label?: string
  /** The row starts with a relation (`&= C`): the left side is the last side of the statement before. */
  continuesChain: boolean
  /** The statement is one `array` and nothing else: a table, not an expression (tables.ts). */
  array?: MathNode & { k: 'env' }
}

/** Cut a region's tree into statements. */
export function readStatements(tree: MathNode[], env: string | undefined): ReadStatement[] {
  const rows = joinContinuedRows(splitRows(tree).map(dropRowLabel))
  const regionLabel = env && SINGLE_EQUATION_ENVS.has(env) ? rows.find(row => row.label)?.label : undefined
  const out: ReadStatement[] = []
  for (const row of rows) {
    const label = row.label ?? regionLabel
    splitStatements(row.nodes).filter(statement => !isLabelStatement(statement)).forEach((statement, indexInRow) => {
      const continuesChain = indexInRow === 0 && out.length > 0 && statement.parts[0]!.length === 0 && statement.parts.length > 1
      const only = statement.parts.length === 1 && statement.parts[0]!.length === 1 ? statement.parts[0]![0]! : undefined
      const array = only?.k === 'env' && only.name === 'array' ? only : undefined
      out.push({ ...statement, continuesChain, ...(label ? { label } : {}), ...(array ? { array } : {}) })
    })
  }
  return out
}

// An empty group `{}` at a row's end (`x_1x_2^2 + {} \\`) only makes the sign binary: trimmed too.
const isStatementBreak = (node: MathNode | undefined) => !!node && ((node.k === 'cs' && (node.v === 'quad' || node.v === 'qquad')) || (node.k === 'group' && node.children.length === 0))
const isSign = (node: MathNode | undefined) => isChar(node, '+') || isChar(node, '-')

/** The nodes without \quad or `{}` at either end. */
function trimBreaks(nodes: MathNode[]): MathNode[] {
  let start = 0
  let end = nodes.length
  while (start < end && isStatementBreak(nodes[start])) start++
  while (end > start && isStatementBreak(nodes[end - 1])) end--
  return nodes.slice(start, end)
}

/**
 * Rows that continue one expression become one row: a row ending with `+` or `-` goes on in the
 * next ("x_1x_2^2 + \\ &\quad 3x_1x_2x_3"), and a row starting with one, with no relation before
 * its first break ("& + x_3"), goes on from the row before. A sign written at both ends of the
 * break counts once. The joined row keeps the first row's nodes, so its claim sits at that line.
 */
export function joinContinuedRows(rows: MathRow[]): MathRow[] {
  const out: MathRow[] = []
  let previousEndsWithSign = false
  for (const row of rows) {
    const previous = out[out.length - 1]
    const nodes = trimBreaks(row.nodes)
    const startsWithSign = isSign(nodes[0]) && splitStatements(row.nodes)[0]?.parts.length === 1
    if (previous && (previousEndsWithSign || startsWithSign)) {
      const previousNodes = trimBreaks(previous.nodes)
      const last = previousNodes[previousNodes.length - 1]
      // "a + \\ + b": the sign repeated at the start of the new line is the same sign.
      const repeated = previousEndsWithSign && isSign(nodes[0]) && last!.k === 'ch' && nodes[0]!.k === 'ch' && last!.v === nodes[0]!.v
      out[out.length - 1] = { nodes: [...previousNodes, ...nodes.slice(repeated ? 1 : 0)], label: previous.label ?? row.label }
    }
    else out.push({ ...row, nodes })
    const joined = out[out.length - 1]!.nodes
    previousEndsWithSign = isSign(joined[joined.length - 1])
  }
  return out
}

/**
 * A label in a row's first cell is not part of the claim: `n=1\colon & h_1 - e_1 = 0`,
 * `(a)\ & …`, `\text{(i)} & …`. The first cell counts as a label only when the rest of the row
 * does not start with a relation (`(12) &= …` has a left side, not a label).
 */
export function dropRowLabel(row: MathRow): MathRow {
  const cut = row.alignPoints?.[0]
  if (!cut) return row
  const first = row.nodes.slice(0, cut)
  const rest = row.nodes.slice(cut)
  if (!rest.length || startsWithRelation(rest) || !isRowLabel(first)) return row
  const alignPoints = row.alignPoints!.slice(1).map(point => point - cut)
  return { ...row, nodes: rest, ...(alignPoints.length ? { alignPoints } : { alignPoints: undefined }) }
}

const TEXT_COMMANDS = new Set(['text', 'textup', 'textrm', 'textnormal', 'mathrm', 'textbf', 'textit', 'emph', 'mbox', 'hbox'])

/** `n=1\colon`, `k = 2:`, `(a)`, `(ii)`, `(3)`, `\text{(i)}`, `\text{Case 2:}`. */
function isRowLabel(nodes: MathNode[]): boolean {
  const cell = trimBreaks(nodes)
  const last = cell[cell.length - 1]
  if (!last) return false
  if ((last.k === 'cs' && last.v === 'colon') || isChar(last, ':')) return true
  if (cell.length >= 3 && isChar(cell[0], '(') && isChar(last, ')')) {
    // (a), (ii), (3); not (12) or (213), which may be a cycle or a permutation.
    const text = cell.slice(1, -1).map(node => (node.k === 'ch' ? node.v : '\\')).join('')
    return /^([A-Za-z]{1,4}|[0-9])$/.test(text)
  }
  if (cell.length === 2 && cell[0]!.k === 'cs' && TEXT_COMMANDS.has(cell[0]!.v) && cell[1]!.k === 'group') {
    const words = plainText(cell[1]!.children).trim()
    return /^\([A-Za-z0-9]{1,4}\)$/.test(words) || /:$/.test(words) || /^[A-Za-z0-9]{1,4}[.)]$/.test(words)
  }
  return false
}

function startsWithRelation(nodes: MathNode[]): boolean {
  const statement = splitStatements(nodes)[0]
  return !!statement && statement.parts[0]!.length === 0 && statement.parts.length > 1
}

/** A statement that is only a label ("n=1\colon" before \quad): not math to read. */
function isLabelStatement(statement: Statement): boolean {
  const lastPart = statement.parts[statement.parts.length - 1]!
  const last = lastPart[lastPart.length - 1]
  return !!last && last.k === 'cs' && last.v === 'colon'
}
