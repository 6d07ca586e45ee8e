import { describe, it, expect } from 'vitest'
import {
  ParametricPolynomial, Polynomial, parameterKey, parameterExponents, parametricDifference, allPermutations,
  grothendieckFormal, grothendieckPolynomial, schubertPolynomial, doubleGrothendieckFormal, doubleGrothendieckPolynomial,
  grothendieckExpansionFormal, formalGrothendieckCombinationToPolynomial, BETA, grothendieckProduct, parsePermutation,
} from '../../../shared/math'

const P = ParametricPolynomial
const beta = P.parameter('beta')
const q = P.parameter('q')
const x1 = P.from(Polynomial.x(1))
const y1 = P.from(Polynomial.y(1))

describe('the ring of named parameters', () => {
  it('keys are canonical whatever the order of the names', () => {
    expect(parameterKey({ q: 1, beta: 2 })).toBe('beta^2*q^1')
    expect(parameterKey({ q: 0 })).toBe('')
    expect(parameterExponents('beta^2*q^1')).toEqual({ beta: 2, q: 1 })
  })

  it('multiplies exactly: (x_1 + β y_1)(x_1 − β y_1) = x_1^2 − β^2 y_1^2, and βq = qβ', () => {
    const p = x1.add(beta.mul(y1)).mul(x1.sub(beta.mul(y1)))
    expect(p.equals(x1.pow(2).sub(beta.pow(2).mul(y1.pow(2))))).toBe(true)
    expect(beta.mul(q).equals(q.mul(beta))).toBe(true)
    expect(beta.mul(q).equals(beta)).toBe(false)
  })

  it('cancels to zero and keeps no empty parts', () => {
    const p = beta.mul(x1).sub(x1.mul(beta))
    expect(p.isZero()).toBe(true)
    expect(p.parts.size).toBe(0)
  })

  it('substitutes a parameter only when asked, and leaves the others', () => {
    const p = x1.add(beta.mul(x1).mul(y1)).add(q)
    expect(p.substitute('beta', 0).equals(x1.add(q))).toBe(true)
    expect(p.substitute('beta', -1).equals(x1.sub(x1.mul(y1)).add(q))).toBe(true)
    expect(p.parameterNames()).toEqual(new Set(['beta', 'q']))
    expect(p.withoutParameters()).toBeUndefined()
    expect(p.substitute('beta', 0).substitute('q', 0).withoutParameters()!.equals(Polynomial.x(1))).toBe(true)
  })

  it('is exact past 2^53', () => {
    const big = P.constant(2n ** 60n).mul(beta)
    expect(big.mul(big).termList()[0]!.coefficient).toBe(2n ** 120n)
  })

  it('writes LaTeX with the parameters first and a term-by-term difference that names the β-terms', () => {
    expect(x1.add(beta.mul(x1).mul(y1)).toLatex()).toBe('x_{1} + \\beta x_{1}y_{1}')
    const d = parametricDifference(x1.add(beta.mul(x1)), x1.sub(beta.mul(x1)))
    expect(d.equal).toBe(false)
    expect(d.wrongCoefficient).toEqual([{ parameters: { beta: 1 }, x: [1], y: [], expected: 1, actual: -1 }])
    expect(parametricDifference(x1, x1).equal).toBe(true)
  })

  it('refuses a parameter name that is not an identifier', () => {
    expect(() => P.parameter('\\beta')).toThrow(/identifier/)
  })
})

describe('Grothendieck polynomials with β formal', () => {
  it('G_{132} = x_1 + x_2 + β x_1x_2 and G_{21}(x; y) = x_1 + y_1 + β x_1y_1 (the ⊕ form)', () => {
    expect(grothendieckFormal(parsePermutation('132')).toLatex()).toBe('x_{1} + x_{2} + \\beta x_{1}x_{2}')
    expect(doubleGrothendieckFormal(parsePermutation('21')).toLatex()).toBe('x_{1} + y_{1} + \\beta x_{1}y_{1}')
  })

  it('β = 0 gives S_w (the lowest-degree part of G_w is S_w, common practice) and β = ±1 the numeric G^β_w, all of S_4', () => {
    for (const w of allPermutations(4)) {
      const g = grothendieckFormal(w)
      expect(g.substitute(BETA, 0).withoutParameters()!.equals(schubertPolynomial(w)), `${w}`).toBe(true)
      for (const b of [-1, 1]) {
        expect(g.substitute(BETA, b).withoutParameters()!.equals(grothendieckPolynomial(w, b)), `${w} β=${b}`).toBe(true)
        expect(doubleGrothendieckFormal(w).substitute(BETA, b).withoutParameters()!.equals(doubleGrothendieckPolynomial(w, b)), `${w} β=${b}`).toBe(true)
      }
    }
  })

  it('the formal expansion of a product agrees at β = −1 with the numeric one, S_3 × S_3', () => {
    for (const u of allPermutations(3)) {
      for (const v of allPermutations(3)) {
        const f = grothendieckFormal(u).mul(grothendieckFormal(v))
        const formal = grothendieckExpansionFormal(f)
        expect(formalGrothendieckCombinationToPolynomial(formal).equals(f)).toBe(true)
        const numeric = grothendieckProduct(u, v, -1)
        const atMinusOne = new Map([...formal].map(([k, c]) => [k, c.substitute(BETA, -1).withoutParameters()!.coefficientOf([])]))
        expect([...atMinusOne].sort(), `${u}·${v}`).toEqual([...numeric].sort())
      }
    }
  })

  it('refuses what is not in ℤ[β][x]', () => {
    expect(() => grothendieckExpansionFormal(y1)).toThrow(/y-variables/)
    expect(() => grothendieckExpansionFormal(q.mul(x1))).toThrow(/parameter q/)
  })
})
