// Tables and arrays (shared/latex/tables.ts): rows of tabular, longtable and array read as claims
// when the header names an object; multiplication tables; arrays with & = &; determinants.
// Expected values, each from outside our code:
// - Schubert polynomials: divided differences of x_1^3x_2^2x_3, computed with Debian's python3-sympy
//   (/usr/bin/python3): S_132 = x_1+x_2, S_213 = x_1, S_231 = x_1x_2, S_312 = x_1^2, S_1342 = x_1x_2+x_1x_3+x_2x_3,
//   S_2143 = x_1^2+x_1x_2+x_1x_3, S_3412 = x_1^2x_2^2;
// - #PD(w) = S_w(1,…,1) (common practice), so #PD(2143) = 3, #PD(1342) = 3, #PD(3412) = 1;
// - Schur polynomials in two variables: s_1 = x_1+x_2, s_2 = x_1^2+x_1x_2+x_2^2, s_11 = x_1x_2, s_21 = x_1^2x_2+x_1x_2^2 (common practice);
// - Pieri products s_1s_1 = s_2+s_11, s_1s_2 = s_3+s_21, s_2s_2 = s_4+s_31+s_22: Debian's `lrcalc mult 1 - 1`, `lrcalc mult 1 - 2`, `lrcalc mult 2 - 2`;
// - Jacobi–Trudi: s_21 = det(h_2 h_3; h_0 h_1), s_321 = det(h_3 h_4 h_5; h_1 h_2 h_3; 0 1 h_1) (Macdonald, Symmetric
//   Functions and Hall Polynomials, I.3 (3.4), from memory of the statement, entries worked out by hand).
import { describe, expect, it } from 'vitest'
import { readSnippet, ready } from './helpers'
import { verdictsOf } from './verdict-helpers'
import { checkManuscript } from '../../../shared/check/index'

/** Line, verdict and source of every claim, end to end. */
function checked(tex: string) {
  return checkManuscript({ files: { 'snippet.tex': tex } }).claims.map(c => [c.line, c.verdict, c.source])
}

describe('index tables in tabular', () => {
  const table = [
    '\\begin{tabular}{c|l}',
    '$w$ & $\\mathfrak{S}_w$ \\\\ \\hline',
    '$132$ & $x_1 + x_2$ \\\\',
    '$2143$ & $x_1^2 + x_1x_2 + x_1x_3$ \\\\',
    '$3412$ & $x_1^2x_2^2 + x_1x_2$ \\\\',
    '\\end{tabular}',
  ].join('\n')

  it('reads each row as a claim at its own line, with the row as its source', () => {
    expect(checked(table)).toEqual([
      [3, 'verified', '$132$ & $x_1 + x_2$'],
      [4, 'verified', '$2143$ & $x_1^2 + x_1x_2 + x_1x_3$'],
      [5, 'mismatch', '$3412$ & $x_1^2x_2^2 + x_1x_2$'],
    ])
  })

  it('records the row index as the binding the claim used, and that binding ends with the row', () => {
    const r = readSnippet(table + '\nAfter the table, $\\ell(w) = 2$.')
    expect(r.claims.map(c => c.context)).toEqual([
      { w: { kind: 'permutation', perm: { form: 'oneLine', entries: [1, 3, 2] } } },
      { w: { kind: 'permutation', perm: { form: 'oneLine', entries: [2, 1, 4, 3] } } },
      { w: { kind: 'permutation', perm: { form: 'oneLine', entries: [3, 4, 1, 2] } } },
    ])
  })

  it('reads a partition-indexed table with variables in the header', () => {
    const tex = [
      '\\begin{tabular}{c|c}',
      '$\\lambda$ & $s_\\lambda(x_1,x_2)$ \\\\ \\hline',
      '$(1)$ & $x_1 + x_2$ \\\\',
      '$(2)$ & $x_1^2 + x_1x_2 + x_2^2$ \\\\',
      '$(1,1)$ & $x_1x_2$ \\\\',
      '$(2,1)$ & $x_1^2x_2 + x_1x_2^2 + x_1x_2$ \\\\',
      '\\end{tabular}',
    ].join('\n')
    expect(checked(tex).map(([line, verdict]) => [line, verdict])).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified'], [6, 'mismatch']])
  })

  it('reads counts, several value columns, and indices written as bare text', () => {
    const tex = [
      '\\begin{tabular}{ccc}',
      '$w$ & $\\#\\mathrm{PD}(w)$ & $\\ell(w)$ \\\\',
      '2143 & $3$ & $2$ \\\\',
      '1342 & $3$ & $2$ \\\\',
      '3412 & $2$ & $4$',
      '\\end{tabular}',
    ].join('\n')
    expect(checked(tex).map(([line, verdict]) => [line, verdict])).toEqual([
      [3, 'verified'], [3, 'verified'], [4, 'verified'], [4, 'verified'], [5, 'mismatch'], [5, 'verified'],
    ])
  })

  it('reads the header through the paper\'s macros', () => {
    const tex = [
      '\\newcommand{\\Sch}[1]{\\mathfrak{S}_{#1}}',
      '\\newcommand{\\perm}{w}',
      '\\begin{tabular}{cc}',
      '$\\perm$ & $\\Sch{\\perm}$ \\\\',
      '$231$ & $x_1x_2$ \\\\',
      '$312$ & $x_1^2$',
      '\\end{tabular}',
    ].join('\n')
    expect(checked(tex).map(([line, verdict]) => [line, verdict])).toEqual([[5, 'verified'], [6, 'verified']])
  })

  it('reads a longtable with rules, a caption and a repeated head', () => {
    const tex = [
      '\\begin{longtable}{cl}',
      '\\caption{Some Schubert polynomials} \\\\',
      '\\toprule',
      '$w$ & $\\mathfrak{S}_w$ \\\\ \\midrule \\endfirsthead',
      '$w$ & $\\mathfrak{S}_w$ \\\\ \\midrule \\endhead',
      '$213$ & $x_1$ \\\\[2pt]',
      '\\cmidrule(lr){1-2}',
      '$1342$ & $x_1x_2 + x_1x_3 + x_2x_3$ \\\\*',
      '\\bottomrule',
      '\\end{longtable}',
    ].join('\n')
    expect(checked(tex).map(([line, verdict]) => [line, verdict])).toEqual([[6, 'verified'], [8, 'verified']])
    expect(readSnippet(tex).notRead).toEqual([])
  })

  it('lists a row whose index cannot be read as not read, and reads the others', () => {
    const tex = '\\begin{tabular}{cc}\n$w$ & $\\mathfrak{S}_w$ \\\\\n$\\sigma$ & $x_1$ \\\\\n$213$ & $x_1$\n\\end{tabular}'
    const r = readSnippet(tex)
    expect(r.claims.map(c => c.line)).toEqual([4])
    expect(r.notRead.map(n => [n.line, n.reason])).toEqual([[3, 'a table row whose index could not be read']])
  })

  it('still reads a cell that holds an equation of its own', () => {
    const tex = '\\begin{tabular}{cc}\n$w$ & remark \\\\\n$21$ & $\\ell(21) = 1$\n\\end{tabular}'
    expect(ready(readSnippet(tex)).map(c => c.source)).toEqual(['\\ell(21) = 1'])
  })
})

describe('tables that must stay silent', () => {
  const silent = (tex: string) => {
    const r = readSnippet(tex)
    return { claims: r.claims.map(c => [c.status, c.source]), notRead: r.notRead.map(n => n.reason) }
  }

  it('makes no claim from a header in words, and lists the table as not read', () => {
    const tex = '\\begin{tabular}{cc}\nPermutation & Polynomial \\\\\n$132$ & $x_1+x_2$ \\\\\n$213$ & $x_1$\n\\end{tabular}'
    expect(silent(tex)).toEqual({ claims: [], notRead: ['a table whose header names no object Scholium knows'] })
  })

  it('makes no claim from a header naming an object Scholium does not know', () => {
    const tex = '\\begin{tabular}{cc}\n$w$ & $\\mathrm{des}(w)$ \\\\\n$132$ & $1$ \\\\\n$321$ & $2$\n\\end{tabular}'
    expect(silent(tex)).toEqual({ claims: [], notRead: ['a table whose header names no object Scholium knows'] })
  })

  it('makes no claim from a table of numbers indexed by n', () => {
    const tex = '\\begin{tabular}{cc}\n$n$ & $n!$ \\\\\n$3$ & $6$ \\\\\n$4$ & $24$\n\\end{tabular}'
    expect(silent(tex).claims).toEqual([])
  })

  it('keeps a table of prose silent and out of the not-read list', () => {
    const tex = '\\begin{tabular}{ll}\nSection & Topic \\\\ \\hline\n2 & Divided differences \\\\\n3 & Pipe dreams\n\\end{tabular}'
    expect(silent(tex)).toEqual({ claims: [], notRead: [] })
  })

  it('keeps an unrelated array silent: no verdict, no unsupported', () => {
    const tex = 'The two-line notation \\[ \\begin{array}{ccc} 1 & 2 & 3 \\\\ 2 & 3 & 1 \\end{array} \\] of $w$.'
    expect(silent(tex).claims).toEqual([])
    expect(verdictsOf(tex)).toEqual([])
  })

  it('does not read a header whose value does not mention the index', () => {
    const tex = '\\begin{tabular}{cc}\n$w$ & $\\mathfrak{S}_{132}$ \\\\\n$132$ & $x_1+x_2$ \\\\\n$213$ & $x_1$\n\\end{tabular}'
    expect(silent(tex).claims).toEqual([])
  })
})

describe('arrays in displays', () => {
  it('reads an array with a header row like a table', () => {
    const tex = '\\[\n\\begin{array}{c|c}\nw & \\mathfrak{S}_w \\\\ \\hline\n231 & x_1x_2 \\\\\n312 & x_1^2 + x_2\n\\end{array}\n\\]'
    expect(checked(tex).map(([line, verdict]) => [line, verdict])).toEqual([[4, 'verified'], [5, 'mismatch']])
  })

  it('reads rows of an array with & = & as equations', () => {
    const tex = '\\[\n\\begin{array}{rcl}\n\\mathfrak{S}_{231} & = & x_1x_2 \\\\\n\\mathfrak{S}_{312} & = & x_1^2 \\\\\n\\mathfrak{S}_{1342} & = & x_1x_2 + x_1x_3 \\\\\n & & + x_2x_3\n\\end{array}\n\\]'
    expect(checked(tex).map(([line, verdict]) => [line, verdict])).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified']])
  })

  it('reads a relation chain in an array with &=&', () => {
    const tex = '\\[ \\begin{array}{rcl} \\ell(321) &=& 3 \\\\ &=& 1 + 2 \\end{array} \\]'
    expect(readSnippet(tex).claims.map(c => [c.source, c.status])).toEqual([['\\ell(321) = 3', 'ready'], ['3 = 1 + 2', 'ready']])
  })

  it('reads arrays of equations with one column or with & = in the second', () => {
    expect(verdictsOf('\\[ \\begin{array}{c} \\mathfrak{S}_{132} = x_1 + x_2 \\\\ \\mathfrak{S}_{213} = x_1 + x_2 \\end{array} \\]')).toEqual(['verified', 'mismatch'])
    const tex = '\\[ \\begin{array}{rl} \\mathfrak{S}_{1342} & = x_1x_2 + x_1x_3 \\\\ & \\quad + x_2x_3 \\end{array} \\]'
    expect(verdictsOf(tex)).toEqual(['verified'])
  })

  it('does not run together cells that are equations of their own', () => {
    const tex = '\\[ \\begin{array}{cc} w = 312 & \\mathfrak{S}_w = x_1^2 \\\\ w = 213 & \\mathfrak{S}_w = x_2 \\end{array} \\]'
    expect(verdictsOf(tex)).toEqual([])
  })

  it('reads aligned with &=&', () => {
    const tex = '\\[ \\begin{aligned} \\mathfrak{S}_{213} &=& x_1 \\\\ \\mathfrak{S}_{132} &=& x_1 + x_2 \\end{aligned} \\]'
    expect(verdictsOf(tex)).toEqual(['verified', 'verified'])
  })
})

describe('multiplication tables', () => {
  it('reads each cell as row head times column head', () => {
    const tex = [
      '\\begin{tabular}{c|cc}',
      ' & $s_1$ & $s_2$ \\\\ \\hline',
      '$s_1$ & $s_2 + s_{11}$ & $s_3 + s_{21}$ \\\\',
      '$s_2$ & $s_3 + s_{21}$ & $s_4 + s_{31}$',
      '\\end{tabular}',
    ].join('\n')
    expect(checked(tex)).toEqual([
      [3, 'verified', 's_1 \\cdot s_1 = s_2 + s_{11}'],
      [3, 'verified', 's_1 \\cdot s_2 = s_3 + s_{21}'],
      [4, 'verified', 's_2 \\cdot s_1 = s_3 + s_{21}'],
      [4, 'mismatch', 's_2 \\cdot s_2 = s_4 + s_{31}'],
    ])
  })

  it('reads a multiplication table of Schubert classes in an array with a corner symbol', () => {
    const tex = '\\[ \\begin{array}{c|cc} \\times & \\mathfrak{S}_{213} & \\mathfrak{S}_{132} \\\\ \\hline \\mathfrak{S}_{213} & \\mathfrak{S}_{312} & \\mathfrak{S}_{231} + \\mathfrak{S}_{312} \\end{array} \\]'
    expect(verdictsOf(tex)).toEqual(['verified', 'verified'])
  })

  it('does not read a group multiplication table of transpositions as Schur functions', () => {
    const tex = '\\begin{tabular}{c|cc}\n & $s_1$ & $s_2$ \\\\\n$s_1$ & $1$ & $s_1s_2$ \\\\\n$s_2$ & $s_2s_1$ & $1$\n\\end{tabular}'
    expect(verdictsOf(tex)).toEqual([])
  })

  it('stays silent when a head is not an object', () => {
    const tex = '\\begin{tabular}{c|cc}\n & $a$ & $b$ \\\\\n$a$ & $a^2$ & $ab$\n\\end{tabular}'
    expect(readSnippet(tex).claims).toEqual([])
  })
})

describe('determinants', () => {
  it('reads \\det\\left( array \\right) of symmetric functions (Jacobi–Trudi)', () => {
    expect(verdictsOf('\\[ \\det\\left(\\begin{array}{cc} h_2 & h_3 \\\\ h_0 & h_1 \\end{array}\\right) = s_{21} \\]')).toEqual(['verified'])
  })

  it('reads \\left| array \\right| and |matrix|', () => {
    expect(verdictsOf('\\[ \\left|\\begin{array}{ccc} h_3 & h_4 & h_5 \\\\ h_1 & h_2 & h_3 \\\\ 0 & 1 & h_1 \\end{array}\\right| = s_{321} \\]')).toEqual(['verified'])
    expect(verdictsOf('\\[ |\\begin{matrix} x_1 & 1 \\\\ 1 & x_2 \\end{matrix}| = x_1x_2 - 1 \\]')).toEqual(['verified'])
  })

  it('reads \\det\\begin{pmatrix} and catches a wrong value', () => {
    expect(verdictsOf('\\[ \\det\\begin{pmatrix} h_2 & h_3 \\\\ 1 & h_1 \\end{pmatrix} = s_{22} \\]')).toEqual(['mismatch'])
  })
})
