/**
 * Back-stable Schubert polynomials in the reader: `\overleftarrow{\mathfrak{S}}_w`, symmetric
 * functions in the non-positive variables, and Chern-class letters declared by a tag.
 *
 * Conventions (checked by shared/check/back-stable.ts against shared/math/back-stable.ts, which
 * states the published formula): a claim that writes ←S_w lives in Λ(x_{≤0}) ⊗ ℤ[x_1, x_2, …]
 * (and Λ(y_{≤0}) ⊗ ℤ[y_1, …] for ←S_w(x;y), factors x − y). The non-positive variables are
 * written after a symmetric function as `[x_-]`, `(x_-)`, `[x_{-}]`, `(x^-)`, `(x_{\le 0})`,
 * `(x_{\leq 0})` or `(x_0, x_{-1}, \dots)` (the same with y). A symmetric function written with
 * no variables at all in such a claim (`\overleftarrow{\mathfrak{S}}_{213} = s_1 + x_1`) is in
 * the non-positive variables too, as back-stable papers identify Λ with Λ(x_{≤0}).
 * Chern-class letters: the tag `chern c h` (or `chern c e`) makes c_k stand for h_k (or e_k) in
 * x_{≤0}, in back-stable claims only; elsewhere c_k keeps its other readings.
 */
import type { MathNode } from '../math-tree'
import { plainText } from '../math-tree'

export type ChernFamily = 'complete' | 'elementary'

const childrenOf = (n: MathNode): MathNode[] => (n.k === 'group' || n.k === 'env' ? n.children : [n])
const isCh = (n: MathNode | undefined, v: string): boolean => !!n && n.k === 'ch' && n.v === v
const isCs = (n: MathNode | undefined, v: string): boolean => !!n && n.k === 'cs' && n.v === v

/** Number of nodes of `\overleftarrow{\mathfrak{S}}` starting at `at` (2), or undefined. */
export function backStableAt(nodes: readonly MathNode[], at: number): number | undefined {
  if (!isCs(nodes[at], 'overleftarrow')) return undefined
  const arg = nodes[at + 1]
  if (!arg) return undefined
  const inner = childrenOf(arg)
  if (inner.length !== 2 || !isCs(inner[0], 'mathfrak')) return undefined
  return plainText(childrenOf(inner[1]!)).trim() === 'S' ? 2 : undefined
}

/** True if the nodes write a back-stable Schubert polynomial anywhere (groups included). */
export function hasBackStableMarker(nodes: readonly MathNode[]): boolean {
  for (let j = 0; j < nodes.length; j++) {
    const n = nodes[j]!
    if (backStableAt(nodes, j) !== undefined) return true
    if ((n.k === 'group' || n.k === 'env') && hasBackStableMarker(n.children)) return true
  }
  return false
}

/** Plain text of a subscript or superscript, with control sequences as `\name`: `{\le 0}` → `\le0`. */
function scriptText(n: MathNode | undefined): string {
  if (!n) return ''
  return childrenOf(n).map(m => (m.k === 'ch' ? m.v : m.k === 'cs' ? `\\${m.v}` : m.k === 'group' ? scriptText(m) : '?')).join('')
}

const NON_POSITIVE_SUBSCRIPTS = new Set(['-', '\\le0', '\\leq0', '\\leqslant0'])
const DOTS = new Set(['dots', 'ldots', 'cdots', 'dotsc'])

/** `x_-`, `x^-`, `x_{\le 0}`: the letter, or undefined. */
function shortForm(content: readonly MathNode[]): 'x' | 'y' | undefined {
  const [letter, mark, script] = content
  if (content.length !== 3 || !letter || letter.k !== 'ch' || (letter.v !== 'x' && letter.v !== 'y')) return undefined
  const text = scriptText(script)
  if (isCh(mark, '_') && NON_POSITIVE_SUBSCRIPTS.has(text)) return letter.v
  if (isCh(mark, '^') && text === '-') return letter.v
  return undefined
}

/** `x_0, x_{-1}, \dots` (optionally `x_{-2}` before the dots): the letter, or undefined. */
function listForm(content: readonly MathNode[]): 'x' | 'y' | undefined {
  const items: MathNode[][] = [[]]
  for (const n of content) {
    if (isCh(n, ',')) items.push([])
    else items[items.length - 1]!.push(n)
  }
  const last = items[items.length - 1]!
  if (items.length < 3 || last.length !== 1 || last[0]!.k !== 'cs' || !DOTS.has(last[0]!.v)) return undefined
  const letter = items[0]![0]
  if (!letter || letter.k !== 'ch' || (letter.v !== 'x' && letter.v !== 'y')) return undefined
  const named = items.slice(0, -1)
  const ok = named.every((item, j) => item.length === 3 && isCh(item[0], letter.v) && isCh(item[1], '_') && scriptText(item[2]) === (j === 0 ? '0' : `-${j}`))
  return ok ? letter.v : undefined
}

/**
 * The non-positive alphabet written right after a symmetric function, `[x_-]` or `(x_0,x_{-1},\dots)`:
 * its letter and the number of nodes it takes, or undefined.
 */
export function nonPositiveAlphabetAt(nodes: readonly MathNode[], at: number): { set: 'x' | 'y', length: number } | undefined {
  const open = nodes[at]
  const closer = isCh(open, '[') ? ']' : isCh(open, '(') ? ')' : undefined
  if (!closer) return undefined
  for (let j = at + 1; j < nodes.length && j < at + 40; j++) {
    if (!isCh(nodes[j], closer)) continue
    const content = nodes.slice(at + 1, j)
    const set = shortForm(content) ?? listForm(content)
    return set ? { set, length: j - at + 1 } : undefined
  }
  return undefined
}

/** Letters that cannot be declared Chern-class letters (they already name something read). */
const RESERVED_CHERN_LETTERS = new Set(['x', 'y', 'z', 's', 'e', 'h', 'm', 'p', 'q', 'F', 'K', 'C'])

/** The words of a `chern <letter> <h|e>` tag: the directive, or an error message. */
export function chernFromTagWords(words: readonly string[]): { letter: string, family: ChernFamily } | { error: string } {
  const [letter, family] = words
  if (words.length !== 2 || !letter || !family) return { error: '"chern" expects a letter and h or e, e.g. "chern c h"' }
  if (!/^[A-Za-z]$/.test(letter) || RESERVED_CHERN_LETTERS.has(letter)) {
    return { error: `"${letter}" cannot be a Chern-class letter (one letter other than ${[...RESERVED_CHERN_LETTERS].join(', ')})` }
  }
  if (family !== 'h' && family !== 'e') return { error: `"chern ${letter}" needs h or e (c_k = h_k or e_k in x_0, x_{-1}, …), got "${family}"` }
  return { letter, family: family === 'h' ? 'complete' : 'elementary' }
}
