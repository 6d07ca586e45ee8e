import { describe, it, expect } from 'vitest'
import {
  Polynomial, checkSupersymmetry, schurPolynomial, elementarySymmetric, completeSymmetric, powerSum,
  conjugate, partitionsOf, littlewoodRichardson, doubleSchubertPolynomial, parsePermutation, InvalidArgumentError,
} from '../../../shared/math'

const inY = (p: Polynomial) => p.swapXY()
const isSupersymmetric = (f: Polynomial, k: number) => checkSupersymmetry(f, k).supersymmetric
const x = Polynomial.x
const y = Polynomial.y

/** Skew Schur s_{λ/μ}(y_1..y_k) through Littlewood–Richardson coefficients. */
function skewSchurInY(lambda: number[], mu: number[], k: number): Polynomial {
  const size = lambda.reduce((a, b) => a + b, 0) - mu.reduce((a, b) => a + b, 0)
  let p = Polynomial.zero()
  for (const nu of partitionsOf(size)) {
    const c = littlewoodRichardson(lambda, mu, nu)
    if (c !== 0) p = p.add(inY(schurPolynomial(nu, k)).scale(c))
  }
  return p
}

/** Hook Schur s_λ(x/y) = Σ_{μ ⊆ λ} s_μ(x) s_{λ'/μ'}(y). */
function hookSchur(lambda: number[], k: number): Polynomial {
  let p = Polynomial.zero()
  const total = lambda.reduce((a, b) => a + b, 0)
  for (let d = 0; d <= total; d++) {
    for (const mu of partitionsOf(d)) {
      if (mu.length > lambda.length || mu.some((m, i) => m > lambda[i]!)) continue
      p = p.add(schurPolynomial(mu, k).mul(skewSchurInY(conjugate(lambda), conjugate(mu), k)))
    }
  }
  return p
}

describe('supersymmetric examples', () => {
  it('super power sums p_r(x) − (−1)^r p_r(y), r = 1..4, k = 2, 3 (Stembridge, J. Algebra 95 (1985), from memory)', () => {
    for (const k of [2, 3]) {
      for (let r = 1; r <= 4; r++) expect(isSupersymmetric(powerSum(r, k).sub(inY(powerSum(r, k)).scale((-1) ** r)), k), `r=${r}`).toBe(true)
    }
  })
  it('super elementary Σ_i e_i(x) h_{r−i}(y), generating function ∏(1 + x_i t)/∏(1 − y_j t) (Macdonald, Symmetric Functions, I.3 Ex. 23, from memory)', () => {
    for (let r = 1; r <= 4; r++) {
      let f = Polynomial.zero()
      for (let i = 0; i <= r; i++) f = f.add(elementarySymmetric(i, 3).mul(inY(completeSymmetric(r - i, 3))))
      expect(isSupersymmetric(f, 3), `r=${r}`).toBe(true)
    }
  })
  it('hook Schur functions s_λ(x/y) = Σ s_μ(x) s_{λ′/μ′}(y) (Berele–Regev 1987; Macdonald I.5 Ex. 23, from memory)', () => {
    for (const lambda of [[1], [2], [1, 1], [2, 1], [3, 1], [2, 2]]) expect(isSupersymmetric(hookSchur(lambda, 2), 2), `λ=${lambda}`).toBe(true)
  })
  it('∏_{i,j ≤ k} (x_i + y_j) vanishes at x_1 = −y_1 and is supersymmetric (common practice)', () => {
    let f = Polynomial.one()
    for (let i = 1; i <= 2; i++) for (let j = 1; j <= 2; j++) f = f.mul(x(i).add(y(j)))
    expect(isSupersymmetric(f, 2)).toBe(true)
  })
  it('the double Schubert polynomial S_{132}(x; −y) = x_1 + x_2 + y_1 + y_2 is p_1(x) + p_1(y) (hand computation)', () => {
    expect(isSupersymmetric(doubleSchubertPolynomial(parsePermutation('132')).negateY(), 2)).toBe(true)
  })
})

describe('non-supersymmetric examples, each failing the condition named', () => {
  it('p_2(x) + p_2(y): symmetric in each set, but depends on y_1 after x_1 = −y_1', () => {
    const c = checkSupersymmetry(powerSum(2, 2).add(inY(powerSum(2, 2))), 2)
    expect(c).toMatchObject({ supersymmetric: false, failure: 'depends-on-y1-after-cancellation' })
  })
  it('e_2(x) + h_2(y): the super elementary e_2 without its middle term', () => {
    expect(checkSupersymmetry(elementarySymmetric(2, 2).add(inY(completeSymmetric(2, 2))), 2).failure).toBe('depends-on-y1-after-cancellation')
  })
  it('S_{132}(x; y) = x_1 + x_2 − y_1 − y_2 is supersymmetric only in the other sign convention', () => {
    expect(isSupersymmetric(doubleSchubertPolynomial(parsePermutation('132')), 2)).toBe(false)
  })
  it('x_1 + y_1 − x_2 is not symmetric in x; x_1 + x_2 + y_2 is not symmetric in y', () => {
    expect(checkSupersymmetry(x(1).add(y(1)).sub(x(2)), 2).failure).toBe('not-symmetric-in-x')
    expect(checkSupersymmetry(x(1).add(x(2)).add(y(2)), 2).failure).toBe('not-symmetric-in-y')
  })
  it('k must be a positive integer', () => {
    expect(() => checkSupersymmetry(x(1), 0)).toThrow(InvalidArgumentError)
  })
})
