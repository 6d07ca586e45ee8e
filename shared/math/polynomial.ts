/**
 * Sparse multivariate polynomials over ℤ in two sets of variables x_1, x_2, …
 * and y_1, y_2, … (indices start at 1).
 *
 * Conventions:
 * - A monomial is a pair of exponent vectors (x, y), stored as a string key:
 *   one UTF-16 code unit per exponent of x (trailing zeros dropped), then, if
 *   some y-exponent is nonzero, the separator U+FFFF and the y-exponents
 *   (trailing zeros dropped). Exponents are limited to 0..65534.
 * - Coefficients are exact nonzero integers (coefficient.ts): numbers while safe, bigints past
 *   2^53 − 1, always in canonical form, so `===` on coefficients is value equality.
 * - Values are canonical after every operation: no zero coefficients, keys
 *   normalised, so structural equality is polynomial equality.
 * - The zero polynomial has degree −Infinity.
 * - Canonical (display) term order: total degree descending, then the
 *   x-exponent vectors lexicographically descending (x_1 first), then the
 *   y-exponent vectors likewise. E.g. `x_{1}^{2}x_{2} + x_{1}x_{3} + x_{2}^{2}`.
 */
import { accumulate, mulChecked, negateCoefficient, absCoefficient, toCoefficient, type Coefficient } from './coefficient'
import { InvalidArgumentError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'

const SEP = '\uffff'
const SEP_CODE = 0xffff

/** One term: exponent vectors of x and y (1-based variables at index 0) and its coefficient. */
export interface Term {
  x: number[]
  y: number[]
  coefficient: Coefficient
}

/** Variable name: `{ set: 'x', index: 3 }` is x_3. */
export interface Variable {
  set: 'x' | 'y'
  index: number
}

/** Encode exponent vectors as a monomial key; e.g. `encodeMonomial([2,1], [])`. */
export function encodeMonomial(x: readonly number[], y: readonly number[] = []): string {
  let xl = x.length
  while (xl > 0 && x[xl - 1] === 0) xl--
  let yl = y.length
  while (yl > 0 && y[yl - 1] === 0) yl--
  let s = ''
  for (let i = 0; i < xl; i++) s += expChar(x[i]!)
  if (yl > 0) {
    s += SEP
    for (let i = 0; i < yl; i++) s += expChar(y[i]!)
  }
  return s
}

function expChar(e: number): string {
  if (!Number.isInteger(e) || e < 0 || e >= SEP_CODE) throw new InvalidArgumentError(`exponent ${e} out of range 0..65534`)
  return String.fromCharCode(e)
}

/** Decode a monomial key into exponent vectors; e.g. `decodeMonomial(encodeMonomial([1],[0,2]))`. */
export function decodeMonomial(key: string): { x: number[], y: number[] } {
  const x: number[] = []
  const y: number[] = []
  let target = x
  for (let i = 0; i < key.length; i++) {
    const c = key.charCodeAt(i)
    if (c === SEP_CODE) target = y
    else target.push(c)
  }
  return { x, y }
}

/** Sparse polynomial in x and y over ℤ. Immutable from the outside. */
export class Polynomial {
  /** Monomial key → nonzero coefficient. Treat as read-only. */
  readonly terms: ReadonlyMap<string, Coefficient>

  /** Wraps a map that the caller promises is canonical (no zero coefficients). */
  constructor(terms: Map<string, Coefficient>) {
    this.terms = terms
  }

  /** The zero polynomial. */
  static zero(): Polynomial {
    return new Polynomial(new Map())
  }

  /** The constant c; e.g. `Polynomial.constant(3)`. */
  static constant(value: number | bigint): Polynomial {
    const c = toCoefficient(value)
    return new Polynomial(c === 0 ? new Map() : new Map([['', c]]))
  }

  /** The constant 1. */
  static one(): Polynomial {
    return Polynomial.constant(1)
  }

  /** The variable x_i; e.g. `Polynomial.x(2)`. */
  static x(i: number): Polynomial {
    return Polynomial.variable({ set: 'x', index: i })
  }

  /** The variable y_j; e.g. `Polynomial.y(1)`. */
  static y(j: number): Polynomial {
    return Polynomial.variable({ set: 'y', index: j })
  }

  /** A single variable; e.g. `Polynomial.variable({ set: 'x', index: 1 })`. */
  static variable(v: Variable): Polynomial {
    if (!Number.isInteger(v.index) || v.index < 1) throw new InvalidArgumentError(`variable index must be ≥ 1, got ${v.index}`)
    const e = new Array<number>(v.index).fill(0)
    e[v.index - 1] = 1
    return Polynomial.monomial(v.set === 'x' ? e : [], v.set === 'y' ? e : [], 1)
  }

  /** c · x^a y^b; e.g. `Polynomial.monomial([2,1], [], 1)` is x_1^2 x_2. */
  static monomial(x: readonly number[], y: readonly number[] = [], value: number | bigint = 1): Polynomial {
    const coefficient = toCoefficient(value)
    if (coefficient === 0) return Polynomial.zero()
    return new Polynomial(new Map([[encodeMonomial(x, y), coefficient]]))
  }

  /** Sum of terms (repeated monomials are added); e.g. `fromTerms([{x:[1],y:[],coefficient:2}])`. */
  static fromTerms(terms: Iterable<Term>): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const t of terms) {
      accumulate(acc, encodeMonomial(t.x, t.y), toCoefficient(t.coefficient))
    }
    return new Polynomial(acc)
  }

  /** Number of terms. */
  get size(): number {
    return this.terms.size
  }

  isZero(): boolean {
    return this.terms.size === 0
  }

  /** Structural (= mathematical, by canonicity) equality. */
  equals(other: Polynomial): boolean {
    if (this.terms.size !== other.terms.size) return false
    for (const [k, c] of this.terms) if (other.terms.get(k) !== c) return false
    return true
  }

  /** Coefficient of x^a y^b (0 when absent). */
  coefficientOf(x: readonly number[], y: readonly number[] = []): Coefficient {
    return this.terms.get(encodeMonomial(x, y)) ?? 0
  }

  add(other: Polynomial): Polynomial {
    const acc = new Map(this.terms)
    for (const [k, c] of other.terms) accumulate(acc, k, c)
    return new Polynomial(acc)
  }

  sub(other: Polynomial): Polynomial {
    const acc = new Map(this.terms)
    for (const [k, c] of other.terms) accumulate(acc, k, negateCoefficient(c))
    return new Polynomial(acc)
  }

  neg(): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [k, c] of this.terms) acc.set(k, negateCoefficient(c))
    return new Polynomial(acc)
  }

  /** c · this; e.g. `p.scale(-2)`. */
  scale(value: number | bigint): Polynomial {
    const c = toCoefficient(value)
    if (c === 0) return Polynomial.zero()
    const acc = new Map<string, Coefficient>()
    for (const [k, v] of this.terms) acc.set(k, mulChecked(v, c))
    return new Polynomial(acc)
  }

  /** Product; pass a budget to bound the number of terms. */
  mul(other: Polynomial, budget?: Budget | BudgetMeter): Polynomial {
    const meter = budget === undefined ? undefined : toMeter(budget)
    const a = [...this.terms].map(([k, c]) => ({ e: decodeMonomial(k), c }))
    const b = [...other.terms].map(([k, c]) => ({ e: decodeMonomial(k), c }))
    const acc = new Map<string, Coefficient>()
    for (const s of a) {
      meter?.step(b.length)
      for (const t of b) {
        accumulate(acc, encodeMonomial(addVec(s.e.x, t.e.x), addVec(s.e.y, t.e.y)), mulChecked(s.c, t.c))
      }
      meter?.terms(acc.size)
    }
    return new Polynomial(acc)
  }

  /** this^k for k ≥ 0. */
  pow(k: number, budget?: Budget | BudgetMeter): Polynomial {
    if (!Number.isInteger(k) || k < 0) throw new InvalidArgumentError(`exponent must be a nonnegative integer, got ${k}`)
    let result = Polynomial.one()
    for (let i = 0; i < k; i++) result = result.mul(this, budget)
    return result
  }

  /** Total degree; −Infinity for the zero polynomial. */
  degree(): number {
    let d = -Infinity
    for (const k of this.terms.keys()) d = Math.max(d, keyDegree(k))
    return d
  }

  /** Total degree in one set of variables; −Infinity for zero. */
  degreeIn(set: 'x' | 'y'): number {
    let d = -Infinity
    for (const k of this.terms.keys()) {
      const e = decodeMonomial(k)
      d = Math.max(d, sum(set === 'x' ? e.x : e.y))
    }
    return d
  }

  /** Whether every term has the same total degree (zero counts as homogeneous). */
  isHomogeneous(): boolean {
    let d: number | undefined
    for (const k of this.terms.keys()) {
      const e = keyDegree(k)
      if (d === undefined) d = e
      else if (d !== e) return false
    }
    return true
  }

  /** Part of total degree d. */
  homogeneousComponent(d: number): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [k, c] of this.terms) if (keyDegree(k) === d) acc.set(k, c)
    return new Polynomial(acc)
  }

  /** Lowest-degree nonzero homogeneous part (zero for zero). */
  lowestDegreePart(): Polynomial {
    let d = Infinity
    for (const k of this.terms.keys()) d = Math.min(d, keyDegree(k))
    return d === Infinity ? this : this.homogeneousComponent(d)
  }

  /** Largest index i with x_i (or y_i) present; 0 if none. */
  maxIndex(set: 'x' | 'y'): number {
    let m = 0
    for (const k of this.terms.keys()) {
      const e = decodeMonomial(k)
      m = Math.max(m, (set === 'x' ? e.x : e.y).length)
    }
    return m
  }

  /** Terms in the canonical order (see module header). */
  termList(): Term[] {
    return sortTerms([...this.terms].map(([k, c]) => ({ ...decodeMonomial(k), coefficient: c })))
  }

  /** Substitute each variable by a polynomial; `f(v)` returning undefined keeps v. */
  substitute(f: (v: Variable) => Polynomial | undefined, budget?: Budget | BudgetMeter): Polynomial {
    const cache = new Map<string, Polynomial>()
    const image = (v: Variable, e: number): Polynomial => {
      const key = `${v.set}${v.index}^${e}`
      let p = cache.get(key)
      if (!p) {
        const base = f(v) ?? Polynomial.variable(v)
        p = base.pow(e, budget)
        cache.set(key, p)
      }
      return p
    }
    let result = Polynomial.zero()
    for (const [k, c] of this.terms) {
      const e = decodeMonomial(k)
      let t = Polynomial.constant(c)
      e.x.forEach((a, i) => { if (a > 0) t = t.mul(image({ set: 'x', index: i + 1 }, a), budget) })
      e.y.forEach((a, i) => { if (a > 0) t = t.mul(image({ set: 'y', index: i + 1 }, a), budget) })
      result = result.add(t)
    }
    return result
  }

  /** y_j ↦ −y_j for all j (switches between the x − y and x + y conventions). */
  negateY(): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [k, c] of this.terms) {
      const e = decodeMonomial(k)
      acc.set(k, sum(e.y) % 2 === 1 ? negateCoefficient(c) : c)
    }
    return new Polynomial(acc)
  }

  /** Exchange the roles of x and y: x_i ↔ y_i. */
  swapXY(): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [k, c] of this.terms) {
      const e = decodeMonomial(k)
      acc.set(encodeMonomial(e.y, e.x), c)
    }
    return new Polynomial(acc)
  }

  /** Rename x_i ↦ x_{i+m} (and leave y); e.g. shifting before embedding into more variables. */
  shiftX(m: number): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [k, c] of this.terms) {
      const e = decodeMonomial(k)
      acc.set(encodeMonomial(e.x.length ? [...new Array<number>(m).fill(0), ...e.x] : [], e.y), c)
    }
    return new Polynomial(acc)
  }

  /** Set x_i = 0 for i > k (truncation to the first k x-variables). */
  truncateX(k: number): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [key, c] of this.terms) {
      const e = decodeMonomial(key)
      if (e.x.length <= k) acc.set(key, c)
    }
    return new Polynomial(acc)
  }

  /** Exact value at integer points (missing values count as 0); e.g. `p.evaluate([1,1,1])`. */
  evaluate(x: readonly (number | bigint)[], y: readonly (number | bigint)[] = []): bigint {
    let total = 0n
    for (const [k, c] of this.terms) {
      const e = decodeMonomial(k)
      let t = BigInt(c)
      e.x.forEach((a, i) => { if (a > 0) t *= BigInt(x[i] ?? 0) ** BigInt(a) })
      e.y.forEach((a, i) => { if (a > 0) t *= BigInt(y[i] ?? 0) ** BigInt(a) })
      total += t
    }
    return total
  }

  /** Apply the transposition of variables i ↔ i+1 in one set. */
  swapVariables(set: 'x' | 'y', i: number): Polynomial {
    const acc = new Map<string, Coefficient>()
    for (const [k, c] of this.terms) {
      const e = decodeMonomial(k)
      const v = set === 'x' ? e.x : e.y
      while (v.length < i + 1) v.push(0)
      const t = v[i - 1]!
      v[i - 1] = v[i]!
      v[i] = t
      acc.set(encodeMonomial(e.x, e.y), c)
    }
    return new Polynomial(acc)
  }

  /** Symmetric in the given variables of one set (default x_1..x_n for n = highest index present)? */
  isSymmetricIn(set: 'x' | 'y', count?: number): boolean {
    const n = count ?? this.maxIndex(set)
    for (let i = 1; i < n; i++) if (!this.swapVariables(set, i).equals(this)) return false
    return true
  }

  /** LaTeX in the canonical order; e.g. `x_{1}^{2}x_{2} - 2x_{1}y_{1} + 1`. */
  /**
   * LaTeX in the canonical term order. With `maxTerms`, a longer polynomial is cut after that
   * many terms and ends in `+ \cdots` with the number of terms, e.g. `toLatex(100)` for a report.
   */
  toLatex(maxTerms = Infinity): string {
    const list = this.termList()
    if (list.length === 0) return '0'
    let out = ''
    list.slice(0, maxTerms).forEach((t, idx) => {
      const mono = monomialLatex(t.x, t.y)
      const abs = absCoefficient(t.coefficient)
      const body = mono === '' ? String(abs) : abs === 1 ? mono : `${abs}${mono}`
      if (idx === 0) out += t.coefficient < 0 ? `-${body}` : body
      else out += t.coefficient < 0 ? ` - ${body}` : ` + ${body}`
    })
    return list.length > maxTerms ? `${out} + \\cdots \\;\\text{(${list.length} terms)}` : out
  }

  /** Plain-text rendering, e.g. `x1^2x2 + x1x3`. */
  toString(): string {
    return this.toLatex().replace(/_\{(\d+)\}/g, '$1').replace(/\^\{(\d+)\}/g, '^$1')
  }
}

/** LaTeX of a monomial, e.g. `x_{1}^{2}y_{3}`; empty for 1. */
export function monomialLatex(x: readonly number[], y: readonly number[]): string {
  let s = ''
  x.forEach((a, i) => { if (a > 0) s += a === 1 ? `x_{${i + 1}}` : `x_{${i + 1}}^{${a}}` })
  y.forEach((a, i) => { if (a > 0) s += a === 1 ? `y_{${i + 1}}` : `y_{${i + 1}}^{${a}}` })
  return s
}

/** Term-by-term difference between an expected and an actual polynomial. */
export interface PolynomialDifference {
  equal: boolean
  /** In expected, absent from actual. */
  missing: Term[]
  /** In actual, absent from expected. */
  extra: Term[]
  /** Present in both with different coefficients. */
  wrongCoefficient: { x: number[], y: number[], expected: Coefficient, actual: Coefficient }[]
}

/** Compare an expected polynomial with an actual one term by term; e.g. `polynomialDifference(claim, truth)`. */
export function polynomialDifference(expected: Polynomial, actual: Polynomial): PolynomialDifference {
  const missing: Term[] = []
  const extra: Term[] = []
  const wrong: PolynomialDifference['wrongCoefficient'] = []
  // Walk the maps by key and decode only what differs: the differences are usually few.
  for (const [k, c] of expected.terms) {
    const a = actual.terms.get(k)
    if (a === undefined) missing.push({ ...decodeMonomial(k), coefficient: c })
    else if (a !== c) wrong.push({ ...decodeMonomial(k), expected: c, actual: a })
  }
  for (const [k, c] of actual.terms) {
    if (!expected.terms.has(k)) extra.push({ ...decodeMonomial(k), coefficient: c })
  }
  return {
    equal: missing.length === 0 && extra.length === 0 && wrong.length === 0,
    missing: sortTerms(missing),
    extra: sortTerms(extra),
    wrongCoefficient: sortTerms(wrong.map(w => ({ ...w, coefficient: w.expected }))).map(({ coefficient: _c, ...w }) => w),
  }
}

function keyDegree(k: string): number {
  let d = 0
  for (let i = 0; i < k.length; i++) {
    const c = k.charCodeAt(i)
    if (c !== SEP_CODE) d += c
  }
  return d
}

function addVec(a: readonly number[], b: readonly number[]): number[] {
  const n = Math.max(a.length, b.length)
  const out = new Array<number>(n)
  for (let i = 0; i < n; i++) out[i] = (a[i] ?? 0) + (b[i] ?? 0)
  return out
}

function sum(v: readonly number[]): number {
  let s = 0
  for (const a of v) s += a
  return s
}

/**
 * Canonical order. Each term gets a string key whose plain string order is the canonical
 * order (degree descending, then exponent vectors descending), so sorting compares strings
 * natively instead of walking vectors: tens of thousands of terms sort in milliseconds.
 */
function sortTerms<T extends Term>(terms: T[]): T[] {
  let xWidth = 0
  let yWidth = 0
  for (const t of terms) {
    xWidth = Math.max(xWidth, t.x.length)
    yWidth = Math.max(yWidth, t.y.length)
  }
  const keyed = terms.map((t) => {
    let key = String.fromCharCode(0xFFFE - sum(t.x) - sum(t.y))
    for (let i = 0; i < xWidth; i++) key += String.fromCharCode(0xFFFE - (t.x[i] ?? 0))
    for (let i = 0; i < yWidth; i++) key += String.fromCharCode(0xFFFE - (t.y[i] ?? 0))
    return { t, key }
  })
  keyed.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0))
  return keyed.map(d => d.t)
}

/** Shorthand: product of linear factors such as ∏(x_i − y_j). */
export function productOf(factors: readonly Polynomial[], budget?: Budget | BudgetMeter): Polynomial {
  let p = Polynomial.one()
  for (const f of factors) p = p.mul(f, budget)
  return p
}
