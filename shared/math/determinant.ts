/**
 * Determinants of square matrices with polynomial entries, and a supersymmetry test.
 *
 * Conventions:
 * - A matrix is an array of rows; the determinant is expanded along rows with
 *   memoisation over the set of columns already used (2^n · n products), exact.
 * - Supersymmetry (for a polynomial f(x; y)): f is symmetric in x_1..x_p, symmetric in
 *   y_1..y_q, and after substituting x_1 = −y_1 the result no longer involves x_1 or y_1
 *   (the cancellation property of supersymmetric polynomials written with factors x_i + y_j;
 *   pass `substitution: 'x1=y1'` for polynomials written with x_i − y_j).
 */
import { Polynomial } from './polynomial'
import { InvalidArgumentError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** det of a square matrix of polynomials; e.g. det([[x1, 1],[1, x2]]) = x_1x_2 − 1. */
export function determinant(matrix: readonly (readonly Polynomial[])[], budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  const n = matrix.length
  for (const row of matrix) if (row.length !== n) throw new InvalidArgumentError('determinant needs a square matrix')
  if (n > 20) throw new InvalidArgumentError('determinant: matrices larger than 20 × 20 are not supported')
  if (n === 0) return Polynomial.one()
  const memo = new Map<number, Polynomial>()
  // minor(row, used) = det of rows row..n−1 with the columns not in `used`.
  const minor = (row: number, used: number): Polynomial => {
    if (row === n) return Polynomial.one()
    const hit = memo.get(used)
    if (hit) return hit
    let total = Polynomial.zero()
    let sign = 1
    for (let c = 0; c < n; c++) {
      if (used & (1 << c)) continue
      const entry = matrix[row]![c]!
      if (!entry.isZero()) {
        meter.step()
        const term = entry.mul(minor(row + 1, used | (1 << c)), meter)
        total = sign > 0 ? total.add(term) : total.sub(term)
        meter.terms(total.size)
      }
      sign = -sign
    }
    memo.set(used, total)
    return total
  }
  return minor(0, 0)
}

/** Whether f(x; y) is supersymmetric in x_1..x_p and y_1..y_q (see module header). */
export function isSupersymmetric(f: Polynomial, options: { xCount?: number, yCount?: number, substitution?: 'x1=-y1' | 'x1=y1' } = {}): boolean {
  const p = options.xCount ?? f.maxIndex('x')
  const q = options.yCount ?? f.maxIndex('y')
  if (f.maxIndex('x') > p || f.maxIndex('y') > q) return false
  if (!f.isSymmetricIn('x', p) || !f.isSymmetricIn('y', q)) return false
  const image = (options.substitution ?? 'x1=-y1') === 'x1=-y1' ? Polynomial.y(1).neg() : Polynomial.y(1)
  const g = f.substitute(v => (v.set === 'x' && v.index === 1 ? image : undefined))
  for (const t of g.termList()) if ((t.x[0] ?? 0) > 0 || (t.y[0] ?? 0) > 0) return false
  return true
}
