// Skew Schur functions s_{λ/μ} and Young diagrams drawn with ytableau's \ydiagram in a subscript.
// Expected values come from Debian's lrcalc and python3-sympy, named beside each check.
import { describe, expect, it } from 'vitest'
import { onlyQuestion, readSnippet, ready } from './helpers'
import { verdictsOf } from './verdict-helpers'

const skew = (index: number[], inner: number[], variableCount?: number) => ({
  type: 'symmetric', family: 'schur', index, skew: inner, ...(variableCount ? { variableCount } : {}),
})

describe('skew Schur functions', () => {
  it.each([
    ['$s_{(3,2)/(1)} = s_{31}+s_{22}$'],
    ['$s_{32/1} = s_{31}+s_{22}$'],
    ['$s_{3,2/1} = s_{31}+s_{22}$'],
  ])('reads %s as s_{(3,2)/(1)}', (tex) => {
    expect(onlyQuestion(tex).lhs).toEqual(skew([3, 2], [1]))
  })

  it('verifies s_{32/1} = s_31 + s_22 (lrcalc skew 3 2 / 1) and flags a missing term', () => {
    expect(verdictsOf('$s_{32/1} = s_{31}+s_{22}$')).toEqual(['verified'])
    expect(verdictsOf('$s_{32/1} = s_{31}$')).toEqual(['mismatch'])
  })

  it('verifies s_{321/21} = s_3 + 2 s_21 + s_111 (lrcalc skew 3 2 1 / 2 1) and flags coefficient 1', () => {
    expect(verdictsOf('$s_{(3,2,1)/(2,1)} = s_{3} + 2s_{21} + s_{111}$')).toEqual(['verified'])
    expect(verdictsOf('$s_{(3,2,1)/(2,1)} = s_{3} + s_{21} + s_{111}$')).toEqual(['mismatch'])
  })

  it('reads s_{\\lambda/\\mu} with λ and μ bound', () => {
    const r = readSnippet('Let $\\lambda=(3,2)$ and $\\mu = (1)$. Then $s_{\\lambda/\\mu} = s_{31}+s_{22}$.')
    expect(ready(r).map(c => c.question?.lhs)).toEqual([skew([3, 2], [1])])
  })

  it('evaluates s_{\\lambda/\\mu}(x_1,\\dots,x_n) with n bound, against sympy', () => {
    // sympy, bialternant formula: s_31(x1,x2) + s_22(x1,x2) = x1**3*x2 + 2*x1**2*x2**2 + x1*x2**3
    const tex = 'Let $n=2$, $\\lambda=(3,2)$ and $\\mu = (1)$. Then $s_{\\lambda/\\mu}(x_1,\\dots,x_n) = x_1^3x_2 + 2x_1^2x_2^2 + x_1x_2^3$.'
    expect(ready(readSnippet(tex)).map(c => c.question?.lhs)).toEqual([skew([3, 2], [1], 2)])
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf(tex.replace('2x_1^2x_2^2', 'x_1^2x_2^2'))).toEqual(['mismatch'])
  })

  it('leaves s_{λ/μ} with μ not inside λ without a verdict', () => {
    const verdicts = verdictsOf('$s_{(1)/(2)} = 0$')
    expect(verdicts).not.toContain('verified')
    expect(verdicts).not.toContain('mismatch')
  })

  it('leaves s_{\\lambda/\\mu} with unbound letters without a verdict', () => {
    const verdicts = verdictsOf('$s_{\\lambda/\\mu} = \\sum_\\nu c^\\lambda_{\\mu\\nu} s_\\nu$')
    expect(verdicts).not.toContain('verified')
    expect(verdicts).not.toContain('mismatch')
  })

  it('does not read a slash as a skew shape outside Schur functions', () => {
    const verdicts = verdictsOf('$m_{32/1} = m_{31}$')
    expect(verdicts).not.toContain('mismatch')
  })
})

describe('Young diagrams drawn with \\ydiagram in a subscript', () => {
  it('reads s_{\\ydiagram{2,1}} as s_{21}', () => {
    expect(onlyQuestion('$s_{\\ydiagram{2,1}} = m_{21}+2m_{111}$').lhs).toEqual({ type: 'symmetric', family: 'schur', index: [2, 1] })
  })

  it('verifies s_21 = m_21 + 2 m_111 written with a diagram and flags a wrong Kostka number', () => {
    // Kostka numbers K_{21,21} = 1, K_{21,111} = 2 (Macdonald, Symmetric Functions and Hall
    // Polynomials, I.6 table for n = 3; from memory).
    expect(verdictsOf('$s_{\\ydiagram{2,1}} = m_{21}+2m_{111}$')).toEqual(['verified'])
    expect(verdictsOf('$s_{\\ydiagram{2,1}} = m_{21}+m_{111}$')).toEqual(['mismatch'])
  })

  it('reads the same partition from \\ydiagram in a paper in French notation', () => {
    // French notation draws the longest row at the bottom, but \ydiagram still lists the row
    // lengths longest first, so the partition is unchanged.
    const tex = '\\ytableausetup{boxsize=1em}\nWe draw diagrams in French notation.\n\n$s_{\\ydiagram{2,1}} = m_{21}+2m_{111}$'
    expect(ready(readSnippet(tex)).map(c => c.question?.lhs)).toEqual([{ type: 'symmetric', family: 'schur', index: [2, 1] }])
    expect(verdictsOf(tex)).toEqual(['verified'])
  })

  it('leaves a \\ydiagram whose rows increase unread instead of guessing English or French order', () => {
    for (const tex of ['$s_{\\ydiagram{1,2}} = m_{21}+2m_{111}$', '$s_{\\ydiagram{1+2,3}} = s_{31}$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts).not.toContain('verified')
      expect(verdicts).not.toContain('mismatch')
    }
  })
})
