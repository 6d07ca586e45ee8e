/**
 * Symmetric polynomials and symmetric functions.
 *
 * Conventions:
 * - A partition is a weakly decreasing array of positive integers, e.g. [3, 1]; [] is ∅.
 *   Its key is the parts joined by "," ("3,1"; "" for ∅).
 * - Finitely many variables: s_λ(x_1..x_n), e_k, h_k, p_k, m_λ are Polynomials in x_1..x_n.
 *   s_λ(x_1..x_n) = Σ over semistandard tableaux of shape λ with entries ≤ n of x^content.
 * - Symmetric-function level: a SchurCombination maps partition keys to nonzero integer
 *   coefficients and stands for Σ c_λ s_λ (no bound on the number of variables).
 * - Littlewood–Richardson rule: c^ν_{λμ} counts semistandard fillings of ν/λ with content μ
 *   whose reverse reading word (rows top to bottom, each right to left) is a lattice word.
 *   We add the letters 1, 2, … as horizontal strips and impose, for every letter k ≥ 2 and
 *   row r, #{k in rows ≤ r} ≤ #{k−1 in rows < r}, which is the lattice condition.
 * - ω is the involution with ω(s_λ) = s_{λ'} (λ' the conjugate partition).
 */
import { compareLex, peelTriangular } from './triangular'
import { Polynomial, encodeMonomial } from './polynomial'
import { InvalidArgumentError, NotSymmetricError } from './errors'
import { accumulate, addChecked, mulChecked, type Coefficient } from './coefficient'
import { toMeter, type Budget, type BudgetMeter } from './budget'

export type Partition = number[]
export type SchurCombination = Map<string, Coefficient>

/** Key of a partition; e.g. `partitionKey([3,1]) === "3,1"`. */
export function partitionKey(lambda: readonly number[]): string {
  return lambda.filter(p => p > 0).join(',')
}

/** Partition from its key; e.g. `partitionFromKey("3,1")` is [3, 1]. */
export function partitionFromKey(key: string): Partition {
  return key === '' ? [] : key.split(',').map(Number)
}

/** Validate and normalise (drop zeros); throws on a non-partition. */
export function toPartition(lambda: readonly number[]): Partition {
  const out = lambda.filter(p => p !== 0)
  for (let i = 0; i < out.length; i++) {
    const p = out[i]!
    if (!Number.isInteger(p) || p < 0 || (i > 0 && p > out[i - 1]!)) throw new InvalidArgumentError(`[${lambda.join(',')}] is not a partition`)
  }
  return out
}

/** Conjugate partition; e.g. [3,1] ↦ [2,1,1]. */
export function conjugate(lambda: readonly number[]): Partition {
  const out: number[] = []
  const first = lambda[0] ?? 0
  for (let j = 1; j <= first; j++) out.push(lambda.filter(p => p >= j).length)
  return out
}

/** All partitions of n, in decreasing lexicographic order; e.g. n = 3 gives [3], [2,1], [1,1,1]. */
export function partitionsOf(n: number, maxPart = n): Partition[] {
  if (n === 0) return [[]]
  const out: Partition[] = []
  for (let first = Math.min(n, maxPart); first >= 1; first--) {
    for (const rest of partitionsOf(n - first, first)) out.push([first, ...rest])
  }
  return out
}

/** Number of standard Young tableaux f^λ (hook length formula), exact. */
export function standardTableauxCount(lambda: readonly number[]): bigint {
  const lam = toPartition(lambda)
  const conj = conjugate(lam)
  let n = 0
  for (const p of lam) n += p
  let num = 1n
  for (let i = 2; i <= n; i++) num *= BigInt(i)
  let den = 1n
  lam.forEach((row, i) => {
    for (let j = 0; j < row; j++) den *= BigInt(row - j - 1 + (conj[j]! - i - 1) + 1)
  })
  return num / den
}

/** Horizontal strips μ ⊆ λ (λ/μ has at most one box per column), with ℓ(μ) ≤ maxRows. */
function innerHorizontalStrips(lambda: readonly number[], maxRows: number): Partition[] {
  const out: Partition[] = []
  const cur: number[] = []
  const rec = (r: number): void => {
    if (r === lambda.length) {
      if (cur.filter(p => p > 0).length <= maxRows) out.push(cur.filter(p => p > 0))
      return
    }
    const lo = lambda[r + 1] ?? 0
    for (let m = lo; m <= lambda[r]!; m++) {
      cur.push(m)
      rec(r + 1)
      cur.pop()
    }
  }
  rec(0)
  return out
}

/** Schur polynomial s_λ(x_1..x_n); e.g. s_{[1]}(x_1,x_2) = x_1 + x_2. */
export function schurPolynomial(lambda: readonly number[], n: number, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  const lam = toPartition(lambda)
  const memo = new Map<string, Polynomial>()
  const go = (shape: Partition, k: number): Polynomial => {
    if (shape.length === 0) return Polynomial.one()
    if (shape.length > k) return Polynomial.zero()
    const key = `${k}|${shape.join(',')}`
    const hit = memo.get(key)
    if (hit) return hit
    let total = Polynomial.zero()
    let size = 0
    for (const p of shape) size += p
    for (const mu of innerHorizontalStrips(shape, k - 1)) {
      let sm = 0
      for (const p of mu) sm += p
      const e = new Array<number>(k).fill(0)
      e[k - 1] = size - sm
      total = total.add(go(mu, k - 1).mul(Polynomial.monomial(e), meter))
      meter.terms(total.size)
    }
    memo.set(key, total)
    return total
  }
  return go(lam, n)
}

/** Elementary symmetric e_k(x_1..x_n); e.g. e_2(x_1,x_2) = x_1x_2. */
export function elementarySymmetric(k: number, n: number): Polynomial {
  return schurPolynomial(new Array<number>(k).fill(1), n)
}

/** Complete homogeneous h_k(x_1..x_n); e.g. h_2(x_1,x_2) = x_1^2 + x_1x_2 + x_2^2. */
export function completeSymmetric(k: number, n: number): Polynomial {
  return k === 0 ? Polynomial.one() : schurPolynomial([k], n)
}

/** Power sum p_k(x_1..x_n) = Σ x_i^k (p_0 = n). */
export function powerSum(k: number, n: number): Polynomial {
  if (k === 0) return Polynomial.constant(n)
  let p = Polynomial.zero()
  for (let i = 1; i <= n; i++) {
    const e = new Array<number>(i).fill(0)
    e[i - 1] = k
    p = p.add(Polynomial.monomial(e))
  }
  return p
}

/** Monomial symmetric m_λ(x_1..x_n): sum of the distinct permutations of x^λ. */
export function monomialSymmetric(lambda: readonly number[], n: number): Polynomial {
  const lam = toPartition(lambda)
  if (lam.length > n) return Polynomial.zero()
  const padded = [...lam, ...new Array<number>(n - lam.length).fill(0)]
  const seen = new Set<string>()
  const acc = new Map<string, Coefficient>()
  const perm = (arr: number[], k: number): void => {
    if (k === arr.length) {
      const key = encodeMonomial(arr)
      if (!seen.has(key)) { seen.add(key); acc.set(key, 1) }
      return
    }
    const used = new Set<number>()
    for (let i = k; i < arr.length; i++) {
      if (used.has(arr[i]!)) continue
      used.add(arr[i]!)
      ;[arr[k], arr[i]] = [arr[i]!, arr[k]!]
      perm(arr, k + 1)
      ;[arr[k], arr[i]] = [arr[i]!, arr[k]!]
    }
  }
  perm(padded, 0)
  return new Polynomial(acc)
}

/** Kostka number K_{λμ}: semistandard tableaux of shape λ and content μ (μ any composition). */
export function kostkaNumber(lambda: readonly number[], mu: readonly number[]): Coefficient {
  const lam = toPartition(lambda)
  const memo = new Map<string, Coefficient>()
  // Peel the largest letter: remove a horizontal strip of size μ_k from the shape.
  const go = (shape: Partition, k: number): Coefficient => {
    if (k === 0) return shape.length === 0 ? 1 : 0
    const key = `${k}|${shape.join(',')}`
    const hit = memo.get(key)
    if (hit !== undefined) return hit
    let size = 0
    for (const p of shape) size += p
    let total: Coefficient = 0
    for (const inner of innerHorizontalStrips(shape, k - 1)) {
      let s = 0
      for (const p of inner) s += p
      if (size - s === mu[k - 1]) total = addChecked(total, go(inner, k - 1))
    }
    memo.set(key, total)
    return total
  }
  let sl = 0
  for (const p of lam) sl += p
  let sm = 0
  for (const p of mu) sm += p
  if (sl !== sm) return 0
  return go(lam, mu.length)
}

/**
 * Expand a symmetric polynomial in x_1..x_n in Schur polynomials s_λ(x_1..x_n), ℓ(λ) ≤ n;
 * e.g. x_1^2 + x_1x_2 + x_2^2 ↦ {"2": 1}. Throws NotSymmetricError when f is not symmetric.
 */
export function schurExpansion(f: Polynomial, n = f.maxIndex('x'), budget?: Budget | BudgetMeter): SchurCombination {
  const meter = toMeter(budget)
  if (f.maxIndex('y') > 0) throw new NotSymmetricError('the polynomial involves y-variables')
  if (f.maxIndex('x') > n) throw new NotSymmetricError(`the polynomial involves x_${f.maxIndex('x')}, beyond x_${n}`)
  if (!f.isSymmetricIn('x', n)) throw new NotSymmetricError(`the polynomial is not symmetric in x_1..x_${n}`)
  // The lexicographically largest monomial of a symmetric polynomial has partition exponents
  // and leads s_λ, so it leads the peeling (triangular.ts).
  return peelTriangular(f, {
    compare: (a, b) => compareLex(b, a),
    label: e => partitionKey(e.filter(a => a > 0)),
    element: e => schurPolynomial(e.filter(a => a > 0), n, meter),
  }, meter)
}

/** s_λ · s_μ as a Schur combination by the Littlewood–Richardson rule; `maxRows` drops ν with more rows. */
export function schurProduct(lambda: readonly number[], mu: readonly number[], options: { maxRows?: number, budget?: Budget | BudgetMeter } = {}): SchurCombination {
  const meter = toMeter(options.budget)
  const lam = toPartition(lambda)
  const m = toPartition(mu)
  const maxRows = options.maxRows ?? Infinity
  const out: SchurCombination = new Map()
  // shape: current outer shape; prev[r] = number of letter k−1 in row r.
  const addLetter = (k: number, shape: number[], prev: number[]): void => {
    meter.step()
    if (k > m.length) {
      const key = partitionKey(shape)
      out.set(key, addChecked(out.get(key) ?? 0, 1))
      meter.terms(out.size, 'partitions')
      return
    }
    const count = m[k - 1]!
    const rows = Math.min(shape.length + 1, maxRows)
    const add = new Array<number>(rows).fill(0)
    const rec = (r: number, left: number, prefixK: number, prefixPrev: number): void => {
      if (left === 0) {
        const next = shape.slice()
        for (let i = 0; i < rows; i++) if (add[i]! > 0) next[i] = (next[i] ?? 0) + add[i]!
        addLetter(k + 1, next, add.slice())
        return
      }
      if (r >= rows) return
      // horizontal strip: new row r may not pass old row r−1
      const cap = r === 0 ? left : Math.min(left, shape[r - 1]! - (shape[r] ?? 0))
      for (let a = cap; a >= 0; a--) {
        if (k >= 2 && prefixK + a > prefixPrev) continue
        add[r] = a
        rec(r + 1, left - a, prefixK + a, prefixPrev + (prev[r] ?? 0))
        add[r] = 0
      }
    }
    rec(0, count, 0, 0)
  }
  addLetter(1, lam.slice(), [])
  return out
}

/** Littlewood–Richardson coefficient c^ν_{λμ}; e.g. c^{321}_{21,21} = 2. */
export function littlewoodRichardson(nu: readonly number[], lambda: readonly number[], mu: readonly number[]): Coefficient {
  return schurProduct(lambda, mu).get(partitionKey(toPartition(nu))) ?? 0
}

/** Product of two Schur combinations. */
export function multiplySchurCombinations(a: SchurCombination, b: SchurCombination, budget?: Budget | BudgetMeter): SchurCombination {
  const meter = toMeter(budget)
  const out: SchurCombination = new Map()
  for (const [ka, ca] of a) for (const [kb, cb] of b) {
    for (const [k, c] of schurProduct(partitionFromKey(ka), partitionFromKey(kb), { budget: meter })) {
      accumulate(out, k, mulChecked(mulChecked(ca, cb), c))
    }
  }
  return out
}

/** ω: s_λ ↦ s_{λ'}. */
export function omega(c: SchurCombination): SchurCombination {
  const out: SchurCombination = new Map()
  for (const [k, v] of c) out.set(partitionKey(conjugate(partitionFromKey(k))), v)
  return out
}

/** Σ c_λ s_λ(x_1..x_n) as a polynomial. */
export function schurCombinationToPolynomial(c: SchurCombination, n: number, budget?: Budget | BudgetMeter): Polynomial {
  let p = Polynomial.zero()
  for (const [k, v] of c) p = p.add(schurPolynomial(partitionFromKey(k), n, budget).scale(v))
  return p
}

/** Equality of Schur combinations. */
export function schurCombinationsEqual(a: SchurCombination, b: SchurCombination): boolean {
  if (a.size !== b.size) return false
  for (const [k, v] of a) if (b.get(k) !== v) return false
  return true
}

/** Sorted entries (largest partitions in lexicographic order first). */
export function schurEntries(c: SchurCombination): { partition: Partition, coefficient: Coefficient }[] {
  return [...c].map(([k, coefficient]) => ({ partition: partitionFromKey(k), coefficient }))
    .sort((a, b) => compareLex(b.partition, a.partition))
}
