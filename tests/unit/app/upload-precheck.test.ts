/**
 * The upload form's own checks (utils/upload-precheck.ts): the server's rules, applied before
 * anything is sent, so that each refused file is shown with its reason.
 */
import { describe, expect, it } from 'vitest'
import { precheckUpload, withoutTopFolder } from '../../../utils/upload-precheck'

const MiB = 1024 * 1024

describe('checking dropped files before upload', () => {
  it('accepts a LaTeX source and refuses build products with file-type, naming each', () => {
    const result = precheckUpload([{ path: 'main.tex', size: 100 }, { path: 'main.aux', size: 10 }, { path: 'fig/plot.pdf', size: 10 }, { path: 'Makefile', size: 5 }])
    expect(result.files.map(f => [f.path, f.status])).toEqual([['main.tex', 'accepted'], ['main.aux', 'refused'], ['fig/plot.pdf', 'accepted'], ['Makefile', 'refused']])
    expect(result.files[1]).toMatchObject({ code: 'file-type', reason: '.aux files are not part of a LaTeX source' })
    expect(result.refusal).toBeNull()
    expect(result.accepted.map(f => f.path)).toEqual(['main.tex', 'fig/plot.pdf'])
  })

  it('leaves out hidden folders and system files', () => {
    const result = precheckUpload([{ path: 'main.tex', size: 1 }, { path: '.git/config', size: 1 }, { path: 'figs/.DS_Store', size: 1 }])
    expect(result.files.filter(f => f.status === 'left-out').map(f => f.path)).toEqual(['.git/config', 'figs/.DS_Store'])
    expect(result.accepted).toEqual([{ path: 'main.tex', size: 1 }])
  })

  it('refuses a file over the per-file limit and an upload over the total limit', () => {
    expect(precheckUpload([{ path: 'big.tex', size: 21 * MiB }]).files[0]).toMatchObject({ status: 'refused', code: 'too-large' })
    const many = Array.from({ length: 3 }, (_, i) => ({ path: `part${i}.tex`, size: 19 * MiB }))
    expect(precheckUpload(many).refusal).toMatchObject({ code: 'too-large' })
  })

  it('refuses an archive with other files, an unread archive kind, and files with no .tex', () => {
    expect(precheckUpload([{ path: 'paper.zip', size: 10 }, { path: 'main.tex', size: 10 }]).refusal?.code).toBe('mixed-upload')
    expect(precheckUpload([{ path: 'paper.7z', size: 10 }]).files[0]).toMatchObject({ code: 'file-type' })
    expect(precheckUpload([{ path: 'refs.bib', size: 10 }]).refusal?.code).toBe('no-tex')
    expect(precheckUpload([{ path: 'paper.tar.gz', size: 10 }]).refusal).toBeNull()
    expect(precheckUpload([]).refusal?.code).toBe('empty')
  })

  it('refuses too many files', () => {
    expect(precheckUpload(Array.from({ length: 501 }, (_, i) => ({ path: `s${i}.tex`, size: 1 }))).refusal?.code).toBe('too-many-files')
  })

  it('removes the dropped folder\'s own name from the paths, as an archive\'s top folder is', () => {
    expect(withoutTopFolder([{ path: 'paper/main.tex', size: 1 }, { path: 'paper/sections/one.tex', size: 1 }]).map(f => f.path)).toEqual(['main.tex', 'sections/one.tex'])
    expect(withoutTopFolder([{ path: 'paper/main.tex', size: 1 }, { path: 'notes.tex', size: 1 }]).map(f => f.path)).toEqual(['paper/main.tex', 'notes.tex'])
  })
})
