// Supersymmetry stated by the text (shared/latex/notation/supersymmetry.ts), checked with the common
// definition (symmetric in each set, free of y_1 after x_1 = −y_1). Values used, common practice:
// p_1(x) + p_1(y) and p_2(x) − p_2(y) are supersymmetric (super power sums p_r(x) − (−1)^r p_r(y));
// p_2(x) + p_2(y) is not; x_1 + y_2 is not symmetric in x_1, x_2.
import { describe, expect, it } from 'vitest'
import { supersymmetricSets } from '../../../shared/latex/notation/supersymmetry'
import { readSnippet } from './helpers'
import { verdictsOf } from './verdict-helpers'

describe('the variable sets of a supersymmetry statement', () => {
  it.each([
    ['x_1,x_2;y_1,y_2', 2], ['x_1,\\dots,x_3; y_1,\\dots,y_3', 3], ['x_1, \\ldots, x_{4};\\, y_1, \\ldots, y_{4}', 4], ['x_1;y_1', 1],
  ])('reads %s as k = %i', (text, k) => {
    expect(supersymmetricSets(text)).toBe(k)
  })
  it.each(['x_1,x_2;y_1,y_2,y_3', 'x_1,x_3;y_1,y_3', 'x_2,x_3;y_2,y_3', 'x_1,x_2', 'a_1,a_2;b_1,b_2'])('refuses %s', (text) => {
    expect(supersymmetricSets(text)).toBeUndefined()
  })
})

describe('supersymmetry claims', () => {
  it('checks the prose form and flags a polynomial that is not supersymmetric', () => {
    expect(verdictsOf('The polynomial $x_1 + x_2 + y_1 + y_2$ is supersymmetric in $x_1,x_2;y_1,y_2$.')).toEqual(['verified'])
    expect(verdictsOf('The polynomial $x_1^2 + x_2^2 + y_1^2 + y_2^2$ is supersymmetric in $x_1,x_2;y_1,y_2$.')).toEqual(['mismatch'])
  })
  it('checks the one-display form', () => {
    expect(verdictsOf('\\[ x_1^2 + x_2^2 - y_1^2 - y_2^2 \\text{ is supersymmetric in } x_1,\\dots,x_2;\\, y_1,\\dots,y_2 \\]')).toEqual(['verified'])
    expect(verdictsOf('\\[ x_1 + y_2 \\text{ is supersymmetric in } x_1,x_2; y_1,y_2 \\]')).toEqual(['mismatch'])
  })
  it('is a claim of kind supersymmetry about the polynomial written', () => {
    const claim = readSnippet('The polynomial $x_1 + y_1$ is supersymmetric in $x_1;y_1$.').claims[0]!
    expect(claim.kind).toBe('supersymmetry')
    expect(claim.question?.lhs).toMatchObject({ type: 'supersymmetric', k: 1 })
  })
  it('lists a letter standing for a polynomial as not read, and keeps other prose silent', () => {
    const named = readSnippet('The polynomial $f$ is supersymmetric in $x_1,x_2;y_1,y_2$.')
    expect(named.claims).toEqual([])
    expect(named.notRead).toHaveLength(1)
    expect(readSnippet('We ask whether $f$ is supersymmetric, and whether $x_1 + y_1$ is symmetric.').claims).toEqual([])
    expect(readSnippet('$x_1 + y_1$ is supersymmetric in $x_1,x_2;y_1$.').claims).toEqual([])
  })
})
