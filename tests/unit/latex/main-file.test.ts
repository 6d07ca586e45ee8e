// chooseMainFile is the one place that decides a bundle's main file.
import { describe, expect, it } from 'vitest'
import { chooseMainFile, readManuscript } from '../../../shared/latex/index'

const paper = (body = '') => `\\documentclass{article}\n\\begin{document}\n${body}\n\\end{document}\n`

describe('chooseMainFile', () => {
  it('picks the file with \\documentclass over an included section', () => {
    expect(chooseMainFile({ 'sec.tex': 'text', 'paper.tex': '\\documentclass{article}\\input{sec}' })).toBe('paper.tex')
  })
  // Regression: the upload service had its own rule (raw text, shallowest path), which chose a
  // file whose \documentclass is only in a comment, or a subfile, over the reader's main file.
  it('decides as the reader does where the upload service\'s old rule did not: a commented-out or subfiles \\documentclass is no main file', () => {
    const files = {
      'notes.tex': '% \\documentclass{article} (old draft)\nSome notes.',
      'part.tex': '\\documentclass[paper/main.tex]{subfiles}\n\\begin{document}x\\end{document}',
      'paper/main.tex': '\\documentclass{amsart}\n\\begin{document}$\\ell(21) = 1$\\end{document}',
    }
    expect(chooseMainFile(files)).toBe('paper/main.tex')
  })
  it('names no main file when the reader would read several roots', () => {
    expect(chooseMainFile({ 'a.tex': '$\\ell(21) = 1$', 'b.tex': '$\\ell(12) = 0$' })).toBeUndefined()
  })

  it('gives undefined for a bundle without LaTeX', () => {
    expect(chooseMainFile({ 'fig.png': new Uint8Array([137, 80, 78, 71]) })).toBeUndefined()
  })

  it('picks the one file with \\documentclass among several, in any folder', () => {
    const files = { 'a/intro.tex': 'Intro.', 'b/results.tex': 'Results.', 'src/thesis.tex': paper('\\input{a/intro}'), 'macros.sty': '\\newcommand{\\x}{1}' }
    expect(chooseMainFile(files)).toBe('src/thesis.tex')
  })

  it('ignores \\documentclass in comments, \\iffalse blocks and verbatim', () => {
    const files = {
      'notes.tex': '% \\documentclass{article} (kept from an old version)\n\\iffalse\n\\documentclass{amsart}\n\\fi\nThe class is set with \\verb|\\documentclass{article}|.',
      'zz-paper.tex': paper('\\input{notes}'),
    }
    expect(chooseMainFile(files)).toBe('zz-paper.tex')
  })

  it('does not take a subfile chapter or a standalone figure for the main file', () => {
    const files = {
      'a-figure.tex': '\\documentclass{standalone}\n\\begin{document}\\end{document}',
      'b-chapter.tex': '\\documentclass[main.tex]{subfiles}\n\\begin{document}\\end{document}',
      'thesis.tex': '\\documentclass{book}\\begin{document}\\end{document}',
    }
    expect(chooseMainFile(files)).toBe('thesis.tex')
  })

  it('follows the toplevel file named in 00README.json', () => {
    const readme = JSON.stringify({ process: { compiler: 'pdflatex' }, sources: [{ filename: 'supplement.tex', usage: 'ignore' }, { filename: 'zeta.tex', usage: 'toplevel' }] })
    const files = { '00README.json': readme, 'main.tex': paper(), 'zeta.tex': paper(), 'supplement.tex': paper() }
    expect(chooseMainFile(files)).toBe('zeta.tex')
  })

  it('follows a "toplevelfile" line of an older 00README.XXX', () => {
    const files = { '00README.XXX': 'zeta.tex toplevelfile\nfigs/plot.eps ignore\nnohypertex\n', 'main.tex': paper(), 'zeta.tex': paper() }
    expect(chooseMainFile(files)).toBe('zeta.tex')
  })

  it('falls back to \\documentclass, with a warning, when the 00README names a file that is not there or is not JSON', () => {
    const missing = { '00README.json': JSON.stringify({ sources: [{ filename: 'gone.tex', usage: 'toplevel' }] }), 'paper.tex': paper(), 'part.tex': 'x' }
    expect(chooseMainFile(missing)).toBe('paper.tex')
    const r = readManuscript({ files: missing })
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'main-file', message: expect.stringContaining('names gone.tex as the toplevel file') })])
    const broken = readManuscript({ files: { '00README.json': '{ not json', 'paper.tex': paper() } })
    expect(broken.warnings).toEqual([expect.objectContaining({ code: 'main-file', message: expect.stringContaining('00README.json is not valid JSON') })])
    expect(broken.files.find(f => f.path === 'paper.tex')?.role).toBe('main')
  })

  it('breaks a tie between ms.tex and main.tex by the file that reads the rest of the bundle', () => {
    const sections = { 'sec/one.tex': 'One.', 'sec/two.tex': 'Two.' }
    expect(chooseMainFile({ ...sections, 'main.tex': paper(), 'ms.tex': paper('\\input{sec/one}\\input{sec/two}') })).toBe('ms.tex')
    expect(chooseMainFile({ ...sections, 'main.tex': paper('\\input{sec/one}\\input{sec/two}'), 'ms.tex': paper() })).toBe('main.tex')
  })

  it('prefers the file that is not \\input by the other, then main.tex over ms.tex on a full tie', () => {
    expect(chooseMainFile({ 'ms.tex': paper('\\input{main}'), 'main.tex': paper() })).toBe('ms.tex')
    expect(chooseMainFile({ 'ms.tex': paper(), 'main.tex': paper() })).toBe('main.tex')
    expect(chooseMainFile({ 'ms.tex': paper(), 'zebra.tex': paper() })).toBe('ms.tex')
  })

  it('prefers a file with \\begin{document} over a class-only preamble file', () => {
    expect(chooseMainFile({ 'main.tex': '\\documentclass{article}\n% preamble only', 'paper.tex': paper() })).toBe('paper.tex')
  })
})
