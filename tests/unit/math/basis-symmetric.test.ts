import { describe, it, expect } from 'vitest'
import {
  Permutation, Polynomial, parsePermutation, allPermutations, schubertPolynomial, schubertExpansion,
  schubertProduct, schubertProductByHorner, schubertProductByTransition, combinationsEqual, combinationToPolynomial, monkProduct,
  structureConstant, NotInSpanError, NotSymmetricError, BudgetExceededError,
  schurPolynomial, elementarySymmetric, completeSymmetric, powerSum, monomialSymmetric, schurExpansion,
  schurProduct, omega, conjugate, schurCombinationToPolynomial, multiplySchurCombinations, partitionsOf,
  stanleySymmetricFunction, schurCombinationsEqual, standardTableauxCount, countReducedWords, isGrassmannian,
  backStableSchubert, backStableTruncation, determinant, isVexillary, vexillaryShape, partitionFromKey,
  doubleSchubertExpansion, doubleSchubertProduct, doubleSchubertPolynomial,
} from '../../../shared/math'
import { schubertProductByExpansion } from '../../../shared/math/oracles'
import { seeded, randomPermutation, randomInt } from './helpers'

const P = (s: string) => parsePermutation(s)
const x = Polynomial.x

describe('Schubert basis', () => {
  it('expands S_w back to itself and x_1 to S_{21}', () => {
    for (const w of allPermutations(4)) {
      const c = schubertExpansion(schubertPolynomial(w))
      expect([...c]).toEqual([[w.key, 1]])
    }
    expect([...schubertExpansion(x(1))]).toEqual([['2,1', 1]])
    // x_2 = S_{132} − S_{213}
    const c = schubertExpansion(x(2))
    expect(c.get('1,3,2')).toBe(1)
    expect(c.get('2,1')).toBe(-1)
  })
  it('round trip: a random integer combination of Schubert polynomials is recovered exactly', () => {
    const rand = seeded(21)
    for (let t = 0; t < 10; t++) {
      const comb = new Map<string, number>()
      for (let k = 0; k < 4; k++) {
        const c = randomInt(rand, -4, 4)
        if (c !== 0) comb.set(randomPermutation(rand, 5).key, (comb.get(randomPermutation(rand, 5).key) ?? 0) + c)
      }
      for (const [k, v] of [...comb]) if (v === 0) comb.delete(k)
      const f = combinationToPolynomial(comb)
      expect(combinationsEqual(schubertExpansion(f), comb)).toBe(true)
    }
  })
  it('refuses polynomials outside the span asked for, with a typed error', () => {
    expect(() => schubertExpansion(x(4), { within: 4 })).toThrow(NotInSpanError)
    expect(() => schubertExpansion(Polynomial.y(1))).toThrow(NotInSpanError)
    expect(schubertExpansion(x(3), { within: 4 }).size).toBe(2)
    try {
      schubertExpansion(x(1).pow(4), { within: 4 })
    }
    catch (e) {
      expect((e as NotInSpanError).code).toBe('NOT_IN_SPAN')
    }
  })
  it('structure constants: transition and Horner–Monk products = expansion of the product polynomial (seeded, S_4 to S_6)', () => {
    const rand = seeded(31)
    for (let t = 0; t < 25; t++) {
      const n = randomInt(rand, 4, 6)
      const u = randomPermutation(rand, n)
      const v = randomPermutation(rand, n)
      if (u.length() + v.length() > 12) continue
      const expected = schubertProductByExpansion(u, v)
      expect(combinationsEqual(schubertProduct(u, v), expected)).toBe(true)
      expect(combinationsEqual(schubertProductByHorner(u, v), expected)).toBe(true)
      expect(combinationsEqual(schubertProductByTransition(v, u), expected)).toBe(true)
    }
  })
  it('Monk rule agrees with the product for every w in S_5 and r ≤ 5', () => {
    for (const w of allPermutations(5)) for (let r = 1; r <= 5; r++) {
      expect(combinationsEqual(monkProduct(r, w), schubertProduct(Permutation.simple(r), w))).toBe(true)
    }
  })
  it('products have nonnegative coefficients and the right degree', () => {
    const c = schubertProduct(P('2143'), P('1432'))
    for (const [k, v] of c) {
      expect(v).toBeGreaterThan(0)
      expect(Permutation.fromOneLine(k.split(',').map(Number)).length()).toBe(5)
    }
    // S_132^2 = S_231 + S_1423 by Monk's rule, worked by hand
    expect(structureConstant(P('132'), P('132'), P('1423'))).toBe(1)
    expect(structureConstant(P('132'), P('132'), P('231'))).toBe(1)
    expect(structureConstant(P('132'), P('132'), P('312'))).toBe(0)
  })
  it('products honour their budget', () => {
    expect(() => schubertProduct(P('1563742'), P('2714365'), { maxTerms: 5 })).toThrow(BudgetExceededError)
  })
})

describe('symmetric polynomials', () => {
  it('e_k, h_k, p_k, m_λ in 3 variables', () => {
    expect(elementarySymmetric(2, 3).equals(x(1).mul(x(2)).add(x(1).mul(x(3))).add(x(2).mul(x(3))))).toBe(true)
    expect(completeSymmetric(2, 2).equals(x(1).pow(2).add(x(1).mul(x(2))).add(x(2).pow(2)))).toBe(true)
    expect(powerSum(2, 2).equals(x(1).pow(2).add(x(2).pow(2)))).toBe(true)
    expect(monomialSymmetric([2, 1], 3).size).toBe(6)
    expect(monomialSymmetric([1, 1, 1, 1], 3).isZero()).toBe(true)
  })
  it('Newton identity p_2 = h_2 − e_2 = s_2 − s_11 (common practice)', () => {
    expect([...schurExpansion(powerSum(2, 3))].sort()).toEqual([['1,1', -1], ['2', 1]])
    expect(powerSum(2, 4).equals(completeSymmetric(2, 4).sub(elementarySymmetric(2, 4)))).toBe(true)
  })
  it('Jacobi–Trudi: s_λ = det[h_{λ_i − i + j}] for all λ ⊢ 4, 5 variables', () => {
    const h = (k: number, n: number) => (k < 0 ? Polynomial.zero() : completeSymmetric(k, n))
    for (const lam of partitionsOf(4)) {
      const l = lam.length
      const m = Array.from({ length: l }, (_, i) => Array.from({ length: l }, (_, j) => h(lam[i]! - i + j, 4)))
      expect(determinant(m).equals(schurPolynomial(lam, 4))).toBe(true)
    }
  })
  it('dual Jacobi–Trudi: s_λ = det[e_{λ′_i − i + j}] (common practice), λ ⊢ 4, 4 variables', () => {
    const e = (k: number, n: number) => (k < 0 ? Polynomial.zero() : k === 0 ? Polynomial.one() : elementarySymmetric(k, n))
    for (const lam of partitionsOf(4)) {
      const c = conjugate(lam)
      const m = Array.from({ length: c.length }, (_, i) => Array.from({ length: c.length }, (_, j) => e(c[i]! - i + j, 4)))
      expect(determinant(m).equals(schurPolynomial(lam, 4))).toBe(true)
    }
  })
  it('flagged Jacobi–Trudi: S_{1432} = det[h_{λ_i−i+j}(x_1..x_{φ_i})] with λ = 21, flags φ = (2, 3) (vexillary, common practice; expanded by hand)', () => {
    const h = (k: number, n: number) => (k < 0 ? Polynomial.zero() : completeSymmetric(k, n))
    const m = [[h(2, 2), h(3, 2)], [h(0, 3), h(1, 3)]]
    expect(determinant(m).equals(schubertPolynomial(P('1432')))).toBe(true)
    // with the unflagged determinant (3 variables in both rows) the identity fails
    const unflagged = [[h(2, 3), h(3, 3)], [h(0, 3), h(1, 3)]]
    expect(determinant(unflagged).equals(schubertPolynomial(P('1432')))).toBe(false)
  })
  it('Grassmannian Schubert polynomials are Schur polynomials: S_w = s_λ(x_1..x_k)', () => {
    for (const w of allPermutations(5).filter(w => isGrassmannian(w) && w.length() > 0)) {
      const k = w.descents()[0]!
      const lam = w.lehmerCode().slice(0, k).sort((a, b) => b - a)
      expect(schubertPolynomial(w).equals(schurPolynomial(lam, k))).toBe(true)
    }
  })
  it('refuses non-symmetric input', () => {
    expect(() => schurExpansion(x(1), 2)).toThrow(NotSymmetricError)
  })
  it('LR products match polynomial multiplication in enough variables (seeded)', () => {
    const rand = seeded(8)
    const parts = [...partitionsOf(1), ...partitionsOf(2), ...partitionsOf(3)]
    for (let t = 0; t < 12; t++) {
      const a = parts[randomInt(rand, 0, parts.length - 1)]!
      const b = parts[randomInt(rand, 0, parts.length - 1)]!
      const n = a.length + b.length
      const poly = schurPolynomial(a, n).mul(schurPolynomial(b, n))
      expect(schurCombinationToPolynomial(schurProduct(a, b), n).equals(poly)).toBe(true)
    }
  })
  it('ω: conjugation, involution, and ω(s_λ s_μ) = ω(s_λ) ω(s_μ)', () => {
    expect(conjugate([3, 1])).toEqual([2, 1, 1])
    const prod = schurProduct([2, 1], [2])
    expect(schurCombinationsEqual(omega(omega(prod)), prod)).toBe(true)
    const lhs = omega(prod)
    const rhs = multiplySchurCombinations(omega(new Map([['2,1', 1]])), omega(new Map([['2', 1]])))
    expect(schurCombinationsEqual(lhs, rhs)).toBe(true)
  })
})

describe('Stanley symmetric functions', () => {
  it('F_w is the stable limit of S_{1^m × w}: the Schur expansion does not change with more variables', () => {
    const rand = seeded(4)
    for (let t = 0; t < 12; t++) {
      const w = randomPermutation(rand, 5)
      if (w.length() > 6) continue
      const f = stanleySymmetricFunction(w, { method: 'limit' })
      expect(schurCombinationsEqual(f, stanleySymmetricFunction(w, { method: 'limit', extraVariables: 2 }))).toBe(true)
      // the transition method (the default) gives the same expansion
      expect(schurCombinationsEqual(f, stanleySymmetricFunction(w))).toBe(true)
      // and S_{1^m × w} itself keeps growing towards F_w: coefficients in the first m variables agree
      const m = w.length() + 1
      const limit = schubertPolynomial(w.shift(m + 1)).truncateX(m)
      expect(schurCombinationToPolynomial(f, m).equals(limit)).toBe(true)
    }
  })
  it('F_w = s_λ for vexillary w (λ from the Lehmer code); F_{w⁻¹} = ω F_w', () => {
    for (const w of allPermutations(5).filter(w => w.length() > 0)) {
      const f = stanleySymmetricFunction(w)
      if (isVexillary(w)) {
        expect(f.size).toBe(1)
        const [[k, c]] = [...f] as [[string, number]]
        expect(c).toBe(1)
        expect(partitionFromKey(k)).toEqual(vexillaryShape(w))
      }
      expect(schurCombinationsEqual(stanleySymmetricFunction(w.inverse()), omega(f))).toBe(true)
    }
  })
  it('Σ_λ a_{wλ} f^λ = number of reduced words of w (coefficient of x_1⋯x_ℓ)', () => {
    for (const w of allPermutations(5).filter((_, k) => k % 4 === 1)) {
      const f = stanleySymmetricFunction(w)
      let total = 0n
      for (const [k, c] of f) total += BigInt(c) * standardTableauxCount(partitionFromKey(k))
      expect(total).toBe(countReducedWords(w))
    }
  })
})

describe('back-stable Schubert polynomials', () => {
  it('Σ F_u(x_1..x_m) S_v(x_{m+1},…) equals S_{1^m × w} for m = 1..4 (stable limit), seeded sample of S_5', () => {
    const rand = seeded(12)
    for (let t = 0; t < 8; t++) {
      const w = randomPermutation(rand, 5)
      if (w.length() > 6) continue
      const terms = backStableSchubert(w)
      for (let m = 1; m <= 4; m++) expect(backStableTruncation(terms, m).equals(schubertPolynomial(w.shift(m)))).toBe(true)
    }
  })
  it('←S_{21} = s_1 ⊗ 1 + 1 ⊗ x_1', () => {
    const terms = backStableSchubert(P('21'))
    expect(terms.length).toBe(2)
    const withSym = terms.find(t => t.u.length() === 1)!
    expect([...withSym.symmetric]).toEqual([['1', 1]])
    expect(withSym.polynomial.equals(Polynomial.one())).toBe(true)
  })
})

describe('double Schubert basis over ℤ[y]', () => {
  it('x_1 = S_{21}(x;y) + y_1, and S_w(x;y) expands to itself', () => {
    const c = doubleSchubertExpansion(Polynomial.x(1))
    expect(c.get('2,1')!.equals(Polynomial.one())).toBe(true)
    expect(c.get('')!.equals(Polynomial.y(1))).toBe(true)
    for (const w of allPermutations(4)) {
      const e = doubleSchubertExpansion(doubleSchubertPolynomial(w))
      expect(e.size).toBe(1)
      expect(e.get(w.key)!.equals(Polynomial.one())).toBe(true)
    }
  })
  it('equivariant Monk rule: S_{s_r}(x;y) S_w(x;y) = Σ_{covers} S_{w t_jk} + (Σ_{i≤r} (y_{w(i)} − y_i)) S_w (common practice)', () => {
    for (const w of allPermutations(4)) for (let r = 1; r <= 3; r++) {
      const prod = doubleSchubertProduct(Permutation.simple(r), w)
      let diag = Polynomial.zero()
      for (let i = 1; i <= r; i++) diag = diag.add(Polynomial.y(w.at(i))).sub(Polynomial.y(i))
      const monk = monkProduct(r, w)
      for (const [k, c] of prod) {
        if (k === w.key) expect(c.equals(diag)).toBe(true)
        else expect(c.equals(Polynomial.constant(monk.get(k) ?? 0))).toBe(true)
      }
      for (const k of monk.keys()) expect(prod.has(k)).toBe(true)
      if (!diag.isZero()) expect(prod.has(w.key)).toBe(true)
    }
  })
  it('at y = 0 the equivariant constants are the ordinary ones (seeded, S_4)', () => {
    const rand = seeded(41)
    for (let t = 0; t < 8; t++) {
      const u = randomPermutation(rand, 4)
      const v = randomPermutation(rand, 4)
      const ordinary = schubertProduct(u, v)
      const eq = doubleSchubertProduct(u, v)
      for (const [k, c] of eq) {
        const atZero = Number(c.evaluate([], []))
        expect(atZero).toBe(ordinary.get(k) ?? 0)
      }
    }
  })
  it('refuses outside the span asked for', () => {
    expect(() => doubleSchubertExpansion(Polynomial.x(3), { within: 3 })).toThrow(NotInSpanError)
  })
})
