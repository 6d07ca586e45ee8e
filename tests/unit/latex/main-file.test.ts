// chooseMainFile is the one place that decides a bundle's main file.
import { describe, expect, it } from 'vitest'
import { chooseMainFile } from '../../../shared/latex/index'

describe('chooseMainFile', () => {
  it('picks the file with \\documentclass over an included section', () => {
    expect(chooseMainFile({ 'sec.tex': 'text', 'paper.tex': '\\documentclass{article}\\input{sec}' })).toBe('paper.tex')
  })
  it('gives undefined for a bundle without LaTeX', () => {
    expect(chooseMainFile({ 'fig.png': new Uint8Array([137, 80, 78, 71]) })).toBeUndefined()
  })
})
