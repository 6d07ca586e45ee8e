import { describe, it, expect } from 'vitest'
import {
  Polynomial, parsePermutation, allPermutations, doubleSchubertPolynomial, doubleBackStableSchubert, doubleBackStableTruncation,
} from '../../../shared/math'

const P = (s: string) => parsePermutation(s)

describe('double back-stable Schubert polynomials (factors x − y)', () => {
  it('←S_{21}(x; y) = s_1(x_{≤0}) − s_1(y_{≤0}) + (x_1 − y_1) (hand computation from the Cauchy formula)', () => {
    const terms = doubleBackStableSchubert(P('21'))
    const render = terms.map(t => `${[...t.xSymmetric].join(';')}|${[...t.ySymmetric].join(';')}|${t.polynomial}`).sort()
    expect(render).toEqual([',1|,1|x1 - y1', ',1|1,-1|1', '1,1|,1|1'].sort())
  })
  it('truncations equal S_{1^m × w}(x; y) for all of S_4, m = 1, 2, 3', () => {
    for (const w of allPermutations(4)) {
      const terms = doubleBackStableSchubert(w)
      for (const m of [1, 2, 3]) expect(doubleBackStableTruncation(terms, m).equals(doubleSchubertPolynomial(w.shift(m))), `w=${w}, m=${m}`).toBe(true)
    }
  })
  it('the identity is 1', () => {
    const terms = doubleBackStableSchubert(P('1'))
    expect(terms.length).toBe(1)
    expect(terms[0]!.polynomial.equals(Polynomial.one())).toBe(true)
  })
})
