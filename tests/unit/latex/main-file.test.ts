// chooseMainFile is the one place that decides a bundle's main file.
import { describe, expect, it } from 'vitest'
import { chooseMainFile } from '../../../shared/latex/index'

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
})
