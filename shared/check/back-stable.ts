/**
 * The ring of back-stable claims: Λ(x_{≤0}) ⊗ Λ(y_{≤0}) ⊗ ℤ[x_1, x_2, …; y_1, y_2, …].
 *
 * Conventions: an element is a map from a pair of Schur indices `λ|μ` (partition keys, s_λ in
 * x_0, x_{−1}, … and s_μ in y_0, y_{−1}, …) to its polynomial coefficient in the positive
 * variables. Schur functions are a basis of Λ, so two elements are equal exactly when every
 * coefficient is: no truncation to finitely many non-positive variables is needed. Values of
 * ←S_w come from shared/math/back-stable.ts (Lam–Lee–Shimozono's formula, stated there).
 */
import {
  Permutation, Polynomial, backStableSchubert, doubleBackStableSchubert, monomialLatex, mulChecked, multiplySchurCombinations,
  partitionFromKey, polynomialDifference, type BudgetMeter, type SchurCombination,
} from '../math'
import type { ClaimDiff } from '../types/report'
import { DIFF_LIMIT } from '../types/report'

export type BackStableTerms = Map<string, Polynomial>

const key = (xKey: string, yKey: string): string => `${xKey}|${yKey}`

function put(out: BackStableTerms, k: string, p: Polynomial): void {
  const next = (out.get(k) ?? Polynomial.zero()).add(p)
  if (next.isZero()) out.delete(k)
  else out.set(k, next)
}

/** ←S_w, or ←S_w(x; y) with factors x − y (`negateY`: every y replaced by −y, for the x + y sign). */
export function backStableTerms(w: Permutation, double: boolean, negateY: boolean, meter: BudgetMeter): BackStableTerms {
  const out: BackStableTerms = new Map()
  if (!double) {
    for (const t of backStableSchubert(w, meter)) {
      for (const [lambda, c] of t.symmetric) put(out, key(lambda, ''), t.polynomial.scale(c))
    }
    return out
  }
  for (const t of doubleBackStableSchubert(w, meter)) {
    for (const [lambda, a] of t.xSymmetric) {
      for (const [mu, b] of t.ySymmetric) {
        // s_μ(−y) = (−1)^{|μ|} s_μ(y): s_μ is homogeneous of degree |μ|.
        const sign = negateY && partitionFromKey(mu).reduce((s, p) => s + p, 0) % 2 === 1 ? -1 : 1
        put(out, key(lambda, mu), (negateY ? t.polynomial.negateY() : t.polynomial).scale(mulChecked(mulChecked(a, b), sign)))
      }
    }
  }
  return out
}

/** A symmetric function (Schur basis) in the non-positive x or y variables. */
export function liftSymmetric(schur: SchurCombination, set: 'x' | 'y'): BackStableTerms {
  const out: BackStableTerms = new Map()
  for (const [lambda, c] of schur) put(out, set === 'x' ? key(lambda, '') : key('', lambda), Polynomial.constant(c))
  return out
}

export function liftPolynomial(p: Polynomial): BackStableTerms {
  return p.isZero() ? new Map() : new Map([[key('', ''), p]])
}

/** The polynomial an element is when it has no symmetric part, or undefined. */
export function polynomialPart(t: BackStableTerms): Polynomial | undefined {
  if (t.size === 0) return Polynomial.zero()
  return t.size === 1 && t.has(key('', '')) ? t.get(key('', ''))! : undefined
}

export function addTerms(a: BackStableTerms, b: BackStableTerms, sign: 1 | -1 = 1): BackStableTerms {
  const out = new Map(a)
  for (const [k, p] of b) put(out, k, sign > 0 ? p : p.neg())
  return out
}

export function negateTerms(a: BackStableTerms): BackStableTerms {
  return new Map([...a].map(([k, p]) => [k, p.neg()]))
}

export function multiplyTerms(a: BackStableTerms, b: BackStableTerms, meter: BudgetMeter): BackStableTerms {
  const out: BackStableTerms = new Map()
  for (const [ka, pa] of a) {
    const [xa, ya] = ka.split('|') as [string, string]
    for (const [kb, pb] of b) {
      const [xb, yb] = kb.split('|') as [string, string]
      const poly = pa.mul(pb, meter)
      const xs = multiplySchurCombinations(new Map([[xa, 1]]), new Map([[xb, 1]]), meter)
      const ys = multiplySchurCombinations(new Map([[ya, 1]]), new Map([[yb, 1]]), meter)
      for (const [x, cx] of xs) for (const [y, cy] of ys) put(out, key(x, y), poly.scale(mulChecked(cx, cy)))
    }
  }
  return out
}

function schurLatex(partitionKey: string, set: 'x' | 'y'): string {
  if (partitionKey === '') return ''
  const parts = partitionFromKey(partitionKey)
  return `s_{${parts.join(parts.some(p => p > 9) ? ',' : '')}}(${set}_{\\le 0})`
}

/** LaTeX of one basis element s_λ(x_{≤0}) s_μ(y_{≤0}) x^a y^b. */
function termLatex(k: string, x: readonly number[], y: readonly number[]): string {
  const [xKey, yKey] = k.split('|') as [string, string]
  const parts = [schurLatex(xKey, 'x'), schurLatex(yKey, 'y'), monomialLatex(x, y)].filter(Boolean)
  return parts.join('\\,') || '1'
}

/** An element in LaTeX, cut after `maxTerms` basis elements. */
export function backStableLatex(t: BackStableTerms, maxTerms: number): string {
  const pieces: string[] = []
  let count = 0
  for (const k of [...t.keys()].sort()) {
    for (const term of t.get(k)!.termList()) {
      count++
      if (pieces.length >= maxTerms) continue
      const c = term.coefficient
      const body = termLatex(k, term.x, term.y)
      const abs = typeof c === 'bigint' ? (c < 0n ? -c : c) : Math.abs(c)
      const coefficient = String(abs) === '1' && body !== '1' ? '' : String(abs)
      const negative = typeof c === 'bigint' ? c < 0n : c < 0
      pieces.push(`${pieces.length === 0 ? (negative ? '-' : '') : negative ? ' - ' : ' + '}${coefficient}${body === '1' ? (coefficient ? '' : '1') : body}`)
    }
  }
  const text = pieces.join('') || '0'
  return count > maxTerms ? `${text} + \\dots\\ (${count} terms)` : text
}

/** Compare computed (left) with claimed (right) basis element by basis element. */
export function backStableDiff(computed: BackStableTerms, claimed: BackStableTerms): ClaimDiff | null {
  const missing: { term: string, coefficient: string }[] = []
  const extra: { term: string, coefficient: string }[] = []
  const wrong: { term: string, claimed: string, computed: string }[] = []
  const keys = new Set([...computed.keys(), ...claimed.keys()])
  for (const k of [...keys].sort()) {
    const d = polynomialDifference(computed.get(k) ?? Polynomial.zero(), claimed.get(k) ?? Polynomial.zero())
    for (const t of d.missing) missing.push({ term: termLatex(k, t.x, t.y), coefficient: String(t.coefficient) })
    for (const t of d.extra) extra.push({ term: termLatex(k, t.x, t.y), coefficient: String(t.coefficient) })
    for (const t of d.wrongCoefficient) wrong.push({ term: termLatex(k, t.x, t.y), claimed: String(t.actual), computed: String(t.expected) })
  }
  if (!missing.length && !extra.length && !wrong.length) return null
  const cut = missing.length > DIFF_LIMIT || extra.length > DIFF_LIMIT || wrong.length > DIFF_LIMIT
  return {
    basis: 'monomial',
    missing: missing.slice(0, DIFF_LIMIT),
    extra: extra.slice(0, DIFF_LIMIT),
    wrongCoefficient: wrong.slice(0, DIFF_LIMIT),
    ...(cut ? { truncated: { missing: missing.length, extra: extra.length, wrongCoefficient: wrong.length } } : {}),
    notes: ['s_λ(x_{≤0}) is the Schur function in the non-positive variables x_0, x_{−1}, …'],
  }
}
