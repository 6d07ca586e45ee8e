// Rows of align and multline (shared/latex/statements.ts): a row ending or starting with a sign
// continues the expression, and a label in the first cell is not part of the claim.
// Expected polynomials: Schubert polynomials from divided differences of x_1^3x_2^2x_3 computed with
// Debian's python3-sympy (/usr/bin/python3); h_n-e_n identities are common practice
// (h_1 = e_1, h_2 - e_1h_1 + e_2 = 0); s_{21} in three variables is m_{21} + 2m_{111} (Kostka K_{21,111} = 2).
import { describe, expect, it } from 'vitest'
import { readSnippet, ready } from './helpers'
import { verdictsOf } from './verdict-helpers'

const S1432 = 'x_1^2x_2 + x_1^2x_3 + x_1x_2^2 + x_1x_2x_3 + x_2^2x_3'

describe('continued rows', () => {
  it('reads a row that ends with + and the row after it as one claim at the first row', () => {
    const tex = [
      '\\begin{align*}',
      's_{21}(x_1,x_2,x_3) &= x_1^2x_2 + x_1^2x_3 + x_1x_2^2 + \\\\',
      '&\\quad + 2x_1x_2x_3 + x_1x_3^2 + x_2^2x_3 + x_2x_3^2',
      '\\end{align*}',
    ].join('\n')
    const r = readSnippet(tex)
    expect(r.claims.map(c => [c.line, c.endLine, c.status])).toEqual([[2, 3, 'ready']])
    expect(verdictsOf(tex)).toEqual(['verified'])
  })

  it('reads a row that ends with - without a sign on the next row', () => {
    const tex = '\\begin{multline}\n\\mathfrak{S}_{1432} - x_1^2x_2 - x_1^2x_3 - \\\\\n x_1x_2^2 - x_1x_2x_3 - x_2^2x_3 = 0\n\\end{multline}'
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(readSnippet(tex).claims[0]!.line).toBe(2)
  })

  it('catches a wrong term on the continued row', () => {
    const tex = `\\begin{align}\n\\mathfrak{S}_{1432} &= x_1^2x_2 + x_1^2x_3 + \\\\\n &\\qquad x_1x_2^2 + x_2^2x_3\n\\end{align}`
    expect(verdictsOf(tex)).toEqual(['mismatch'])
    expect(readSnippet(tex).claims.map(c => [c.line, c.endLine])).toEqual([[2, 3]])
  })

  it('reads a row starting with a sign after a chain, and the chain goes on from the joined side', () => {
    const tex = `\\begin{align}\n\\mathfrak{S}_{1432} &= x_1^2x_2 + x_1^2x_3 \\\\\n & \\quad + x_1x_2^2 + x_1x_2x_3 + x_2^2x_3 \\\\\n &= ${S1432}\n\\end{align}`
    const r = readSnippet(tex)
    expect(r.claims.map(c => [c.line, c.status])).toEqual([[2, 'ready'], [4, 'ready']])
    expect(verdictsOf(tex)).toEqual(['verified', 'verified'])
  })

  // Regression: `+ {} \\` (an empty group after the sign, to keep it binary) ended the claim at the first row.
  it('continues a row that ends with "+ {}" and flags a wrong term on the next row', () => {
    const row = (rest: string) => `\\begin{align}\ns_{21}(x_1,x_2,x_3) &= x_1^2x_2 + x_1^2x_3 + x_1x_2^2 + {} \\\\\n &\\quad ${rest}\n\\end{align}`
    const tex = row('+ 2x_1x_2x_3 + x_1x_3^2 + x_2^2x_3 + x_2x_3^2')
    expect(readSnippet(tex).claims.map(c => [c.line, c.endLine, c.status])).toEqual([[2, 3, 'ready']])
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf(row('{} + x_1x_2x_3 + x_1x_3^2 + x_2^2x_3 + x_2x_3^2'))).toEqual(['mismatch'])
  })

  it('keeps gather rows that start with a minus sign as equations of their own', () => {
    const tex = '\\begin{gather}\n\\ell(21) = 1 \\\\\n-\\ell(321) = -3\n\\end{gather}'
    expect(readSnippet(tex).claims.map(c => c.line)).toEqual([2, 3])
  })
})

describe('labelled rows', () => {
  it('drops a "n=1\\colon" label in the first cell', () => {
    const tex = '\\begin{align*}\nn=1\\colon & h_1-e_1=0 \\\\\nn=2\\colon & h_2 - e_1h_1 + e_2 = 0\n\\end{align*}'
    const r = readSnippet(tex)
    expect(ready(r).map(c => c.source)).toEqual(['h_1-e_1 = 0', 'h_2 - e_1h_1 + e_2 = 0'])
    expect(r.claims).toHaveLength(2)
    expect(verdictsOf(tex)).toEqual(['verified', 'verified'])
  })

  it('drops (a), (ii) and \\text{(i)} labels', () => {
    const tex = [
      '\\begin{align*}',
      '(a)\\ & \\ell(2143) = 2 \\\\',
      '(ii)\\ & \\ell(321) = 3 \\\\',
      '\\text{(i)} & \\mathfrak{S}_{132} = x_1 + x_2 \\\\',
      '\\text{Case 2:} & \\mathfrak{S}_{213} = x_1',
      '\\end{align*}',
    ].join('\n')
    const r = readSnippet(tex)
    expect(r.claims.map(c => c.source)).toEqual(['\\ell(2143) = 2', '\\ell(321) = 3', '\\mathfrak{S}_{132} = x_1 + x_2', '\\mathfrak{S}_{213} = x_1'])
    expect(verdictsOf(tex)).toEqual(['verified', 'verified', 'verified', 'verified'])
  })

  it('drops a label set off by \\quad instead of &', () => {
    const r = readSnippet('\\[ k=2\\colon\\quad h_2 - e_1h_1 + e_2 = 0 \\]')
    expect(ready(r).map(c => c.source)).toEqual(['h_2 - e_1h_1 + e_2 = 0'])
    expect(r.notRead).toEqual([])
  })

  it('does not take a left side before &= for a label', () => {
    const r = readSnippet('\\begin{align*}\n(x_1 + x_2) &= \\mathfrak{S}_{132}\n\\end{align*}')
    expect(ready(r).map(c => c.source)).toEqual(['(x_1 + x_2) = \\mathfrak{S}_{132}'])
  })

  it('does not take a cycle-like (213) first cell for a label', () => {
    const r = readSnippet('\\begin{align*}\n(213) & s_1 = s_2 s_1\n\\end{align*}')
    expect(ready(r)).toEqual([])
  })

  it('keeps the prose around a labelled row silent', () => {
    const r = readSnippet('For each case we write the row as follows.\n\\begin{align*}\n\\text{(i)} & \\text{nothing to check here}\n\\end{align*}')
    expect(r.claims).toEqual([])
  })
})
