// Where a binding holds (shared/latex/bindings.ts): until the end of its example/theorem/proof/…
// environment, or of its paragraph outside one. Each case tests both directions: the binding is
// used where it holds, and an unbound letter after it is never read as that value.
import { describe, expect, it } from 'vitest'
import { BindingScopes, declaredTheoremNames } from '../../../shared/latex/bindings'
import { readSnippet, ready } from './helpers'

const perm = (...entries: number[]) => ({ kind: 'permutation', perm: { form: 'oneLine', entries } }) as const

/** Sources of the ready claims, and of the not-read math, of a snippet. */
function outcome(tex: string) {
  const r = readSnippet(tex)
  return { ready: ready(r).map(c => c.source), notRead: r.notRead.map(n => n.source), claims: r.claims.length }
}

describe('a binding inside an environment', () => {
  it('holds across paragraphs of its example and ends with it', () => {
    const got = outcome([
      '\\begin{example}', 'Let $w = 2143$.', '', 'Then $\\ell(w) = 2$.', '\\end{example}',
      'In general $\\ell(w) = 5$ fails.',
    ].join('\n'))
    expect(got.ready).toEqual(['\\ell(w) = 2'])
    expect(got.claims).toBe(1)
    expect(got.notRead).toEqual(['\\ell(w) = 5'])
  })

  it('never leaks into the next example', () => {
    const got = outcome([
      '\\begin{example}Let $w = 321$. Then $\\ell(w) = 3$.\\end{example}',
      '\\begin{example}Here $\\ell(w) = 1$ for a transposition $w$.\\end{example}',
    ].join('\n'))
    expect(got.ready).toEqual(['\\ell(w) = 3'])
    expect(got.claims).toBe(1)
  })

  it('works for environments the paper declares with \\newtheorem, starred or not', () => {
    const got = outcome([
      '\\newtheorem{exa}{Example}',
      '\\begin{exa}For $w = 132$, $\\ell(w) = 1$.\\end{exa}',
      'And $\\ell(w) = 1$ again.',
      '\\begin{remark*}Let $w = 231$. Then $\\ell(w) = 2$.\\end{remark*} Now $\\ell(w) = 2$.',
    ].join('\n'))
    expect(got.ready).toEqual(['\\ell(w) = 1', '\\ell(w) = 2'])
    expect(got.claims).toBe(2)
  })

  it('restores the outer binding when the inner environment ends', () => {
    const got = outcome([
      '\\begin{proof}Let $w = 21$.',
      '\\begin{remark}Let $w = 321$. Then $\\ell(w) = 3$.\\end{remark}',
      'So $\\ell(w) = 1$.\\end{proof}',
    ].join('\n'))
    expect(got.ready).toEqual(['\\ell(w) = 3', '\\ell(w) = 1'])
  })
})

describe('a binding outside every environment', () => {
  it('holds to the end of its paragraph', () => {
    const got = outcome('Let $w = 2143$. Then\n$\\ell(w) = 2$ and \\[ \\mathfrak{S}_w = x_1^2 + x_1x_2 + x_1x_3 \\]\nas claimed.')
    expect(got.ready).toEqual(['\\ell(w) = 2', '\\mathfrak{S}_w = x_1^2 + x_1x_2 + x_1x_3'])
  })

  it('ends at a blank line', () => {
    const got = outcome('Let $w = 2143$.\n\nFor every $w$, $\\ell(w) = 7$ is false.')
    expect(got.ready).toEqual([])
    expect(got.claims).toBe(0)
  })

  it('ends at \\par', () => {
    expect(outcome('Let $w = 2143$.\\par Then $\\ell(w) = 2$.').claims).toBe(0)
  })

  it('is not ended by a line holding only a comment', () => {
    expect(outcome('Let $w = 2143$.\n% a note to ourselves\nThen $\\ell(w) = 2$.').ready).toEqual(['\\ell(w) = 2'])
  })

  it('holds inside an example that starts in the same paragraph, and ends at the paragraph after it', () => {
    const got = outcome('Let $w = 21$.\n\\begin{example}Then $\\ell(w) = 1$.\\end{example}\n\nLater $\\ell(w) = 4$.')
    expect(got.ready).toEqual(['\\ell(w) = 1'])
    expect(got.claims).toBe(1)
  })
})

describe('BindingScopes', () => {
  it('undoes bindings in the order scopes close', () => {
    const scopes = new BindingScopes()
    scopes.bind('w', perm(2, 1))
    scopes.openEnvironment('example')
    scopes.bind('w', perm(3, 2, 1))
    scopes.bind('u', perm(1, 3, 2))
    scopes.endParagraph()
    expect(scopes.visible.get('w')).toEqual(perm(3, 2, 1))
    scopes.closeEnvironment('example')
    expect([...scopes.visible]).toEqual([['w', perm(2, 1)]])
    scopes.endParagraph()
    expect(scopes.visible.size).toBe(0)
  })

  it('ignores an \\end without its \\begin, and pairs \\end after a clear', () => {
    const scopes = new BindingScopes()
    scopes.closeEnvironment('proof')
    scopes.openEnvironment('proof')
    scopes.bind('w', perm(2, 1))
    scopes.clear()
    scopes.bind('u', perm(2, 1))
    scopes.closeEnvironment('proof')
    expect(scopes.visible.size).toBe(0)
  })

  it('reads the names that \\newtheorem and \\declaretheorem declare', () => {
    expect(declaredTheoremNames('\\newtheorem{thm}{Theorem}[section] \\newtheorem*{ex}{Example} \\declaretheorem[name=Remark]{rem}')).toEqual(['thm', 'ex', 'rem'])
  })
})
