/**
 * Key polynomials (Demazure characters) κ_α and Demazure atoms A_α for weak compositions α.
 *
 * Conventions:
 * - A weak composition α = (α_1, …, α_n) of nonnegative integers names a polynomial in
 *   x_1..x_n (indices start at 1); trailing zeros may be dropped, so κ_{(1,0)} = κ_{(1)}.
 * - Demazure operator π_i f = ∂_i(x_i f) (isobaric divided difference, divided-difference.ts),
 *   atom operator π̄_i = π_i − 1, so π̄_i f = x_{i+1} ∂_i f (Leibniz rule).
 * - κ_α = x^α when α is weakly decreasing (a partition), and κ_α = π_i κ_{s_i α} when
 *   α_i < α_{i+1} (s_i α exchanges α_i and α_{i+1}); the same recursion with π̄_i gives A_α,
 *   starting from A_λ = x^λ. These are the "x_1 first" conventions: κ_{(0,1)} = x_1 + x_2,
 *   A_{(0,1)} = x_2, and κ_α = s_λ(x_1..x_n) for α the increasing rearrangement of λ.
 * - Triangularity used by the expansions (checked exhaustively in tests/unit/math/key.test.ts):
 *   x^α occurs in κ_α and in A_α with coefficient 1, and every other monomial x^β of either is
 *   lexicographically larger (first differing exponent, x_1 first, is larger in β).
 *   Keys and atoms of compositions with n parts are each a basis of ℤ[x_1..x_n].
 */
import { Polynomial } from './polynomial'
import { compareLex, peelTriangular } from './triangular'
import { dividedDifference, isobaricDividedDifference } from './divided-difference'
import { Permutation } from './permutation'
import { schubertPolynomial } from './schubert'
import type { Coefficient } from './coefficient'
import { InvalidArgumentError, NotInSpanError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** A weak composition (α_1, …, α_n), entries ≥ 0. */
export type WeakComposition = number[]

/** Σ c_α κ_α (or Σ c_α A_α), keyed by the composition with trailing zeros dropped, e.g. "0,2,1". */
export type CompositionCombination = Map<string, Coefficient>

/** Canonical key of a weak composition: trailing zeros dropped, comma-separated; e.g. [0,2,1,0] ↦ "0,2,1". */
export function compositionKey(alpha: readonly number[]): string {
  let n = alpha.length
  while (n > 0 && alpha[n - 1] === 0) n--
  return alpha.slice(0, n).join(',')
}

/** Inverse of compositionKey; e.g. "0,2,1" ↦ [0,2,1], "" ↦ []. */
export function compositionFromKey(key: string): WeakComposition {
  return key === '' ? [] : key.split(',').map(Number)
}

function checkComposition(alpha: readonly number[]): void {
  for (const a of alpha) {
    if (!Number.isInteger(a) || a < 0) throw new InvalidArgumentError(`a weak composition has nonnegative integer entries, got [${alpha.join(',')}]`)
  }
}

const keyMemo = new Map<string, Polynomial>()
const atomMemo = new Map<string, Polynomial>()

function demazureRecursion(
  alpha: readonly number[],
  memo: Map<string, Polynomial>,
  step: (f: Polynomial, i: number, meter: BudgetMeter) => Polynomial,
  meter: BudgetMeter,
): Polynomial {
  checkComposition(alpha)
  const key = compositionKey(alpha)
  const hit = memo.get(key)
  if (hit) return hit
  const a = compositionFromKey(key)
  let i = 0
  while (i + 1 < a.length && a[i]! >= a[i + 1]!) i++
  let result: Polynomial
  if (i + 1 >= a.length) {
    result = Polynomial.monomial(a)
  }
  else {
    const b = a.slice()
    b[i] = a[i + 1]!
    b[i + 1] = a[i]!
    result = step(demazureRecursion(b, memo, step, meter), i + 1, meter)
  }
  meter.terms(result.size)
  memo.set(key, result)
  return result
}

/** The key polynomial (Demazure character) κ_α; e.g. `keyPolynomial([0,1])` is x_1 + x_2. */
export function keyPolynomial(alpha: readonly number[], budget?: Budget | BudgetMeter): Polynomial {
  return demazureRecursion(alpha, keyMemo, (f, i, m) => isobaricDividedDifference(f, i, 'x', m), toMeter(budget))
}

/** The Demazure atom A_α (π̄_i = π_i − 1); e.g. `demazureAtom([0,1])` is x_2. */
export function demazureAtom(alpha: readonly number[], budget?: Budget | BudgetMeter): Polynomial {
  return demazureRecursion(alpha, atomMemo, (f, i, m) => dividedDifference(f, i, 'x', m).mul(Polynomial.x(i + 1), m), toMeter(budget))
}

function triangularExpansion(f: Polynomial, basis: (alpha: number[]) => Polynomial, within: number | undefined, name: string, meter: BudgetMeter): CompositionCombination {
  // The lexicographically smallest monomial leads (see the module header).
  return peelTriangular(f, {
    compare: compareLex,
    check: (x, y) => {
      if (y.length > 0) throw new NotInSpanError(`the polynomial involves y-variables; ${name} span ℤ[x] only`)
      if (within !== undefined && x.length > within) throw new NotInSpanError(`not in the span of ${name} in x_1..x_${within}: the polynomial involves x_${x.length}`)
    },
    label: compositionKey,
    element: basis,
  }, meter)
}

/**
 * A polynomial in x_1..x_n as Σ c_α κ_α; e.g. x_2 ↦ κ_{(0,1)} − κ_{(1)}.
 * With `within: n` a polynomial that involves x_{n+1} or later is refused (NotInSpanError).
 */
export function keyExpansion(f: Polynomial, options: { within?: number, budget?: Budget | BudgetMeter } = {}): CompositionCombination {
  const meter = toMeter(options.budget)
  return triangularExpansion(f, a => keyPolynomial(a, meter), options.within, 'key polynomials', meter)
}

/** A polynomial in x_1..x_n as Σ c_α A_α; e.g. x_1 + x_2 ↦ A_{(1)} + A_{(0,1)}. */
export function atomExpansion(f: Polynomial, options: { within?: number, budget?: Budget | BudgetMeter } = {}): CompositionCombination {
  const meter = toMeter(options.budget)
  return triangularExpansion(f, a => demazureAtom(a, meter), options.within, 'Demazure atoms', meter)
}

/** S_w in the key basis (coefficients are nonnegative, Reiner–Shimozono); e.g. S_{132} = κ_{(0,1)}. */
export function schubertKeyExpansion(w: Permutation, budget?: Budget | BudgetMeter): CompositionCombination {
  const meter = toMeter(budget)
  return keyExpansion(schubertPolynomial(w, meter), { budget: meter })
}

/** κ_α in the atom basis (coefficients 0 or 1); e.g. κ_{(0,1)} = A_{(1)} + A_{(0,1)}. */
export function keyAtomExpansion(alpha: readonly number[], budget?: Budget | BudgetMeter): CompositionCombination {
  const meter = toMeter(budget)
  return atomExpansion(keyPolynomial(alpha, meter), { budget: meter })
}

/** Σ c_α κ_α as a polynomial. */
export function keyCombinationToPolynomial(c: CompositionCombination, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  let p = Polynomial.zero()
  for (const [k, v] of c) p = p.add(keyPolynomial(compositionFromKey(k), meter).scale(v))
  return p
}
