/**
 * Slow, independent routes to values the engine computes another way, kept only to cross-check
 * it in tests. Not part of the engine's barrel (shared/math/index.ts): nothing in the product may
 * import this module (eslint.config.mjs refuses it outside tests/), so the check path never
 * takes a route meant as a witness.
 *
 * - `schubertByTransition`: S_w by the transition formula, without divided differences;
 * - `schubertFromPipeDreams` / `schubertFromBumpless`: S_w(x) and S_w(x; y) as sums over
 *   reduced and bumpless pipe dreams (conventions in pipe-dream.ts and bumpless.ts);
 * - `schubertProductByExpansion`: S_u · S_v by expanding the product polynomial.
 */
import { Permutation, trimFixedPoints } from './permutation'
import { Polynomial } from './polynomial'
import { schubertPolynomial, transitionStep } from './schubert'
import { schubertExpansion, type SchubertCombination } from './schubert-basis'
import { pipeDreams } from './pipe-dream'
import { bumplessPipeDreams } from './bumpless'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** S_w by the transition formula (Algorithm B), memoised; e.g. `schubertByTransition(P('132'))` is x_1 + x_2. */
export function schubertByTransition(w: Permutation, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  const memo = new Map<string, Polynomial>()
  const go = (line: readonly number[]): Polynomial => {
    const key = trimFixedPoints(line).join(',')
    const hit = memo.get(key)
    if (hit) return hit
    meter.step()
    const step = transitionStep(line)
    let result: Polynomial
    if (!step) result = Polynomial.one()
    else {
      result = go(step.v).mul(Polynomial.x(step.r), meter)
      for (const u of step.others) result = result.add(go(u))
    }
    memo.set(key, result)
    meter.terms(result.size)
    return result
  }
  return go(w.oneLine)
}

/** S_w(x; y) = Σ over reduced pipe dreams of ∏ over crosses (x_i − y_j); `double: false` gives S_w(x). */
export function schubertFromPipeDreams(w: Permutation, options: { double?: boolean, budget?: Budget | BudgetMeter } = {}): Polynomial {
  const meter = toMeter(options.budget)
  return sumOfCellProducts(pipeDreams(w, meter).map(pd => pd.crosses), options.double === true, meter)
}

/** S_w(x; y) = Σ over bumpless pipe dreams of ∏ over blanks (x_i − y_j); `double: false` gives S_w(x). */
export function schubertFromBumpless(w: Permutation, options: { double?: boolean, budget?: Budget | BudgetMeter } = {}): Polynomial {
  const meter = toMeter(options.budget)
  return sumOfCellProducts(bumplessPipeDreams(w, meter).map(bpd => bpd.blanks), options.double === true, meter)
}

/** S_u · S_v by expanding the product polynomial in the Schubert basis; e.g. S_{21}·S_{21} = S_{312} + S_{231}. */
export function schubertProductByExpansion(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter): SchubertCombination {
  const meter = toMeter(budget)
  return schubertExpansion(schubertPolynomial(u, meter).mul(schubertPolynomial(v, meter), meter), { budget: meter })
}

// Σ over diagrams of ∏ over their cells (i, j) of x_i (single) or x_i − y_j (double).
function sumOfCellProducts(diagrams: readonly (readonly (readonly [number, number])[])[], double: boolean, meter: BudgetMeter): Polynomial {
  const factors = new Map<string, Polynomial>()
  let total = Polynomial.zero()
  for (const cells of diagrams) {
    let p = Polynomial.one()
    for (const [i, j] of cells) {
      const key = `${i},${j}`
      let f = factors.get(key)
      if (!f) factors.set(key, (f = double ? Polynomial.x(i).sub(Polynomial.y(j)) : Polynomial.x(i)))
      p = p.mul(f, meter)
    }
    total = total.add(p)
    meter.terms(total.size)
  }
  return total
}
