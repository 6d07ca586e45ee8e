/**
 * Compares the two sides of one claim under one set of conventions and says,
 * term by term, what differs. The left side is the reference: the engine's value
 * of it is "computed", the right side is what the manuscript "claims".
 *
 * Cheap invariants come first: when a side is a single Schubert polynomial with
 * many terms, its degree ℓ(w) and its value at (1,…,1) (the number of pipe dreams,
 * counted without expanding) are compared before anything is expanded.
 */
import type { Expr } from '../types/claims'
import type { ClaimDiff, DiffTerm, DiffWrongCoefficient } from '../types/report'
import { DIFF_LIMIT } from '../types/report'
import {
  accumulate, combinationEntries, monomialLatex, partitionFromKey, Permutation, polynomialDifference, schubertAtOnes, schubertExpansion,
  schubertProduct, checkSupersymmetry, mulChecked, absCoefficient, toCoefficient, parametricDifference, parametricMonomialLatex,
  type Coefficient, type SchubertCombination, type SchurCombination,
} from '../math'
import { evaluate, meantPermutation, permutationOf, type EvaluationEnv } from './evaluate'
import { commonDenominator, INFINITE_WITH_FINITE, numeratorOver, simplifyValue, toBackStable, toParametric, toPolynomial, UnsupportedClaimError, type Value } from './values'
import { compareInRing, isRingClaim } from './grassmannian'
import { backStableDiff, backStableLatex } from './back-stable'

export interface Comparison {
  holds: boolean
  /** LaTeX of the computed (left) side, in the basis the claim is written in. */
  computed: string | null
  diff: ClaimDiff | null
}

/** Longer computed values are shown cut, with their number of terms. */
const COMPUTED_LATEX_TERMS = 120

/** Above this many pipe dreams, a mismatch found by invariants is reported without expanding. */
const INVARIANTS_FIRST_ABOVE = 5000n

export function compareSides(lhs: Expr, rhs: Expr, env: EvaluationEnv): Comparison {
  if (lhs.type === 'supersymmetric') {
    const result = checkSupersymmetry(toPolynomial(evaluate(lhs.arg, env)), lhs.k, env.meter)
    return { holds: result.supersymmetric, computed: result.message, diff: result.supersymmetric ? null : { basis: 'property', property: 'supersymmetry', computed: result.message } }
  }
  if (isRingClaim(lhs, rhs, env.grassmannian)) return compareInRing(lhs, rhs, env, env.grassmannian)
  const early = invariantMismatch(lhs, rhs, env) ?? invariantMismatch(rhs, lhs, env, true)
  if (early) return early

  const claimedCombination = writtenSchubertCombination(rhs, env, isSchubertProduct(lhs))
  if (claimedCombination) {
    const computed = schubertCombinationOfSide(lhs, env)
    return combinationComparison(computed, claimedCombination, 'schubert', schubertTermLatex)
  }

  const left = simplifyValue(evaluate(lhs, env))
  const right = simplifyValue(evaluate(rhs, env))
  env.meter.checkTime()
  if (left.kind === 'parametric' || right.kind === 'parametric') return parametricComparison(left, right, env)
  if (left.kind === 'backStable' || right.kind === 'backStable') {
    const computed = toBackStable(left)
    const diff = backStableDiff(computed, toBackStable(right))
    return { holds: diff === null, computed: backStableLatex(computed, COMPUTED_LATEX_TERMS), diff }
  }
  if (left.kind === 'number' && right.kind === 'number') {
    const holds = left.value === right.value
    return { holds, computed: left.value.toString(), diff: holds ? null : { basis: 'number', claimed: right.value.toString(), computed: left.value.toString() } }
  }
  if (left.kind === 'symmetric' || right.kind === 'symmetric') {
    return combinationComparison(schurOf(left), schurOf(right), 'schur', schurTermLatex)
  }
  const computed = toPolynomial(left)
  const claimed = toPolynomial(right)
  const difference = polynomialDifference(computed, claimed)
  return {
    holds: difference.equal,
    computed: computed.toLatex(COMPUTED_LATEX_TERMS),
    diff: difference.equal
      ? null
      : limitDiff('monomial',
          difference.missing.length, difference.missing.slice(0, DIFF_LIMIT).map(t => monomialTerm(t.x, t.y, t.coefficient)),
          difference.extra.length, difference.extra.slice(0, DIFF_LIMIT).map(t => monomialTerm(t.x, t.y, t.coefficient)),
          difference.wrongCoefficient.length, difference.wrongCoefficient.slice(0, DIFF_LIMIT).map(t => ({ term: monomialLatex(t.x, t.y) || '1', claimed: String(t.actual), computed: String(t.expected) }))),
  }
}

/**
 * Sides over the parameter ring (β, q, …), possibly with ⊖ denominators ∏ (1 + βy_j)^{d_j}: both are
 * brought to their common denominator and the numerators compared term by term, parameters included.
 */
function parametricComparison(left: Value, right: Value, env: EvaluationEnv): Comparison {
  const l = toParametric(left, right)
  const r = toParametric(right, left)
  const d = commonDenominator(l, r)
  const computed = numeratorOver(l, d, env.meter)
  const claimed = numeratorOver(r, d, env.meter)
  const difference = parametricDifference(computed, claimed)
  const over = d.some(e => e > 0) ? denominatorLatex(d, l.beta) : ''
  const term = (t: { parameters: Record<string, number>, x: readonly number[], y: readonly number[] }) => parametricMonomialLatex(t.parameters, t.x, t.y) || '1'
  return {
    holds: difference.equal,
    computed: over ? `\\frac{${computed.toLatex(COMPUTED_LATEX_TERMS)}}{${over}}` : computed.toLatex(COMPUTED_LATEX_TERMS),
    diff: difference.equal
      ? null
      : limitDiff('monomial',
          difference.missing.length, difference.missing.slice(0, DIFF_LIMIT).map(t => ({ term: term(t), coefficient: String(t.coefficient) })),
          difference.extra.length, difference.extra.slice(0, DIFF_LIMIT).map(t => ({ term: term(t), coefficient: String(t.coefficient) })),
          difference.wrongCoefficient.length, difference.wrongCoefficient.slice(0, DIFF_LIMIT).map(t => ({ term: term(t), claimed: String(t.actual), computed: String(t.expected) }))),
  }
}

/** ∏ (1 + βy_j)^{d_j} in LaTeX, for the computed side of a ⊖ claim. */
function denominatorLatex(d: readonly number[], beta: number | null): string {
  const b = beta === null ? '\\beta ' : beta === 1 ? '' : beta === -1 ? '-' : `${beta}`
  return d.map((e, j) => {
    if (e === 0) return ''
    const factor = beta !== null && beta < 0 ? `(1 - ${beta === -1 ? '' : -beta}y_{${j + 1}})` : `(1 + ${b}y_{${j + 1}})`
    return e === 1 ? factor : `${factor}^{${e}}`
  }).join('')
}

function schurOf(v: Value): SchurCombination {
  if (v.kind === 'symmetric') return v.schur
  if (v.kind === 'number') return v.value === 0n ? new Map() : new Map([['', toCoefficient(v.value)]])
  throw new UnsupportedClaimError(INFINITE_WITH_FINITE)
}

/**
 * If `schubertSide` is a Schubert polynomial (single or double) with many terms and `other` is a plain
 * polynomial, compare degree and value at ones without expanding S_w.
 */
function invariantMismatch(schubertSide: Expr, other: Expr, env: EvaluationEnv, swapped = false): Comparison | null {
  // Both S_w(x) and S_w(x;y) are homogeneous of degree ℓ(w), and both give #PD(w) at x = 1, y = 0.
  if (schubertSide.type !== 'schubert' || !isPlainPolynomial(other)) return null
  const w = permutationOf(schubertSide.perm)
  const atOnes = schubertAtOnes(meantPermutation(w, env.conventions), env.meter)
  // A double polynomial has many more terms than pipe dreams: up to 2^ℓ(w) from one pipe dream.
  const large = schubertSide.variant === 'double' ? w.length() > 10 || atOnes > INVARIANTS_FIRST_ABOVE / 50n : atOnes > INVARIANTS_FIRST_ABOVE
  if (!large) return null
  const written = toPolynomial(evaluate(other, env))
  const label = swapped ? 'the left side' : 'the right side'
  if (!written.isZero() && (!written.isHomogeneous() || written.degree() !== w.length())) {
    return { holds: false, computed: null, diff: { basis: 'invariant', invariant: 'degree', claimed: written.isHomogeneous() ? String(written.degree()) : `not homogeneous (${label})`, computed: String(w.length()) } }
  }
  const writtenAtOnes = written.evaluate(new Array(written.maxIndex('x')).fill(1), new Array(written.maxIndex('y')).fill(0))
  if (writtenAtOnes !== atOnes) {
    return { holds: false, computed: null, diff: { basis: 'invariant', invariant: 'value at ones', claimed: writtenAtOnes.toString(), computed: atOnes.toString() } }
  }
  return null
}

function isPlainPolynomial(expr: Expr): boolean {
  switch (expr.type) {
    case 'integer': case 'variable': return true
    case 'add': return expr.terms.every(isPlainPolynomial)
    case 'multiply': return expr.factors.every(isPlainPolynomial)
    case 'negate': return isPlainPolynomial(expr.arg)
    case 'power': return isPlainPolynomial(expr.base)
    default: return false
  }
}

/** S_u S_v written on the left: its right side is an expansion in the Schubert basis, even with one term. */
function isSchubertProduct(expr: Expr): boolean {
  return expr.type === 'multiply' && expr.factors.length === 2 && expr.factors.every(f => f.type === 'schubert' && f.variant === 'single')
}

/**
 * Σ c_w S_w as written (single Schubert polynomials with integer coefficients), or null.
 * `expansion`: the left side is a product, so even a lone S_w is an expansion to compare in the basis.
 */
export function writtenSchubertCombination(expr: Expr, env: EvaluationEnv, expansion = false): SchubertCombination | null {
  const out: SchubertCombination = new Map()
  const addTerm = (term: Expr, sign: number): boolean => {
    if (term.type === 'negate') return addTerm(term.arg, -sign)
    let coefficient: Coefficient = sign
    let schubert: Expr | undefined
    if (term.type === 'multiply' && term.factors.length === 2) {
      const [a, b] = term.factors as [Expr, Expr]
      const [number, object] = a.type === 'integer' ? [a, b] : b.type === 'integer' ? [b, a] : [undefined, undefined]
      if (!number || number.type !== 'integer') return false
      coefficient = mulChecked(coefficient, toCoefficient(BigInt(number.value)))
      schubert = object
    }
    else schubert = term
    if (schubert?.type !== 'schubert' || schubert.variant !== 'single') return false
    const w = permutationOf(schubert.perm)
    const key = meantPermutation(w, env.conventions).key
    accumulate(out, key, coefficient)
    return true
  }
  const terms = expr.type === 'add' ? expr.terms : [expr]
  // A lone S_w is not a "combination" worth a basis diff; polynomials show more.
  if (terms.length < 2 && !(expr.type === 'multiply') && !expansion) return null
  return terms.every(t => addTerm(t, 1)) ? out : null
}

/** The left side in the Schubert basis: products of two Schubert polynomials by the engine's product, else by expansion. */
function schubertCombinationOfSide(expr: Expr, env: EvaluationEnv): SchubertCombination {
  if (expr.type === 'multiply' && expr.factors.length === 2 && expr.factors.every(f => f.type === 'schubert' && f.variant === 'single')) {
    const [u, v] = expr.factors.map(f => meantPermutation(permutationOf((f as Extract<Expr, { type: 'schubert' }>).perm), env.conventions)) as [Permutation, Permutation]
    return schubertProduct(u, v, env.meter)
  }
  return schubertExpansion(toPolynomial(evaluate(expr, env)), { budget: env.meter })
}

function combinationComparison(computed: Map<string, Coefficient>, claimed: Map<string, Coefficient>, basis: 'schubert' | 'schur', latex: (key: string) => string): Comparison {
  const missing: DiffTerm[] = []
  const extra: DiffTerm[] = []
  const wrong: DiffWrongCoefficient[] = []
  for (const [key, c] of computed) {
    const written = claimed.get(key)
    if (written === undefined) missing.push({ term: latex(key), coefficient: String(c) })
    else if (written !== c) wrong.push({ term: latex(key), claimed: String(written), computed: String(c) })
  }
  for (const [key, c] of claimed) if (!computed.has(key)) extra.push({ term: latex(key), coefficient: String(c) })
  const holds = missing.length === 0 && extra.length === 0 && wrong.length === 0
  return {
    holds,
    computed: combinationLatex(computed, latex),
    diff: holds ? null : limitDiff(basis, missing.length, missing.slice(0, DIFF_LIMIT), extra.length, extra.slice(0, DIFF_LIMIT), wrong.length, wrong.slice(0, DIFF_LIMIT)),
  }
}

export function schubertTermLatex(key: string): string {
  return `\\mathfrak{S}_{${oneLineLatex(key === '' ? [1] : key.split(',').map(Number))}}`
}

export function schurTermLatex(key: string): string {
  const parts = partitionFromKey(key)
  return parts.length === 0 ? '1' : `s_{${parts.some(p => p > 9) ? parts.join(',') : parts.join('')}}`
}

function oneLineLatex(line: readonly number[]): string {
  return line.some(v => v > 9) ? `[${line.join(',')}]` : line.join('')
}

function combinationLatex(combination: Map<string, Coefficient>, latex: (key: string) => string): string {
  if (combination.size === 0) return '0'
  const keys = [...combination.keys()]
  const ordered = latex === schubertTermLatex
    ? combinationEntries(combination as SchubertCombination).map(e => e.permutation.key)
    : keys.sort((a, b) => b.localeCompare(a, 'en', { numeric: true }))
  return ordered.map((key, i) => {
    const c = combination.get(key)!
    const sign = c < 0 ? ' - ' : i === 0 ? '' : ' + '
    const magnitude = absCoefficient(c) === 1 ? '' : `${absCoefficient(c)}\\,`
    return `${i === 0 && c < 0 ? '-' : sign}${magnitude}${latex(key)}`
  }).join('')
}

function monomialTerm(x: readonly number[], y: readonly number[], coefficient: Coefficient): DiffTerm {
  return { term: monomialLatex(x, y) || '1', coefficient: String(coefficient) }
}

/** A diff whose lists hold at most DIFF_LIMIT entries (already cut by the caller, who knows the totals). */
function limitDiff(basis: 'monomial' | 'schubert' | 'schur', missingCount: number, missing: DiffTerm[], extraCount: number, extra: DiffTerm[], wrongCount: number, wrong: DiffWrongCoefficient[]): ClaimDiff {
  const cut = missingCount > missing.length || extraCount > extra.length || wrongCount > wrong.length
  return {
    basis,
    missing,
    extra,
    wrongCoefficient: wrong,
    ...(cut ? { truncated: { missing: missingCount, extra: extraCount, wrongCoefficient: wrongCount } } : {}),
  }
}
