/**
 * Supersymmetry in two sets of variables x_1..x_k; y_1..y_k.
 *
 * Definition (the common one, Stembridge's cancellation form with the sign written x_1 = −y_1):
 * f is supersymmetric in x_1..x_k; y_1..y_k when
 *   (1) f is symmetric in x_1..x_k,
 *   (2) f is symmetric in y_1..y_k, and
 *   (3) after the substitution x_1 = −y_1, f no longer depends on y_1 (hence not on x_1 either).
 * With this sign the super power sums are p_r(x) − (−1)^r p_r(y) and the generating function of
 * the elementary ones is ∏(1 + x_i t) / ∏(1 − y_j t). Other variables (x_{k+1}, y_{k+1}, …) are
 * treated as constants. The numbers of x- and y-variables are both k here. determinant.ts has the
 * boolean isSupersymmetric with a choice of sign; this module adds the named failing condition.
 */
import { Polynomial } from './polynomial'
import { InvalidArgumentError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** Which condition of the definition fails, if any. */
export type SupersymmetryFailure = 'not-symmetric-in-x' | 'not-symmetric-in-y' | 'depends-on-y1-after-cancellation'

/** Outcome of a supersymmetry check with a sentence for a report. */
export interface SupersymmetryCheck {
  supersymmetric: boolean
  failure?: SupersymmetryFailure
  message: string
}

/** Decide supersymmetry of f in x_1..x_k; y_1..y_k; e.g. p_1(x) + p_1(y) is, p_2(x) + p_2(y) is not. */
export function checkSupersymmetry(f: Polynomial, k: number, budget?: Budget | BudgetMeter): SupersymmetryCheck {
  if (!Number.isInteger(k) || k < 1) throw new InvalidArgumentError(`supersymmetry needs k ≥ 1 variables in each set, got ${k}`)
  const meter = toMeter(budget)
  const sets = `x_1..x_${k}; y_1..y_${k}`
  if (!f.isSymmetricIn('x', k)) return { supersymmetric: false, failure: 'not-symmetric-in-x', message: `not symmetric in x_1..x_${k}, so not supersymmetric in ${sets}` }
  if (!f.isSymmetricIn('y', k)) return { supersymmetric: false, failure: 'not-symmetric-in-y', message: `not symmetric in y_1..y_${k}, so not supersymmetric in ${sets}` }
  const cancelled = f.substitute(v => (v.set === 'x' && v.index === 1 ? Polynomial.y(1).neg() : undefined), meter)
  for (const t of cancelled.termList()) {
    if ((t.y[0] ?? 0) > 0) {
      return { supersymmetric: false, failure: 'depends-on-y1-after-cancellation', message: `symmetric in each set, but after x_1 = −y_1 it still depends on y_1, so not supersymmetric in ${sets}` }
    }
  }
  return { supersymmetric: true, message: `supersymmetric in ${sets}` }
}
