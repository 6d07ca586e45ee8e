/**
 * The text report of `scholium check`, from reports built by hand: one mark per verdict, the
 * reason under every line that is not verified, the difference term by term, notes and summary.
 */
import { describe, it, expect } from 'vitest'
import { mark, painter, renderReport } from '../../../scripts/cli/render'
import { REFERENCE_CONVENTIONS } from '../../../shared/types/conventions'
import type { Report, ReportClaim } from '../../../shared/types/report'

function claim(line: number, fields: Partial<ReportClaim>): ReportClaim {
  return {
    id: `main.tex:${line}:1`, file: 'main.tex', line, endLine: line, kind: 'schubert', verdict: 'verified', holdsUnder: [],
    source: 'x', computed: null, diff: null, message: 'Both sides agree term by term.', conventions: REFERENCE_CONVENTIONS, permutations: [],
    ...fields,
  }
}

const report: Report = {
  schema: 'scholium.report/2',
  engine: { version: '9.9.9' },
  conventions: { inferred: { doubleSign: 'xy-plus' }, fixed: { partition: 'shape-columns' }, used: { ...REFERENCE_CONVENTIONS, doubleSign: 'xy-plus', partition: 'shape-columns' }, evidence: { 'xy-plus': 3 } },
  summary: { claims: 6, verified: 1, mismatch: 3, unsupported: 1, error: 1, otherConvention: 1, skipped: 0, durationMs: 12 },
  files: [{ path: 'main.tex', role: 'main', lines: 120 }],
  warnings: [{ code: 'include', message: 'sections/missing.tex was not found', file: 'main.tex', line: 7 }],
  claims: [
    claim(9, { source: '\\mathfrak{S}_{132} = x_1 + x_2' }),
    claim(10, { verdict: 'mismatch', source: '\\mathfrak{S}_{132} = x_1', message: '1 term missing.', computed: 'x_{1} + x_{2}', diff: { basis: 'monomial', missing: [{ term: 'x_{2}', coefficient: '1' }], extra: [{ term: 'x_{3}', coefficient: '-2' }], wrongCoefficient: [{ term: 'x_{1}', claimed: '3', computed: '1' }] } }),
    claim(11, { verdict: 'mismatch', holdsUnder: ['xy-minus'], source: '\\mathfrak{S}_{213}(x;y) = x_1 - y_1', message: 'Holds only with xy-minus.', diff: { basis: 'number', claimed: '4', computed: '5' } }),
    claim(100, { verdict: 'mismatch', kind: 'count', source: '\\#\\PD(w) = 4', message: 'The degree differs.', diff: { basis: 'invariant', invariant: 'degree', claimed: '6', computed: '17' } }),
    claim(101, { verdict: 'unsupported', message: 'double Grothendieck polynomials are not computed yet' }),
    claim(102, { verdict: 'error', message: 'over budget: too many terms' }),
  ],
}

describe('text report', () => {
  const text = renderReport(report, 'paper/', painter(false), [{ path: 'paper.aux', reason: 'not a manuscript file' }])
  const lines = text.split('\n')
  const lineOf = (n: number) => lines.find(l => new RegExp(`^\\s+${n}\\s`).test(l))

  it('marks every claim line with a glyph and a word, numbers aligned', () => {
    expect(lineOf(9)).toBe('    9  = verified         \\mathfrak{S}_{132} = x_1 + x_2')
    expect(lineOf(10)).toMatch(/^ {3}10 {2}≠ mismatch /)
    expect(lineOf(11)).toMatch(/⇄ other convention/)
    expect(lineOf(100)).toMatch(/^ {2}100 {2}≠ mismatch /)
    expect(lineOf(101)).toMatch(/\? unsupported/)
    expect(lineOf(102)).toMatch(/! error/)
    expect(mark(claim(1, { verdict: 'unsupported', skipped: true, message: 'skipped at the author\'s request' })).word).toBe('skipped')
  })
  it('gives the reason and the difference under a mismatch', () => {
    const at = lines.indexOf(lineOf(10)!)
    expect(lines.slice(at + 1, at + 6)).toEqual([
      '       1 term missing.',
      '       missing   +x_{2}',
      '       extra     −2x_{3}',
      '       coefficient of x_{1}: written 3, computed 1',
      '       computed: x_{1} + x_{2}',
    ])
    expect(text).toContain('written 4, computed 5')
    expect(text).toContain('degree: written 6, computed 17')
    expect(text).toContain('over budget: too many terms')
  })
  it('ends with notes, the summary, the conventions and the caution', () => {
    expect(text).toContain('main.tex:7: sections/missing.tex was not found')
    expect(text).toContain('paper.aux: left out, not a manuscript file')
    expect(text).toContain('1 verified, 3 mismatch (1 holding under another convention), 1 error, 1 unsupported — 12 ms')
    expect(text).toContain('Conventions: xy-plus (inferred from 3 claims), perm-w (default), shape-columns (fixed), beta-minus (default)')
    expect(text).toMatch(/does not prove the statement/)
    expect(lines[0]).toBe('Scholium check of paper/ — 1 file, 6 claims, engine 9.9.9')
  })
})
