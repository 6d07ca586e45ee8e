/**
 * Notation of K-theory, parameters, keys and atoms, read into `Expr` pieces for expression.ts.
 *
 * Conventions (precision first: what is not certain stays unread):
 * - Parameters. `\beta` is the formal parameter `beta` only in a K-theory claim: one that writes
 *   \mathfrak{G} (or a macro declared to mean grothendieck), `\oplus` or `\ominus`. Elsewhere
 *   ("where $\beta$ is a parameter", "we take $\beta = -1$") it stays an unknown symbol, as before.
 *   Other letters (q, t, `\gamma`, …) are parameters only when the paper declares them with a
 *   `parameters` tag; an undeclared letter stays unread. Parameters are never given a value
 *   except by an explicit specialisation in the claim.
 * - `a \oplus b` is a + b + βab, `a \ominus b` is (a − b)/(1 + βb), as in
 *   shared/math/double-grothendieck.ts. A sum mixing ⊕ or ⊖ with + or − at the same level is
 *   ambiguous and is not read; write parentheses.
 * - Specialisation: `X|_{\beta=0}`, `X\big|_{\beta=0}`, `\left. X \right|_{\beta = -1}` give the
 *   parameter an integer value.
 * - Key polynomials `\kappa_{(0,2,1)}`, `\kappa_{021}`, `\kappa_{0,2,1}`, `\kappa_\alpha` (α bound by
 *   "Let $\alpha = (0,2,1)$") and Demazure atoms `\mathcal{A}_{(1,0,2)}`, `\mathcal{A}_\alpha`.
 *   Digits written together are one entry each; for atoms a bare run needs a 0 or three entries
 *   (`\mathcal{A}_{12}` may be a matrix entry). A bare one-digit index (`\kappa_1`, `\mathcal{A}_2`)
 *   reads as the part of a partition or a numbered object, never as a composition: it is not read.
 */
import type { ContextValue } from '../../types/claims'
import { isChar, plainText, splitCommas, type MathNode } from '../math-tree'
import type { NotationObject } from '../tags'

/** What the notation needs from the parser's context. */
export interface KTheoryContext {
  bindings: ReadonlyMap<string, ContextValue>
  notation: ReadonlyMap<string, NotationObject>
  /** Parameters the paper declared with a `parameters` tag (names as in the ring: `q`, `gamma`). */
  parameters?: ReadonlySet<string>
  /** Set by the parser when the claim is a K-theory claim (see the module header). */
  kTheory?: boolean
}

/** Thrown for notation this module recognises but cannot read; expression.ts turns it into a ParseFail. */
export class KTheoryReadError extends Error {}

const childrenOf = (n: MathNode): MathNode[] => (n.k === 'group' || n.k === 'env' ? n.children : [n])
const unwrap = (nodes: MathNode[]): MathNode[] => (nodes.length === 1 && nodes[0]!.k === 'group' ? unwrap(nodes[0]!.children) : nodes)
const isDigit = (n: MathNode | undefined): boolean => !!n && n.k === 'ch' && /^[0-9]$/.test(n.v)

/** True if the nodes hold \mathfrak{G}, a grothendieck macro, \oplus or \ominus anywhere. */
export function hasKTheoryMarker(nodes: readonly MathNode[], ctx: Pick<KTheoryContext, 'notation'>): boolean {
  for (let j = 0; j < nodes.length; j++) {
    const n = nodes[j]!
    if (n.k === 'group' || n.k === 'env') {
      if (hasKTheoryMarker(n.children, ctx)) return true
      continue
    }
    if (n.k !== 'cs') continue
    if (n.v === 'oplus' || n.v === 'ominus') return true
    if (ctx.notation.get(n.v) === 'grothendieck') return true
    if (n.v === 'mathfrak' && nodes[j + 1] && plainText(childrenOf(nodes[j + 1]!)).trim() === 'G') return true
  }
  return false
}

/** The parameter a node names in this claim, or undefined; e.g. `\beta` in a K-theory claim is `beta`. */
export function parameterOf(n: MathNode | undefined, ctx: KTheoryContext): string | undefined {
  if (!n) return undefined
  const name = n.k === 'cs' ? n.v : n.k === 'ch' ? n.v : undefined
  if (name === undefined || !/^[A-Za-z]+$/.test(name)) return undefined
  if (ctx.parameters?.has(name)) return name
  if (n.k === 'cs' && name === 'beta' && ctx.kTheory) return 'beta'
  return undefined
}

/** The formal-group operator a node is, if any. */
export function formalGroupOperator(n: MathNode | undefined): 'oplus' | 'ominus' | undefined {
  return n?.k === 'cs' && (n.v === 'oplus' || n.v === 'ominus') ? n.v : undefined
}

const BAR_SIZES = new Set(['big', 'Big', 'bigg', 'Bigg', 'bigr', 'Bigr', 'biggr', 'Biggr', 'right'])

/**
 * A specialisation suffix at `nodes[at]`: `|_{\beta=0}`, `\big|_{\beta=0}`, `\right|_{\beta=0}`.
 * Returns the parameter, its integer value and the nodes used; undefined when there is none.
 */
export function readSpecialisation(nodes: readonly MathNode[], at: number, ctx: KTheoryContext): { parameter: string, value: string, length: number } | undefined {
  let j = at
  if (nodes[j]?.k === 'cs' && BAR_SIZES.has((nodes[j] as { v: string }).v)) j++
  if (!isChar(nodes[j], '|') || !isChar(nodes[j + 1], '_') || !nodes[j + 2]) return undefined
  const inner = unwrap(childrenOf(nodes[j + 2]!))
  const eq = inner.findIndex(n => isChar(n, '='))
  if (eq !== 1) return undefined
  const parameter = parameterOf(inner[0], ctx)
  if (!parameter) throw new KTheoryReadError(`the specialisation |_{${plainText(inner)}} names no parameter of this claim`)
  const rest = inner.slice(2)
  const negative = isChar(rest[0], '-')
  const digits = negative ? rest.slice(1) : rest
  if (!digits.length || !digits.every(isDigit)) throw new KTheoryReadError(`the value in |_{${plainText(inner)}} is not an integer`)
  const value = (negative ? '-' : '') + digits.map(d => (d as { v: string }).v).join('')
  return { parameter, value: value === '-0' ? '0' : value, length: j + 3 - at }
}

/** Key polynomial or atom at this control sequence: `\kappa` or `\mathcal{A}` followed by a subscript. */
export function keyFamilyAt(nodes: readonly MathNode[], at: number): { family: 'key' | 'atom', length: number } | undefined {
  const n = nodes[at]
  if (n?.k !== 'cs') return undefined
  if (n.v === 'kappa' && isChar(nodes[at + 1], '_')) return { family: 'key', length: 1 }
  if (n.v === 'mathcal' && nodes[at + 1] && plainText(childrenOf(nodes[at + 1]!)).trim() === 'A' && isChar(nodes[at + 2], '_')) return { family: 'atom', length: 2 }
  return undefined
}

const COMPOSITION_SYMBOLS = new Set(['\\alpha', '\\gamma', '\\beta', '\\mu', '\\lambda', '\\nu'])

/**
 * Read a weak composition: `(0,2,1)`, `021`, `0,2,1`, or a bound symbol (a composition, or a partition,
 * which is one). Returns undefined, without a reason, for what is not a composition at all (a bare
 * single digit, letters), so the caller can stay silent.
 */
export function readComposition(sub: MathNode[], ctx: KTheoryContext, used: Map<string, ContextValue>, strict = false): number[] | undefined {
  const ns = unwrap(sub)
  if (ns.length === 1 && ns[0]!.k === 'cs') {
    const name = '\\' + ns[0]!.v
    const bound = ctx.bindings.get(name)
    if (bound?.kind === 'composition' || bound?.kind === 'partition') {
      used.set(name, bound)
      return bound.parts
    }
    if (COMPOSITION_SYMBOLS.has(name)) throw new KTheoryReadError(`composition ${name} is not bound (write "Let $${name} = (0,2,1)$" before the claim)`)
    return undefined
  }
  let inner = ns
  const parenthesised = isChar(inner[0], '(') && isChar(inner[inner.length - 1], ')')
  if (parenthesised) inner = inner.slice(1, -1)
  const items = splitCommas(inner)
  let parts: number[]
  if (items.length === 1) {
    const only = unwrap(items[0]!)
    if (!only.length || !only.every(isDigit)) return undefined
    if (only.length === 1 && !parenthesised) return undefined
    parts = only.map(d => Number((d as { v: string }).v))
    // \mathcal{A}_{12} is as likely a matrix entry as an atom: a bare digit run needs a 0 or three entries.
    if (strict && !parenthesised && parts.length < 3 && !parts.includes(0)) return undefined
  }
  else {
    parts = []
    for (const it of items) {
      const u = unwrap(it)
      if (!u.length || !u.every(isDigit)) return undefined
      parts.push(Number(u.map(d => (d as { v: string }).v).join('')))
    }
  }
  return parts
}

/** The value of a composition binding "Let $\alpha = (0,2,1)$" (two entries or more), or undefined. */
export function readCompositionBinding(name: string, value: MathNode[]): ContextValue | undefined {
  if (name !== '\\alpha' && name !== '\\gamma') return undefined
  try {
    const parts = readComposition(value, { bindings: new Map(), notation: new Map() }, new Map())
    return parts && parts.length > 1 ? { kind: 'composition', parts } : undefined
  }
  catch (e) {
    if (e instanceof KTheoryReadError) return undefined
    throw e
  }
}
