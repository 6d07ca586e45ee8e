// Stage "table cells" (shared/latex/tables.ts): grids of text tables and display arrays, before any
// object is read; and what happens to a table that cannot be taken whole.
import { describe, expect, it } from 'vitest'
import { arrayTableGrid, textTableGrid, type TableGrid } from '../../../shared/latex/tables'
import { buildMathTree, renderNodes, type MathNode } from '../../../shared/latex/math-tree'
import { lineStarts } from '../../../shared/latex/decode'
import { tokenize } from '../../../shared/latex/tokens'
import type { SourceFile } from '../../../shared/latex/regions'
import { readSnippet, ready } from './helpers'

const fileOf = (text: string): SourceFile => ({ path: 'a.tex', original: text, masked: text, starts: lineStarts(text), lineTags: new Map() })

/** Each row as its cells: the cell's math, `…` for a filled cell that is not math, '' for an empty one. */
const shape = (grid: TableGrid) => grid.rows.map(row => row.cells.map(c => (c.nodes ? renderNodes(c.nodes) : c.filled ? '…' : '')))

describe('textTableGrid', () => {
  const grid = (body: string) => textTableGrid(fileOf(body), tokenize(body), 0, body.length)

  it('cuts rows at \\\\ and cells at &, dropping rules', () => {
    expect(shape(grid('$w$ & $\\mathfrak{S}_w$ \\\\ \\hline\n$132$ & $x_1+x_2$ \\\\[3pt] \\midrule\n213 & $x_1$'))).toEqual([
      ['w', '\\mathfrak{S}_w'], ['132', 'x_1+x_2'], ['213', 'x_1'],
    ])
  })

  it('does not cut at & or \\\\ inside math, braces or a nested environment', () => {
    const body = '$\\begin{matrix} a & b \\\\ c & d \\end{matrix}$ & \\parbox{2cm}{one \\\\ two} \\\\ $1$ & $2$'
    expect(grid(body).rows.map(row => row.cells.length)).toEqual([2, 2])
  })

  it('keeps prose cells as not math, and keeps their inline math as regions', () => {
    const rows = grid('$w$ & the value $\\ell(w)$ here').rows
    expect(rows[0]!.cells[1]!.nodes).toBeUndefined()
    expect(rows[0]!.cells[1]!.regions).toHaveLength(1)
  })

  it('reads the content of \\multicolumn and skips a caption row', () => {
    expect(shape(grid('\\caption{Values} \\\\ \\multicolumn{1}{c}{$w$} & $\\ell(w)$'))).toEqual([['w', '\\ell(w)']])
  })

  it('reads a cell through its styling', () => {
    expect(shape(grid('\\textbf{$w$} & \\bfseries $\\ell(w)$ & \\emph{\\textbf{213}} & \\textbf{a} $x$'))).toEqual([['w', '\\ell(w)', '213', '…']])
  })

  it('places each cell at its math in the file', () => {
    const body = '$w$ & $\\ell(w)$ \\\\\n  $21$ & $1$'
    const cell = grid(body).rows[1]!.cells[0]!
    expect(body.slice(cell.pos, cell.end)).toBe('$21$')
  })
})

describe('arrayTableGrid', () => {
  it('cuts an array node into rows and cells', () => {
    const tree = buildMathTree(tokenize('\\begin{array}{c|c} w & \\ell(w) \\\\ \\hline 21 & 1 \\\\ 321 & 3 \\end{array}'))
    const env = tree[0] as MathNode & { k: 'env' }
    expect(shape(arrayTableGrid(fileOf(''), env))).toEqual([['w', '\\ell(w)'], ['21', '1'], ['321', '3']])
  })
})

describe('a table that cannot be taken whole', () => {
  it('is read as ordinary text when it is never closed (regression: its cells were lost)', () => {
    const r = readSnippet('\\begin{tabular}{cc}\n$w$ & $\\ell(21) = 1$ \\\\\nno end here')
    expect(ready(r).map(c => c.source)).toEqual(['\\ell(21) = 1'])
  })

  it('is read as ordinary text when it comes out of a macro', () => {
    const r = readSnippet('\\newcommand{\\tab}{\\begin{tabular}{c} $\\ell(21) = 1$ \\end{tabular}}\n\\tab')
    expect(ready(r).map(c => c.source)).toHaveLength(1)
  })
})

describe('long tables', () => {
  it('reads a longtable longer than one piece of math may be (regression: 4,000 rows fell back to no claims)', () => {
    const rows = Array.from({ length: 4000 }, () => '$213$ & $x_1$ \\\\').join('\n')
    const r = readSnippet(`\\begin{longtable}{cc}\n$w$ & $\\mathfrak{S}_w$ \\\\\n${rows}\n\\end{longtable}`)
    expect(r.claims).toHaveLength(4000)
    expect(r.claims[3999]!.line).toBe(4002)
  })
})
