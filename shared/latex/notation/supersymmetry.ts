/**
 * Supersymmetry stated by the text: "$P$ is supersymmetric in $x_1,\dots,x_k; y_1,\dots,y_k$", or
 * in one display `P \text{ is supersymmetric in } x_1,x_2; y_1,y_2`.
 *
 * Conventions: the statement is a claim only when the polynomial P is written out (a Schubert
 * polynomial, a sum of monomials, …) and both sets are x_1..x_k and y_1..y_k with the same k; the
 * check uses the common definition (shared/math/supersymmetric.ts: symmetric in each set, and free
 * of y_1 after x_1 = −y_1). A letter standing for a polynomial ("$f$ is supersymmetric") is not a
 * value and is listed as not read by the claims stage.
 */
import type { MathNode } from '../math-tree'
import { plainText } from '../math-tree'

const childrenOf = (n: MathNode): MathNode[] => (n.k === 'group' || n.k === 'env' ? n.children : [n])
const TEXT_COMMANDS = new Set(['text', 'textrm', 'mbox', 'textup', 'mathrm'])
const STATEMENT = /^\s*(?:is|are)\s*supersymmetric\s*in\s*$/i // math drops the spaces of \text
const PROSE_AFTER = /^\s*(?:is|are)\s+supersymmetric\s+in\s+\$([^$]{1,200})\$/i

export interface StatedSupersymmetry {
  /** The polynomial the statement is about. */
  polynomial: MathNode[]
  /** k of x_1..x_k; y_1..y_k. */
  k: number
}

/** One set `x_1,\dots,x_k` or `x_1,x_2,x_3` as written (spaces and thin spaces removed): k, or undefined. */
function setSize(text: string, letter: 'x' | 'y'): number | undefined {
  const items = text.split(',').filter(Boolean)
  const index = (item: string): number | undefined => {
    const m = new RegExp(`^${letter}_(?:\\{(\\d+)\\}|(\\d))$`).exec(item)
    return m ? Number(m[1] ?? m[2]) : undefined
  }
  if (items.length === 0 || index(items[0]!) !== 1) return undefined
  let previous = 1
  for (let j = 1; j < items.length; j++) {
    const item = items[j]!
    if (/^\\(?:dots|ldots|cdots|dotsc)$/.test(item)) {
      if (j !== items.length - 2) return undefined
      continue
    }
    const i = index(item)
    const afterDots = j > 0 && /^\\(?:dots|ldots|cdots|dotsc)$/.test(items[j - 1]!)
    if (i === undefined || (afterDots ? i <= previous : i !== previous + 1)) return undefined
    previous = i
  }
  return previous
}

/** `x_1,\dots,x_k; y_1,\dots,y_k`: k when both sets have it, or undefined. */
export function supersymmetricSets(text: string): number | undefined {
  const flat = text.replace(/\\[,;!: ]/g, '').replace(/\s+/g, '')
  const halves = flat.split(';')
  if (halves.length !== 2) return undefined
  const k = setSize(halves[0]!, 'x')
  return k !== undefined && setSize(halves[1]!, 'y') === k ? k : undefined
}

/** Plain LaTeX text of nodes, for the variable sets. */
function nodesText(nodes: readonly MathNode[]): string {
  return nodes.map(n => (n.k === 'ch' ? n.v : n.k === 'cs' ? `\\${n.v}` : n.k === 'group' ? `{${nodesText(n.children)}}` : '?')).join('')
}

/**
 * The statement in one piece of math without a relation: `P \text{ is supersymmetric in } sets`, or
 * (`proseAfter`, the text following inline math) "$P$ is supersymmetric in $sets$".
 */
export function statedSupersymmetry(nodes: MathNode[], proseAfter: string | undefined): StatedSupersymmetry | undefined {
  for (let j = 1; j + 1 < nodes.length; j++) {
    const n = nodes[j]!
    if (n.k !== 'cs' || !TEXT_COMMANDS.has(n.v)) continue
    const arg = nodes[j + 1]!
    if (!STATEMENT.test(plainText(childrenOf(arg)))) continue
    const k = supersymmetricSets(nodesText(nodes.slice(j + 2)))
    return k === undefined ? undefined : { polynomial: nodes.slice(0, j), k }
  }
  if (proseAfter === undefined) return undefined
  const m = PROSE_AFTER.exec(proseAfter)
  const k = m ? supersymmetricSets(m[1]!) : undefined
  return k === undefined ? undefined : { polynomial: nodes, k }
}
