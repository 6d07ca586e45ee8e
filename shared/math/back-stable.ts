/**
 * Back-stable Schubert polynomials, as finite sums of (symmetric function) × (polynomial).
 *
 * Formula implemented (Lam, Lee, Shimozono, "Back stable Schubert calculus",
 * Compositio Mathematica 157 (2021)): for w a permutation of the positive integers,
 *     ←S_w = Σ_{w = u v, ℓ(u) + ℓ(v) = ℓ(w)} F_u(x_0, x_{−1}, …) · S_v(x_1, x_2, …),
 * F_u the Stanley symmetric function (stanley.ts) in the non-positive variables.
 *
 * Back-stability: ←S_w is the limit of S_{1^m × w} after renaming x_i ↦ x_{i−m}. Truncating
 * the symmetric factor to m variables and renaming back (x_{≤0} ↦ x_1..x_m, x_i ↦ x_{m+i})
 * gives exactly S_{1^m × w}(x_1, …, x_{m+n}) for the values tested in tests/unit/math.
 */
import { Permutation } from './permutation'
import { Polynomial } from './polynomial'
import { schubertPolynomial } from './schubert'
import { stanleySymmetricFunction } from './stanley'
import { schurCombinationToPolynomial, type SchurCombination } from './symmetric'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** One summand F_u ⊗ S_v of a back-stable Schubert polynomial. */
export interface BackStableTerm {
  u: Permutation
  v: Permutation
  /** F_u in the Schur basis (symmetric in x_0, x_{−1}, …). */
  symmetric: SchurCombination
  /** S_v(x_1, x_2, …). */
  polynomial: Polynomial
}

/** Elements u ≤ w in right weak order (prefixes of reduced words), with v = u⁻¹ w. */
export function lengthAdditiveFactorizations(w: Permutation): { u: Permutation; v: Permutation }[] {
  const seen = new Map<string, Permutation>()
  const stack = [w.trimmed()]
  seen.set(stack[0]!.key, stack[0]!)
  while (stack.length > 0) {
    const x = stack.pop()!
    for (const i of x.descents()) {
      const y = x.rightMultiplySimple(i).trimmed()
      if (!seen.has(y.key)) { seen.set(y.key, y); stack.push(y) }
    }
  }
  return [...seen.values()].map(u => ({ u, v: u.inverse().compose(w).trimmed() }))
}

/** ←S_w as a list of F_u ⊗ S_v; e.g. ←S_{21} = F_{21}·1 + 1·S_{21} = s_1 + x_1. */
export function backStableSchubert(w: Permutation, budget?: Budget | BudgetMeter): BackStableTerm[] {
  const meter = toMeter(budget)
  return lengthAdditiveFactorizations(w).map(({ u, v }) => ({
    u,
    v,
    symmetric: u.length() === 0 ? new Map([['', 1]]) : stanleySymmetricFunction(u, { budget: meter }),
    polynomial: schubertPolynomial(v, meter),
  }))
}

/** Σ F_u(x_1..x_m) · S_v(x_{m+1}, …): the back-stable polynomial truncated to m non-positive variables and renamed. */
export function backStableTruncation(terms: readonly BackStableTerm[], m: number, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  let total = Polynomial.zero()
  for (const t of terms) {
    total = total.add(schurCombinationToPolynomial(t.symmetric, m, meter).mul(t.polynomial.shiftX(m), meter))
  }
  return total
}
