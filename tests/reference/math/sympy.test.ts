/**
 * Cross-check against Debian's python3-sympy (/usr/bin/python3, sympy 1.11): a separate divided-
 * difference computation written below in Python, using sympy's sparse polynomial rings (sympy.polys.rings) and exact division, for S_w and
 * S_w(x; y) (factors x_i − y_j) for all of S_4 and a seeded sample of S_5. It walks from w0 to w
 * by a different route from the engine (first ascent each time, starting at w0's product formula).
 */
import { describe, it, expect } from 'vitest'
import { Permutation, allPermutations, schubertPolynomial, doubleSchubertPolynomial, polynomialDifference } from '../../../shared/math'
import { seeded, randomPermutation } from '../../unit/math/helpers'
import { polynomialFromSympy, runSympy } from '../../helpers/sympy'

// S_w = ∂_{a1} ∂_{a2} ⋯ S_{w0}: climb from w to w0 by ascents (first ascent each time).
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

print(json.dumps([schubert(item['w'], item['double']) for item in data]))
`

describe('Schubert polynomials against an independent sympy computation', () => {
  it('S_w and S_w(x; y) for all of S_4 and a seeded sample of S_5', () => {
    const rand = seeded(555)
    const perms: Permutation[] = [...allPermutations(4), ...Array.from({ length: 40 }, () => randomPermutation(rand, 5))]
    const items = perms.flatMap(w => [{ w: [...w.oneLine], double: false }, { w: [...w.oneLine], double: true }])
    const results = runSympy<[number[], number][][]>(PROGRAM, items)
    expect(results.length).toBe(items.length)
    items.forEach((item, k) => {
      const w = Permutation.fromOneLine(item.w)
      const n = w.size
      const ours = item.double ? doubleSchubertPolynomial(w) : schubertPolynomial(w)
      const theirs = polynomialFromSympy(results[k]!, n)
      expect(polynomialDifference(ours, theirs).equal, `${item.double ? 'double ' : ''}S_${w}`).toBe(true)
    })
  }, 120_000)
})
