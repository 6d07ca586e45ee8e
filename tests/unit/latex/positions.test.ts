// Positions checked against an independent parser: unified-latex (@unified-latex/unified-latex-util-parse)
// reports line and column for every math node. Our own scanner must place each piece of math
// on the same line and column, in original (unmasked, unexpanded) coordinates.
import { describe, expect, it } from 'vitest'
import { parse } from '@unified-latex/unified-latex-util-parse'
import { visit } from '@unified-latex/unified-latex-util-visit'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { readManuscript } from '../../../shared/latex/index'
import { FIXTURES, readSnippet } from './helpers'

/** Line and column where each inline math region starts, according to unified-latex. */
function inlineMathStarts(tex: string): { line: number, column: number }[] {
  const out: { line: number, column: number }[] = []
  visit(parse(tex), (node) => {
    if (node.type === 'inlinemath' && node.position) out.push({ line: node.position.start.line, column: node.position.start.column })
  })
  return out
}

describe('positions agree with unified-latex', () => {
  it('places every inline claim where unified-latex puts its math', () => {
    const tex = [
      'Intro text with $\\ell(21) = 1$ and',
      '  then   $\\ell(321) = 3$, $\\ell(312) = 2$.',
      '% a comment with $\\ell(1) = 0$',
      '\\emph{Emphasis} $\\mathfrak S_{132} = x_1 + x_2$',
      '',
      'Unicode: café, naïve, ∂ — $\\ell(2143) = 2$',
    ].join('\n')
    const ours = readSnippet(tex).claims.map(c => ({ line: c.line, column: c.column - 1 }))
    // unified-latex gives the position of the '$'; our column is that of the claim's first character.
    expect(ours).toEqual(inlineMathStarts(tex))
  })

  it('keeps every position right after inline code, listings, drawings and layout settings', () => {
    const tex = [
      '\\ytableausetup{boxsize=1.2em, aligntableaux=center} \\tikzset{dot/.style={circle}} Then $\\ell(21) = 1$.',
      'Code: \\verb|$\\ell(1) = 5$| then $\\ell(321) = 3$, \\lstinline{a = {b}} and $\\ell(312) = 2$, \\verb+x+ $\\ell(2143) = 2$.',
      '\\begin{tikzpicture}[scale=0.5]',
      '  \\node at (0,0) {$\\ell(21) = 7$}; \\draw (0,0) -- (1,1);',
      '\\end{tikzpicture} After the drawing $\\ell(231) = 2$ and \\pgfplotsset{width=5cm} $\\ell(132) = 1$.',
      '\\begin{lstlisting}',
      'ell(21) = 9 $x$',
      '\\end{lstlisting}',
      '\\begin{comment} $\\ell(21) = 4$ \\end{comment} Last: $\\ell(4321) = 6$',
    ].join('\n')
    const expected: { line: number, column: number }[] = []
    visit(parse(tex), (node, info) => {
      const inDrawing = info.parents.some(p => p.type === 'environment' && (p as { env?: string }).env === 'tikzpicture')
      if (node.type === 'inlinemath' && node.position && !inDrawing) expected.push({ line: node.position.start.line, column: node.position.start.column })
    })
    const read = readSnippet(tex)
    // unified-latex reads \verb, \lstinline, lstlisting and comment as code, as we do; inside tikzpicture it still finds math, which we hide.
    expect(read.claims.map(c => ({ line: c.line, column: c.column - 1 }))).toEqual(expected)
    expect(read.claims.map(c => c.status)).toEqual(Array(7).fill('ready'))
    expect(read.notRead).toEqual([])
    expect(read.warnings).toEqual([])
  })

  it('places align rows on the lines unified-latex reports for them', () => {
    const tex = readFileSync(join(FIXTURES, 'workshop-notes/sections/examples.tex'), 'utf8')
    const rowLines: number[] = []
    visit(parse(tex), (node, info) => {
      const envName = (p: { env?: unknown }) => (typeof p.env === 'string' ? p.env : (p.env as { content?: string } | undefined)?.content)
      const inAlign = info.parents.some(p => (p.type === 'environment' || p.type === 'mathenv') && envName(p) === 'align')
      if (inAlign && node.type === 'string' && node.content === '=' && node.position) rowLines.push(node.position.start.line)
    })
    const files: Record<string, string> = { 'examples.tex': tex }
    // Read alone, the file lacks the main file's \Sc: that row is listed as not read, at its own line.
    const read = readManuscript({ files })
    const inAlign = (line: number) => line >= 3 && line <= 6
    const ours = [
      ...read.claims.filter(c => c.display && inAlign(c.line)).map(c => c.line),
      ...read.notRead.filter(n => inAlign(n.line)).map(n => n.line),
    ].sort((a, b) => a - b)
    expect(rowLines).toEqual([4, 5])
    expect(ours).toEqual(rowLines)
  })
})
