/**
 * Fast representation of single Schubert polynomials of S_n (n ≤ 12).
 *
 * Every monomial of S_w, w ∈ S_n, divides the staircase x_1^{n−1} x_2^{n−2} ⋯ x_{n−1},
 * so it is encoded by the mixed-radix integer Σ_i e_i R_i with R_1 = 1,
 * R_{i+1} = R_i (n − i + 1); the codes are exactly 0 … n! − 1. A packed polynomial
 * is a pair of parallel arrays (monomial codes ascending, coefficients).
 * Divided differences accumulate into a dense scratch array for n ≤ 10 and a Map
 * beyond. Coefficients stay exact: before each step the sum of absolute values of
 * all contributions is bounded below 2^53, otherwise CoefficientOverflowError.
 */
import type { Coefficient } from './coefficient'
import { CoefficientOverflowError, InvalidArgumentError } from './errors'
import { Polynomial, encodeMonomial } from './polynomial'
import type { BudgetMeter } from './budget'

export const PACKED_MAX_N = 12

/** A single Schubert-type polynomial in x_1..x_{n−1} packed for S_n. */
export interface PackedPolynomial {
  n: number
  codes: Int32Array
  coefficients: Float64Array
}

export class PackedContext {
  readonly n: number
  /** R[i] for i = 1..n (R[0] unused). */
  readonly radix: number[]
  readonly size: number
  private dense: Float64Array | undefined
  private touched: Int32Array | undefined

  constructor(n: number) {
    if (n > PACKED_MAX_N) throw new InvalidArgumentError(`packed form supports n ≤ ${PACKED_MAX_N}`)
    this.n = n
    this.radix = [0, 1]
    for (let i = 1; i < n; i++) this.radix.push(this.radix[i]! * (n - i + 1))
    this.size = this.radix[n] ?? 1
    if (n <= 10) {
      this.dense = new Float64Array(Math.max(1, this.size))
      this.touched = new Int32Array(Math.max(1, this.size))
    }
  }

  /** Exponent of x_i in the monomial with the given code. */
  exponent(code: number, i: number): number {
    return Math.floor(code / this.radix[i]!) % (this.n - i + 1)
  }

  /** The packed monomial x^e (e must fit the staircase). */
  monomial(e: readonly number[]): PackedPolynomial {
    let code = 0
    for (let i = 1; i < this.n; i++) {
      const a = e[i - 1] ?? 0
      if (a > this.n - i) throw new InvalidArgumentError('monomial outside the staircase')
      code += a * this.radix[i]!
    }
    return { n: this.n, codes: Int32Array.of(code), coefficients: Float64Array.of(1) }
  }

  /** ∂_i of a packed polynomial whose monomials lie under the staircase after ∂_i. */
  dividedDifference(f: PackedPolynomial, i: number, meter?: BudgetMeter): PackedPolynomial {
    const { codes, coefficients } = f
    const Ri = this.radix[i]!
    const Rj = this.radix[i + 1]!
    const mi = this.n - i + 1
    const mj = this.n - i
    let bound = 0
    for (let t = 0; t < codes.length; t++) {
      const code = codes[t]!
      const p = Math.floor(code / Ri) % mi
      const q = Math.floor(code / Rj) % mj
      bound += Math.abs(coefficients[t]!) * Math.abs(p - q)
    }
    if (bound > Number.MAX_SAFE_INTEGER) throw new CoefficientOverflowError()
    meter?.step(codes.length)
    const dense = this.dense
    if (dense && this.touched) {
      const touched = this.touched
      let nt = 0
      for (let t = 0; t < codes.length; t++) {
        const code = codes[t]!
        const c = coefficients[t]!
        const p = Math.floor(code / Ri) % mi
        const q = Math.floor(code / Rj) % mj
        if (p === q) continue
        const base = code - p * Ri - q * Rj
        if (p > q) {
          for (let k = 0; k < p - q; k++) {
            const nc = base + (p - 1 - k) * Ri + (q + k) * Rj
            if (dense[nc] === 0) touched[nt++] = nc
            dense[nc] = dense[nc]! + c
          }
        }
        else {
          for (let k = 0; k < q - p; k++) {
            const nc = base + (q - 1 - k) * Ri + (p + k) * Rj
            if (dense[nc] === 0) touched[nt++] = nc
            dense[nc] = dense[nc]! - c
          }
        }
      }
      // A cell can return to 0 and be touched again; collect distinct nonzero cells.
      const sel = touched.subarray(0, nt)
      sel.sort()
      let count = 0
      let prev = -1
      for (let t = 0; t < nt; t++) {
        const nc = sel[t]!
        if (nc !== prev && dense[nc] !== 0) count++
        prev = nc
      }
      const outCodes = new Int32Array(count)
      const outCoef = new Float64Array(count)
      let w = 0
      prev = -1
      for (let t = 0; t < nt; t++) {
        const nc = sel[t]!
        if (nc !== prev && dense[nc] !== 0) {
          outCodes[w] = nc
          outCoef[w] = dense[nc]!
          w++
        }
        dense[nc] = 0
        prev = nc
      }
      meter?.terms(count)
      return { n: this.n, codes: outCodes, coefficients: outCoef }
    }
    const acc = new Map<number, number>()
    for (let t = 0; t < codes.length; t++) {
      const code = codes[t]!
      const c = coefficients[t]!
      const p = Math.floor(code / Ri) % mi
      const q = Math.floor(code / Rj) % mj
      if (p === q) continue
      const base = code - p * Ri - q * Rj
      const [hi, lo, s] = p > q ? [p, q, c] : [q, p, -c]
      for (let k = 0; k < hi - lo; k++) {
        const nc = base + (hi - 1 - k) * Ri + (lo + k) * Rj
        acc.set(nc, (acc.get(nc) ?? 0) + s)
      }
    }
    const keys = [...acc.keys()].filter(k => acc.get(k) !== 0).sort((a, b) => a - b)
    meter?.terms(keys.length)
    return { n: this.n, codes: Int32Array.from(keys), coefficients: Float64Array.from(keys, k => acc.get(k)!) }
  }

  /** Exponent vectors (length n − 1) of each term. */
  exponents(code: number): number[] {
    const e: number[] = []
    for (let i = 1; i < this.n; i++) e.push(this.exponent(code, i))
    return e
  }

  /** Convert to the general sparse form. */
  toPolynomial(f: PackedPolynomial): Polynomial {
    const m = new Map<string, Coefficient>()
    for (let t = 0; t < f.codes.length; t++) m.set(encodeMonomial(this.exponents(f.codes[t]!)), f.coefficients[t]!)
    return new Polynomial(m)
  }
}
