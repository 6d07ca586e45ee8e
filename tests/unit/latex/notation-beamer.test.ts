// Beamer overlays and colours inside math (shared/latex/math-tree.ts, dropDecorations): the
// decoration goes, the content stays. Expected products: the Pieri rule (common practice), checked
// with Debian's lrcalc: `lrcalc mult 1 - 1` gives (2) + (1,1), `lrcalc mult 2 - 1` gives (3) + (2,1);
// c^{321}_{21,21} = 2 (`lrcalc lrcoef 3 2 1 - 2 1 - 2 1`); c^{42}_{31,11} = 1 (`lrcalc lrcoef 4 2 - 3 1 - 1 1`).
import { describe, expect, it } from 'vitest'
import { readSnippet } from './helpers'
import { verdictsOf } from './verdict-helpers'

describe('beamer decorations inside math', () => {
  it.each([
    ['$s_{1}\\, s_{1} = s_{2} + \\alert{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} + \\alert<2>{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} + \\only<2->{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} + \\uncover<3>{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} + \\visible<1,3>{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} \\pause + s_{11}$'],
    ['$s_{1}\\, s_{1} = s_{2} \\onslide<2-> + s_{11}$'],
    ['$s_{1}\\, s_{1} = s_{2} + \\textcolor{red}{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} + \\textcolor<2>{blue}{s_{11}}$'],
    ['$s_{1}\\, s_{1} = s_{2} + {\\color{red} s_{11}}$'],
  ])('keeps the content of %s, verifies it and flags the same claim with a term dropped', (tex) => {
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf(tex.replace('s_{2} ', 's_{3} '))).toEqual(['mismatch'])
  })

  it('reads \\alert on a bare value: c^{321}_{21,21} = \\alert{2} holds, = \\alert<4>{1} does not', () => {
    expect(verdictsOf('\\[ c^{321}_{21,21} = \\alert{2} \\]')).toEqual(['verified'])
    expect(verdictsOf('\\[ c^{321}_{21,21} = \\alert<4>{1} \\]')).toEqual(['mismatch'])
    expect(verdictsOf('$c^{42}_{31,11} = \\alert<4>{2}$')).toEqual(['mismatch'])
  })

  it('keeps the command in the claim source, so the mark sits on what the paper wrote', () => {
    expect(readSnippet('\\[ c^{321}_{21,21} = \\alert{2} \\]').claims[0]!.source).toBe('c^{321}_{21,21} = \\alert{2}')
  })

  it('leaves \\alt<2>{a}{b} (two alternatives) and a decoration without its argument unread', () => {
    for (const tex of ['$s_{1}\\, s_{1} = s_{2} + \\alt<2>{s_{11}}{s_{2}}$', '$s_{1}\\, s_{1} = s_{2} + \\alert$', '$s_{1}s_{1} = s_{2} + \\textcolor{red}$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts, tex).not.toContain('verified')
      expect(verdicts, tex).not.toContain('mismatch')
    }
  })

  it('does not take an inequality for an overlay', () => {
    expect(verdictsOf('$\\ell(w) < 2 > 1$')).not.toContain('mismatch')
  })
})

describe('overlays that show a claim again', () => {
  // Monk's rule (common practice): S_213 S_213 = S_312, S_132 S_213 = S_231 + S_312.
  const slide = [
    '\\begin{frame}',
    '\\only<1>{\\[ \\mathfrak{S}_{213}\\,\\mathfrak{S}_{213} = \\mathfrak{S}_{312} \\]}',
    '\\only<2>{\\[ \\mathfrak{S}_{213}\\,\\mathfrak{S}_{213} = \\mathfrak{S}_{312} \\]}',
    '\\uncover<3->{\\[ \\mathfrak{S}_{132}\\,\\mathfrak{S}_{213} = \\mathfrak{S}_{231} + \\mathfrak{S}_{312} \\]}',
    '\\end{frame}',
  ].join('\n')

  it('reports a claim an overlay repeats once, at its first line', () => {
    expect(readSnippet(slide).claims.map(c => [c.line, c.status])).toEqual([[2, 'ready'], [4, 'ready']])
  })

  it('keeps a repeated claim that is not on an overlay line, and an overlay claim that differs', () => {
    const twice = '$s_{1}\\, s_{1} = s_{2} + s_{11}$\n\n$s_{1}\\, s_{1} = s_{2} + s_{11}$'
    expect(readSnippet(twice).claims).toHaveLength(2)
    const changed = slide.replace('\\only<2>{\\[ \\mathfrak{S}_{213}\\,\\mathfrak{S}_{213} = \\mathfrak{S}_{312}', '\\only<2>{\\[ \\mathfrak{S}_{213}\\,\\mathfrak{S}_{213} = \\mathfrak{S}_{231}')
    expect(verdictsOf(changed)).toEqual(['verified', 'mismatch', 'verified'])
  })
})
