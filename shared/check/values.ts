/**
 * Values a claim's expressions evaluate to, and arithmetic between them.
 *
 * - `number`: an exact integer (BigInt).
 * - `polynomial`: a polynomial in x and y (the engine's Polynomial; integers promote to it).
 * - `symmetric`: a symmetric function in infinitely many variables, in the Schur basis
 *   (F_w, s_λ written without variables). It never mixes with polynomials: comparing
 *   a symmetric function with a polynomial in finitely many x would silently truncate.
 */
import {
  addCombinations, multiplySchurCombinations, partitionKey, Polynomial, toCoefficient, type BudgetMeter, type SchurCombination,
} from '../math'

export type Value =
  | { kind: 'number', value: bigint }
  | { kind: 'polynomial', poly: Polynomial }
  | { kind: 'symmetric', schur: SchurCombination }

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
  if (v.kind === 'number') return Polynomial.constant(safeNumber(v.value))
  throw new UnsupportedClaimError(INFINITE_WITH_FINITE)
}

function toSymmetric(v: Value): SchurCombination {
  if (v.kind === 'symmetric') return v.schur
  if (v.kind === 'number') return v.value === 0n ? new Map() : new Map([[partitionKey([]), safeNumber(v.value)]])
  throw new UnsupportedClaimError(INFINITE_WITH_FINITE)
}


function combine(a: Value, b: Value): 'number' | 'polynomial' | 'symmetric' {
  if (a.kind === 'number' && b.kind === 'number') return 'number'
  if (a.kind === 'symmetric' || b.kind === 'symmetric') return 'symmetric'
  return 'polynomial'
}

export function addValues(a: Value, b: Value): Value {
  switch (combine(a, b)) {
    case 'number': return numberValue((a as { value: bigint }).value + (b as { value: bigint }).value)
    case 'polynomial': return { kind: 'polynomial', poly: toPolynomial(a).add(toPolynomial(b)) }
    case 'symmetric': return { kind: 'symmetric', schur: addCombinations(toSymmetric(a), toSymmetric(b), 1) }
  }
}

export function negateValue(a: Value): Value {
  if (a.kind === 'number') return numberValue(-a.value)
  if (a.kind === 'polynomial') return { kind: 'polynomial', poly: a.poly.neg() }
  return { kind: 'symmetric', schur: addCombinations(new Map(), a.schur, -1) }
}

export function multiplyValues(a: Value, b: Value, meter: BudgetMeter): Value {
  switch (combine(a, b)) {
    case 'number': return numberValue((a as { value: bigint }).value * (b as { value: bigint }).value)
    case 'polynomial': return { kind: 'polynomial', poly: toPolynomial(a).mul(toPolynomial(b), meter) }
    case 'symmetric': return { kind: 'symmetric', schur: multiplySchurCombinations(toSymmetric(a), toSymmetric(b), meter) }
  }
}

export function powerValue(a: Value, exponent: number, meter: BudgetMeter): Value {
  if (exponent < 0) throw new UnsupportedClaimError('negative exponents are not polynomials')
  let result: Value = numberValue(1)
  for (let i = 0; i < exponent; i++) result = multiplyValues(result, a, meter)
  return result
}

