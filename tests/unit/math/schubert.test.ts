import { describe, it, expect } from 'vitest'
import {
  Permutation, Polynomial, parsePermutation, allPermutations, schubertPolynomial, doubleSchubertPolynomial,
  SchubertFamily, schubertAtOnes, schubertInvariants, grothendieckPolynomial,
  dividedDifference, pipeDreams, countPipeDreams, bumplessPipeDreams,
  countBumplessPipeDreams, BudgetExceededError, rotheDiagram,
} from '../../../shared/math'
import { schubertByTransition, schubertFromBumpless, schubertFromPipeDreams } from '../../../shared/math/oracles'
import { seeded, randomPermutation } from './helpers'

const P = (s: string) => parsePermutation(s)
const S5 = allPermutations(5)

describe('two independent algorithms for S_w agree', () => {
  it('dominant descent = transition formula = family walk for every w in S_5', () => {
    const family = SchubertFamily.compute(5)
    expect(family.count).toBe(120)
    for (const w of S5) {
      const a = schubertPolynomial(w)
      expect(schubertByTransition(w).equals(a)).toBe(true)
      expect(family.get(w).equals(a)).toBe(true)
    }
  })
  it('the same on a seeded sample of S_7 and S_8', () => {
    const rand = seeded(5)
    const fam7 = SchubertFamily.compute(7)
    for (let t = 0; t < 15; t++) {
      const w = randomPermutation(rand, 7)
      expect(schubertByTransition(w).equals(schubertPolynomial(w))).toBe(true)
      expect(fam7.get(w).equals(schubertPolynomial(w))).toBe(true)
    }
  })
  it('the generic (unpacked) path agrees with the packed path beyond n = 12', () => {
    // 1^8 × 2143 lives in S_12; 1^9 × 2143 in S_13 uses the generic sparse path.
    const w = P('2143')
    // Compare the generic path with the independent transition formula and with S(1,…,1).
    expect(schubertPolynomial(w.shift(9)).evaluate(new Array(13).fill(1))).toBe(schubertAtOnes(w.shift(9)))
    expect(schubertPolynomial(w.shift(9)).equals(schubertByTransition(w.shift(9)))).toBe(true)
  })
})

describe('pipe dreams and bumpless pipe dreams', () => {
  it('S_w(x; y) from pipe dreams (crosses) and from BPDs (blanks) equals divided differences for every w in S_5', () => {
    for (const w of S5) {
      const d = doubleSchubertPolynomial(w)
      expect(schubertFromPipeDreams(w, { double: true }).equals(d)).toBe(true)
      expect(schubertFromBumpless(w, { double: true }).equals(d)).toBe(true)
      expect(schubertFromPipeDreams(w).equals(schubertPolynomial(w))).toBe(true)
    }
  })
  it('counts agree with listings, and with S_w(1,…,1)', () => {
    for (const w of S5) {
      const n = schubertAtOnes(w)
      expect(BigInt(pipeDreams(w).length)).toBe(n)
      expect(BigInt(bumplessPipeDreams(w).length)).toBe(n)
      expect(countBumplessPipeDreams(w, { method: 'walk' })).toBe(n)
      expect(schubertPolynomial(w).evaluate([1, 1, 1, 1, 1])).toBe(n)
    }
    expect(countPipeDreams(P('1432'))).toBe(5n)
  })
  it('pipe dreams read off reduced words of w; tiles are well-formed', () => {
    for (const pd of pipeDreams(P('2413'))) {
      expect(Permutation.fromWord(pd.word).equals(P('2413'))).toBe(true)
      expect(pd.tiles.flat().filter(t => t === 'cross').length).toBe(3)
      expect(pd.tiles[0]![3]).toBe('turn')
    }
  })
  it('the Rothe BPD is among the BPDs: blanks exactly the Rothe diagram', () => {
    const w = P('31524')
    const rothe = JSON.stringify(rotheDiagram(w))
    expect(bumplessPipeDreams(w).some(b => JSON.stringify(b.blanks) === rothe)).toBe(true)
    for (const b of bumplessPipeDreams(w)) expect(b.blanks.length).toBe(w.length())
  })
  it('BPD tiles: every row has exactly one pipe leaving east, every column one pipe entering south', () => {
    for (const b of bumplessPipeDreams(P('2143'))) {
      for (const row of b.tiles) {
        const last = row[row.length - 1]!
        expect(['horizontal', 'elbowSE', 'cross']).toContain(last)
      }
      const bottom = b.tiles[b.tiles.length - 1]!
      for (const t of bottom) expect(['vertical', 'elbowSE', 'cross']).toContain(t)
    }
  })
  it('enumeration stops with a typed error past its budget', () => {
    expect(() => pipeDreams(Permutation.fromOneLine([1, 5, 4, 3, 2, 8, 7, 6]), { maxTerms: 10 })).toThrow(BudgetExceededError)
    expect(() => bumplessPipeDreams(Permutation.fromOneLine([1, 5, 4, 3, 2, 8, 7, 6]), { maxSteps: 100 })).toThrow(BudgetExceededError)
    try {
      pipeDreams(Permutation.fromOneLine([1, 5, 4, 3, 2, 8, 7, 6]), { maxTerms: 10 })
    }
    catch (e) {
      expect((e as BudgetExceededError).code).toBe('TOO_LARGE')
    }
  })
})

describe('identities (seeded property tests)', () => {
  const rand = seeded(99)
  const sample = Array.from({ length: 25 }, () => randomPermutation(rand, 6))
  it('∂_i S_w = S_{w s_i} if ℓ(w s_i) < ℓ(w), else 0', () => {
    for (const w of sample) {
      const s = schubertPolynomial(w)
      for (let i = 1; i < 6; i++) {
        const d = dividedDifference(s, i)
        if (w.at(i) > w.at(i + 1)) expect(d.equals(schubertPolynomial(w.rightMultiplySimple(i)))).toBe(true)
        else expect(d.isZero()).toBe(true)
      }
    }
  })
  it('S_w(x; 0) = S_w(x)', () => {
    for (const w of sample.slice(0, 10)) {
      const d = doubleSchubertPolynomial(w)
      expect(d.substitute(v => (v.set === 'y' ? Polynomial.zero() : undefined)).equals(schubertPolynomial(w))).toBe(true)
    }
  })
  it('S_{w⁻¹}(x; y) = S_w(−y; −x) (factors x_i − y_j)', () => {
    for (const w of [...S5.filter((_, k) => k % 7 === 0), ...sample.slice(0, 6)]) {
      const lhs = doubleSchubertPolynomial(w.inverse())
      // swapXY gives S_w(y; x); negating every variable multiplies degree-d terms by (−1)^d.
      const flipped = doubleSchubertPolynomial(w).swapXY()
      const negAll = Polynomial.fromTerms(flipped.termList().map(t => ({ ...t, coefficient: (t.x.concat(t.y).reduce((a, b) => a + b, 0) % 2 ? -1n : 1n) * BigInt(t.coefficient) })))
      expect(lhs.equals(negAll)).toBe(true)
    }
  })
  it('degree of S_w is ℓ(w); S_w is homogeneous; invariants need no expansion', () => {
    for (const w of sample) {
      const s = schubertPolynomial(w)
      expect(s.degree()).toBe(w.length())
      expect(s.isHomogeneous()).toBe(true)
      const inv = schubertInvariants(w)
      expect(inv.degree).toBe(w.length())
      expect(inv.valueAtOnes).toBe(s.evaluate(new Array(6).fill(1)))
      expect(s.maxIndex('x')).toBe(inv.lastVariable)
    }
  })
  it('Grothendieck: lowest-degree part is S_w; β enters as β^(degree − ℓ(w)); G_{w0} = x^δ', () => {
    for (const w of S5.filter((_, k) => k % 3 === 0)) {
      const g = grothendieckPolynomial(w)
      expect(g.lowestDegreePart().equals(schubertPolynomial(w))).toBe(true)
      const g2 = grothendieckPolynomial(w, 2)
      for (const t of g.termList()) {
        const extra = t.x.reduce((a, b) => a + b, 0) - w.length()
        expect(BigInt(g2.coefficientOf(t.x))).toBe(BigInt(t.coefficient) * (-2n) ** BigInt(extra))
      }
      expect(grothendieckPolynomial(w, 0).equals(schubertPolynomial(w))).toBe(true)
    }
    expect(grothendieckPolynomial(Permutation.longest(4)).equals(Polynomial.monomial([3, 2, 1]))).toBe(true)
    // G_{132} = x_1 + x_2 − x_1 x_2 (β = −1)
    expect(grothendieckPolynomial(P('132')).toLatex()).toBe('-x_{1}x_{2} + x_{1} + x_{2}')
    // alternating signs by degree (β = −1), common practice
    for (const t of grothendieckPolynomial(P('1432')).termList()) {
      expect(t.coefficient < 0 ? -1 : 1).toBe((t.x.reduce((a, b) => a + b, 0) - 3) % 2 === 0 ? 1 : -1)
    }
  })
  it('double Schubert of w0 is ∏_{i+j≤n}(x_i − y_j)', () => {
    let prod = Polynomial.one()
    for (let i = 1; i < 4; i++) for (let j = 1; i + j <= 4; j++) prod = prod.mul(Polynomial.x(i).sub(Polynomial.y(j)))
    expect(doubleSchubertPolynomial(Permutation.longest(4)).equals(prod)).toBe(true)
  })
})

describe('budgets', () => {
  it('S_w in S_10 with a tiny term budget throws BudgetExceededError', () => {
    expect(() => schubertPolynomial(P('[1,10,2,9,3,8,4,7,5,6]'), { maxTerms: 100 })).toThrow(BudgetExceededError)
  })
  it('the S_n family honours its budget', () => {
    expect(() => SchubertFamily.compute(7, { maxSteps: 1000 })).toThrow(BudgetExceededError)
  })
})
