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
 *
 * Double (factors x_i − y_j, as in schubert.ts): from the Cauchy formula for double Schubert
 * polynomials (Macdonald, "Notes on Schubert polynomials", (6.3)),
 *     S_w(x; y) = Σ_{w = v⁻¹ u, ℓ(v) + ℓ(u) = ℓ(w)} S_u(x) · S_v(−y),
 * applied to 1^m × w (whose length-additive factorizations are those of w, shifted) and the limit
 * m → ∞, which is the form Lam–Lee–Shimozono state for the double back-stable polynomial:
 *     ←S_w(x; y) = Σ_{w = v⁻¹ u} ←S_u(x) · ←S_v(−y),
 * so with ←S_u(x) = Σ F_{u_1}(x_{≤0}) S_{u_2}(x_{>0}) and F_{v_1}(−y) = (−1)^{ℓ(v_1)} F_{v_1}(y),
 *     ←S_w(x; y) = Σ F_{u_1}(x_{≤0}) · (−1)^{ℓ(v_1)} F_{v_1}(y_{≤0}) · S_{u_2}(x_{>0}) S_{v_2}(−y_{>0}),
 * summed over w = v_2⁻¹ v_1⁻¹ u_1 u_2, all length-additive. Each term below is one pair (u_1, v_1)
 * with the polynomial parts collected. Truncating both symmetric factors to m variables and renaming
 * (x_{≤0}, y_{≤0} ↦ x_1..x_m, y_1..y_m; x_i, y_i ↦ x_{m+i}, y_{m+i}) gives S_{1^m × w}(x; y).
 */
import { mulChecked } from './coefficient'
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
export function lengthAdditiveFactorizations(w: Permutation): { u: Permutation, v: Permutation }[] {
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

/** One summand F_{u_1}(x_{≤0}) · G(y_{≤0}) · P(x_{>0}, y_{>0}) of a double back-stable Schubert polynomial. */
export interface DoubleBackStableTerm {
  /** F_{u_1} in the Schur basis, symmetric in x_0, x_{−1}, …. */
  xSymmetric: SchurCombination
  /** (−1)^{ℓ(v_1)} F_{v_1} in the Schur basis, symmetric in y_0, y_{−1}, …. */
  ySymmetric: SchurCombination
  /** Σ S_{u_2}(x_1, x_2, …) S_{v_2}(−y_1, −y_2, …) over the factorizations sharing (u_1, v_1). */
  polynomial: Polynomial
}

function stanleyOrOne(u: Permutation, sign: number, meter: BudgetMeter): SchurCombination {
  if (u.length() === 0) return new Map([['', sign]])
  const f = stanleySymmetricFunction(u, { budget: meter })
  return new Map([...f].map(([k, c]) => [k, mulChecked(sign, c)]))
}

/** S_v(−y): S_v with x_i ↦ −y_i. */
function schubertInMinusY(v: Permutation, meter: BudgetMeter): Polynomial {
  return schubertPolynomial(v, meter).swapXY().negateY()
}

/** ←S_w(x; y) (factors x − y) as Σ F(x_{≤0}) · F(y_{≤0}) · polynomial; e.g. ←S_{21} = s_1(x) − s_1(y) + x_1 − y_1. */
export function doubleBackStableSchubert(w: Permutation, budget?: Budget | BudgetMeter): DoubleBackStableTerm[] {
  const meter = toMeter(budget)
  const groups = new Map<string, DoubleBackStableTerm>()
  // w = v⁻¹ u: the prefixes p ≤ w in right weak order give v = p⁻¹ and u = p⁻¹ w.
  for (const { u: p, v: u } of lengthAdditiveFactorizations(w)) {
    const v = p.inverse().trimmed()
    for (const xf of lengthAdditiveFactorizations(u)) {
      for (const yf of lengthAdditiveFactorizations(v)) {
        const key = `${xf.u.key}|${yf.u.key}`
        let g = groups.get(key)
        if (!g) {
          g = { xSymmetric: stanleyOrOne(xf.u, 1, meter), ySymmetric: stanleyOrOne(yf.u, yf.u.length() % 2 === 0 ? 1 : -1, meter), polynomial: Polynomial.zero() }
          groups.set(key, g)
        }
        g.polynomial = g.polynomial.add(schubertPolynomial(xf.v, meter).mul(schubertInMinusY(yf.v, meter), meter))
      }
    }
  }
  return [...groups.values()].filter(t => !t.polynomial.isZero())
}

/** Rename y_i ↦ y_{i+m}. */
function shiftY(p: Polynomial, m: number): Polynomial {
  return p.swapXY().shiftX(m).swapXY()
}

/** The double back-stable polynomial truncated to m non-positive variables of each set and renamed (see the module header). */
export function doubleBackStableTruncation(terms: readonly DoubleBackStableTerm[], m: number, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  let total = Polynomial.zero()
  for (const t of terms) {
    const xs = schurCombinationToPolynomial(t.xSymmetric, m, meter)
    const ys = schurCombinationToPolynomial(t.ySymmetric, m, meter).swapXY()
    total = total.add(xs.mul(ys, meter).mul(shiftY(t.polynomial.shiftX(m), m), meter))
  }
  return total
}
