/**
 * Values a claim's expressions evaluate to, and arithmetic between them.
 *
 * - `number`: an exact integer (BigInt).
 * - `polynomial`: a polynomial in x and y (the engine's Polynomial; integers promote to it).
 * - `symmetric`: a symmetric function in infinitely many variables, in the Schur basis
 *   (F_w, s_λ written without variables). It never mixes with polynomials: comparing
 *   a symmetric function with a polynomial in finitely many x would silently truncate.
 * - `parametric`: a polynomial over a ring of named parameters (β, q, t, …; shared/math/parameter-ring.ts)
 *   divided by ∏_j (1 + b y_j)^{denominator[j−1]}, the denominators of the ⊖ form of K-theory. `beta`
 *   says what b is: null for the formal parameter β, or the number β stands for in this evaluation.
 *   Numbers and polynomials promote to it when they meet one.
 */
import {
  addCombinations, multiplySchurCombinations, partitionKey, Polynomial, toCoefficient, ParametricPolynomial, BETA,
  type BudgetMeter, type SchurCombination,
} from '../math'
import { addTerms, liftPolynomial, liftSymmetric, multiplyTerms, negateTerms, polynomialPart, type BackStableTerms } from './back-stable'

export type Value
  = | { kind: 'number', value: bigint }
    | { kind: 'polynomial', poly: Polynomial }
    | { kind: 'symmetric', schur: SchurCombination }
    | { kind: 'parametric', poly: ParametricPolynomial, denominator: number[], beta: number | null }
  /** Λ(x_{≤0}) ⊗ Λ(y_{≤0}) ⊗ ℤ[x, y] of a back-stable claim (check/back-stable.ts). */
    | { kind: 'backStable', terms: BackStableTerms }

type ParametricValue = Extract<Value, { kind: 'parametric' }>

/** A claim we can read but not evaluate; becomes an `unsupported` verdict with this reason. */
export class UnsupportedClaimError extends Error {
  override readonly name = 'UnsupportedClaimError'
}

/** The reason for mixing the two kinds of value; the claim's own objects add advice (see check/claim.ts). */
export const INFINITE_WITH_FINITE = 'a symmetric function in infinitely many variables cannot be combined with a polynomial in finitely many'

export const numberValue = (value: bigint | number): Value => ({ kind: 'number', value: BigInt(value) })

/** Past 2^53 coefficients are exact bigints (the engine's Coefficient), never rounded. */
const safeNumber = toCoefficient

export function toPolynomial(v: Value): Polynomial {
  if (v.kind === 'polynomial') return v.poly
  if (v.kind === 'parametric') {
    const plain = v.denominator.every(d => d === 0) ? v.poly.withoutParameters() : undefined
    if (plain) return plain
    throw new UnsupportedClaimError('a polynomial with parameters (β, q, …) or a ⊖ denominator cannot be used here')
  }
  if (v.kind === 'number') return Polynomial.constant(safeNumber(v.value))
  if (v.kind === 'backStable') {
    const plain = polynomialPart(v.terms)
    if (plain) return plain
    throw new UnsupportedClaimError('a back-stable value (symmetric in x_0, x_{−1}, …) cannot be used here')
  }
  throw new UnsupportedClaimError(INFINITE_WITH_FINITE)
}

/** `v` in the back-stable ring; a symmetric function without variables is taken in x_0, x_{−1}, …. */
export function toBackStable(v: Value): BackStableTerms {
  if (v.kind === 'backStable') return v.terms
  if (v.kind === 'symmetric') return liftSymmetric(v.schur, 'x')
  if (v.kind === 'parametric') throw new UnsupportedClaimError('back-stable polynomials with parameters (β, q, …) are not read')
  return liftPolynomial(toPolynomial(v))
}

function toSymmetric(v: Value): SchurCombination {
  if (v.kind === 'symmetric') return v.schur
  if (v.kind === 'number') return v.value === 0n ? new Map() : new Map([[partitionKey([]), safeNumber(v.value)]])
  throw new UnsupportedClaimError(INFINITE_WITH_FINITE)
}

function combine(a: Value, b: Value): 'number' | 'polynomial' | 'symmetric' | 'parametric' | 'backStable' {
  if (a.kind === 'number' && b.kind === 'number') return 'number'
  if (a.kind === 'backStable' || b.kind === 'backStable') return 'backStable'
  if (a.kind === 'symmetric' || b.kind === 'symmetric') return 'symmetric'
  if (a.kind === 'parametric' || b.kind === 'parametric') return 'parametric'
  return 'polynomial'
}

/** `v` as a parametric value with the β of `like` (the other operand). */
export function toParametric(v: Value, like?: Value): ParametricValue {
  if (v.kind === 'parametric') return v
  const beta = like?.kind === 'parametric' ? like.beta : null
  if (v.kind === 'symmetric') throw new UnsupportedClaimError('a symmetric function in infinitely many variables cannot be combined with a polynomial with parameters')
  return { kind: 'parametric', poly: ParametricPolynomial.from(toPolynomial(v)), denominator: [], beta }
}

/** 1 + b·y_j, b the formal β or the number it stands for. */
function onePlusBY(j: number, beta: number | null): ParametricPolynomial {
  const b = beta === null ? ParametricPolynomial.parameter(BETA) : ParametricPolynomial.constant(beta)
  return ParametricPolynomial.constant(1).add(b.mul(ParametricPolynomial.from(Polynomial.y(j))))
}

/** The numerator over the denominator ∏ (1 + b y_j)^{target_j} (target ≥ the value's own denominator). */
export function numeratorOver(v: ParametricValue, target: readonly number[], meter?: BudgetMeter): ParametricPolynomial {
  let p = v.poly
  target.forEach((t, j) => {
    const extra = t - (v.denominator[j] ?? 0)
    if (extra > 0) p = p.mul(onePlusBY(j + 1, v.beta).pow(extra, meter), meter)
  })
  return p
}

/** The least common denominator of two parametric values (exponent by exponent). */
export function commonDenominator(a: ParametricValue, b: ParametricValue): number[] {
  if (a.beta !== b.beta) throw new UnsupportedClaimError('the two sides use different values of β')
  const n = Math.max(a.denominator.length, b.denominator.length)
  return Array.from({ length: n }, (_, j) => Math.max(a.denominator[j] ?? 0, b.denominator[j] ?? 0))
}

function trimDenominator(d: number[]): number[] {
  const out = d.slice()
  while (out.length && out[out.length - 1] === 0) out.pop()
  return out
}

function addParametric(a: ParametricValue, b: ParametricValue, meter?: BudgetMeter): ParametricValue {
  const d = commonDenominator(a, b)
  return { kind: 'parametric', poly: numeratorOver(a, d, meter).add(numeratorOver(b, d, meter)), denominator: trimDenominator(d), beta: a.beta }
}

function multiplyParametric(a: ParametricValue, b: ParametricValue, meter: BudgetMeter): ParametricValue {
  if (a.beta !== b.beta) throw new UnsupportedClaimError('the two factors use different values of β')
  const n = Math.max(a.denominator.length, b.denominator.length)
  const d = Array.from({ length: n }, (_, j) => (a.denominator[j] ?? 0) + (b.denominator[j] ?? 0))
  return { kind: 'parametric', poly: a.poly.mul(b.poly, meter), denominator: trimDenominator(d), beta: a.beta }
}

/** a ⊕ b = a + b + βab. */
export function formalSum(a: Value, b: Value, meter: BudgetMeter): Value {
  const pa = toParametric(a, b)
  const pb = toParametric(b, a)
  const beta: ParametricValue = { kind: 'parametric', poly: pa.beta === null ? ParametricPolynomial.parameter(BETA) : ParametricPolynomial.constant(pa.beta), denominator: [], beta: pa.beta }
  return addParametric(addParametric(pa, pb, meter), multiplyParametric(beta, multiplyParametric(pa, pb, meter), meter), meter)
}

/** a ⊖ y_j = (a − y_j)/(1 + βy_j); the right operand must be a single y_j (the only denominators kept). */
export function formalDifference(a: Value, b: Value, yIndex: number | undefined, meter: BudgetMeter): Value {
  if (yIndex === undefined) throw new UnsupportedClaimError('a ⊖ b is read only for b a single variable y_j (so that the denominator is 1 + βy_j)')
  const pa = toParametric(a, b)
  const pb = toParametric(b, a)
  const diff = addParametric(pa, { ...pb, poly: pb.poly.neg() }, meter)
  const d = diff.denominator.slice()
  while (d.length < yIndex) d.push(0)
  d[yIndex - 1]! += 1
  return { ...diff, denominator: d }
}

/** Give a parameter an integer value; β = 0 also clears the ⊖ denominators. */
export function specialiseValue(v: Value, parameter: string, value: bigint): Value {
  if (v.kind !== 'parametric') return v
  const poly = v.poly.substitute(parameter, value)
  if (parameter !== BETA || v.beta !== null) return { ...v, poly }
  const beta = Number(value)
  const specialised: ParametricValue = { kind: 'parametric', poly, denominator: beta === 0 ? [] : v.denominator, beta }
  return simplifyValue(specialised)
}

/** A parametric value with no parameters and no denominators is a polynomial. */
export function simplifyValue(v: Value): Value {
  if (v.kind !== 'parametric' || v.denominator.length > 0) return v
  const plain = v.poly.withoutParameters()
  return plain ? { kind: 'polynomial', poly: plain } : v
}

export function addValues(a: Value, b: Value): Value {
  switch (combine(a, b)) {
    case 'number': return numberValue((a as { value: bigint }).value + (b as { value: bigint }).value)
    case 'polynomial': return { kind: 'polynomial', poly: toPolynomial(a).add(toPolynomial(b)) }
    case 'symmetric': return { kind: 'symmetric', schur: addCombinations(toSymmetric(a), toSymmetric(b), 1) }
    case 'parametric': return addParametric(toParametric(a, b), toParametric(b, a))
    case 'backStable': return { kind: 'backStable', terms: addTerms(toBackStable(a), toBackStable(b)) }
  }
}

export function negateValue(a: Value): Value {
  if (a.kind === 'number') return numberValue(-a.value)
  if (a.kind === 'polynomial') return { kind: 'polynomial', poly: a.poly.neg() }
  if (a.kind === 'parametric') return { ...a, poly: a.poly.neg() }
  if (a.kind === 'backStable') return { kind: 'backStable', terms: negateTerms(a.terms) }
  return { kind: 'symmetric', schur: addCombinations(new Map(), a.schur, -1) }
}

export function multiplyValues(a: Value, b: Value, meter: BudgetMeter): Value {
  switch (combine(a, b)) {
    case 'number': return numberValue((a as { value: bigint }).value * (b as { value: bigint }).value)
    case 'polynomial': return { kind: 'polynomial', poly: toPolynomial(a).mul(toPolynomial(b), meter) }
    case 'symmetric': return { kind: 'symmetric', schur: multiplySchurCombinations(toSymmetric(a), toSymmetric(b), meter) }
    case 'parametric': return multiplyParametric(toParametric(a, b), toParametric(b, a), meter)
    case 'backStable': return { kind: 'backStable', terms: multiplyTerms(toBackStable(a), toBackStable(b), meter) }
  }
}

export function powerValue(a: Value, exponent: number, meter: BudgetMeter): Value {
  if (exponent < 0) throw new UnsupportedClaimError('negative exponents are not polynomials')
  let result: Value = numberValue(1)
  for (let i = 0; i < exponent; i++) result = multiplyValues(result, a, meter)
  return result
}
