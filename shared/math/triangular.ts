/**
 * Expansion in a unitriangular basis by peeling leading terms.
 *
 * The basis {b_α} is indexed by exponent vectors and unitriangular for a total order ≺ on
 * monomials: x^α occurs in b_α with coefficient 1 and every other monomial of b_α comes after it.
 * Then f = Σ c_α b_α is found by taking the first monomial x^α of the remainder, recording its
 * coefficient c, subtracting c · b_α, and repeating. Schur polynomials (symmetric.ts, the
 * lexicographically largest monomial first) and key polynomials and Demazure atoms (key.ts, the
 * lexicographically smallest first) use it.
 */
import { decodeMonomial, type Polynomial } from './polynomial'
import { accumulate, mulChecked, negateCoefficient, type Coefficient } from './coefficient'
import type { BudgetMeter } from './budget'

export interface TriangularBasis {
  /** Negative when the exponent vector a comes before b (a is the leading one). */
  compare: (a: readonly number[], b: readonly number[]) => number
  /** Called on each leading x-exponent vector before it is peeled; throw to refuse it. */
  check?: (leading: readonly number[], y: readonly number[]) => void
  /** The basis label of a leading exponent vector (a partition key, a composition key). */
  label: (leading: readonly number[]) => string
  /** The basis element whose leading monomial is x^leading. */
  element: (leading: number[]) => Polynomial
}

/** f as Σ c_label b_label; e.g. with Schur polynomials x_1^2 + x_1x_2 + x_2^2 ↦ {"2": 1}. */
export function peelTriangular(f: Polynomial, basis: TriangularBasis, meter: BudgetMeter): Map<string, Coefficient> {
  const rest = new Map(f.terms)
  const out = new Map<string, Coefficient>()
  while (rest.size > 0) {
    meter.step(rest.size)
    let best: number[] | undefined
    let bestKey = ''
    for (const k of rest.keys()) {
      const e = decodeMonomial(k)
      basis.check?.(e.x, e.y)
      if (best === undefined || basis.compare(e.x, best) < 0) { best = e.x; bestKey = k }
    }
    const c = rest.get(bestKey)!
    out.set(basis.label(best!), c)
    for (const [k, v] of basis.element(best!).terms) accumulate(rest, k, negateCoefficient(mulChecked(c, v)))
    meter.terms(rest.size)
  }
  return out
}

/** Lexicographic comparison of exponent vectors, x_1 first (missing entries are 0). */
export function compareLex(a: readonly number[], b: readonly number[]): number {
  const n = Math.max(a.length, b.length)
  for (let i = 0; i < n; i++) {
    const d = (a[i] ?? 0) - (b[i] ?? 0)
    if (d !== 0) return d
  }
  return 0
}
