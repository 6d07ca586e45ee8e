// Products written with spacing commands, powers of classes and functions, and e_λ, h_λ, p_λ
// for a partition λ. Expected values come from outside the project, named beside each check.
import { describe, expect, it } from 'vitest'
import { onlyQuestion, readSnippet, ready } from './helpers'
import { verdictsOf } from './verdict-helpers'

const S = (...entries: number[]) => ({ type: 'schubert', perm: { form: 'oneLine', entries }, variant: 'single' })
const sym = (family: string, ...index: number[]) => ({ type: 'symmetric', family, index })

// lrcalc mult 2 1 - 3 1 (Debian lrcalc 2.1):
// s_52 + s_511 + s_43 + 2 s_421 + s_4111 + s_331 + s_322 + s_3211
const S21_S31 = 's_{52}+s_{511}+s_{43}+2s_{421}+s_{4111}+s_{331}+s_{322}+s_{3211}'

describe('products with spacing commands between factors', () => {
  it.each([
    ['\\ ', `$s_{(2,1)}\\ s_{(3,1)} = ${S21_S31}$`],
    ['\\,', `$s_{(2,1)}\\,s_{(3,1)} = ${S21_S31}$`],
    ['\\;', `$s_{(2,1)}\\;s_{(3,1)} = ${S21_S31}$`],
    ['\\!', `$s_{(2,1)}\\!s_{(3,1)} = ${S21_S31}$`],
    ['\\cdot', `$s_{(2,1)}\\cdot s_{(3,1)} = ${S21_S31}$`],
  ])('reads a Schur product spaced by %s as a product and verifies the lrcalc expansion', (_space, tex) => {
    expect(onlyQuestion(tex).lhs).toEqual({ type: 'multiply', factors: [sym('schur', 2, 1), sym('schur', 3, 1)] })
    expect(verdictsOf(tex)).toEqual(['verified'])
  })

  it('flags a wrong coefficient in a spaced Schur product (lrcalc gives 2 s_421, not 1)', () => {
    expect(verdictsOf(`$s_{(2,1)}\\ s_{(3,1)} = ${S21_S31.replace('2s_{421}', 's_{421}')}$`)).toEqual(['mismatch'])
  })

  it('reads \\mathfrak{S}_{132}\\,\\mathfrak{S}_{213} as a product of Schubert polynomials', () => {
    // S_132 = x_1 + x_2 and S_213 = x_1 (Manivel, Symmetric Functions, Schubert Polynomials and
    // Degeneracy Loci, table of S_w for S_3), so the product is x_1^2 + x_1 x_2.
    const tex = '$\\mathfrak{S}_{132}\\,\\mathfrak{S}_{213} = x_1^2 + x_1x_2$'
    expect(onlyQuestion(tex).lhs).toEqual({ type: 'multiply', factors: [S(1, 3, 2), S(2, 1, 3)] })
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf('$\\mathfrak{S}_{132}\\;\\mathfrak{S}_{213} = x_1^2 + x_2^2$')).toEqual(['mismatch'])
  })
})

describe('powers of classes and functions', () => {
  it('reads an integer superscript on \\mathfrak{S}_w as a power', () => {
    expect(onlyQuestion('$\\mathfrak{S}_{132}^2 = x_1^2+2x_1x_2+x_2^2$').lhs).toEqual({ type: 'power', base: S(1, 3, 2), exponent: 2 })
    expect(onlyQuestion('$\\mathfrak{S}^{2}_{132} = x_1^2+2x_1x_2+x_2^2$').lhs).toEqual({ type: 'power', base: S(1, 3, 2), exponent: 2 })
  })

  it('verifies (x_1+x_2)^2 for \\mathfrak{S}_{132}^2 and flags a wrong middle coefficient', () => {
    // (x_1 + x_2)^2 = x_1^2 + 2 x_1 x_2 + x_2^2 (binomial theorem, common practice).
    expect(verdictsOf('$\\mathfrak{S}_{132}^2 = x_1^2+2x_1x_2+x_2^2$')).toEqual(['verified'])
    expect(verdictsOf('$\\mathfrak{S}_{132}^2 = x_1^2+x_1x_2+x_2^2$')).toEqual(['mismatch'])
  })

  it('keeps a superscript on \\mathfrak{S} that is not an integer unread as a power', () => {
    const r = readSnippet('$\\mathfrak{S}^{(n)}_{132} = x_1 + x_2$')
    expect(ready(r)).toEqual([])
  })

  it('verifies s_1^3 by the Pieri rule and flags a wrong coefficient', () => {
    // s_1^3 = Σ f^λ s_λ over |λ| = 3, with f^{(2,1)} = 2 standard tableaux (common practice).
    expect(verdictsOf('$s_1^3 = s_3 + 2s_{21} + s_{111}$')).toEqual(['verified'])
    expect(verdictsOf('$s_1^3 = s_3 + s_{21} + s_{111}$')).toEqual(['mismatch'])
  })

  it('verifies the square of a binomial in x and y and flags a wrong one', () => {
    // sympy: expand((x1+y1)**2) = x1**2 + 2*x1*y1 + y1**2
    expect(onlyQuestion('$(x_1+y_1)^2 = x_1^2+2x_1y_1+y_1^2$').lhs).toMatchObject({ type: 'power', exponent: 2 })
    expect(verdictsOf('$(x_1+y_1)^2 = x_1^2+2x_1y_1+y_1^2$')).toEqual(['verified'])
    expect(verdictsOf('$(x_1+y_1)^2 = x_1^2+y_1^2$')).toEqual(['mismatch'])
  })
})

describe('e_λ, h_λ and p_λ for a partition λ', () => {
  it('reads e_{21} as e_2 e_1, never as e with index 21', () => {
    expect(onlyQuestion('$e_{21} = m_{21} + 3m_{111}$').lhs).toEqual({ type: 'multiply', factors: [sym('elementary', 2), sym('elementary', 1)] })
  })

  it.each([
    ['$h_{(2,2)} = h_2^2$', 'complete', [2, 2]],
    ['$h_{22} = h_2h_2$', 'complete', [2, 2]],
    ['$p_{(2,1)} = p_2p_1$', 'powerSum', [2, 1]],
    ['$e_{2,1,1} = e_2e_1^2$', 'elementary', [2, 1, 1]],
  ])('reads %s over the parts of the partition', (tex, family, parts) => {
    expect(onlyQuestion(tex).lhs).toEqual({ type: 'multiply', factors: parts.map(k => sym(family, k)) })
    expect(verdictsOf(tex)).toEqual(['verified'])
  })

  it('reads e_\\lambda with λ bound to a partition', () => {
    const r = readSnippet('Let $\\lambda = (2,1)$. Then $e_\\lambda = m_{21} + 3m_{111}$.')
    expect(ready(r).map(c => c.question?.lhs)).toEqual([{ type: 'multiply', factors: [sym('elementary', 2), sym('elementary', 1)] }])
  })

  it('reads e_k with k bound to an integer as one elementary function', () => {
    const r = readSnippet('Let $k = 2$. Then $e_k = m_{11}$.')
    expect(ready(r).map(c => c.question?.lhs)).toEqual([sym('elementary', 2)])
  })

  it('verifies e_{21} = m_{21} + 3 m_{111} and flags a wrong coefficient', () => {
    // e_2 e_1 = m_21 + 3 m_111 (Macdonald, Symmetric Functions and Hall Polynomials, I.6, the
    // transition matrix M(e, m) for n = 3: entry 3 at (21, 111); from memory).
    expect(verdictsOf('$e_{21} = m_{21} + 3m_{111}$')).toEqual(['verified'])
    expect(verdictsOf('$e_{21} = m_{21} + 2m_{111}$')).toEqual(['mismatch'])
    // h_2 h_1 = s_3 + s_21 (lrcalc mult 2 - 1).
    expect(verdictsOf('$h_{21} = s_{3} + s_{21}$')).toEqual(['verified'])
    expect(verdictsOf('$h_{21} = s_{3}$')).toEqual(['mismatch'])
  })

  it('evaluates e_{21}(x_1,x_2) in two variables', () => {
    // sympy: expand((x1*x2) * (x1 + x2)) = x1**2*x2 + x1*x2**2
    const tex = '$e_{21}(x_1,x_2) = x_1^2x_2 + x_1x_2^2$'
    expect(onlyQuestion(tex).lhs).toEqual({ type: 'multiply', factors: [{ ...sym('elementary', 2), variableCount: 2 }, { ...sym('elementary', 1), variableCount: 2 }] })
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf('$e_{21}(x_1,x_2) = x_1^2x_2$')).toEqual(['mismatch'])
  })

  it('leaves e_{12} (not a partition) without a verdict rather than reading e with index 12', () => {
    expect(verdictsOf('$e_{12} = m_{21}$')).not.toContain('mismatch')
    expect(verdictsOf('$e_{12} = m_{21}$')).not.toContain('verified')
  })

  it('still reads a one-digit index as one function', () => {
    expect(onlyQuestion('$e_3 = m_{111}$').lhs).toEqual(sym('elementary', 3))
    expect(onlyQuestion('$h_0 = 1$').lhs).toEqual(sym('complete'))
  })
})
