/**
 * Stanley symmetric functions F_w, in the Schur basis.
 *
 * Conventions:
 * - F_w is the stable limit of S_{1^m × w} as m → ∞: for m ≥ ℓ(w),
 *   F_w(x_1, …, x_m) = S_{1^m × w}(x_1, …, x_m, 0, 0, …), and since every Schur function
 *   in F_w has at most ℓ(w) rows, expanding that polynomial in s_λ(x_1..x_m) gives the
 *   exact Schur coefficients ('limit' method; 1^m × w fixes 1..m and shifts w).
 * - Default 'transition' method: apply the transition formula (schubert.ts) to 1^m × w and
 *   truncate to x_1..x_m; the x_r-term dies, leaving
 *     F_w = Σ_{q<r, ℓ(v t_{qr}) = ℓ(w)} F_{v t_{qr}}  +  [v(r) < v(j) for all j < r] F_{(1 × v) t_{1, r+1}},
 *   with r the last descent of w and v = w t_{rs} as there. Leaves are Grassmannian
 *   permutations u (at most one descent), for which F_u = s_λ, λ = the nonzero entries of
 *   the Lehmer code sorted decreasingly.
 * - With our word convention (w = s_{a_1}⋯s_{a_ℓ}), F_{w⁻¹} = ω F_w and
 *   Σ_λ a_{wλ} f^λ = #reduced words of w.
 */
import { Permutation, isGrassmannian, trimFixedPoints } from './permutation'
import { schubertPolynomial, transitionStep } from './schubert'
import { partitionKey, schurExpansion, type SchurCombination } from './symmetric'
import { accumulate } from './coefficient'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** F_w in the Schur basis; e.g. F_{21} = s_1, F_{2143} = s_2 + s_{11}. */
export function stanleySymmetricFunction(
  w: Permutation,
  options: { method?: 'transition' | 'limit', extraVariables?: number, budget?: Budget | BudgetMeter } = {},
): SchurCombination {
  const meter = toMeter(options.budget)
  if (options.method === 'limit') {
    const m = Math.max(w.length(), 1) + (options.extraVariables ?? 0)
    const truncated = schubertPolynomial(w.trimmed().shift(m), meter).truncateX(m)
    return schurExpansion(truncated, m, meter)
  }
  const memo = new Map<string, SchurCombination>()
  const go = (line: number[]): SchurCombination => {
    const trimmed = trimFixedPoints(line)
    // F is invariant under the shift 1 × w, so key on the shift-normal form too.
    let lead = 0
    while (lead < trimmed.length && trimmed[lead] === lead + 1) lead++
    const normal = trimmed.slice(lead).map(v => v - lead)
    const key = normal.join(',')
    const hit = memo.get(key)
    if (hit) return hit
    meter.step()
    const u = Permutation.unchecked(normal)
    let result: SchurCombination
    if (isGrassmannian(u)) {
      result = new Map([[partitionKey(u.lehmerCode().filter(c => c > 0).sort((a, b) => b - a)), 1]])
    }
    else {
      const step = transitionStep(normal)!
      result = new Map()
      const add = (c: SchurCombination): void => {
        for (const [k, v] of c) accumulate(result, k, v)
      }
      for (const child of step.others) add(go(child))
      const vr = step.v[step.r - 1]!
      let smallest = true
      for (let j = 1; j < step.r; j++) if (step.v[j - 1]! < vr) { smallest = false; break }
      if (smallest) {
        // (1 × v) t_{1, r+1}: prepend a fixed point, then swap positions 1 and r + 1.
        const shifted = [1, ...step.v.map(a => a + 1)]
        const t = shifted[0]!
        shifted[0] = shifted[step.r]!
        shifted[step.r] = t
        add(go(shifted))
      }
    }
    memo.set(key, result)
    meter.terms(memo.size, 'memoised permutations')
    return result
  }
  return go(w.oneLine.slice())
}
