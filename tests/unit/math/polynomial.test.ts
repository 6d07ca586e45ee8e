import { describe, it, expect } from 'vitest'
import {
  Polynomial, polynomialDifference, dividedDifference, dividedDifferenceWord, isobaricDividedDifference,
  grothendieckOperator, CoefficientOverflowError, BudgetExceededError, determinant, isSupersymmetric,
  encodeMonomial, decodeMonomial,
} from '../../../shared/math'
import { seeded, randomInt } from './helpers'

const x = Polynomial.x
const y = Polynomial.y

function randomPolynomial(rand: () => number, vars: number, terms: number, withY = false): Polynomial {
  const list = []
  for (let t = 0; t < terms; t++) {
    list.push({
      x: Array.from({ length: vars }, () => randomInt(rand, 0, 3)),
      y: withY ? Array.from({ length: vars }, () => randomInt(rand, 0, 2)) : [],
      coefficient: randomInt(rand, -5, 5),
    })
  }
  return Polynomial.fromTerms(list)
}

describe('ring operations', () => {
  it('(x1 + x2)^2 expands with exact coefficients', () => {
    const p = x(1).add(x(2)).pow(2)
    expect(p.coefficientOf([2])).toBe(1)
    expect(p.coefficientOf([1, 1])).toBe(2)
    expect(p.coefficientOf([0, 2])).toBe(1)
    expect(p.size).toBe(3)
  })
  it('is canonical: cancellation leaves the zero polynomial, equal values are equal', () => {
    const p = x(1).mul(y(2)).sub(y(2).mul(x(1)))
    expect(p.isZero()).toBe(true)
    expect(p.degree()).toBe(-Infinity)
    expect(x(1).add(x(2)).equals(x(2).add(x(1)))).toBe(true)
    expect(encodeMonomial([1, 0, 0], [0])).toBe(encodeMonomial([1]))
    expect(decodeMonomial(encodeMonomial([0, 2], [1]))).toEqual({ x: [0, 2], y: [1] })
  })
  it('ring axioms on seeded random polynomials', () => {
    const rand = seeded(1)
    for (let t = 0; t < 20; t++) {
      const a = randomPolynomial(rand, 3, 4, true)
      const b = randomPolynomial(rand, 3, 4, true)
      const c = randomPolynomial(rand, 3, 3, true)
      expect(a.mul(b).equals(b.mul(a))).toBe(true)
      expect(a.mul(b.add(c)).equals(a.mul(b).add(a.mul(c)))).toBe(true)
      expect(a.sub(a).isZero()).toBe(true)
    }
  })
  it('degree, substitution, evaluation', () => {
    const p = x(1).pow(2).mul(x(2)).add(x(3))
    expect(p.degree()).toBe(3)
    expect(p.evaluate([2, 3, 5])).toBe(17n)
    const q = x(1).sub(y(1))
    expect(q.negateY().equals(x(1).add(y(1)))).toBe(true)
    expect(q.substitute(v => (v.set === 'y' ? Polynomial.constant(0) : undefined)).equals(x(1))).toBe(true)
    expect(q.swapXY().equals(y(1).sub(x(1)))).toBe(true)
  })
  it('past 2^53 coefficients switch to BigInt exactly (regression: they used to throw); (x_1+x_2)^70 has the binomial coefficients C(70,k), computed in BigInt here', () => {
    const big = Polynomial.constant(2 ** 52)
    expect(big.add(big).add(big).terms.get('')).toBe(3n * 2n ** 52n)
    expect(big.mul(Polynomial.constant(4)).terms.get('')).toBe(2n ** 54n)
    expect(big.add(big).sub(big).sub(big).isZero()).toBe(true)
    const p = x(1).add(x(2)).pow(70)
    let binom = 1n
    for (let k = 0; k <= 70; k++) {
      const c = p.coefficientOf([70 - k, k])
      expect(BigInt(c), `C(70,${k})`).toBe(binom)
      // canonical form: a number exactly when the value is safe
      expect(typeof c).toBe(binom <= BigInt(Number.MAX_SAFE_INTEGER) ? 'number' : 'bigint')
      binom = binom * BigInt(70 - k) / BigInt(k + 1)
    }
    expect(() => Polynomial.constant(2 ** 60)).toThrow(CoefficientOverflowError)
  })
  it('symmetry tests', () => {
    const e2 = x(1).mul(x(2)).add(x(1).mul(x(3))).add(x(2).mul(x(3)))
    expect(e2.isSymmetricIn('x', 3)).toBe(true)
    expect(x(1).isSymmetricIn('x', 2)).toBe(false)
  })
  it('LaTeX in the documented order', () => {
    const p = x(1).mul(x(3)).add(x(1).pow(2).mul(x(2)))
    expect(p.toLatex()).toBe('x_{1}^{2}x_{2} + x_{1}x_{3}')
    expect(x(1).sub(y(2)).scale(-3).add(Polynomial.constant(2)).toLatex()).toBe('-3x_{1} + 3y_{2} + 2')
    expect(Polynomial.zero().toLatex()).toBe('0')
  })
  it('term-by-term difference lists missing, extra and wrong coefficients', () => {
    const expected = x(1).pow(2).add(x(1).mul(x(2)).scale(2)).add(x(3))
    const actual = x(1).pow(2).add(x(1).mul(x(2))).add(x(2))
    const d = polynomialDifference(expected, actual)
    expect(d.equal).toBe(false)
    expect(d.missing.map(t => t.x)).toEqual([[0, 0, 1]])
    expect(d.extra.map(t => t.x)).toEqual([[0, 1]])
    expect(d.wrongCoefficient).toEqual([{ x: [1, 1], y: [], expected: 2, actual: 1 }])
    expect(polynomialDifference(actual, actual).equal).toBe(true)
  })
  it('multiplication honours a term budget', () => {
    const p = x(1).add(x(2)).add(x(3)).add(x(4)).pow(4)
    expect(() => p.mul(p, { maxTerms: 50 })).toThrow(BudgetExceededError)
    const ac = new AbortController()
    ac.abort()
    expect(() => p.mul(p, { signal: ac.signal })).toThrow(/aborted/)
  })
})

describe('divided differences', () => {
  it('∂_1 x_1^2 = x_1 + x_2; ∂_i acts on y when asked', () => {
    expect(dividedDifference(x(1).pow(2), 1).equals(x(1).add(x(2)))).toBe(true)
    expect(dividedDifference(y(1), 1, 'y').equals(Polynomial.one())).toBe(true)
    expect(dividedDifference(y(1), 1, 'x').isZero()).toBe(true)
  })
  it('∂_i ∂_i = 0, ∂_i kills symmetric functions, braid relation, Leibniz rule (seeded)', () => {
    const rand = seeded(2)
    for (let t = 0; t < 25; t++) {
      const f = randomPolynomial(rand, 4, 5, t % 2 === 0)
      const g = randomPolynomial(rand, 4, 3)
      const i = randomInt(rand, 1, 3)
      expect(dividedDifference(dividedDifference(f, i), i).isZero()).toBe(true)
      // ∂_i(f) · (x_i − x_{i+1}) = f − s_i f
      expect(dividedDifference(f, i).mul(x(i).sub(x(i + 1))).equals(f.sub(f.swapVariables('x', i)))).toBe(true)
      // ∂_i(fg) = ∂_i(f) g + s_i(f) ∂_i(g)
      const lhs = dividedDifference(f.mul(g), i)
      const rhs = dividedDifference(f, i).mul(g).add(f.swapVariables('x', i).mul(dividedDifference(g, i)))
      expect(lhs.equals(rhs)).toBe(true)
      expect(dividedDifferenceWord(f, [1, 2, 1]).equals(dividedDifferenceWord(f, [2, 1, 2]))).toBe(true)
      // in y as well
      expect(dividedDifference(dividedDifference(f, i, 'y'), i, 'y').isZero()).toBe(true)
    }
  })
  it('isobaric π_i fixes symmetric polynomials and is idempotent', () => {
    const rand = seeded(3)
    const sym = x(1).mul(x(2)).add(Polynomial.constant(3))
    expect(isobaricDividedDifference(sym, 1).equals(sym)).toBe(true)
    for (let t = 0; t < 10; t++) {
      const f = randomPolynomial(rand, 3, 4)
      const once = isobaricDividedDifference(f, 2)
      expect(isobaricDividedDifference(once, 2).equals(once)).toBe(true)
    }
  })
  it('the K-theoretic operator with β = −1: π_1(x_1) = 1', () => {
    expect(grothendieckOperator(x(1), 1).equals(Polynomial.one())).toBe(true)
    // with β = 0 it is the plain divided difference
    expect(grothendieckOperator(x(1).pow(2), 1, 0).equals(x(1).add(x(2)))).toBe(true)
  })
})

describe('determinants and supersymmetry', () => {
  it('det [[x1, 1],[1, x2]] = x1 x2 − 1 and det of a triangular matrix is the diagonal product', () => {
    expect(determinant([[x(1), Polynomial.one()], [Polynomial.one(), x(2)]]).equals(x(1).mul(x(2)).sub(Polynomial.one()))).toBe(true)
    const z = Polynomial.zero()
    expect(determinant([[x(1), y(1), x(3)], [z, x(2), y(2)], [z, z, x(3)]]).equals(x(1).mul(x(2)).mul(x(3)))).toBe(true)
    expect(determinant([]).equals(Polynomial.one())).toBe(true)
    expect(() => determinant([[x(1), x(2)]])).toThrow(/square/)
  })
  it('Vandermonde: det[x_i^{n−j}] = ∏_{i<j}(x_i − x_j) (common practice)', () => {
    const n = 4
    const m = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => x(i + 1).pow(n - 1 - j)))
    let prod = Polynomial.one()
    for (let i = 1; i <= n; i++) for (let j = i + 1; j <= n; j++) prod = prod.mul(x(i).sub(x(j)))
    expect(determinant(m).equals(prod)).toBe(true)
  })
  it('supersymmetry: Σx_i + Σy_j and ∏(x_i + y_j) pass, x_1 y_1 fails', () => {
    const p1 = x(1).add(x(2)).add(y(1)).add(y(2))
    expect(isSupersymmetric(p1)).toBe(true)
    const prod = x(1).add(y(1)).mul(x(1).add(y(2))).mul(x(2).add(y(1))).mul(x(2).add(y(2)))
    expect(isSupersymmetric(prod)).toBe(true)
    expect(isSupersymmetric(x(1).mul(y(1)).add(x(2).mul(y(2))))).toBe(false)
    expect(isSupersymmetric(x(1).pow(2).add(x(2).pow(2)).add(y(1).pow(2)).add(y(2).pow(2)))).toBe(false)
    // p_2(x) − p_2(y) is supersymmetric in the x_i − y_j form: substitute x_1 = y_1
    expect(isSupersymmetric(x(1).pow(2).add(x(2).pow(2)).sub(y(1).pow(2)).sub(y(2).pow(2)), { substitution: 'x1=y1' })).toBe(true)
  })
})
