// Precision: equalities that look like claims but are settings, definitions, multiplicities,
// products in the symmetric group or general identities must give no verdict and no
// "unsupported" line. Each case is invented; NOTATION.md lists the patterns.
import { describe, expect, it } from 'vitest'
import { readSnippet } from './helpers'

const verdictLines = (tex: string) => readSnippet(tex).claims.map(c => [c.status, c.source])

describe('what stays silent', () => {
  it.each([
    ['a substitution after "Setting"', 'Setting $x_2=-y_2$ in the formula we get'],
    ['a substitution without lead-in words', 'the case $x_3 = -y_3$ gives'],
    ['"put $q_3=0$"', 'and put $q_3=0$ to recover'],
    ['"with $t=1$"', 'with $t=1$ the sum is'],
    ['an LR coefficient named by its indices', 'Take $c^{\\nu}_{\\lambda\\mu} = c^{33}_{21,21}$ here.'],
    ['"we write c = ..."', 'we write $c = c^{\\nu}_{\\lambda\\mu}$ for short.'],
    ['a permutation binding', 'Let $u = 1342$.'],
    ['multiplicities of parts', 'where $m_3 = 1$ and $m_1=2$ count the parts'],
    ['a flag of subspaces', 'a flag $0=V_0\\subset V_1\\subset\\cdots$ of subspaces'],
    ['a product of permutations with cycle notation', 'in the group, $(132)s_1 = s_2s_1$.'],
    ['a braid relation in simple transpositions', 'the braid relation $s_2s_1s_2 = s_1s_2s_1$ holds'],
    ['a transposition squaring to one', 'and $s_1^2 = 1$ in the group'],
    ['a general identity in unbound letters', '$s_\\lambda s_\\mu=\\sum_\\nu c^\\nu_{\\lambda\\mu}s_\\nu$'],
    ['a number in prose', 'In 2019 there were $n = 3$ cases'],
  ])('%s', (_name, tex) => {
    expect(verdictLines(tex)).toEqual([])
  })
})

describe('what is still a claim', () => {
  it('keeps a Schubert polynomial after "with" as a claim, since its left side is an object', () => {
    expect(verdictLines('with $\\mathfrak{S}_{132} = x_1 + x_2$ we see')).toEqual([['ready', '\\mathfrak{S}_{132} = x_1 + x_2']])
  })
  it('keeps a Schur product with one factor on the right (s_1 s_1 = s_2) as a claim', () => {
    expect(verdictLines('$s_1 s_1 = s_2$').map(c => c[0])).toEqual(['ready'])
  })
  it('reads a bound partition after "Let"', () => {
    expect(verdictLines('Let $\\lambda = (4,1)$. Then $s_\\lambda = s_{41}$.').map(c => c[0])).toEqual(['ready'])
  })
})

describe('the not-read list', () => {
  it('lists a general identity as not read, with its line and a reason naming the unbound letter', () => {
    const r = readSnippet('Text.\n$s_\\lambda s_\\mu=\\sum_\\nu c^\\nu_{\\lambda\\mu}s_\\nu$')
    expect(r.notRead).toHaveLength(1)
    expect(r.notRead[0]).toMatchObject({ file: 'snippet.tex', line: 2 })
    expect(r.notRead[0]!.reason).toMatch(/is not bound here/)
  })
  it('lists unknown notation beside variables as not read, not as unsupported', () => {
    const r = readSnippet('$\\mathfrak{T}_{132} = x_1 + x_2$')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.source)).toEqual(['\\mathfrak{T}_{132} = x_1 + x_2'])
  })
  it('cuts a long source to a short excerpt and keeps the reason under 200 characters', () => {
    const long = Array.from({ length: 80 }, (_, i) => `f_{${i}}`).join(' + ')
    const r = readSnippet(`$\\mathfrak{T}_{1} = x_1 + ${long}$`)
    expect(r.notRead).toHaveLength(1)
    expect(r.notRead[0]!.source.length).toBeLessThanOrEqual(120)
    expect(r.notRead[0]!.source.endsWith('…')).toBe(true)
    expect(r.notRead[0]!.reason.length).toBeLessThanOrEqual(200)
  })
  it('lists math repeated by beamer overlays once', () => {
    const r = readSnippet('$\\mathfrak{T}_{1} = x_1 + x_2$ \\pause $\\mathfrak{T}_{1} = x_1 + x_2$')
    expect(r.notRead).toHaveLength(1)
  })
})
