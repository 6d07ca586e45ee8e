// Tags in comments: syntax, attachment to lines, one-claim and lasting conventions, notation.
import { describe, expect, it } from 'vitest'
import { parseTag } from '../../../shared/latex/index'
import { readSnippet } from './helpers'

describe('parseTag', () => {
  it('reads every directive', () => {
    expect(parseTag(' scholium: skip').directives).toEqual([{ type: 'skip' }])
    expect(parseTag('scholium: claim schubert; use xy-plus perm-inverse').directives).toEqual([
      { type: 'claim', kind: 'schubert' },
      { type: 'use', conventions: ['xy-plus', 'perm-inverse'] },
    ])
    expect(parseTag(' Scholium: set shape-columns, beta-plus').directives).toEqual([{ type: 'set', conventions: ['shape-columns', 'beta-plus'] }])
    expect(parseTag(' scholium: \\Sch means schubert').directives).toEqual([{ type: 'means', macro: 'Sch', object: 'schubert' }])
  })

  it('explains what it does not understand', () => {
    expect(parseTag(' scholium: use xy-sideways').errors).toEqual(['unknown convention "xy-sideways"'])
    expect(parseTag(' scholium: claim teapot').errors[0]).toMatch(/unknown claim kind "teapot"/)
    expect(parseTag(' scholium: frobnicate').errors).toEqual(['unknown directive "frobnicate"'])
    expect(parseTag(' scholium: \\X means banana').errors[0]).toMatch(/expects one of: schubert/)
  })
})

describe('tags in a manuscript', () => {
  const tex = [
    /* 1 */ '% scholium: set xy-plus',
    /* 2 */ '$\\ell(21) = 1$ % scholium: skip',
    /* 3 */ '% scholium: use perm-inverse',
    /* 4 */ '',
    /* 5 */ '$\\ell(321) = 3$ and $\\ell(312) = 2$',
    /* 6 */ '$\\ell(132) = 1$',
    /* 7 */ '% scholium: set xy-minus beta-plus',
    /* 8 */ '% scholium: \\Sch means schubert; \\Kost means schur',
    /* 9 */ '\\newcommand{\\Sch}{\\mathfrak{T}}',
    /* 10 */ '$\\Sch_{132} = x_1 + x_2$ and $\\Kost_{21}(x_1,x_2) = x_1^2 x_2 + x_1 x_2^2$',
    /* 11 */ '% scholium: claim',
    /* 12 */ '$a_1 = b_2$',
    /* 13 */ '$\\mathfrak S_{132} \\le x_1 + x_2$ % scholium: claim schubert; frobnicate',
  ].join('\n')
  const r = readSnippet(tex)
  const at = (line: number) => r.claims.filter(c => c.line === line)

  it('skips the claim on the tagged line, keeping its question', () => {
    expect(at(2)).toEqual([expect.objectContaining({ status: 'skipped', conventions: ['xy-plus'], question: expect.any(Object) })])
  })

  it('applies a line-of-its-own tag to the next non-blank line only', () => {
    expect(at(5).map(c => c.conventions)).toEqual([['xy-plus', 'perm-inverse'], ['xy-plus', 'perm-inverse']])
    expect(at(6).map(c => c.conventions)).toEqual([['xy-plus']])
  })

  it('changes lasting conventions from the tag on', () => {
    expect(at(10).map(c => c.conventions)).toEqual([['xy-minus', 'beta-plus'], ['xy-minus', 'beta-plus']])
  })

  it('lets a tag declare what a macro means, overriding its definition', () => {
    expect(at(10).map(c => [c.kind, c.question?.lhs])).toEqual([
      ['schubert', { type: 'schubert', perm: { form: 'oneLine', entries: [1, 3, 2] }, variant: 'single' }],
      ['symmetricFunction', { type: 'symmetric', family: 'schur', index: [2, 1], variableCount: 2 }],
    ])
  })

  it('forces a claim the reader would not report, saying why it cannot be read', () => {
    expect(at(12)).toEqual([expect.objectContaining({ status: 'unsupported', tagged: true, reason: 'tagged as a claim, but unknown symbol a: a letter named or defined here, not an object' })])
    expect(at(13)).toEqual([expect.objectContaining({ status: 'unsupported', kind: 'schubert', reason: 'the relation \\le is not checked; only equalities are' })])
  })

  it('warns about directives it does not understand, with the line', () => {
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'tag', line: 13, message: 'tag not understood: unknown directive "frobnicate"' })])
  })
})
