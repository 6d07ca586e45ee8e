/**
 * Grassmannians in the text: which Gr(k,n) a paper's Schubert classes σ_λ live in.
 *
 * Spaces read (k and n integers with 1 ≤ k ≤ n − 1):
 * - `\mathrm{Gr}(2,4)`, `\operatorname{Gr}(2,4)`, `\mathbf{Gr}(2,4)`, `Gr(2,4)`, `\Gr(2,4)` (an
 *   undefined macro), `\mathrm{Gr}(2,\mathbb{C}^4)`, `\mathrm{Gr}_2(\mathbb{C}^4)`;
 * - `G(2,5)`, a bare G, only where it cannot be something else: inside `H^*(…)` or `QH^*(…)`,
 *   after `X =`, or when the prose just before the math says "Grassmannian".
 *
 * A setting (where σ_λ is read, see GrassmannianSetting) comes from math that names one space:
 * `H^*(\mathrm{Gr}(2,4))` (cohomology), `QH^*(\mathrm{Gr}(2,5))` (quantum), `X = \mathrm{Gr}(3,7)`
 * (cohomology, and ∫_X is read), or the space alone ("the Grassmannian $\mathrm{Gr}_2(\mathbb{C}^4)$").
 * Math naming two different spaces, or one space both as H^* and QH^*, ends the setting: we do not
 * guess which one the next claim means. The reader keeps a setting until the end of the
 * environment or section it was made in, or the next setting; a tag (`scholium: in Gr(2,4)`,
 * `scholium: in QH Gr(2,5)`, `scholium: in Sym` to end it) lasts until the next such tag.
 */
import type { Expr, GrassmannianSetting, GrassmannianSpace } from '../../types/claims'
import { isChar, plainText, type MathNode } from '../math-tree'

/** Font commands a paper wraps the name Gr in. */
const NAME_FONTS = new Set(['mathrm', 'operatorname', 'mathbf', 'mathit', 'mathsf', 'text', 'textrm', 'textup', 'rm', 'mathbb'])

const isDigitNode = (n: MathNode | undefined): boolean => !!n && n.k === 'ch' && /^[0-9]$/.test(n.v)
const unwrap = (nodes: MathNode[]): MathNode[] => (nodes.length === 1 && nodes[0]!.k === 'group' ? unwrap(nodes[0]!.children) : nodes)

function integerOf(nodes: MathNode[]): number | undefined {
  const ns = unwrap(nodes)
  if (!ns.length || ns.length > 4 || !ns.every(isDigitNode)) return undefined
  return Number(ns.map(n => (n as { v: string }).v).join(''))
}

/** `\mathbb{C}^4`, `\mathbb C^{4}`, `\CC^4`, `\C^4`: the n of ℂ^n. */
function complexSpaceDimension(nodes: MathNode[]): number | undefined {
  const ns = unwrap(nodes)
  let j = 0
  const head = ns[0]
  if (head?.k === 'cs' && head.v === 'mathbb' && ns[1]) {
    if (plainText(ns[1].k === 'group' ? ns[1].children : [ns[1]]).trim() !== 'C') return undefined
    j = 2
  }
  else if (head?.k === 'cs' && (head.v === 'CC' || head.v === 'C')) j = 1
  else if (isChar(head, 'C')) j = 1
  else return undefined
  if (!isChar(ns[j], '^') || !ns[j + 1] || ns.length !== j + 2) return undefined
  return integerOf(ns[j + 1]!.k === 'group' ? (ns[j + 1] as { children: MathNode[] }).children : [ns[j + 1]!])
}

function space(k: number | undefined, n: number | undefined): GrassmannianSpace | undefined {
  if (k === undefined || n === undefined || k < 1 || k > n - 1) return undefined
  return { k, n }
}

/** The index of the ")" closing the "(" at `open`, or -1. */
function closing(nodes: MathNode[], open: number): number {
  let depth = 0
  for (let j = open; j < nodes.length; j++) {
    if (isChar(nodes[j], '(')) depth++
    else if (isChar(nodes[j], ')') && --depth === 0) return j
  }
  return -1
}

/** `(k,n)` or `(k,\mathbb{C}^n)` starting at `open`. */
function pairAt(nodes: MathNode[], open: number): { space: GrassmannianSpace, end: number } | undefined {
  if (!isChar(nodes[open], '(')) return undefined
  const close = closing(nodes, open)
  if (close < 0) return undefined
  const inner = nodes.slice(open + 1, close)
  const comma = inner.findIndex(m => isChar(m, ','))
  if (comma < 0 || inner.slice(comma + 1).some(m => isChar(m, ','))) return undefined
  const k = integerOf(inner.slice(0, comma))
  const rest = inner.slice(comma + 1)
  const s = space(k, integerOf(rest) ?? complexSpaceDimension(rest))
  return s ? { space: s, end: close + 1 } : undefined
}

/**
 * The Grassmannian named at `nodes[i]`, and the index after it; e.g. the nodes of
 * `\mathrm{Gr}(2,4)` give `{ space: { k: 2, n: 4 }, end: 7 }`. `allowBareG` also reads `G(k,n)`.
 */
export function readGrassmannianSpace(nodes: MathNode[], i: number, allowBareG = false): { space: GrassmannianSpace, end: number } | undefined {
  const n = nodes[i]
  if (!n) return undefined
  let after: number
  if (n.k === 'cs' && NAME_FONTS.has(n.v) && nodes[i + 1]?.k === 'group') {
    const name = plainText((nodes[i + 1] as { children: MathNode[] }).children).trim()
    if (name !== 'Gr') return undefined
    after = i + 2
  }
  else if (n.k === 'cs' && n.v === 'Gr') after = i + 1
  else if (isChar(n, 'G') && isChar(nodes[i + 1], 'r')) after = i + 2
  else if (isChar(n, 'G') && allowBareG && !isChar(nodes[i - 1], '_') && !isChar(nodes[i - 1], '^')) after = i + 1
  else return undefined
  if (isChar(nodes[after], '_') && nodes[after + 1]) {
    // Gr_k(\mathbb{C}^n)
    const k = integerOf(nodes[after + 1]!.k === 'group' ? (nodes[after + 1] as { children: MathNode[] }).children : [nodes[after + 1]!])
    const open = after + 2
    if (!isChar(nodes[open], '(')) return undefined
    const close = closing(nodes, open)
    if (close < 0) return undefined
    const s = space(k, complexSpaceDimension(nodes.slice(open + 1, close)))
    return s ? { space: s, end: close + 1 } : undefined
  }
  return pairAt(nodes, after)
}

/** `H^*(`, `H^{*}(`, `H^\bullet(`, `QH^*(`, `\mathrm{QH}^*(` ending just before `open`: which ring, if any. */
function ringBefore(nodes: MathNode[], open: number): 'cohomology' | 'quantum' | undefined {
  if (!isChar(nodes[open], '(')) return undefined
  const sup = nodes[open - 1]
  if (!sup || !isChar(nodes[open - 2], '^')) return undefined
  const star = sup.k === 'group' ? plainText(sup.children).trim() : sup.k === 'ch' ? sup.v : ''
  const bullet = sup.k === 'cs' ? sup.v === 'bullet' || sup.v === 'ast' : sup.k === 'group' && sup.children.length === 1 && sup.children[0]!.k === 'cs' && ['bullet', 'ast'].includes((sup.children[0] as { v: string }).v)
  if (star !== '*' && !bullet) return undefined
  const head = nodes[open - 3]
  if (isChar(head, 'H')) return isChar(nodes[open - 4], 'Q') ? 'quantum' : 'cohomology'
  if (head?.k === 'group' && nodes[open - 4]?.k === 'cs' && NAME_FONTS.has((nodes[open - 4] as { v: string }).v)) {
    const name = plainText(head.children).trim()
    if (name === 'H') return 'cohomology'
    if (name === 'QH') return 'quantum'
  }
  return undefined
}

interface Mention {
  setting: GrassmannianSetting
}

function collectMentions(nodes: MathNode[], proseSaysGrassmannian: boolean, out: Mention[]): void {
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i]!
    const ring = ringBefore(nodes, i - 1)
    // A bare G is read inside H^*( ), after "X =", or when the prose calls it a Grassmannian.
    const named = isChar(nodes[i - 1], '=') && i === 2 && isNameNode(nodes[0])
    const found = readGrassmannianSpace(nodes, i, proseSaysGrassmannian || ring !== undefined || named)
    if (found) {
      const setting: GrassmannianSetting = { ring: ring ?? 'cohomology', ...found.space }
      if (named) setting.name = nameOf(nodes[0]!)
      out.push({ setting })
      i = found.end - 1
      continue
    }
    if (n.k === 'group' || n.k === 'env') collectMentions(n.children, proseSaysGrassmannian, out)
  }
}

function isNameNode(n: MathNode | undefined): boolean {
  return !!n && ((n.k === 'ch' && /^[A-Za-z]$/.test(n.v)) || (n.k === 'cs' && /^[A-Za-z]+$/.test(n.v) && !NAME_FONTS.has(n.v)))
}

function nameOf(n: MathNode): string {
  return n.k === 'cs' ? '\\' + n.v : (n as { v: string }).v
}

/**
 * What one piece of math says about the setting: a new setting, `'ambiguous'` when it names
 * two different ones (the setting ends), or undefined when it names none.
 * e.g. the tree of `H^*(\mathrm{Gr}(2,4))` gives `{ ring: 'cohomology', k: 2, n: 4 }`.
 */
export function settingInMath(rows: MathNode[][], proseSaysGrassmannian: boolean): GrassmannianSetting | 'ambiguous' | undefined {
  const mentions: Mention[] = []
  for (const row of rows) collectMentions(row, proseSaysGrassmannian, mentions)
  if (!mentions.length) return undefined
  const first = mentions[0]!.setting
  const same = mentions.every(m => m.setting.k === first.k && m.setting.n === first.n)
  if (!same) return 'ambiguous'
  const rings = new Set(mentions.map(m => m.setting.ring))
  if (rings.size > 1) return 'ambiguous'
  const name = mentions.find(m => m.setting.name)?.setting.name
  return { ...first, ...(name ? { name } : {}) }
}

const SPACE_SOURCE = String.raw`(?:\\(?:mathrm|operatorname)\s*\{\s*Gr\s*\}|\\Gr\b|Gr)\s*\(\s*(\d{1,4})\s*,\s*(\d{1,4})\s*\)`
const STAR_SOURCE = String.raw`\^\s*(?:\*|\{\s*\*\s*\}|\\ast\b|\{\s*\\ast\s*\}|\\bullet\b|\{\s*\\bullet\s*\})`
const TRAILING = new RegExp(String.raw`^\s*(?:in|on|inside)\s+\$\s*(?:(Q?H)\s*${STAR_SOURCE}\s*\(\s*${SPACE_SOURCE}\s*\)|${SPACE_SOURCE})\s*\$`)

/**
 * "… $\sigma_1^2 = \sigma_2 + \sigma_{11}$ in $H^*(\mathrm{Gr}(2,4))$": the setting named right
 * after a piece of math (only "in", "on" or "inside" between them), read from the source as
 * written; e.g. `trailingSetting(' in $QH^*(\mathrm{Gr}(2,5))$.', 0)` is the quantum Gr(2,5).
 */
export function trailingSetting(masked: string, end: number): GrassmannianSetting | undefined {
  const m = TRAILING.exec(masked.slice(end, end + 120))
  if (!m) return undefined
  const quantum = m[1] === 'QH'
  const s = m[2] !== undefined ? space(Number(m[2]), Number(m[3])) : space(Number(m[4]), Number(m[5]))
  return s && { ring: quantum ? 'quantum' : 'cohomology', ...s }
}

/** True if the prose before the math calls it a Grassmannian (so a bare `G(2,5)` is one). */
export function proseSaysGrassmannian(prose: string): boolean {
  return /grassmannian/i.test(prose)
}

/** `X = \mathrm{Gr}(3,7)`: a statement that names the space; it sets the setting and is no claim. */
export function isSpaceBinding(parts: MathNode[][]): boolean {
  if (parts.length !== 2) return false
  const [lhs, rhs] = parts as [MathNode[], MathNode[]]
  if (lhs.length !== 1 || !isNameNode(lhs[0])) return false
  const found = readGrassmannianSpace(rhs, 0, true)
  return !!found && found.end === rhs.length
}

/** Reads `in Gr(2,4)`, `in QH Gr(2,5)`, `in Sym` from a tag's words; undefined when it is not that. */
export function settingFromTagWords(text: string): { setting: GrassmannianSetting | null } | { error: string } | undefined {
  const m = /^\s*in\s+(.*)$/i.exec(text)
  if (!m) return undefined
  const rest = m[1]!.trim()
  if (/^(sym|lambda)$/i.test(rest)) return { setting: null }
  const g = /^(?:(QH|H)\s+)?Gr\s*\(\s*(\d{1,4})\s*,\s*(\d{1,4})\s*\)$/i.exec(rest)
  if (!g) return { error: `"in ${rest}": write "in Gr(k,n)", "in QH Gr(k,n)" or "in Sym"` }
  const s = space(Number(g[2]), Number(g[3]))
  if (!s) return { error: `Gr(${g[2]},${g[3]}) needs 1 ≤ k ≤ n − 1` }
  return { setting: { ring: g[1]?.toUpperCase() === 'QH' ? 'quantum' : 'cohomology', ...s } }
}

/** Node types that only make sense in a Grassmannian setting. */
const CLASS_TYPES = new Set<Expr['type']>(['schubertClass', 'quantumParameter'])

function visit(e: Expr, f: (e: Expr) => void): void {
  f(e)
  switch (e.type) {
    case 'add': e.terms.forEach(t => visit(t, f)); break
    case 'multiply': e.factors.forEach(t => visit(t, f)); break
    case 'negate': case 'evaluateAtOnes': case 'dividedDifference': visit(e.arg, f); break
    case 'power': visit(e.base, f); break
    case 'determinant': e.rows.forEach(r => r.forEach(t => visit(t, f))); break
    case 'integral': if (!e.space) visit(e.arg, f); break
    case 'tensor': visit(e.left, f); visit(e.right, f); break
    case 'coproduct': visit(e.arg, f); break
    default: break
  }
}

/**
 * The setting a claim is checked in, or undefined (checked as before, in Λ or in polynomials).
 * A claim takes the setting when it writes σ_λ or q, or when it is a Schur identity in s, e, h
 * without variables ("s_1 s_1 = s_2 + s_{11}" in a Gr(2,4) section is an identity in H*(Gr(2,4)):
 * Λ → H*(Gr(k,n)) is a ring map, so what holds in Λ still holds there). `'mixed'` when σ_λ or q
 * stand next to x_i or other objects ("σ_1 = x_1 + x_2" in a presentation of the ring): such a
 * step is not read.
 */
export function settingForClaim(lhs: Expr, rhs: Expr, setting: GrassmannianSetting | undefined): GrassmannianSetting | 'mixed' | undefined {
  if (!setting) return undefined
  let classes = false
  let symmetric = false
  let other = false
  let tensor = false
  for (const side of [lhs, rhs]) {
    visit(side, (e) => {
      if (CLASS_TYPES.has(e.type)) classes = true
      else if (e.type === 'integral' && !e.space) classes = true
      else if (e.type === 'symmetric') {
        if (e.variableCount === undefined && (e.family === 'schur' || e.family === 'elementary' || e.family === 'complete')) symmetric = true
        else other = true
      }
      else if (e.type === 'tensor' || e.type === 'coproduct') tensor = true
      else if (!['integer', 'add', 'negate', 'multiply', 'power', 'determinant', 'integral', 'grassmannianDegree'].includes(e.type)) other = true
    })
  }
  if (tensor) return undefined
  if (classes) return other ? 'mixed' : setting
  return symmetric && !other ? setting : undefined
}
