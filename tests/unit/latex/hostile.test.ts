// Hostile and unusual inputs: each must finish in bounded time with a clear message, and
// never throw. Big inputs are generated here, not committed.
import { describe, expect, it } from 'vitest'
import { readManuscript } from '../../../shared/latex/index'
import { readSnippet } from './helpers'

const time = <T>(f: () => T): { value: T, ms: number } => {
  const t = performance.now()
  const value = f()
  return { value, ms: performance.now() - t }
}

describe('hostile inputs', () => {
  it('reads a 10 MB file in bounded time and finds its claims', () => {
    const para = 'Some prose about Schubert calculus, repeated to fill the page with words and words. '.repeat(12)
    const unit = `${para}\n$\\ell(2143) = 2$ and more text.\n\n`
    const copies = Math.ceil((10 * 1024 * 1024) / unit.length)
    const tex = unit.repeat(copies)
    expect(tex.length).toBeGreaterThan(10 * 1024 * 1024)
    const { value, ms } = time(() => readSnippet(tex))
    expect(value.claims).toHaveLength(copies)
    expect(value.claims[copies - 1]!.line).toBe(2 + 3 * (copies - 1))
    expect(ms).toBeLessThan(20_000)
  })

  it('keeps 10^5 macro definitions and uses the last ones', () => {
    let tex = ''
    for (let i = 0; i < 100_000; i++) tex += `\\newcommand{\\m${toLetters(i)}}{${i % 10}}\n`
    tex += `$\\ell(21) = \\m${toLetters(99_991)}$\n`
    const { value, ms } = time(() => readSnippet(tex))
    expect(value.claims).toHaveLength(1)
    expect(value.claims[0]).toMatchObject({ line: 100_001, status: 'ready', question: { rhs: { type: 'integer', value: '1' } } })
    expect(ms).toBeLessThan(20_000)
  })

  it('stops a self-referential macro with a clear error claim', () => {
    const r = readSnippet('\\newcommand{\\loop}{x_1 + \\loop}\n\n$\\ell(21) = \\loop$ and $\\ell(21) = 1$.')
    expect(r.claims.map(c => [c.line, c.status])).toEqual([[3, 'error'], [3, 'ready']])
    expect(r.claims[0]!.reason).toMatch(/\\loop is nested more than 100 expansions deep; is it defined in terms of itself\?/)
  })

  it('stops a macro that doubles itself by the output limit', () => {
    const { value, ms } = time(() => readSnippet('\\def\\a{\\a\\a}\n$\\ell(21) = \\a$'))
    expect(value.claims[0]).toMatchObject({ status: 'error', line: 2 })
    expect(value.claims[0]!.reason).toMatch(/more than \d+ tokens|nested more than/)
    expect(ms).toBeLessThan(10_000)
  })

  it('reports unbalanced braces in math and in a definition, and keeps reading', () => {
    const r = readSnippet('$\\ell(21) = {1$\n\n$\\ell(21) = 1$\n\\[ \\ell(21) = 1} \\]\n\\newcommand{\\bad}{x_1\n')
    expect(r.claims.map(c => [c.line, c.status])).toEqual([[1, 'error'], [3, 'ready'], [4, 'error']])
    expect(r.claims[0]!.reason).toMatch(/not closed before the end of the paragraph/)
    expect(r.claims[2]!.reason).toMatch(/unbalanced braces/)
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'macro', line: 5, message: expect.stringMatching(/never closed/) })])
  })

  it('reports math that is never closed and reads what follows', () => {
    const r = readSnippet('\\begin{equation}\n\\ell(21) = 1\n\nno end here\n')
    expect(r.claims).toEqual([expect.objectContaining({ line: 1, status: 'error', reason: '\\begin{equation} is never closed' })])
    const s = readSnippet('$\\ell(21) = 1\n\nA new paragraph with $\\ell(321) = 3$.')
    expect(s.claims.map(c => [c.line, c.status])).toEqual([[1, 'error'], [3, 'ready']])
    expect(s.claims[0]!.reason).toMatch(/not closed before the end of the paragraph/)
  })

  it('skips binary junk with a warning', () => {
    const junk = new Uint8Array(4096)
    for (let i = 0; i < junk.length; i++) junk[i] = (i * 7919) % 256
    const r = readManuscript({ files: { 'main.tex': '\\documentclass{article}\\begin{document}\\input{fig}$\\ell(21) = 1$\\end{document}', 'fig.tex': junk } })
    expect(r.claims).toHaveLength(1)
    expect(r.warnings).toContainEqual(expect.objectContaining({ code: 'binary', file: 'fig.tex' }))
  })

  it('reads a Latin-1 source with a warning and exact lines', () => {
    const text = '% Caf\xe9 notes, na\xefve\n\\section{R\xe9sum\xe9}\n$\\ell(2143) = 2$\n'
    const bytes = Uint8Array.from(text, ch => ch.charCodeAt(0))
    const r = readManuscript({ files: { 'notes.tex': bytes } })
    expect(r.warnings).toContainEqual(expect.objectContaining({ code: 'encoding', file: 'notes.tex', message: expect.stringMatching(/Latin-1/) }))
    expect(r.claims.map(c => c.line)).toEqual([3])
    expect(r.files[0]).toMatchObject({ encoding: 'latin-1', lines: 4 })
  })

  it('keeps line numbers exact with Windows line endings', () => {
    const r = readSnippet('one\r\ntwo\r\n\r\n$\\ell(21) = 1$\r\n\\begin{align}\r\n\\ell(321) &= 3 \\\\\r\n &= 1 + 2\r\n\\end{align}\r\n')
    expect(r.claims.map(c => [c.line, c.column])).toEqual([[4, 2], [6, 1], [7, 3]])
  })

  it('skips an \\input cycle with a warning', () => {
    const r = readManuscript({
      files: {
        'main.tex': '\\documentclass{article}\\begin{document}\\input{a}\\end{document}',
        'a.tex': '$\\ell(21) = 1$\n\\input{b}',
        'b.tex': '$\\ell(321) = 3$\n\\input{a.tex}',
      },
    })
    expect(r.claims.map(c => c.file)).toEqual(['a.tex', 'b.tex'])
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'include-cycle', file: 'b.tex', line: 2 })])
    expect(r.warnings[0]!.message).toContain('main.tex → a.tex → b.tex → a.tex')
  })

  it('refuses paths that leave the bundle', () => {
    const r = readManuscript({
      files: {
        'main.tex': '\\documentclass{article}\\begin{document}\n\\input{../secret}\n\\input{/etc/passwd}\n\\input{sub/../../x}\n\\input{C:/x}\n\\end{document}',
        'secret.tex': '$\\ell(21) = 1$',
        '../outside.tex': '$\\ell(21) = 1$',
      },
    })
    expect(r.claims).toEqual([])
    expect(r.warnings.filter(w => w.code === 'path-escape').map(w => w.line ?? 0)).toEqual([0, 2, 3, 4, 5])
    expect(r.files.find(f => f.path === 'secret.tex')?.role).toBe('unused')
  })

  it('never throws on arbitrary strings', () => {
    const pieces = ['$', '$$', '\\[', '\\]', '{', '}', '\\begin{align}', '\\end{align}', '\\def\\a#1#2{', '\\newcommand', '\\mathfrak S_', '&', '\\\\', '=', '(', ')', '\\left(', '^', '_', '\\input{', '%', '\n', 'x_1', '2143', '\\ell(']
    let seed = 12345
    const rand = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31), seed / 2 ** 31)
    for (let run = 0; run < 300; run++) {
      let tex = ''
      for (let k = 0; k < 40; k++) tex += pieces[Math.floor(rand() * pieces.length)]
      expect(() => readSnippet(tex)).not.toThrow()
    }
  })
})

function toLetters(i: number): string {
  let s = ''
  do {
    s += String.fromCharCode(97 + (i % 26))
    i = Math.floor(i / 26)
  } while (i > 0)
  return s
}
