// The manuscript's own macros: \DeclareMathOperator, \let copies, starred and xparse definitions,
// user environments, \newtheorem, and macros that come from a .sty or .cls beside the paper.
import { describe, expect, it } from 'vitest'
import { readManuscript } from '../../../shared/latex/index'
import { ReaderRun } from '../../../shared/latex/reader'
import { DEFAULT_LIMITS } from '../../../shared/latex/limits'
import { Expander, MacroTable, parseArgumentSpec, readDefinition } from '../../../shared/latex/macros'
import { Tokenizer, tokenize } from '../../../shared/latex/tokens'
import { int, oneLine, readSnippet, ready, x } from './helpers'

const schubert = (...entries: number[]) => ({ type: 'schubert', perm: oneLine(...entries), variant: 'single' })

describe('\\DeclareMathOperator', () => {
  it('keeps a symbol: \\sch_w with \\sch declared as \\mathfrak{S} is a Schubert polynomial (also the * form)', () => {
    const r = readSnippet('\\DeclareMathOperator{\\sch}{\\mathfrak{S}}\\DeclareMathOperator*{\\Sb}{\\mathfrak S}\n$\\sch_{132} = x_1 + x_2$ and $\\Sb_{213} = x_1$')
    expect(ready(r).map(c => c.question!.lhs)).toEqual([schubert(1, 3, 2), schubert(2, 1, 3)])
  })

  it('keeps \\ell: \\len(w) declared as \\ell is a length', () => {
    const r = readSnippet('\\DeclareMathOperator{\\len}{\\ell}\n$\\len(2143) = 2$')
    expect(ready(r)).toEqual([expect.objectContaining({ kind: 'length', question: expect.objectContaining({ rhs: int(2) }) })])
  })

  it('leaves a plain operator name a name, never an object: \\Des declared as Des', () => {
    const r = readSnippet('\\DeclareMathOperator{\\Des}{Des}\\DeclareMathOperator{\\sh}{S}\n$\\Des(2143) = 2$ and $\\sh_{132} = x_1 + x_2$')
    expect(ready(r)).toEqual([])
    expect(r.claims.filter(c => c.status === 'ready' || c.status === 'unsupported')).toEqual([])
    expect(r.notRead.map(n => n.source)).toContain('\\sh_{132} = x_1 + x_2')
  })
})

describe('\\let', () => {
  // Regression: `\let\oldsum\sum \renewcommand{\sum}{\oldsum\limits}` was reported as "macro \sum is
  // nested more than 100 expansions deep" (course notes, recorded false alarm).
  it('copies the meaning a command has now, so a \\renewcommand using its \\let copy is not recursive', () => {
    const r = readSnippet('\\let\\oldsum\\sum\n\\renewcommand{\\sum}{\\oldsum\\limits}\nRecall $s_\\lambda s_\\mu = \\sum_\\nu c^\\nu_{\\lambda\\mu} s_\\nu$ and $\\ell(21) = 1$.')
    expect(r.claims.filter(c => c.status === 'error')).toEqual([])
    expect(r.warnings).toEqual([])
    expect(ready(r)).toHaveLength(1)
    expect(r.notRead).toEqual([expect.objectContaining({ line: 3, reason: expect.stringMatching(/not bound/) })])
  })

  it('accepts \\let\\a=\\b and copies a user macro as it is at the time of the \\let', () => {
    const r = readSnippet('\\newcommand{\\one}{1}\\let\\uno=\\one\\renewcommand{\\one}{2}\n$\\ell(21) = \\uno$ and $\\ell(321) = \\one$')
    expect(ready(r).map(c => c.question!.rhs)).toEqual([int(1), int(2)])
  })

  it('copies a character with \\let\\eq== and keeps the text after it', () => {
    const r = readSnippet('\\let\\eq==\\let\\plus=+\n$\\mathfrak{S}_{132} \\eq x_1 \\plus x_2$')
    expect(ready(r).map(c => c.question!.rhs)).toEqual([{ type: 'add', terms: [x(1), x(2)] }])
  })

  it('still stops a macro that really calls itself', () => {
    const r = readSnippet('\\renewcommand{\\sum}{\\sum\\limits}\n$\\ell(21) = \\sum_i 1$')
    expect(r.claims).toEqual([expect.objectContaining({ status: 'error', reason: expect.stringMatching(/\\sum is nested more than/) })])
  })
})

describe('starred and xparse definitions', () => {
  it('reads \\newcommand*, \\renewcommand*, \\providecommand and \\providecommand*', () => {
    const tex = [
      '\\newcommand*{\\Sc}[1]{\\mathfrak{S}_{#1}}',
      '\\newcommand{\\two}{7}\\renewcommand*{\\two}{2}',
      '\\providecommand*{\\three}{3}\\providecommand{\\three}{4}\\providecommand{\\one}{1}',
      '$\\Sc{213} = x_1$, $\\ell(2143) = \\two$, $\\ell(321) = \\three$, $\\ell(21) = \\one$',
    ].join('\n')
    const r = readSnippet(tex)
    expect(ready(r).map(c => c.question!.rhs)).toEqual([x(1), int(2), int(3), int(1)])
  })

  it('reads \\NewDocumentCommand with m, o and O{default} arguments', () => {
    const tex = [
      '\\NewDocumentCommand{\\Sw}{m}{\\mathfrak{S}_{#1}}',
      '\\NewDocumentCommand\\Sv{O{x} m}{\\mathfrak{S}_{#2}(#1)}',
      '\\DeclareDocumentCommand{\\pow}{+m o}{x_{#1}}',
      '$\\Sw{213} = x_1$ and $\\Sv{132} = x_1 + x_2$ and $\\Sv[x]{213} = \\pow{1}$',
    ].join('\n')
    const r = readSnippet(tex)
    expect(ready(r).map(c => c.question!.lhs)).toEqual([schubert(2, 1, 3), schubert(1, 3, 2), schubert(2, 1, 3)])
    expect(ready(r)[2]!.question!.rhs).toEqual(x(1))
  })

  it('an absent o argument is -NoValue-, which no notation reads: not read, never guessed', () => {
    const r = readSnippet('\\NewDocumentCommand{\\Sw}{o}{\\mathfrak{S}_{#1}}\n$\\Sw = x_1$')
    expect(r.claims).toEqual([])
    expect(r.notRead).toHaveLength(1)
  })

  it('marks a macro with an argument type it does not follow as unread: no claim, no guess', () => {
    const tex = '\\NewDocumentCommand{\\Sw}{>{\\SplitList{,}}m}{\\mathfrak{S}_{#1}}\n\\RenewDocumentCommand{\\ell}{g m}{\\#\\mathrm{Red}(#2)}\n$\\Sw{213} = x_1$ and $\\ell(2143) = 2$'
    const r = readSnippet(tex)
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.source)).toEqual(['\\Sw{213} = x_1', '\\ell(2143) = 2'])
    expect(r.notRead[0]!.reason).toMatch(/\\Sw/)
  })

  it('parses argument specifications', () => {
    expect(parseArgumentSpec(tokenize('m O{1} +o'))).toEqual({ args: [{ kind: 'mandatory' }, { kind: 'optional', default: [expect.objectContaining({ v: '1' })] }, { kind: 'optional' }] })
    expect(parseArgumentSpec(tokenize('>{\\SplitList{,}}m'))).toEqual({ unread: expect.stringMatching(/">" is not followed/) })
    expect(parseArgumentSpec(tokenize('m b'))).toEqual({ unread: expect.stringMatching(/"b"/) })
  })
})

describe('user environments and theorem-like blocks', () => {
  it('expands \\newenvironment begin and end code, with arguments', () => {
    const tex = [
      '\\newenvironment{eqn}{\\begin{equation}}{\\end{equation}}',
      '\\newenvironment{ex}[1][Example]{\\par\\textbf{#1.}}{\\par}',
      '\\begin{ex}[Small case]',
      '\\begin{eqn}',
      '\\mathfrak{S}_{132} = x_1 + x_2',
      '\\end{eqn}',
      '\\end{ex}',
    ].join('\n')
    const r = readSnippet(tex)
    expect(r.claims.map(c => [c.line, c.status, c.display])).toEqual([[5, 'ready', true]])
    expect(r.warnings).toEqual([])
  })

  it('tells a listener where a user environment begins and ends, and leaves other environments alone', () => {
    const src = '\\newenvironment{ex}{A}{B}\\begin{ex}x\\end{ex}\\begin{proof}y\\end{proof}'
    const table = new MacroTable()
    const expander = new Expander(new Tokenizer(src), table, new Set(), DEFAULT_LIMITS, { produced: 0 })
    table.add(readDefinition(expander.next()!, expander, 'a.tex')!)
    const edges: [string, string, number][] = []
    expander.onUserEnvironment = (name, edge, pos) => edges.push([name, edge, pos])
    const rest: string[] = []
    for (let t = expander.next(); t; t = expander.next()) rest.push(t.v)
    expect(rest).toEqual(['A', 'x', 'B', 'begin', '{', 'proof', '}', 'y', 'end', '{', 'proof', '}'])
    expect(edges).toEqual([['ex', 'begin', src.indexOf('\\begin{ex}')], ['ex', 'end', src.indexOf('\\end{ex}')]])
  })

  it('records \\newtheorem (also starred, with counters) and \\declaretheorem names as theorem-like environments', () => {
    const tex = '\\newtheorem{theorem}{Theorem}[section]\\newtheorem{example}[theorem]{Example}\\newtheorem*{remark}{Remark}\\declaretheorem[style=definition]{exercise}\n\\begin{example} $\\ell(21) = 1$ \\end{example}'
    const run = new ReaderRun({ 'a.tex': tex }, { ...DEFAULT_LIMITS })
    run.run(undefined)
    expect([...run.macroTable.theoremEnvironments].sort()).toEqual(['example', 'exercise', 'remark', 'theorem'])
    expect(run.claims.map(c => c.status)).toEqual(['ready'])
  })

  it('does not record ordinary environments as theorem-like', () => {
    const run = new ReaderRun({ 'a.tex': '\\newenvironment{boxed}{}{}\\newcommand{\\example}{x}' }, { ...DEFAULT_LIMITS })
    run.run(undefined)
    expect([...run.macroTable.theoremEnvironments]).toEqual([])
  })
})

describe('packages and classes in the bundle', () => {
  it('follows \\usepackage, \\RequirePackage and \\documentclass to .sty and .cls files beside the paper', () => {
    const r = readManuscript({
      files: {
        'paper.tex': '\\documentclass{mynotes}\n\\usepackage[final]{amsmath,mymacros}\n\\begin{document}\n$\\Sc{132} = x_1 + x_2$ and $\\Gw{21} = \\one$\n\\end{document}',
        'mynotes.cls': '\\LoadClass{article}\\RequirePackage{morestuff}\n\\providecommand{\\one}{1}',
        'morestuff.sty': '\\newcommand{\\Gw}[1]{\\ell(#1)}',
        'mymacros.sty': '\\ProvidesPackage{mymacros}\n\\makeatletter\\newcommand*{\\Sc}[1]{\\mathfrak{S}_{#1}}\\makeatother',
      },
    })
    expect(r.claims.map(c => [c.kind, c.status])).toEqual([['schubert', 'ready'], ['length', 'ready']])
    expect(r.warnings).toEqual([])
    expect(r.files.map(f => [f.path, f.role])).toEqual([
      ['morestuff.sty', 'included'], ['mymacros.sty', 'included'], ['mynotes.cls', 'included'], ['paper.tex', 'main'],
    ])
  })

  it('ignores packages that are not in the bundle, silently', () => {
    const r = readSnippet('\\documentclass{amsart}\\usepackage{ytableau}\\RequirePackage{tikz}\n$\\ell(21) = 1$')
    expect(r.warnings).toEqual([])
    expect(ready(r)).toHaveLength(1)
  })

  it('does not loop on a package that requires itself', () => {
    const r = readManuscript({ files: { 'a.tex': '\\documentclass{article}\\usepackage{self}$\\ell(21) = \\one$', 'self.sty': '\\RequirePackage{self}\\newcommand{\\one}{1}' } })
    expect(ready(r)).toHaveLength(1)
  })
})
