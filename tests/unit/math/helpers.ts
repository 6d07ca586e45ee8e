/** Test helpers: a tiny seeded PRNG (mulberry32) and random permutations. */
import { Permutation } from '../../../shared/math'

export { seeded } from '../../helpers/seeded-random'

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
