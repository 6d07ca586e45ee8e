/**
 * Double Grothendieck polynomials against Debian's python3-sympy (/usr/bin/python3): the program
 * below starts from the top class of S_n, ∏_{i+j≤n} (x_i + y_j + β x_i y_j) (⊕ form) or
 * ∏_{i+j≤n} (x_i − y_j) over ∏_j (1 + β y_j)^{n−j} (⊖ form), and walks down to w by isobaric divided
 * differences π^β_i f = ∂_i((1 + β x_{i+1}) f) with sympy's sparse rings and exact division
 * (first ascent each time; the engine starts at a dominant permutation instead).
 * All of S_4 and a seeded sample of S_5, β = −1 and β = +1.
 */
import { describe, it, expect } from 'vitest'
import {
  Permutation, allPermutations, doubleGrothendieckPolynomial, doubleGrothendieckOminus, rationalsEqual,
} from '../../../shared/math'
import { seeded, randomPermutation } from '../../unit/math/helpers'
import { polynomialFromSympy, runSympy } from '../../helpers/sympy'

const PROGRAM = String.raw`
def grothendieck(w, beta, form):
    n = len(w)
    R, x, y = xy_ring(n)
    f = R.one
    for i in range(1, n):
        for j in range(1, n - i + 1):
            a, b = x[i - 1], y[j - 1]
            f = f * ((a + b + beta * a * b) if form == 'oplus' else (a - b))
    for i in reversed(ascents_to_top(w)):
        g = f * (1 + beta * x[i + 1])
        f = divide_exact(g - swap(R, g, i), x[i] - x[i + 1])
    return terms(f)

print(json.dumps([grothendieck(d['w'], d['beta'], d['form']) for d in data]))
`

describe('double Grothendieck polynomials against an independent sympy computation', () => {
  it('⊕ and ⊖ forms, β = ±1, all of S_4 and a seeded sample of S_5', () => {
    const rand = seeded(909)
    const perms: Permutation[] = [...allPermutations(4), ...Array.from({ length: 6 }, () => randomPermutation(rand, 5))]
    const items = perms.flatMap(w => [-1, 1].flatMap(beta => (['oplus', 'ominus'] as const).map(form => ({ w: [...w.oneLine], beta, form }))))
    const out = runSympy<[number[], number][][]>(PROGRAM, items)
    expect(out.length).toBe(items.length)
    items.forEach((item, k) => {
      const w = Permutation.fromOneLine(item.w)
      const n = item.w.length
      const theirs = polynomialFromSympy(out[k]!, n)
      if (item.form === 'oplus') {
        expect(doubleGrothendieckPolynomial(w, item.beta).equals(theirs), `G_${w}, β=${item.beta}`).toBe(true)
      }
      else {
        const denominator = Array.from({ length: n - 1 }, (_, j) => n - 1 - j)
        expect(rationalsEqual(doubleGrothendieckOminus(w, item.beta), { numerator: theirs, beta: item.beta, denominator }), `G^⊖_${w}, β=${item.beta}`).toBe(true)
      }
    })
  }, 120_000)
})
