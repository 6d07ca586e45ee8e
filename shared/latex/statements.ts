/**
 * Stage "statements": a math region's tree cut into rows and statements, with the structure a
 * display gives them (row labels, rows that continue the one before).
 *
 * Conventions: this stage is purely syntactic. It does not read objects or bindings; it says which
 * nodes stand on either side of which relation, and whether a statement continues the relation
 * chain of the statement before it (`&= C` on a new row).
 */
import { isChar, splitRows, splitStatements, type MathNode, type MathRow, type Statement } from './math-tree'
import { SINGLE_EQUATION_ENVS } from './regions'

/** A statement of a display, in reading order. */
export interface ReadStatement extends Statement {
  /** \label of its row, or of its single-equation environment. */
  label?: string
  /** The row starts with a relation (`&= C`): the left side is the last side of the statement before. */
  continuesChain: boolean
}

/** Cut a region's tree into statements. */
export function readStatements(tree: MathNode[], env: string | undefined): ReadStatement[] {
  const rows = joinContinuedRows(splitRows(tree))
  const regionLabel = env && SINGLE_EQUATION_ENVS.has(env) ? rows.find(row => row.label)?.label : undefined
  const out: ReadStatement[] = []
  for (const row of rows) {
    const label = row.label ?? regionLabel
    splitStatements(row.nodes).forEach((statement, indexInRow) => {
      const continuesChain = indexInRow === 0 && out.length > 0 && statement.parts[0]!.length === 0 && statement.parts.length > 1
      out.push({ ...statement, continuesChain, ...(label ? { label } : {}) })
    })
  }
  return out
}

const isStatementBreak = (node: MathNode | undefined) => !!node && node.k === 'cs' && (node.v === 'quad' || node.v === 'qquad')

/**
 * A row that starts with `+` or `-` and no relation before its first break ("& + x_3") continues
 * the expression of the row before: the two become one row.
 */
export function joinContinuedRows(rows: MathRow[]): MathRow[] {
  const out: MathRow[] = []
  for (const row of rows) {
    const previous = out[out.length - 1]
    let start = 0
    while (isStatementBreak(row.nodes[start])) start++
    const first = row.nodes[start]
    const startsWithSign = isChar(first, '+') || isChar(first, '-')
    if (previous && startsWithSign && splitStatements(row.nodes)[0]?.parts.length === 1) {
      out[out.length - 1] = { nodes: [...previous.nodes, ...row.nodes.slice(start)], label: previous.label ?? row.label }
    } else out.push(row)
  }
  return out
}
