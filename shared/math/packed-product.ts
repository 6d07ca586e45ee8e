/**
 * The fast path of S_u · S_v by the transition recursion (see schubertProductByTransition):
 * combinations held in typed arrays instead of Maps.
 *
 * Every permutation met while multiplying S_u · S_v by the transition recursion has all its
 * descents at positions ≤ D = max(last descent of u, of v), because every combination is the
 * (unique) expansion of a polynomial in x_1..x_D. Such a permutation is fixed by its first D
 * values (the rest increase), so it is keyed by the number Σ_{i≤D} w(i) B^{i−1}, exact
 * whenever B^D ≤ 2^53 with B bounding the values (B = D + ℓ(u) + ℓ(v) + 2 suffices, as
 * w(i) ≤ i + c_i(w) ≤ D + ℓ(w)).
 *
 * Why typed arrays: these keys are mostly above the small-integer range, so as Map keys each
 * one is a heap number, and a Map per recursion node grows by rehashing; both fed the garbage
 * collector and dominated a fresh process (the command line runs one product per process).
 * Here a combination is three flat arrays (keys, coefficients, and each term's first D values,
 * so that no key is ever decoded by division), and every node accumulates into one reused
 * open-addressing table. Coefficients are floats that stay exact while safe; a sum leaving the
 * safe range stops this path (PackedRangeExceeded) and the caller redoes the product exactly.
 */
import { trimFixedPoints, type Permutation } from './permutation'
import type { BudgetMeter } from './budget'
import type { Coefficient } from './coefficient'
import { transitionStep } from './schubert'

/** A sum left the range of exact floats, or a value left its bound: the caller falls back to exact arithmetic. */
export class PackedRangeExceeded extends Error {
  override readonly name = 'PackedRangeExceeded'
}

const MAX = Number.MAX_SAFE_INTEGER

/** Σ c_t S_{w_t}: term t has key keys[t], coefficient coefficients[t], and w_t(1..D) at values[t·D ..]. */
export interface PackedCombination {
  size: number
  keys: Float64Array
  coefficients: Float64Array
  values: Uint16Array
}

/** Bounds of the numeric keys for one product; undefined when B^D would pass 2^53. */
export interface PackedKeys {
  D: number
  B: number
  /** P[i] = B^{i−1}, i = 1..D (P[0] unused). */
  P: Float64Array
}

export function packedKeys(u: Permutation, v: Permutation): PackedKeys | undefined {
  const last = (w: Permutation): number => { const d = w.descents(); return d.length ? d[d.length - 1]! : 0 }
  const D = Math.max(last(u), last(v), 1)
  const B = D + u.length() + v.length() + 2
  if (B > 0xffff || Math.pow(B, D) > MAX) return undefined
  const P = new Float64Array(D + 1)
  for (let i = 1; i <= D; i++) P[i] = Math.pow(B, i - 1)
  return { D, B, P }
}

/**
 * An open-addressing hash table of terms (numeric key → coefficient, with the term's first D
 * values), reused by every node: `clear()`, `add…` the node's contributions, `take()` its result.
 */
export class TermTable {
  private readonly D: number
  private mask: number
  /** slot → entry index + 1 (0 = empty). */
  private slots: Int32Array
  /** entry → its slot, to clear the table in time proportional to its entries. */
  private slotOf: Int32Array
  private keys: Float64Array
  private coefficients: Float64Array
  private values: Uint16Array
  count = 0

  constructor(D: number, capacity = 1024) {
    this.D = D
    let size = 16
    while (size < 2 * capacity) size *= 2
    this.mask = size - 1
    this.slots = new Int32Array(size)
    this.slotOf = new Int32Array(size >> 1)
    this.keys = new Float64Array(size >> 1)
    this.coefficients = new Float64Array(size >> 1)
    this.values = new Uint16Array((size >> 1) * D)
  }

  clear(): void {
    const { slots, slotOf } = this
    for (let e = 0; e < this.count; e++) slots[slotOf[e]!] = 0
    this.count = 0
  }

  /**
   * Add c · S_w, w being the term at `from` of `source` (values `sourceValues`) with position
   * p set to value a and, if q ≥ 0, position q set to value b (0-based positions); e.g.
   * `add(key', c, vals, t * D, r - 1, wk, k - 1, wr)` for w · t_{rk}.
   */
  add(key: number, c: number, sourceValues: Uint16Array, from: number, p: number, a: number, q: number, b: number): void {
    const mask = this.mask
    const slots = this.slots
    const keys = this.keys
    // Mix both 32-bit halves of the key (keys reach 2^53); multiplicative hashing spreads them.
    let h = Math.imul((key >>> 0) ^ Math.imul((key / 4294967296) >>> 0, 0x9e3779b1), 0x85ebca6b)
    h = (h ^ (h >>> 15)) & mask
    for (;;) {
      const e = slots[h]!
      if (e === 0) break
      if (keys[e - 1] === key) {
        const sum = this.coefficients[e - 1]! + c
        if (sum > MAX || sum < -MAX) throw new PackedRangeExceeded('coefficient beyond 2^53 − 1')
        this.coefficients[e - 1] = sum
        return
      }
      h = (h + 1) & mask
    }
    if (this.count === this.keys.length) { this.grow(); this.add(key, c, sourceValues, from, p, a, q, b); return }
    const e = this.count++
    slots[h] = e + 1
    this.slotOf[e] = h
    keys[e] = key
    this.coefficients[e] = c
    const D = this.D
    const values = this.values
    const to = e * D
    for (let i = 0; i < D; i++) values[to + i] = sourceValues[from + i]!
    if (p >= 0) values[to + p] = a
    if (q >= 0) values[to + q] = b
  }

  /** The nonzero terms as a combination of their own; the table is left as it was. */
  take(): PackedCombination {
    const D = this.D
    let size = 0
    for (let e = 0; e < this.count; e++) if (this.coefficients[e] !== 0) size++
    const out: PackedCombination = { size, keys: new Float64Array(size), coefficients: new Float64Array(size), values: new Uint16Array(size * D) }
    const { keys, coefficients, values } = this
    let t = 0
    for (let e = 0; e < this.count; e++) {
      const c = coefficients[e]!
      if (c === 0) continue
      out.keys[t] = keys[e]!
      out.coefficients[t] = c
      // A loop, not values.subarray(): a view per term was most of this function's time.
      for (let i = 0; i < D; i++) out.values[t * D + i] = values[e * D + i]!
      t++
    }
    return out
  }

  private grow(): void {
    const size = this.slots.length * 2
    const entries = size >> 1
    const widen = <T extends Float64Array | Int32Array | Uint16Array>(old: T, length: number): T => {
      const next = new (old.constructor as new (n: number) => T)(length)
      next.set(old)
      return next
    }
    this.keys = widen(this.keys, entries)
    this.coefficients = widen(this.coefficients, entries)
    this.values = widen(this.values, entries * this.D)
    this.slotOf = widen(this.slotOf, entries)
    this.slots = new Int32Array(size)
    this.mask = size - 1
    for (let e = 0; e < this.count; e++) {
      const key = this.keys[e]!
      let h = Math.imul((key >>> 0) ^ Math.imul((key / 4294967296) >>> 0, 0x9e3779b1), 0x85ebca6b)
      h = (h ^ (h >>> 15)) & this.mask
      while (this.slots[h] !== 0) h = (h + 1) & this.mask
      this.slots[h] = e + 1
      this.slotOf[e] = h
    }
  }
}

/**
 * Add x_r · Σ c_w S_w (the combination `comb`) to `table`, by
 * x_r S_w = Σ_{k>r, ℓ(w t_{rk}) = ℓ(w)+1} S_{w t_{rk}} − Σ_{q<r, ℓ(w t_{qr}) = ℓ(w)+1} S_{w t_{qr}}.
 * `present` is a zeroed scratch array of length B + 2, left zeroed.
 */
function addTimesVariable(table: TermTable, r: number, comb: PackedCombination, keys: PackedKeys, present: Uint8Array): void {
  const { D, B, P } = keys
  const values = comb.values
  const Pr = P[r]!
  for (let t = 0; t < comb.size; t++) {
    const key = comb.keys[t]!
    const c = comb.coefficients[t]!
    const o = t * D
    const wr = values[o + r - 1]!
    for (let i = 0; i < D; i++) present[values[o + i]!] = 1
    // up-moves within the first D positions: w(r) < w(k), no value between them in between
    let m = Infinity
    for (let k = r + 1; k <= D; k++) {
      const wk = values[o + k - 1]!
      if (wk > wr && wk < m) {
        m = wk
        table.add(key + (wk - wr) * (Pr - P[k]!), c, values, o, r - 1, wk, k - 1, wr)
      }
    }
    // up-move into the increasing tail: its smallest value above w(r)
    let tail = wr + 1
    while (present[tail]) tail++
    if (tail < m) {
      if (tail >= B) throw new PackedRangeExceeded('value bound exceeded')
      table.add(key + (tail - wr) * Pr, c, values, o, r - 1, tail, -1, 0)
    }
    // down-moves: w(q) < w(r), q < r, no value between them in between
    let M = -Infinity
    for (let q = r - 1; q >= 1; q--) {
      const wq = values[o + q - 1]!
      if (wq < wr && wq > M) {
        M = wq
        table.add(key + (wr - wq) * (P[q]! - Pr), -c, values, o, q - 1, wr, r - 1, wq)
      }
    }
    for (let i = 0; i < D; i++) present[values[o + i]!] = 0
  }
}

function addAll(table: TermTable, comb: PackedCombination, D: number): void {
  for (let t = 0; t < comb.size; t++) table.add(comb.keys[t]!, comb.coefficients[t]!, comb.values, t * D, -1, 0, -1, 0)
}

/**
 * S_u · S_v by the transition recursion on u over packed combinations, as (trimmed one-line key,
 * coefficient) pairs; throws PackedRangeExceeded when a coefficient or value leaves its bound.
 */
export function packedTransitionProduct(u: Permutation, v: Permutation, keys: PackedKeys, meter: BudgetMeter): Map<string, Coefficient> {
  const { D, B, P } = keys
  // First pass: how many times each node of the transition recursion is used, so that an
  // intermediate combination is dropped as soon as its last user has read it (keeps memory low).
  const uses = new Map<string, number>()
  const keyOf = (line: readonly number[]): { key: string, trimmed: readonly number[] } => {
    const trimmed = trimFixedPoints(line)
    return { key: trimmed.join(','), trimmed }
  }
  const visit = (line: readonly number[]): void => {
    const { key, trimmed } = keyOf(line)
    const seen = uses.get(key)
    uses.set(key, (seen ?? 0) + 1)
    if (seen !== undefined) return
    const step = transitionStep(trimmed)
    if (step) { visit(step.v); for (const o of step.others) visit(o) }
  }
  visit(u.oneLine)

  const baseValues = new Uint16Array(D)
  let baseKey = 0
  for (let i = 1; i <= D; i++) { baseValues[i - 1] = v.at(i); baseKey += v.at(i) * P[i]! }
  const base: PackedCombination = { size: 1, keys: Float64Array.of(baseKey), coefficients: Float64Array.of(1), values: baseValues }
  const table = new TermTable(D)
  const present = new Uint8Array(B + 2)
  const memo = new Map<string, PackedCombination>()
  const release = (key: string): void => {
    const left = uses.get(key)! - 1
    uses.set(key, left)
    if (left === 0) memo.delete(key)
  }
  const go = (line: readonly number[]): PackedCombination => {
    const { key, trimmed } = keyOf(line)
    const hit = memo.get(key)
    if (hit) return hit
    const step = transitionStep(trimmed)
    let result: PackedCombination
    if (!step) result = base
    else {
      // The children first: they use the table too.
      const first = go(step.v)
      const rest = step.others.map(go)
      table.clear()
      addTimesVariable(table, step.r, first, keys, present)
      meter.step(first.size * D)
      release(keyOf(step.v).key)
      for (let i = 0; i < rest.length; i++) {
        addAll(table, rest[i]!, D)
        meter.step(rest[i]!.size)
        release(keyOf(step.others[i]!).key)
      }
      meter.terms(table.count, 'Schubert classes')
      result = table.take()
    }
    memo.set(key, result)
    return result
  }
  const top = go(u.oneLine)
  const out = new Map<string, Coefficient>()
  const used = new Uint8Array(B + 2)
  for (let t = 0; t < top.size; t++) {
    const line: number[] = []
    let max = D
    for (let i = 0; i < D; i++) {
      const a = top.values[t * D + i]!
      line.push(a)
      used[a] = 1
      if (a > max) max = a
    }
    for (let a = 1; a <= max; a++) if (!used[a]) line.push(a)
    for (let i = 0; i < D; i++) used[line[i]!] = 0
    out.set(trimFixedPoints(line).join(','), top.coefficients[t]!)
  }
  return out
}
