// Inputs: main-file choice, \subfile and \input without braces, what is not typeset,
// byte decoding, macro forms, and misuse.
import { describe, expect, it } from 'vitest'
import { readManuscript } from '../../../shared/latex/index'
import { decodeSource, lineStarts, positionAt } from '../../../shared/latex/decode'
import { maskSource } from '../../../shared/latex/mask'
import { normalizeBundlePath } from '../../../shared/latex/paths'
import { int, loadBundle, readSnippet } from './helpers'

describe('bundles', () => {
  const r = readManuscript({ files: loadBundle('subfiles-bundle') })

  it('follows \\subfile and \\input without braces, skipping what is not typeset', () => {
    expect(r.claims.map(c => [c.file, c.line, c.question?.rhs])).toEqual([
      ['chapters/one.tex', 4, int(1)],
      ['chapters/two.tex', 12, int(1)],
    ])
    expect(r.claims[0]!.question!.lhs).toEqual({ type: 'littlewoodRichardson', lambda: [2, 1], mu: [1], nu: [3, 1] })
    expect(r.files.find(f => f.path === 'thesis.tex')?.role).toBe('main')
    expect(r.warnings).toEqual([])
  })

  it('uses a configured main file, and warns when it is missing', () => {
    const files = { 'a.tex': '\\documentclass{article}\\begin{document}$\\ell(21) = 1$\\end{document}', 'b.tex': '\\documentclass{article}\\begin{document}$\\ell(321) = 3$\\end{document}' }
    expect(readManuscript({ files, main: 'b.tex' }).claims.map(c => c.file)).toEqual(['b.tex'])
    const missing = readManuscript({ files, main: 'c.tex' })
    expect(missing.warnings[0]).toMatchObject({ code: 'main-file', message: expect.stringContaining('"c.tex" is not in the input') })
    expect(missing.warnings[1]).toMatchObject({ code: 'main-file', message: expect.stringContaining('several files have \\documentclass') })
  })

  it('reads a set of files without \\documentclass, each root once', () => {
    const r2 = readManuscript({ files: { 'b.tex': '$\\ell(21) = 1$ \\input{c}', 'a.tex': '$\\ell(321) = 3$', 'c.tex': '$\\ell(312) = 2$' } })
    expect(r2.claims.map(c => c.file)).toEqual(['a.tex', 'b.tex', 'c.tex'])
  })

  it('reports a missing \\input with the paths it tried', () => {
    const r3 = readSnippet('\\input{nowhere}')
    expect(r3.warnings).toEqual([expect.objectContaining({ code: 'missing-file', line: 1, message: expect.stringContaining('tried nowhere, nowhere.tex') })])
  })
})

describe('decoding and masking', () => {
  it('decodes UTF-8 bytes with a BOM and keeps lines of CR, LF and CRLF', () => {
    const bytes = new TextEncoder().encode('\ufeffa\r\nb\rc\nd ∂')
    const d = decodeSource(bytes)
    expect(d).toEqual({ text: 'a\nb\nc\nd ∂', encoding: 'utf-8' })
    expect(positionAt(lineStarts(d.text), d.text.indexOf('d'))).toEqual({ line: 4, column: 1 })
  })

  it('keeps the length and line breaks of masked text, and collects comments', () => {
    const src = 'a % one\n\\% not a comment % two\n\\iffalse\nx\n\\fi b'
    const m = maskSource(src)
    expect(m.text.length).toBe(src.length)
    expect(m.text.split('\n').length).toBe(src.split('\n').length)
    expect(m.comments.map(c => [c.text, c.wholeLine])).toEqual([[' one', false], [' two', false]])
    expect(m.text).toContain('\\% not a comment')
    expect(m.text).not.toContain('x')
    expect(m.text.trimEnd().endsWith('b')).toBe(true)
  })

  it('refuses bundle paths that leave the folder', () => {
    expect(normalizeBundlePath('a/./b/../c.tex')).toBe('a/c.tex')
    expect(normalizeBundlePath('../x.tex')).toBeUndefined()
    expect(normalizeBundlePath('/etc/x.tex')).toBeUndefined()
    expect(normalizeBundlePath('C:\\x.tex')).toBeUndefined()
  })
})

describe('macro forms', () => {
  it('expands \\def with delimited parameters, \\let, and macros defined in terms of others', () => {
    const tex = [
      '\\def\\pair(#1,#2){\\mathfrak S_{#1} = #2}',
      '\\let\\Len\\ell',
      '\\newcommand{\\one}{1}\\newcommand{\\uno}{\\one}',
      '$\\pair(21,x_1)$ and $\\Len(21) = \\uno$',
    ].join('\n')
    const r = readSnippet(tex)
    expect(r.claims.map(c => [c.line, c.kind, c.status])).toEqual([[4, 'schubert', 'ready'], [4, 'length', 'ready']])
    expect(r.claims[0]!.source).toBe('\\pair(21,x_1)')
    expect(r.claims[0]!.expandedSource).toBe('\\mathfrak S_{21} = x_1')
    expect(r.claims[1]!.question!.rhs).toEqual(int(1))
  })

  it('ignores \\providecommand for a name already defined, and uses \\renewcommand', () => {
    const r = readSnippet('\\newcommand{\\n}{1}\\providecommand{\\n}{2}$\\ell(21) = \\n$\\renewcommand{\\n}{3}$\\ell(321) = \\n$')
    expect(r.claims.map(c => c.question?.rhs)).toEqual([int(1), int(3)])
  })
})

describe('misuse', () => {
  it('throws on a missing files object or a bad limit, not on content', () => {
    expect(() => readManuscript(undefined as never)).toThrow(/input.files must be an object/)
    expect(() => readManuscript({ files: {}, limits: { maxMathTokens: -1 } })).toThrow(/positive number/)
    expect(() => readManuscript({ files: { 'a.tex': 42 as never } })).toThrow(/string or a Uint8Array/)
    expect(readManuscript({ files: {} }).warnings).toEqual([expect.objectContaining({ code: 'main-file' })])
  })
})
