import { describe, it, expect } from 'vitest'
import {
  Polynomial, parsePermutation, allPermutations, schubertPolynomial, schurPolynomial, isVexillary,
  keyPolynomial, demazureAtom, keyExpansion, atomExpansion, schubertKeyExpansion, keyAtomExpansion,
  keyCombinationToPolynomial, compositionKey, compositionFromKey, decodeMonomial, NotInSpanError, InvalidArgumentError,
} from '../../../shared/math'

/** All weak compositions of d with n parts. */
function compositions(d: number, n: number): number[][] {
  if (n === 0) return d === 0 ? [[]] : []
  const out: number[][] = []
  for (let a = 0; a <= d; a++) for (const rest of compositions(d - a, n - 1)) out.push([a, ...rest])
  return out
}

function lexLess(a: readonly number[], b: readonly number[]): boolean {
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const d = (a[i] ?? 0) - (b[i] ?? 0)
    if (d !== 0) return d < 0
  }
  return false
}

const X = (i: number) => Polynomial.x(i)

describe('key polynomials and atoms: small values by hand', () => {
  it('κ and A in two variables (π_1 f = ∂_1(x_1 f), π̄_1 = π_1 − 1)', () => {
    expect(keyPolynomial([0, 1]).equals(X(1).add(X(2)))).toBe(true)
    expect(demazureAtom([0, 1]).equals(X(2))).toBe(true)
    expect(keyPolynomial([1, 0]).equals(X(1))).toBe(true)
    // A_{(1,2)} = π̄_1 x_1^2 x_2 = x_1 x_2^2
    expect(demazureAtom([1, 2]).equals(Polynomial.monomial([1, 2]))).toBe(true)
    expect(keyPolynomial([1, 2]).equals(Polynomial.monomial([2, 1]).add(Polynomial.monomial([1, 2])))).toBe(true)
  })
  it('trailing zeros do not change the composition', () => {
    expect(compositionKey([0, 2, 1, 0, 0])).toBe('0,2,1')
    expect(compositionFromKey('0,2,1')).toEqual([0, 2, 1])
    expect(keyPolynomial([0, 2, 1, 0]).equals(keyPolynomial([0, 2, 1]))).toBe(true)
  })
  it('a negative or fractional entry is refused with a clear error', () => {
    expect(() => keyPolynomial([1, -1])).toThrow(InvalidArgumentError)
    expect(() => demazureAtom([0.5])).toThrow(InvalidArgumentError)
  })
})

describe('triangularity the expansions rely on', () => {
  it('x^α has coefficient 1 in κ_α and A_α and every other monomial is lex-larger (all α of size ≤ 4, 4 parts)', () => {
    for (let d = 0; d <= 4; d++) {
      for (const a of compositions(d, 4)) {
        for (const p of [keyPolynomial(a), demazureAtom(a)]) {
          expect(p.coefficientOf(a)).toBe(1)
          for (const k of p.terms.keys()) {
            const e = decodeMonomial(k).x
            if (compositionKey(e) !== compositionKey(a)) expect(lexLess(a, e), `${a} vs ${e}`).toBe(true)
          }
        }
      }
    }
  })
})

describe('published facts', () => {
  it('κ_α = s_λ(x_1..x_n) for α the increasing rearrangement of λ (common practice)', () => {
    for (const lambda of [[1], [2, 1], [3, 1], [2, 2], [3, 2, 1], [2, 1, 1]]) {
      for (const n of [lambda.length, lambda.length + 1, 4]) {
        const alpha = [...new Array<number>(n - lambda.length).fill(0), ...lambda.slice().reverse()]
        expect(keyPolynomial(alpha).equals(schurPolynomial(lambda, n)), `λ=${lambda}, n=${n}`).toBe(true)
      }
    }
  })
  it('S_w = κ_{code(w)} exactly when w is vexillary, all of S_5 (common practice)', () => {
    let vex = 0
    for (const w of allPermutations(5)) {
      const single = keyPolynomial(w.lehmerCode()).equals(schubertPolynomial(w))
      expect(single, `w=${w}`).toBe(isVexillary(w))
      if (isVexillary(w)) vex++
    }
    expect(vex).toBe(103) // vexillary (2143-avoiding) permutations of S_5: OEIS A005802 gives 103
  })
  it('S_w expands in keys with nonnegative coefficients and the expansion sums back (all of S_5)', () => {
    for (const w of allPermutations(5)) {
      const c = schubertKeyExpansion(w)
      for (const v of c.values()) expect(v).toBeGreaterThan(0)
      expect(keyCombinationToPolynomial(c).equals(schubertPolynomial(w))).toBe(true)
    }
    // S_{2143} = x_1^2 + x_1x_2 + x_1x_3 = κ_{(1,0,1)} + κ_{(2)}  (hand computation)
    expect([...schubertKeyExpansion(parsePermutation('2143'))].sort()).toEqual([['1,0,1', 1], ['2', 1]])
  })
  it('keys expand in atoms with coefficients 0 or 1 (all α of size ≤ 4, 4 parts; common practice)', () => {
    for (let d = 1; d <= 4; d++) {
      for (const a of compositions(d, 4)) {
        const c = keyAtomExpansion(a)
        for (const v of c.values()) expect(v).toBe(1)
        let total = Polynomial.zero()
        for (const k of c.keys()) total = total.add(demazureAtom(compositionFromKey(k)))
        expect(total.equals(keyPolynomial(a))).toBe(true)
        expect(c.get(compositionKey(a))).toBe(1)
      }
    }
  })
  it('atoms of all rearrangements of λ sum to s_λ(x_1..x_n) (common practice)', () => {
    const perms = new Set(compositions(3, 3).filter(a => a.slice().sort().join() === '0,1,2').map(a => a.join(',')))
    expect(perms.size).toBe(6)
    let total = Polynomial.zero()
    for (const k of perms) total = total.add(demazureAtom(k.split(',').map(Number)))
    expect(total.equals(schurPolynomial([2, 1], 3))).toBe(true)
  })
})

describe('expansions', () => {
  it('expansions of a polynomial outside ℤ[x_1..x_n] are refused when asked to stay within n', () => {
    expect(() => keyExpansion(X(3), { within: 2 })).toThrow(NotInSpanError)
    expect(() => atomExpansion(Polynomial.y(1))).toThrow(NotInSpanError)
  })
  it('x_2 = κ_{(0,1)} − κ_{(1)}', () => {
    expect([...keyExpansion(X(2))].sort()).toEqual([['0,1', 1], ['1', -1]])
  })
})
