/**
 * Stanley symmetric functions F_w, in the Schur basis.
 *
 * Conventions:
 * - F_w is the stable limit of S_{1^m × w} as m → ∞: for m ≥ ℓ(w),
 *   F_w(x_1, …, x_m) = S_{1^m × w}(x_1, …, x_m, 0, 0, …), and since every Schur function
 *   in F_w has at most ℓ(w) rows, expanding that polynomial in s_λ(x_1..x_m) gives the
 *   exact Schur coefficients. (1^m × w fixes 1..m and shifts w, see permutation.ts.)
 * - With our word convention (w = s_{a_1}⋯s_{a_ℓ}), F_{w⁻¹} = ω F_w, F_w = s_λ for
 *   a Grassmannian w with λ the sorted Lehmer code, and Σ_λ a_{wλ} f^λ = #reduced words of w.
 */
import { Permutation } from './permutation'
import { schubertPolynomial } from './schubert'
import { schurExpansion, type SchurCombination } from './symmetric'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** F_w in the Schur basis; `extraVariables` adds rows beyond ℓ(w) (for stability checks). e.g. F_{21} = s_1. */
export function stanleySymmetricFunction(w: Permutation, options: { extraVariables?: number; budget?: Budget | BudgetMeter } = {}): SchurCombination {
  const meter = toMeter(options.budget)
  const m = Math.max(w.length(), 1) + (options.extraVariables ?? 0)
  const shifted = w.trimmed().shift(m)
  const truncated = schubertPolynomial(shifted, meter).truncateX(m)
  return schurExpansion(truncated, m, meter)
}
