/**
 * Skew Schur functions and the coproduct of Schur functions.
 *
 * Conventions:
 * - Partitions and SchurCombinations are those of symmetric.ts (weakly decreasing parts, keys "3,1").
 * - A skew shape λ/μ needs μ ⊆ λ (μ_i ≤ λ_i for every i); otherwise s_{λ/μ} = 0 and the
 *   expansion is the empty combination (not an error: that is the value of the function).
 * - s_{λ/μ} = Σ_ν c^λ_{μν} s_ν (Littlewood–Richardson rule). We count LR tableaux of shape λ/μ
 *   directly: the letters 1, 2, … are added to μ as horizontal strips inside λ, and for every
 *   letter k ≥ 2 and row r, #{k in rows ≤ r} ≤ #{k−1 in rows < r} (the lattice condition on the
 *   reverse reading word, rows top to bottom, each right to left). The content of a completed
 *   filling is ν.
 * - Δ(s_λ) = Σ_{μ ⊆ λ} s_μ ⊗ s_{λ/μ} = Σ_{μ,ν} c^λ_{μν} s_μ ⊗ s_ν. The coproduct is returned as
 *   a list of terms (left = μ, right = ν, coefficient), both orders of a pair listed, sorted by
 *   |μ| descending and then by μ and ν in decreasing lexicographic order.
 * - `maxRows` keeps only ν with at most that many rows (s_ν in finitely many variables).
 * - Search: row r of an LR tableau holds only letters ≤ r, so letter k must complete row k and no
 *   row above it is left open; branches that break this are cut at once.
 */
import { type Partition, type SchurCombination, partitionKey, toPartition } from './symmetric'
import { InvalidArgumentError } from './errors'
import { addChecked, type Coefficient } from './coefficient'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** One term c · s_μ ⊗ s_ν of a coproduct. */
export interface CoproductTerm {
  left: Partition
  right: Partition
  coefficient: Coefficient
}

/** True when μ ⊆ λ as Young diagrams; e.g. `containsPartition([3,1], [2,1]) === true`. */
export function containsPartition(lambda: readonly number[], mu: readonly number[]): boolean {
  if (mu.length > lambda.length) return false
  for (let i = 0; i < mu.length; i++) if (mu[i]! > lambda[i]!) return false
  return true
}

/**
 * s_{λ/μ} in the Schur basis; e.g. s_{21/1} = s_2 + s_{11}.
 * Empty when μ ⊄ λ; `maxRows` drops s_ν with ℓ(ν) > maxRows.
 */
export function skewSchurExpansion(lambda: readonly number[], mu: readonly number[], options: { maxRows?: number, budget?: Budget | BudgetMeter } = {}): SchurCombination {
  const meter = toMeter(options.budget)
  const lam = toPartition(lambda)
  const inner = toPartition(mu)
  const maxRows = options.maxRows ?? Infinity
  if (maxRows < 0 || (Number.isFinite(maxRows) && !Number.isInteger(maxRows))) throw new InvalidArgumentError('maxRows must be a nonnegative integer')
  const out: SchurCombination = new Map()
  if (!containsPartition(lam, inner)) return out
  const rows = lam.length
  let remaining = 0
  for (let i = 0; i < rows; i++) remaining += lam[i]! - (inner[i] ?? 0)
  const content: number[] = []
  // shape: current filled shape (length rows, zeros allowed); prev[r] = letters k−1 in row r.
  const addLetter = (k: number, shape: number[], prev: number[], left: number, cap: number): void => {
    meter.step()
    if (left === 0) {
      const key = partitionKey(content)
      out.set(key, addChecked(out.get(key) ?? 0, 1))
      meter.terms(out.size, 'partitions')
      return
    }
    if (k > maxRows || k > rows) return
    const add = new Array<number>(rows).fill(0)
    // The letter k occurs at most as often as k−1 (lattice word), at least once (the filling goes on).
    const rec = (r: number, placed: number, prefixK: number, prefixPrev: number): void => {
      if (r === rows) {
        if (placed === 0) return
        // Letter k + 1 must complete row k, with at most as many boxes as letter k has.
        if (k < rows && lam[k]! - shape[k]! - add[k]! > placed) return
        const next = shape.slice()
        for (let i = 0; i < rows; i++) next[i]! += add[i]!
        content.push(placed)
        addLetter(k + 1, next, add.slice(), left - placed, placed)
        content.pop()
        return
      }
      // Horizontal strip inside λ: row r may not pass the old row r−1 nor λ_r.
      const room = Math.min(lam[r]!, r === 0 ? Infinity : shape[r - 1]!) - shape[r]!
      const most = Math.min(room, cap - placed)
      // Row r (0-based) holds only letters ≤ r + 1 (its largest entry is read right after the
      // rows above, which hold only smaller letters), so letter k must complete row k − 1 and
      // cannot go above it: this prunes every filling that could never be finished.
      const least = r === k - 1 ? lam[r]! - shape[r]! : 0
      if (r < k - 1 && room > 0) return
      for (let a = most; a >= least; a--) {
        if (k >= 2 && prefixK + a > prefixPrev) continue
        add[r] = a
        rec(r + 1, placed + a, prefixK + a, prefixPrev + (prev[r] ?? 0))
        add[r] = 0
      }
    }
    rec(0, 0, 0, 0)
  }
  const start = new Array<number>(rows).fill(0)
  for (let i = 0; i < inner.length; i++) start[i] = inner[i]!
  addLetter(1, start, [], remaining, remaining)
  return out
}

/** Skew Littlewood–Richardson coefficient c^λ_{μν} = ⟨s_{λ/μ}, s_ν⟩; e.g. c^{21}_{1,1} = 1. */
export function skewCoefficient(lambda: readonly number[], mu: readonly number[], nu: readonly number[]): Coefficient {
  return skewSchurExpansion(lambda, mu).get(partitionKey(toPartition(nu))) ?? 0
}

/** All partitions μ ⊆ λ (including ∅ and λ). */
export function partitionsInside(lambda: readonly number[]): Partition[] {
  const lam = toPartition(lambda)
  const out: Partition[] = []
  const cur: number[] = []
  const rec = (r: number, bound: number): void => {
    if (r === lam.length) { out.push(cur.filter(p => p > 0)); return }
    for (let m = Math.min(bound, lam[r]!); m >= 0; m--) {
      cur.push(m)
      rec(r + 1, m)
      cur.pop()
    }
  }
  rec(0, Infinity)
  return out
}

/** Δ(s_λ) = Σ c^λ_{μν} s_μ ⊗ s_ν; e.g. Δ(s_1) = s_1 ⊗ 1 + 1 ⊗ s_1. */
export function schurCoproduct(lambda: readonly number[], options: { budget?: Budget | BudgetMeter } = {}): CoproductTerm[] {
  const meter = toMeter(options.budget)
  const out: CoproductTerm[] = []
  for (const mu of partitionsInside(lambda)) {
    for (const [key, coefficient] of skewSchurExpansion(lambda, mu, { budget: meter })) {
      out.push({ left: mu, right: key === '' ? [] : key.split(',').map(Number), coefficient })
    }
    meter.terms(out.length, 'coproduct terms')
  }
  const size = (p: readonly number[]) => p.reduce((s, a) => s + a, 0)
  const lex = (a: readonly number[], b: readonly number[]) => {
    for (let i = 0; i < Math.max(a.length, b.length); i++) {
      const d = (a[i] ?? 0) - (b[i] ?? 0)
      if (d !== 0) return d
    }
    return 0
  }
  return out.sort((s, t) => size(t.left) - size(s.left) || lex(t.left, s.left) || lex(t.right, s.right))
}
