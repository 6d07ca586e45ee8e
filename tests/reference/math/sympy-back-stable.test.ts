/**
 * Back-stable Schubert polynomials, single and double, against truncations computed by Debian's
 * python3-sympy (/usr/bin/python3): S_{1^m × w}(x) and S_{1^m × w}(x; y) (factors x_i − y_j) from the
 * top class of S_{m+n} by divided differences in sympy's sparse rings (first ascent each time). The
 * engine's side is the formula of shared/math/back-stable.ts truncated to m non-positive variables of
 * each set and renamed (x_{≤0} ↦ x_1..x_m, x_i ↦ x_{m+i}, the same for y).
 */
import { describe, it, expect } from 'vitest'
import {
  Permutation, allPermutations, parsePermutation, backStableSchubert, backStableTruncation,
  doubleBackStableSchubert, doubleBackStableTruncation,
} from '../../../shared/math'
import { polynomialFromSympy, runSympy } from '../../helpers/sympy'

const PROGRAM = String.raw`
def schubert(w, double):
    n = len(w)
    R, x, y = xy_ring(n)
    f = R.one
    for i in range(1, n):
        for j in range(1, n - i + 1):
            f = f * ((x[i - 1] - y[j - 1]) if double else x[i - 1])
    for i in reversed(ascents_to_top(w)):
        f = divide_exact(f - swap(R, f, i), x[i] - x[i + 1])
    return terms(f)

print(json.dumps([schubert(d['w'], d['double']) for d in data]))
`

describe('back-stable Schubert polynomials against sympy truncations S_{1^m × w}', () => {
  it('single: all w in S_4 with m = 1, 2; double: all w in S_3 with m = 1, 2 and four of S_4 with m = 1', () => {
    const cases: { w: Permutation, m: number, double: boolean }[] = [
      ...allPermutations(4).flatMap(w => [1, 2].map(m => ({ w, m, double: false }))),
      ...allPermutations(3).flatMap(w => [1, 2].map(m => ({ w, m, double: true }))),
      ...['2143', '1342', '3142', '2413'].map(s => ({ w: parsePermutation(s), m: 1, double: true })),
    ]
    const items = cases.map(c => ({ w: [...c.w.shift(c.m).oneLine], double: c.double }))
    const out = runSympy<[number[], number][][]>(PROGRAM, items)
    expect(out.length).toBe(cases.length)
    cases.forEach((c, k) => {
      const n = items[k]!.w.length
      const theirs = polynomialFromSympy(out[k]!, n)
      const ours = c.double
        ? doubleBackStableTruncation(doubleBackStableSchubert(c.w), c.m)
        : backStableTruncation(backStableSchubert(c.w), c.m)
      expect(ours.equals(theirs), `${c.double ? 'double ' : ''}w=${c.w}, m=${c.m}`).toBe(true)
    })
  }, 120_000)
})
