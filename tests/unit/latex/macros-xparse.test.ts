// xparse argument types beyond m, o and O: s, t, r, R, d, D, e, E, v and b (environments), with
// \IfBooleanTF and \IfNoValueTF decided exactly. What cannot be expanded exactly leaves the use
// unread, so its math is listed as not read instead of being guessed. Every case is invented.
import { describe, expect, it } from 'vitest'
import { parseArgumentSpec } from '../../../shared/latex/macros'
import { tokenize } from '../../../shared/latex/tokens'
import { checkManuscript } from '../../../shared/check'
import { oneLine, readSnippet, ready } from './helpers'

const schubert = (...entries: number[]) => ({ type: 'schubert', perm: oneLine(...entries), variant: 'single' })
const grothendieck = (...entries: number[]) => ({ type: 'grothendieck', perm: oneLine(...entries), variant: 'single' })
const lhsOf = (tex: string) => ready(readSnippet(tex)).map(c => c.question!.lhs)

describe('s and t: a star or a chosen token, tested with \\IfBooleanTF', () => {
  const star = '\\NewDocumentCommand{\\Pol}{s m}{\\IfBooleanTF{#1}{\\mathfrak{G}_{#2}}{\\mathfrak{S}_{#2}}}\n'
  it('takes the star branch with *, the other without', () => {
    expect(lhsOf(`${star}$\\Pol*{132} = x_1$ and $\\Pol{213} = x_1$`)).toEqual([grothendieck(1, 3, 2), schubert(2, 1, 3)])
  })
  it('reads t<token> and the T and F forms', () => {
    const tex = '\\NewDocumentCommand{\\Pol}{t+ m}{\\IfBooleanT{#1}{\\mathfrak{G}}\\IfBooleanF{#1}{\\mathfrak{S}}_{#2}}\n$\\Pol+{213} = x_1$ and $\\Pol{132} = x_1 + x_2$'
    expect(lhsOf(tex)).toEqual([grothendieck(2, 1, 3), schubert(1, 3, 2)])
  })
  it('leaves \\IfBooleanTF on anything but a boolean unread', () => {
    const r = readSnippet('\\NewDocumentCommand{\\Pol}{m}{\\IfBooleanTF{#1}{\\mathfrak{G}_{213}}{\\mathfrak{S}_{213}}}\n$\\Pol{x} = x_1$')
    expect(r.claims).toEqual([])
    expect(r.notRead).toHaveLength(1)
  })
})

describe('r, R, d, D: delimited arguments', () => {
  it('reads r() as a required argument between parentheses', () => {
    expect(lhsOf('\\NewDocumentCommand{\\Sr}{r()}{\\mathfrak{S}_{#1}}\n$\\Sr(213) = x_1$')).toEqual([schubert(2, 1, 3)])
  })
  it('leaves a use without the r delimiter unread: LaTeX would stop there', () => {
    const r = readSnippet('\\NewDocumentCommand{\\Sr}{R(){213}}{\\mathfrak{S}_{#1}}\n$\\Sr = x_1$')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.reason)).toEqual([expect.stringMatching(/\\Sr takes arguments the reader does not follow/)])
  })
  it('reads d<> with \\IfNoValueTF, and D<>{default}', () => {
    const tex = [
      '\\NewDocumentCommand{\\Sd}{d<> m}{\\IfNoValueTF{#1}{\\mathfrak{S}_{#2}}{\\mathfrak{G}_{#2}}}',
      '\\NewDocumentCommand{\\SD}{D<>{132} m}{\\mathfrak{S}_{#1}#2}',
      '$\\Sd<b>{213} = x_1$, $\\Sd{213} = x_1$, $\\SD{} = x_1 + x_2$, $\\SD<213>{} = x_1$',
    ].join('\n')
    expect(lhsOf(tex)).toEqual([grothendieck(2, 1, 3), schubert(2, 1, 3), schubert(1, 3, 2), schubert(2, 1, 3)])
  })
  it('keeps nested delimiters whole: d() around (1,3,2)', () => {
    expect(lhsOf('\\NewDocumentCommand{\\Sp}{d()}{\\mathfrak{S}_{#1}}\n$\\Sp((1,3,2)) = x_1 + x_2$')).toEqual([schubert(1, 3, 2)])
  })
  it('an absent d argument used as a value is -NoValue-: not read', () => {
    const r = readSnippet('\\NewDocumentCommand{\\Sp}{d()}{\\mathfrak{S}_{#1}}\n$\\Sp = x_1$')
    expect(r.claims).toEqual([])
    expect(r.notRead).toHaveLength(1)
  })
})

describe('e and E: embellishments', () => {
  it('reads _ and ^ in either order, one argument each', () => {
    const tex = '\\NewDocumentCommand{\\Pol}{e{_^}}{\\IfNoValueTF{#2}{\\mathfrak{S}_{#1}}{\\mathfrak{G}_{#1}}}\n$\\Pol_{213} = x_1$ and $\\Pol^{b}_{132} = x_1 + x_2$'
    expect(lhsOf(tex)).toEqual([schubert(2, 1, 3), grothendieck(1, 3, 2)])
  })
  it('uses the E default for an embellishment that is absent', () => {
    expect(lhsOf('\\NewDocumentCommand{\\Pol}{E{_}{{132}}}{\\mathfrak{S}_{#1}}\n$\\Pol = x_1 + x_2$ and $\\Pol_{213} = x_1$')).toEqual([schubert(1, 3, 2), schubert(2, 1, 3)])
  })
})

describe('v: verbatim contents are code, never math', () => {
  it('swallows the verbatim argument, with any delimiter or braces, and keeps reading after it', () => {
    const tex = '\\NewDocumentCommand{\\code}{v}{\\texttt{#1}}\nRun \\code|$\\mathfrak{S}_{21} = 1$| and \\code{$e_2 = 0$}, then $\\mathfrak{S}_{213} = x_1$.'
    const r = readSnippet(tex)
    expect(r.claims.map(c => c.source)).toEqual(['\\mathfrak{S}_{213} = x_1'])
    expect(r.notRead).toEqual([])
  })
  it('math that holds a verbatim argument is not read', () => {
    const r = readSnippet('\\NewDocumentCommand{\\code}{v}{#1}\n$\\code|213| = x_1$')
    expect(r.claims).toEqual([])
    expect(r.notRead).toHaveLength(1)
  })
})

describe('b: the body of an environment', () => {
  it('hands the body to the begin code and then runs the end code, with the arguments', () => {
    const tex = '\\NewDocumentEnvironment{claimbox}{m b}{\\[ #2 #1 \\]}{}\n\\begin{claimbox}{= x_1}\\mathfrak{S}_{213}\\end{claimbox}\nand $\\mathfrak{S}_{132} = x_1 + x_2$.'
    expect(lhsOf(tex)).toEqual([schubert(2, 1, 3), schubert(1, 3, 2)])
  })
  it('keeps a nested environment of the same name inside the body', () => {
    const tex = '\\NewDocumentEnvironment{plus}{b}{#1 + x_2}{}\n\\[ \\begin{plus}\\begin{plus}x_1\\end{plus}\\end{plus} = \\mathfrak{S}_{132} + x_2 \\]'
    // x_1 + x_2 + x_2 = \mathfrak{S}_{132} + x_2 holds only if the inner environment is expanded inside the outer body.
    expect(checkManuscript({ files: { 'snippet.tex': tex } }).claims.map(c => c.verdict)).toEqual(['verified'])
  })
  it('accepts b only as an environment\'s last argument', () => {
    expect(parseArgumentSpec(tokenize('b m'), { environment: true })).toEqual({ unread: expect.stringMatching(/"b"/) })
    expect(parseArgumentSpec(tokenize('m b'))).toEqual({ unread: expect.stringMatching(/"b"/) })
  })
})

describe('argument specifications', () => {
  it('parses every type the reader follows', () => {
    expect(parseArgumentSpec(tokenize('s t+ r() R<>{1} d[] D(){2}'))).toEqual({
      args: [
        { kind: 'boolean', token: '*' }, { kind: 'boolean', token: '+' },
        { kind: 'required', open: '(', close: ')' }, { kind: 'required', open: '<', close: '>' },
        { kind: 'optional', open: '[', close: ']' }, { kind: 'optional', open: '(', close: ')', default: [expect.objectContaining({ v: '2' })] },
      ],
    })
    expect(parseArgumentSpec(tokenize('e{_^} E{^}{{3}} v !o +m'))).toEqual({
      args: [
        { kind: 'embellishments', tokens: ['_', '^'], defaults: [undefined, undefined] },
        { kind: 'embellishments', tokens: ['^'], defaults: [[expect.objectContaining({ v: '3' })]] },
        { kind: 'verbatim' }, { kind: 'optional', noSpace: true }, { kind: 'mandatory' },
      ],
    })
  })
  it('refuses more than nine parameters, counting one per embellishment', () => {
    expect(parseArgumentSpec(tokenize('m m m m m m m e{abc}'))).toEqual({ unread: 'more than nine arguments' })
  })
})
