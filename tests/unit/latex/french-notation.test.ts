// French notation only flips how a Young diagram is drawn (longest row at the bottom); the row
// lengths a paper lists in \ydiagram{…} are the same, so the partition read is the same whatever
// setting the paper uses. Rows listed in increasing order are never reversed by a guess, and
// tableaux drawn with \ytableaushort are not read.
import { describe, expect, it } from 'vitest'
import { readSnippet } from './helpers'

const FRENCH_SETTINGS = [
  ['the ytableau package option', '\\usepackage[french]{ytableau}'],
  ['a ytableau setting', '\\usepackage{ytableau}\n\\ytableausetup{french, boxsize=1em}'],
  ['the youngtab switch', '\\usepackage{youngtab}\n\\Yfrench'],
  ['a French-language paper (babel), which is not the notation', '\\usepackage[french]{babel}\\usepackage{ytableau}'],
] as const

/** What the reader makes of one line of math after a preamble. */
function readAfter(preamble: string, math: string) {
  const r = readSnippet(`\\documentclass{article}\n${preamble}\n\\begin{document}\n${math}\n\\end{document}`)
  return { questions: r.claims.map(c => [c.status, c.question?.lhs]), notRead: r.notRead.map(n => n.source), warnings: r.warnings }
}

describe('French notation', () => {
  const english = readAfter('\\usepackage{ytableau}', '$s_{\\ydiagram{3,1}} = s_{31}$')

  it('reads s_{\\ydiagram{3,1}} as s_{31} in English notation (the baseline)', () => {
    expect(english.questions).toEqual([['ready', { type: 'symmetric', family: 'schur', index: [3, 1] }]])
  })

  it.each(FRENCH_SETTINGS)('reads the same partition under %s', (_name, preamble) => {
    expect(readAfter(preamble, '$s_{\\ydiagram{3,1}} = s_{31}$')).toEqual(english)
  })

  it.each(FRENCH_SETTINGS)('never reverses increasing rows into a partition under %s', (_name, preamble) => {
    const r = readAfter(preamble, '$s_{\\ydiagram{1,3}} = s_{31}$')
    expect(r.questions).toEqual([])
    expect(r.notRead).toEqual(['s_{\\ydiagram{1,3}} = s_{31}'])
  })

  it.each(FRENCH_SETTINGS)('says nothing about a tableau drawn with \\ytableaushort under %s', (_name, preamble) => {
    const r = readAfter(preamble, '$s_{\\ytableaushort{13,2}} = s_{21}$')
    expect(r.questions).toEqual([])
    expect(r.notRead).toEqual(['s_{\\ytableaushort{13,2}} = s_{21}'])
  })
})
