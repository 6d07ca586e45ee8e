import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  Polynomial, parsePermutation, allPermutations, grothendieckPolynomial, doubleSchubertPolynomial, schubertPolynomial,
  doubleGrothendieckPolynomial, doubleGrothendieckOminus, doubleGrothendieckByHecke, kOplus, rationalsEqual, reduceRational, betaCoefficients,
  betaZeroSpecialisation, checkBetaZeroSpecialisation, grothendieckExpansion, grothendieckProduct,
  grothendieckProductFormal, combinationEntries, InvalidArgumentError, type SchubertCombination, type Permutation,
} from '../../../shared/math'

const P = (s: string) => parsePermutation(s)
const x = Polynomial.x
const y = Polynomial.y
const S4 = allPermutations(4)

function combine(c: SchubertCombination, beta: number): Polynomial {
  let p = Polynomial.zero()
  for (const { permutation, coefficient } of combinationEntries(c)) p = p.add(grothendieckPolynomial(permutation, beta).scale(coefficient))
  return p
}

describe('double Grothendieck polynomials, ⊕ normalisation (k-oplus)', () => {
  it('G_{21} = x_1 ⊕ y_1 and G_{w}(x; 0) is the single G^β_w (all of S_4, β = ±1)', () => {
    expect(doubleGrothendieckPolynomial(P('21'), -1).equals(x(1).add(y(1)).sub(x(1).mul(y(1))))).toBe(true)
    for (const beta of [-1, 1]) {
      for (const w of S4) {
        const g = doubleGrothendieckPolynomial(w, beta)
        const atYZero = new Polynomial(new Map([...g.terms].filter(([k]) => !k.includes('\uffff'))))
        expect(atYZero.equals(grothendieckPolynomial(w, beta)), `w=${w}, β=${beta}`).toBe(true)
      }
    }
  })
  it('the lowest-degree part of G_w(x; y) is S_w(x; −y), and β = 0 gives exactly S_w(x; −y) (common practice)', () => {
    for (const w of S4) {
      const s = doubleSchubertPolynomial(w).negateY()
      expect(doubleGrothendieckPolynomial(w, -1).lowestDegreePart().equals(s)).toBe(true)
      expect(doubleGrothendieckPolynomial(w, 0).equals(s)).toBe(true)
    }
  })
  it('the single G_w has lowest-degree part S_w (common practice)', () => {
    for (const w of allPermutations(5)) expect(grothendieckPolynomial(w, -1).lowestDegreePart().equals(schubertPolynomial(w))).toBe(true)
  })
  it('G_{w0} is the product of x_i ⊕ y_j over i + j ≤ n (stated top class)', () => {
    let top = Polynomial.one()
    for (let i = 1; i <= 3; i++) for (let j = 1; i + j <= 4; j++) top = top.mul(kOplus(x(i), y(j), -1))
    expect(doubleGrothendieckPolynomial(P('4321'), -1).equals(top)).toBe(true)
  })
  it('the 0-Hecke Cauchy route agrees with the divided-difference route (all of S_4, β = ±1)', () => {
    for (const beta of [-1, 1]) for (const w of S4) expect(doubleGrothendieckByHecke(w, beta).equals(doubleGrothendieckPolynomial(w, beta)), `w=${w}`).toBe(true)
  })
  it('a fractional β is refused with a clear error', () => {
    expect(() => doubleGrothendieckPolynomial(P('21'), 0.5)).toThrow(InvalidArgumentError)
  })
})

describe('⊖ normalisation (k-ominus)', () => {
  it('G^⊖_{21} = (x_1 − y_1)/(1 + βy_1) and G^⊖_{132} has denominator (1 − y_1)(1 − y_2) at β = −1', () => {
    const g = doubleGrothendieckOminus(P('21'), -1)
    expect(g.numerator.equals(x(1).sub(y(1)))).toBe(true)
    expect(g.denominator).toEqual([1])
    expect(doubleGrothendieckOminus(P('132'), -1).denominator).toEqual([1, 1])
  })
  it('G^⊖_w(x; y) = G^⊕_w(x; ⊖y): (x ⊖ y) ⊕ y = x checked on the top class of S_3 after clearing denominators', () => {
    // ⊖y = −y/(1+βy): substitute into G^⊕ and clear (1+βy_j)^{deg}; compare by cross-multiplying.
    for (const beta of [-1, 1]) {
      for (const w of allPermutations(3)) {
        const plus = doubleGrothendieckPolynomial(w, beta)
        const degY = 2
        // each y_j^k term becomes (−y_j)^k (1+βy_j)^{degY−k}; the result sits over ∏(1+βy_j)^{degY}
        let num = Polynomial.zero()
        for (const t of plus.termList()) {
          let term = Polynomial.monomial(t.x, [], t.coefficient)
          for (let j = 0; j < 2; j++) {
            const k = t.y[j] ?? 0
            term = term.mul(y(j + 1).neg().pow(k)).mul(Polynomial.one().add(y(j + 1).scale(beta)).pow(degY - k))
          }
          num = num.add(term)
        }
        expect(rationalsEqual(doubleGrothendieckOminus(w, beta), { numerator: num, beta, denominator: [degY, degY] }), `w=${w}`).toBe(true)
      }
    }
  })
  it('at β = 0 the ⊖ form is S_w(x; y) (factors x_i − y_j)', () => {
    for (const w of S4) {
      const g = doubleGrothendieckOminus(w, 0)
      expect(g.denominator).toEqual([])
      expect(g.numerator.equals(doubleSchubertPolynomial(w))).toBe(true)
    }
  })
  it('reduceRational cancels exactly the common factors (1 + βy_j)', () => {
    const f = x(1).sub(y(1)).mul(Polynomial.one().sub(y(1)))
    expect(reduceRational({ numerator: f, beta: -1, denominator: [2] })).toEqual({ numerator: x(1).sub(y(1)), beta: -1, denominator: [1] })
    expect(reduceRational({ numerator: x(1), beta: -1, denominator: [1] }).denominator).toEqual([1])
  })
})

describe('β formal', () => {
  it('β^k coefficients from the value at β = 1 reproduce the value at β = −1 and β = 2 (all of S_4)', () => {
    for (const w of S4) {
      const coeffs = betaCoefficients(doubleGrothendieckPolynomial(w, 1), w.length())
      expect(coeffs[0]!.equals(doubleSchubertPolynomial(w).negateY())).toBe(true)
      for (const beta of [-1, 2]) {
        const sum = coeffs.reduce((acc, c, k) => acc.add(c.scale(beta ** k)), Polynomial.zero())
        expect(sum.equals(doubleGrothendieckPolynomial(w, beta)), `w=${w}, β=${beta}`).toBe(true)
      }
    }
  })
})

describe('specialisation β = 0 and the sign slip', () => {
  it('a claim of the other y-sign is named as a sign slip, under each normalisation', () => {
    const w = P('132')
    const plus = betaZeroSpecialisation(w, 'k-oplus')
    expect(plus.equals(x(1).add(x(2)).add(y(1)).add(y(2)))).toBe(true)
    const slip = checkBetaZeroSpecialisation(w, 'k-oplus', doubleSchubertPolynomial(w))
    expect(slip).toMatchObject({ holds: false, slip: 'y-sign' })
    expect(slip.message).toMatch(/sign of y/)
    expect(checkBetaZeroSpecialisation(w, 'k-ominus', doubleSchubertPolynomial(w)).holds).toBe(true)
    expect(checkBetaZeroSpecialisation(w, 'k-ominus', plus).slip).toBe('y-sign')
  })
  it('a plainly wrong claim is a mismatch without a slip, and a y-free claim is never called a sign slip', () => {
    const wrong = checkBetaZeroSpecialisation(P('132'), 'k-oplus', x(1))
    expect(wrong.holds).toBe(false)
    expect(wrong.slip).toBeUndefined()
    expect(checkBetaZeroSpecialisation(P('1'), 'k-oplus', Polynomial.one()).holds).toBe(true)
  })
})

describe('K-theoretic products in the Grothendieck basis', () => {
  it('x_2 = G_{132} − G_{21} + G_{231} at β = −1 (hand computation)', () => {
    expect([...grothendieckExpansion(x(2), -1)].sort()).toEqual([['1,3,2', 1], ['2,1', -1], ['2,3,1', 1]])
  })
  it('G_{132} G_{213} = G_{312} + G_{231} − G_{321} at β = −1 (hand computation: x_1(x_1 + x_2 − x_1x_2))', () => {
    expect([...grothendieckProduct(P('132'), P('213'), -1)].sort()).toEqual([['2,3,1', 1], ['3,1,2', 1], ['3,2,1', -1]])
  })
  it('products sum back and obey the sign alternation (−1)^{ℓ(w)−ℓ(u)−ℓ(v)} c ≥ 0 at β = −1 (Brion 2002), all u, v in S_3 and S_4 samples', () => {
    const pairs: [Permutation, Permutation][] = []
    for (const u of allPermutations(3)) for (const v of allPermutations(3)) pairs.push([u, v])
    pairs.push([P('1342'), P('2143')], [P('1432'), P('1324')], [P('2413'), P('3142')])
    for (const [u, v] of pairs) {
      const c = grothendieckProduct(u, v, -1)
      expect(combine(c, -1).equals(grothendieckPolynomial(u, -1).mul(grothendieckPolynomial(v, -1)))).toBe(true)
      for (const { permutation: w, coefficient } of combinationEntries(c)) {
        expect(Number(coefficient) * (-1) ** (w.length() - u.length() - v.length()), `${u}·${v} at ${w}`).toBeGreaterThan(0)
      }
      // β formal: c(β) = c(1) β^{ℓ(w)−ℓ(u)−ℓ(v)}, so c(−1) is c(1) times that sign
      const formal = grothendieckProductFormal(u, v)
      expect(formal.length).toBe(c.size)
      for (const t of formal) expect(c.get(t.permutation.key)).toBe(Number(t.coefficient) * (-1) ** t.betaPower)
    }
  })
  it('commutative and associative (fast-check, S_3 × S_3 × S_3, β = −1)', () => {
    const S3 = allPermutations(3)
    const perm = fc.integer({ min: 0, max: 5 }).map(i => S3[i]!)
    fc.assert(fc.property(perm, perm, (u, v) => {
      const a = grothendieckProduct(u, v, -1)
      const b = grothendieckProduct(v, u, -1)
      return [...a].sort().join() === [...b].sort().join()
    }), { seed: 9, numRuns: 20 })
    // Σ_a c^a_{uv} c^z_{aw} = Σ_b c^b_{vw} c^z_{ub}: structure constants only, no polynomial shortcut
    const sumProducts = (outer: SchubertCombination, mul: (p: Permutation) => SchubertCombination) => {
      const acc = new Map<string, number>()
      for (const { permutation, coefficient } of combinationEntries(outer)) {
        for (const [k, c] of mul(permutation)) acc.set(k, (acc.get(k) ?? 0) + Number(coefficient) * Number(c))
      }
      return [...acc].filter(([, c]) => c !== 0).sort().join()
    }
    fc.assert(fc.property(perm, perm, perm, (u, v, w) => {
      const left = sumProducts(grothendieckProduct(u, v, -1), a => grothendieckProduct(a, w, -1))
      const right = sumProducts(grothendieckProduct(v, w, -1), b => grothendieckProduct(u, b, -1))
      return left === right
    }), { seed: 11, numRuns: 15 })
  })
})
