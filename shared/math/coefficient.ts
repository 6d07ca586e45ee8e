/**
 * Exact integer coefficients: numbers while they are safe, BigInt beyond.
 *
 * A Coefficient is `number | bigint` in canonical form: a safe integer (|c| ≤ 2^53 − 1) is
 * always a number, and a bigint only ever holds a value outside that range. So `===` is value
 * equality across both representations, `c === 0` tests zero, and the common case stays on
 * fast float arithmetic. A sum or product of numbers is done in floats first; when the float
 * result leaves the safe range it is recomputed exactly in BigInt (inside the safe range IEEE
 * arithmetic on integers is exact, and a true result outside it rounds to a value outside it,
 * so the test after the operation is sound). Nothing is ever rounded: the only Number(bigint)
 * conversion is of a value already known to be safe.
 */
import { CoefficientOverflowError } from './errors'

/** An exact integer; canonical: a number when safe, otherwise a bigint. */
export type Coefficient = number | bigint

const MAX = Number.MAX_SAFE_INTEGER
const BIG_MAX = BigInt(MAX)

/** Canonical form of an exact integer; e.g. `normalizeCoefficient(5n) === 5`. */
export function normalizeCoefficient(c: bigint | number): Coefficient {
  if (typeof c === 'number') { assertSafeInteger(c); return c }
  return c <= BIG_MAX && c >= -BIG_MAX ? Number(c) : c
}

/** a + b, exact; e.g. `addChecked(2, 3) === 5`, and 2^53 − 1 + 1 becomes the bigint 2^53. */
export function addChecked(a: Coefficient, b: Coefficient): Coefficient {
  if (typeof a === 'number' && typeof b === 'number') {
    const r = a + b
    if (r <= MAX && r >= -MAX) return r
  }
  return normalizeCoefficient(BigInt(a) + BigInt(b))
}

/** a · b, exact; e.g. `mulChecked(4, 5) === 20`. */
export function mulChecked(a: Coefficient, b: Coefficient): Coefficient {
  if (typeof a === 'number' && typeof b === 'number') {
    const r = a * b
    if (r <= MAX && r >= -MAX) return r === 0 ? 0 : r
  }
  return normalizeCoefficient(BigInt(a) * BigInt(b))
}

/** −c, exact (the canonical range is symmetric). */
export function negateCoefficient(c: Coefficient): Coefficient {
  return typeof c === 'number' ? (c === 0 ? 0 : -c) : -c
}

/** |c|, exact. */
export function absCoefficient(c: Coefficient): Coefficient {
  return c < 0 ? negateCoefficient(c) : c
}

/** Throws unless `c` is a safe integer (a larger number has already been rounded); e.g. `assertSafeInteger(3)`. */
export function assertSafeInteger(c: number): void {
  if (!Number.isSafeInteger(c)) throw new CoefficientOverflowError(`coefficient ${c} is not a safe integer: it may already have been rounded, pass a bigint`)
}

/** Accept an integer given as a safe number or any bigint, in canonical form. */
export function toCoefficient(c: number | bigint): Coefficient {
  return normalizeCoefficient(c)
}

/**
 * Adds c into acc[key] and keeps the map canonical: an entry that cancels is deleted, a zero is
 * never stored. The one way the engine and the check core sum into a combination or a term map.
 * e.g. `accumulate(m, '231', 1)` then `accumulate(m, '231', -1)` leaves no '231' in m.
 */
export function accumulate<K>(acc: Map<K, Coefficient>, key: K, c: Coefficient): void {
  const old = acc.get(key)
  if (old === undefined) {
    if (c !== 0) acc.set(key, c)
  }
  else {
    const v = addChecked(old, c)
    if (v === 0) acc.delete(key)
    else acc.set(key, v)
  }
}

/** a + sign · b as a new map, canonical as `accumulate` keeps it; e.g. `addCombinations(m, m, -1).size === 0`. */
export function addCombinations<K>(a: ReadonlyMap<K, Coefficient>, b: ReadonlyMap<K, Coefficient>, sign: 1 | -1 = 1): Map<K, Coefficient> {
  const out = new Map(a)
  for (const [key, c] of b) accumulate(out, key, sign > 0 ? c : negateCoefficient(c))
  return out
}
