// The CLI lists the math the reader passed over only with --show-unread, always prints its count,
// and never lets it change the exit status.
import { describe, expect, it } from 'vitest'
import { parseArguments } from '../../../scripts/cli/args'
import { painter, renderReport } from '../../../scripts/cli/render'
import { checkManuscript } from '../../../shared/check'

const tex = 'We have $\\ell(21) = 1$, and in general $s_\\lambda s_\\mu = \\sum_\\nu c^\\nu_{\\lambda\\mu} s_\\nu$.\n'

describe('not read in the CLI', () => {
  it('parses --show-unread and refuses a value for it', () => {
    expect(parseArguments(['check', 'a.tex', '--show-unread'])).toMatchObject({ command: 'check', showUnread: true })
    expect(parseArguments(['check', 'a.tex'])).not.toHaveProperty('showUnread')
    expect(parseArguments(['check', 'a.tex', '--show-unread=yes'])).toMatchObject({ command: 'problem' })
  })
  it('counts the not-read math in the summary, apart from the verdicts', () => {
    const report = checkManuscript({ files: { 'a.tex': tex } })
    expect(report.summary).toMatchObject({ claims: 1, verified: 1, unsupported: 0, notRead: 1 })
    expect(report.notRead).toEqual([expect.objectContaining({ file: 'a.tex', line: 1 })])
  })
  it('prints the count always and the list only with --show-unread', () => {
    const report = checkManuscript({ files: { 'a.tex': tex } })
    const plain = renderReport(report, 'a.tex', painter(false))
    expect(plain).toContain('1 piece of math not read (list them with --show-unread)')
    expect(plain).not.toContain('a.tex:1  s_')
    const listed = renderReport(report, 'a.tex', painter(false), [], { showUnread: true })
    expect(listed).toContain('Not read')
    expect(listed).toContain('a.tex:1  s_\\lambda s_\\mu')
  })
})
