/**
 * Checked integer arithmetic on JavaScript numbers.
 *
 * Coefficients are stored as numbers for speed. Every sum and product is
 * checked: if the exact result leaves the safe range |c| ≤ 2^53 − 1 the
 * operation throws CoefficientOverflowError rather than rounding. (Inside
 * the safe range IEEE arithmetic on integers is exact, and a result that
 * truly leaves it is rounded to a value that also leaves it, so the check
 * after the operation is sound.)
 */
import { CoefficientOverflowError } from './errors'

/** a + b, exact or throws; e.g. `addChecked(2, 3) === 5`. */
export function addChecked(a: number, b: number): number {
  const r = a + b
  if (r > Number.MAX_SAFE_INTEGER || r < -Number.MAX_SAFE_INTEGER) throw new CoefficientOverflowError()
  return r
}

/** a · b, exact or throws; e.g. `mulChecked(4, 5) === 20`. */
export function mulChecked(a: number, b: number): number {
  const r = a * b
  if (r > Number.MAX_SAFE_INTEGER || r < -Number.MAX_SAFE_INTEGER) throw new CoefficientOverflowError()
  return r
}

/** Throws unless `c` is a safe integer; e.g. `assertSafeInteger(3)`. */
export function assertSafeInteger(c: number): void {
  if (!Number.isSafeInteger(c)) throw new CoefficientOverflowError(`coefficient ${c} is not a safe integer`)
}
