// The alphabets of double polynomials: (x|y), (\mathbf{x};\mathbf{y}) and (x;-y), which means
// every y_j replaced by −y_j. Expected values: S_21(x;y) = x_1 − y_1 and S_132(x;y) =
// x_1 + x_2 − y_1 − y_2 (Fulton, Young Tableaux, §10, double Schubert polynomials; from memory),
// with the reference sign convention Π(x_i − y_j).
import { describe, expect, it } from 'vitest'
import { onlyQuestion } from './helpers'
import { verdictsOf } from './verdict-helpers'

const S = (entries: number[], extra: Record<string, unknown> = {}) => ({ type: 'schubert', perm: { form: 'oneLine', entries }, variant: 'double', ...extra })

describe('second alphabets of double Schubert polynomials', () => {
  it.each([
    ['$\\mathfrak{S}_{21}(x|y) = x_1 - y_1$'],
    ['$\\mathfrak{S}_{21}(x\\mid y) = x_1 - y_1$'],
    ['$\\mathfrak{S}_{21}(\\mathbf{x};\\mathbf{y}) = x_1 - y_1$'],
  ])('reads %s as a double Schubert polynomial', (tex) => {
    expect(onlyQuestion(tex).lhs).toEqual(S([2, 1]))
  })

  it('reads (x;-y) as the double polynomial with y replaced by −y', () => {
    expect(onlyQuestion('$\\mathfrak{S}_{132}(x;-y) = x_1+x_2+y_1+y_2$').lhs).toEqual(S([1, 3, 2], { negatedY: true }))
    expect(onlyQuestion('$\\mathfrak{S}_{132}(\\mathbf{x};-\\mathbf{y}) = x_1+x_2+y_1+y_2$').lhs).toEqual(S([1, 3, 2], { negatedY: true }))
  })

  it('verifies S_w(x;-y) next to S_w(x;y) in the same paper and flags the sign left unchanged', () => {
    const fixed = '$\\mathfrak{S}_{21}(x;y) = x_1 - y_1$, so '
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x;-y) = x_1+x_2+y_1+y_2$.`)).toEqual(['verified', 'verified'])
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x;-y) = x_1+x_2-y_1-y_2$.`)).toEqual(['verified', 'mismatch'])
  })

  it('verifies (x|y) like (x;y) and flags a wrong sign', () => {
    const fixed = '$\\mathfrak{S}_{21}(x;y) = x_1 - y_1$, so '
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x|y) = x_1+x_2-y_1-y_2$.`)).toEqual(['verified', 'verified'])
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x|y) = x_1+x_2+y_1-y_2$.`)).toEqual(['verified', 'mismatch'])
  })

  it('does not read (x;-y) on a double Grothendieck polynomial or with a non-variable after the minus', () => {
    for (const tex of ['$\\mathfrak{G}_{21}(x;-y) = x_1 + y_1$', '$\\mathfrak{S}_{21}(x;-1) = x_1 + 1$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts, tex).not.toContain('verified')
      expect(verdicts, tex).not.toContain('mismatch')
    }
  })
})

describe('alphabets a claim declares in an argument list', () => {
  // sympy, bialternant formula: s_21(a,b,c) = a**2*b + a**2*c + a*b**2 + 2*a*b*c + a*c**2 + b**2*c + b*c**2
  const S21_ABC = 'a^2b+a^2c+ab^2+2abc+ac^2+b^2c+bc^2'

  it('reads s_{21}(a,b,c) with a, b, c as the three variables', () => {
    const q = onlyQuestion(`$s_{21}(a,b,c) = ${S21_ABC}$`)
    expect(q.lhs).toEqual({ type: 'symmetric', family: 'schur', index: [2, 1], variableCount: 3 })
  })

  it('verifies s_{21}(a,b,c) (sympy) and flags a wrong coefficient of abc', () => {
    expect(verdictsOf(`$s_{21}(a,b,c) = ${S21_ABC}$`)).toEqual(['verified'])
    expect(verdictsOf(`$s_{21}(a,b,c) = ${S21_ABC.replace('2abc', 'abc')}$`)).toEqual(['mismatch'])
  })

  it('verifies m_{2}(x_0,x_1,x_2) in variables from x_0 and flags a missing square', () => {
    // m_2 in three variables is the sum of their squares (definition, common practice).
    expect(onlyQuestion('$m_{2}(x_0,x_1,x_2) = x_0^2+x_1^2+x_2^2$').lhs).toEqual({ type: 'symmetric', family: 'monomial', index: [2], variableCount: 3 })
    expect(verdictsOf('$m_{2}(x_0,x_1,x_2) = x_0^2+x_1^2+x_2^2$')).toEqual(['verified'])
    expect(verdictsOf('$m_{2}(x_0,x_1,x_2) = x_0^2+x_1^2$')).toEqual(['mismatch'])
  })

  it('reads a second alphabet z in \\mathfrak{S}_w(x;z) as y', () => {
    expect(onlyQuestion('$\\mathfrak{S}_{132}(x;z) = x_1+x_2-z_1-z_2$').rhs).toEqual({
      type: 'add', terms: [{ type: 'variable', name: 'x', index: 1 }, { type: 'variable', name: 'x', index: 2 }, { type: 'negate', arg: { type: 'variable', name: 'y', index: 1 } }, { type: 'negate', arg: { type: 'variable', name: 'y', index: 2 } }],
    })
    const fixed = '$\\mathfrak{S}_{21}(x;y) = x_1 - y_1$, so '
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x;z) = x_1+x_2-z_1-z_2$.`)).toEqual(['verified', 'verified'])
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x;z) = x_1+x_2+z_1-z_2$.`)).toEqual(['verified', 'mismatch'])
  })

  it('declares no alphabet when letters sit next to explicit x_i, or outside an argument list', () => {
    for (const tex of ['$s_{1}(a,b) = a + x_1$', '$f(a,b) = a + b$', '$z_1 = x_1$', '$a + b = s_{1}$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts, tex).not.toContain('verified')
      expect(verdicts, tex).not.toContain('mismatch')
    }
  })

  it('verifies e_{2}(a,b) = ab and flags a^2', () => {
    expect(verdictsOf('$e_{2}(a,b) = ab$')).toEqual(['verified'])
    expect(verdictsOf('$e_{2}(a,b) = a^2$')).toEqual(['mismatch'])
  })

  // sympy, bialternant: s_21(z_1,z_2) = z1**2*z2 + z1*z2**2; s_1(t_1,t_2,t_3) = t1 + t2 + t3 (definition).
  it('reads s_{21}(z_1,z_2) in the indexed alphabet z as x, and flags a wrong term', () => {
    expect(onlyQuestion('$s_{21}(z_1,z_2) = z_1^2z_2 + z_1z_2^2$').lhs).toEqual({ type: 'symmetric', family: 'schur', index: [2, 1], variableCount: 2 })
    expect(verdictsOf('$s_{21}(z_1,z_2) = z_1^2z_2 + z_1z_2^2$')).toEqual(['verified'])
    expect(verdictsOf('$s_{21}(z_1,z_2) = z_1^2z_2 + z_1^2z_2^2$')).toEqual(['mismatch'])
    expect(verdictsOf('$e_{1}(t_1,t_2,t_3) = t_1+t_2+t_3$')).toEqual(['verified'])
  })

  it('declares no indexed alphabet when the indices do not run from 1, beside x_i, or in an object letter', () => {
    for (const tex of ['$s_{1}(z_2,z_3) = z_2+z_3$', '$s_{1}(z_1,z_2) = x_1+x_2$', '$s_{1}(z_1,z_2) = z_1+y_2$', '$s_{1}(e_1,e_2) = e_1+e_2$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts, tex).not.toContain('verified')
      expect(verdicts, tex).not.toContain('mismatch')
    }
  })

  // Regression: (x;z) next to an explicit y_1 read z as y and y as y, verifying a claim that mixes two alphabets.
  it('does not read (x;z) when the claim also writes y_j', () => {
    const verdicts = verdictsOf('$\\mathfrak{S}_{21}(x;z) = x_1 - y_1$')
    expect(verdicts).not.toContain('verified')
    expect(verdicts).not.toContain('mismatch')
  })
})
