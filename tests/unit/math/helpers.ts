/** Test helpers: a tiny seeded PRNG (mulberry32) and random permutations. */
import { Permutation } from '../../../shared/math'

/** Deterministic PRNG in [0, 1); e.g. `const rand = seeded(42)`. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Uniform random element of S_n (Fisher–Yates). */
export function randomPermutation(rand: () => number, n: number): Permutation {
  const line = Array.from({ length: n }, (_, i) => i + 1)
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1))
    ;[line[i], line[j]] = [line[j]!, line[i]!]
  }
  return Permutation.fromOneLine(line)
}

/** Random integer in [lo, hi]. */
export function randomInt(rand: () => number, lo: number, hi: number): number {
  return lo + Math.floor(rand() * (hi - lo + 1))
}
