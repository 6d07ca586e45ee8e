// What is never mathematics: inline code (also under an alias), listings, drawings and layout
// settings yield no claim, no "unsupported" and no "not read" entry, and leave positions intact.
import { describe, expect, it } from 'vitest'
import { maskSource } from '../../../shared/latex/mask'
import { readSnippet, ready } from './helpers'

/** Claims, not-read entries and warnings of a snippet, as short tuples. */
function outcome(tex: string) {
  const r = readSnippet(tex)
  return {
    claims: r.claims.map(c => [c.line, c.source, c.status]),
    notRead: r.notRead.map(n => n.source),
    warnings: r.warnings.map(w => w.message),
  }
}

describe('inline code', () => {
  it('hides \\verb with any delimiter and \\lstinline with delimiters, options or braces', () => {
    const tex = 'A \\verb|\\ell(21) = 5| B \\verb+s_1 = 7+ C \\verb*!x_1 = 2! D \\lstinline[language=C]|S[132] = x1| E \\lstinline{w_0 = {4321}} F $\\ell(21) = 1$'
    expect(outcome(tex)).toEqual({ claims: [[1, '\\ell(21) = 1', 'ready']], notRead: [], warnings: [] })
  })

  it('hides code under a \\let or \\newcommand alias of \\lstinline or \\verb, with bars and with braces', () => {
    const tex = [
      '\\let\\code=\\lstinline',
      '\\let\\vb\\verb',
      '\\newcommand{\\src}{\\lstinline}',
      'See \\code|S[w] = dd(i, S[w*s_i])| and \\code{w_0 = 4321} and \\vb!s_2 = 3! and \\src|x_1 = 0|.',
      'Then $\\mathfrak{S}_{132} = x_1 + x_2$.',
    ].join('\n')
    expect(outcome(tex)).toEqual({ claims: [[5, '\\mathfrak{S}_{132} = x_1 + x_2', 'ready']], notRead: [], warnings: [] })
  })

  it('does not take an alias from a comment, and a command of the same name stays ordinary', () => {
    const tex = '% \\let\\code=\\lstinline\n\\newcommand{\\code}[1]{#1}\n$\\code{\\ell(21)} = 1$'
    // The argument keeps its own place in the file: the claim's source is what the macro wraps.
    expect(outcome(tex).claims).toEqual([[3, '\\ell(21) = 1', 'ready']])
  })

  it('hides \\mintinline{lang}{…} and |…|', () => {
    expect(outcome('\\mintinline{python}{x_1 = 3} \\mintinline{c}|s_1 = 2| $\\ell(21) = 1$').claims).toHaveLength(1)
  })
})

describe('environments that are code or drawings', () => {
  it.each([
    ['lstlisting', '\\begin{lstlisting}[language=Python]\nS[132] = x1 + x2 $\\ell(21) = 4$\n\\end{lstlisting}'],
    ['minted', '\\begin{minted}{python}\n$\\ell(21) = 4$\n\\end{minted}'],
    ['verbatim', '\\begin{verbatim}\n$\\ell(21) = 4$\n\\end{verbatim}'],
    ['Verbatim', '\\begin{Verbatim}[frame=single]\n$\\ell(21) = 4$\n\\end{Verbatim}'],
    ['comment', '\\begin{comment}\n$\\ell(21) = 4$\n\\end{comment}'],
    ['tikzpicture', '\\begin{tikzpicture}\n\\node at (1,2) {$w = 2413$, $\\ell(w) = 3$}; \\draw (0,0) node {$x_1 = 0$};\n\\end{tikzpicture}'],
    ['nested tikzpicture', '\\begin{tikzpicture}\\node {\\begin{tikzpicture}\\end{tikzpicture}}; \\node {$\\ell(21) = 4$};\n\\end{tikzpicture}'],
    ['pgfplots axis', '\\begin{tikzpicture}\\begin{axis}[xlabel={$n$}]\n\\addplot coordinates {(1,2) (2,3)}; \\node {$s_1 = 3$};\n\\end{axis}\\end{tikzpicture}'],
    ['tikz-cd diagram', '\\[\\begin{tikzcd} A \\arrow[r, "\\mathfrak{S}_{21} = x_2"] & B \\end{tikzcd}\\]'],
    ['inline \\tikz', 'A dot \\tikz[baseline] \\draw (0,0) node {$\\ell(21) = 4$};'],
  ])('%s gives no claim, no unsupported and no not-read entry', (_name, body) => {
    expect(outcome(`${body}\nAfter: $\\ell(321) = 3$.`)).toEqual({
      claims: [[body.split('\n').length + 1, '\\ell(321) = 3', 'ready']], notRead: [], warnings: [],
    })
  })

  it('warns once about a drawing never closed and reads nothing after it', () => {
    const r = readSnippet('$\\ell(21) = 1$\n\\begin{tikzpicture}\n\\node {$\\ell(21) = 4$};\n$\\ell(321) = 3$')
    expect(r.claims.map(c => c.line)).toEqual([1])
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'syntax', line: 2, message: expect.stringMatching(/tikzpicture\} is never closed/) })])
  })
})

describe('layout settings', () => {
  it('hides the argument of \\ytableausetup, \\tikzset, \\pgfplotsset and \\tikzstyle', () => {
    const tex = [
      '\\ytableausetup{boxsize=1.1em, aligntableaux=center}',
      '\\tikzset{every node/.style={font=\\small}, x=1cm}',
      '\\pgfplotsset{compat=1.18, width={5cm}}',
      '\\tikzstyle{box}=[draw, minimum size=2]',
      '$\\ell(21) = 1$',
    ].join('\n')
    expect(outcome(tex)).toEqual({ claims: [[5, '\\ell(21) = 1', 'ready']], notRead: [], warnings: [] })
  })

  it('keeps the text after a setting with no argument, and the length of the masked text', () => {
    const src = 'as \\ytableausetup was told, $\\ell(21) = 1$ and \\ytableausetup{} $\\ell(321) = 3$'
    expect(maskSource(src).text).toHaveLength(src.length)
    expect(ready(readSnippet(src)).map(c => c.source)).toEqual(['\\ell(21) = 1', '\\ell(321) = 3'])
  })

  it('lists a tableau drawn with \\ytableaushort or the ytableau environment as not read, with no verdict', () => {
    const r = readSnippet('\\ytableausetup{french}\n$s_{\\ytableaushort{12,3}} = x_1$ and $K_{\\ytableaushort{12}} = 1$\n\\[ \\begin{ytableau} 1 & 2 \\end{ytableau} = x_1 \\]')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => [n.line, n.reason])).toEqual([
      [2, expect.stringMatching(/ytableaushort/)], [2, expect.stringMatching(/ytableaushort/)], [3, expect.stringMatching(/ytableaushort/)],
    ])
  })
})

describe('many aliases', () => {
  // Regression guard: each backslash once searched every alias definition (quadratic in the file).
  it('reads a file with 20,000 alias definitions and 5,000 uses', () => {
    let tex = ''
    for (let i = 0; i < 20_000; i++) tex += `\\let\\c${String.fromCharCode(97 + (i % 26))}=\\lstinline\n`
    for (let i = 0; i < 5_000; i++) tex += `\\ca|x_1 = 2| $\\ell(21) = 1$\n`
    const r = readSnippet(tex)
    expect(r.claims).toHaveLength(5_000)
    expect(r.notRead).toEqual([])
  })
})
