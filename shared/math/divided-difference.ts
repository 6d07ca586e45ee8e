/**
 * Divided differences and isobaric divided differences.
 *
 * Conventions:
 * - ∂_i f = (f − s_i f) / (x_i − x_{i+1}), s_i exchanging x_i and x_{i+1} (i ≥ 1).
 * - ∂^y_i f = (f − s^y_i f) / (y_i − y_{i+1}), the same operator on the y-variables.
 * - Isobaric (Demazure) π_i f = ∂_i(x_i f).
 * - K-theoretic operator π^β_i f = ∂_i((1 + β x_{i+1}) f); β = −1 gives the
 *   operator used for Grothendieck polynomials (grothendieck.ts).
 * - For a word a_1…a_k, ∂_{a_1…a_k} = ∂_{a_1} ∘ ⋯ ∘ ∂_{a_k}; ∂_w for a reduced word of w
 *   does not depend on the word chosen.
 */
import { accumulate, negateCoefficient, type Coefficient } from './coefficient'
import { Polynomial, decodeMonomial, encodeMonomial } from './polynomial'
import { toMeter, type Budget, type BudgetMeter } from './budget'
import { InvalidArgumentError } from './errors'

/** ∂_i in x (or in y with set = 'y'); e.g. `dividedDifference(Polynomial.x(1), 1)` is 1. */
export function dividedDifference(f: Polynomial, i: number, set: 'x' | 'y' = 'x', budget?: Budget | BudgetMeter): Polynomial {
  if (!Number.isInteger(i) || i < 1) throw new InvalidArgumentError(`∂_i needs i ≥ 1, got ${i}`)
  const meter = budget === undefined ? undefined : toMeter(budget)
  const acc = new Map<string, Coefficient>()
  for (const [k, c] of f.terms) {
    const e = decodeMonomial(k)
    const v = set === 'x' ? e.x : e.y
    while (v.length < i + 1) v.push(0)
    const p = v[i - 1]!
    const q = v[i]!
    if (p === q) continue
    const [hi, lo, sign] = p > q ? [p, q, 1] : [q, p, -1]
    meter?.step(hi - lo)
    for (let t = 0; t < hi - lo; t++) {
      v[i - 1] = hi - 1 - t
      v[i] = lo + t
      accumulate(acc, encodeMonomial(e.x, e.y), sign > 0 ? c : negateCoefficient(c))
    }
  }
  meter?.terms(acc.size)
  return new Polynomial(acc)
}

/** ∂ along a word: ∂_{a_1}(∂_{a_2}(⋯∂_{a_k} f)); e.g. `dividedDifferenceWord(f, [1,2])`. */
export function dividedDifferenceWord(f: Polynomial, word: readonly number[], set: 'x' | 'y' = 'x', budget?: Budget | BudgetMeter): Polynomial {
  let g = f
  for (let k = word.length - 1; k >= 0; k--) g = dividedDifference(g, word[k]!, set, budget)
  return g
}

/** Isobaric π_i f = ∂_i(x_i f); e.g. `isobaricDividedDifference(Polynomial.x(1), 1)` is x_1 + x_2. */
export function isobaricDividedDifference(f: Polynomial, i: number, set: 'x' | 'y' = 'x', budget?: Budget | BudgetMeter): Polynomial {
  const v = set === 'x' ? Polynomial.x(i) : Polynomial.y(i)
  return dividedDifference(f.mul(v, budget), i, set, budget)
}

/** π^β_i f = ∂_i((1 + β x_{i+1}) f); e.g. β = −1 for Grothendieck polynomials. */
export function grothendieckOperator(f: Polynomial, i: number, beta = -1, budget?: Budget | BudgetMeter): Polynomial {
  const factor = Polynomial.one().add(Polynomial.x(i + 1).scale(beta))
  return dividedDifference(f.mul(factor, budget), i, 'x', budget)
}

/** Whether f is symmetric in x_i, x_{i+1} (equivalently ∂_i f = 0). */
export function isSymmetricInPair(f: Polynomial, i: number, set: 'x' | 'y' = 'x'): boolean {
  return f.swapVariables(set, i).equals(f)
}
