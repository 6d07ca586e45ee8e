/**
 * Conventions: the checker infers what a manuscript follows from its own claims, flags the one claim
 * that breaks it, and lets a tag or a fixed setting override the inference.
 *
 * Values (all small, and the same in any textbook):
 * - double Schubert polynomials with factors x_i − y_j: S_213 = x_1 − y_1, S_132 = x_1 + x_2 − y_1 − y_2,
 *   S_231 = (x_1 − y_1)(x_2 − y_1), S_312 = (x_1 − y_1)(x_1 − y_2), S_321 = (x_1 − y_1)(x_1 − y_2)(x_2 − y_1):
 *   the product formula for w_0 and divided differences (Lascoux–Schützenberger's definition, common practice);
 *   the x_i + y_j forms replace y_j by −y_j;
 * - single Schubert polynomials S_231 = x_1x_2, S_312 = x_1^2, S_1342 = x_1x_2 + x_1x_3 + x_2x_3,
 *   S_1423 = x_1^2 + x_1x_2 + x_2^2, S_2341 = x_1x_2x_3, S_4123 = x_1^3: Macdonald, "Notes on Schubert
 *   polynomials" (1991), table for S_4, recalled from memory and confirmed with the sympy program
 *   tests/fixtures/corpus/reference.py; inverses: 231⁻¹ = 312, 1342⁻¹ = 1423, 2341⁻¹ = 4123;
 * - s_(k) = h_k and s_(1^k) = e_k (common practice), so s_11(x_1,x_2) = x_1x_2 and s_2(x_1,x_2) = x_1^2 + x_1x_2 + x_2^2.
 */
import { describe, it, expect } from 'vitest'
import { checkManuscript } from '../../../shared/check'
import type { ReportClaim } from '../../../shared/types/report'

const preamble = '\\documentclass{article}\n\\begin{document}\n'

/** A manuscript whose claims are one per line, after a two-line preamble (so line = index + 3). */
function paper(...claimLines: string[]): string {
  return `${preamble}${claimLines.join('\n')}\n\\end{document}\n`
}
const verdicts = (claims: ReportClaim[]) => claims.map(c => [c.line, c.verdict])

const PLUS_PAPER = [
  '\\[ \\mathfrak{S}_{213}(x;y) = x_1 + y_1 \\]', // line 3
  '\\[ \\mathfrak{S}_{132}(x;y) = x_1 + x_2 + y_1 + y_2 \\]', // 4
  '\\[ \\mathfrak{S}_{231}(x;y) = (x_1 + y_1)(x_2 + y_1) \\]', // 5
  '\\[ \\mathfrak{S}_{312}(x;y) = (x_1 - y_1)(x_1 - y_2) \\]', // 6: the odd one, written with x_i − y_j
  '\\[ \\mathfrak{S}_{321}(x;y) = (x_1 + y_1)(x_1 + y_2)(x_2 + y_1) \\]', // 7
]

describe('double polynomials: x_i + y_j against x_i − y_j', () => {
  it('infers x_i + y_j from the paper and flags exactly the claim written with x_i − y_j', () => {
    const report = checkManuscript({ files: { 'main.tex': paper(...PLUS_PAPER) } })
    expect(report.conventions.inferred.doubleSign).toBe('xy-plus')
    expect(report.conventions.used.doubleSign).toBe('xy-plus')
    expect(report.conventions.evidence['xy-plus']).toBe(4)
    expect(report.conventions.evidence['xy-minus']).toBe(1)
    expect(verdicts(report.claims)).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified'], [6, 'mismatch'], [7, 'verified']])
    const odd = report.claims[3]!
    expect(odd.holdsUnder).toEqual(['xy-minus'])
    expect(odd.breaksPaperConvention).toEqual({ axis: 'doubleSign', paper: 'xy-plus', claim: 'xy-minus' })
    expect(odd.message).toMatch(/rest of the paper follows xy-plus/)
    expect(report.summary).toMatchObject({ claims: 5, verified: 4, mismatch: 1, otherConvention: 1 })
  })

  it('a "set xy-minus" tag overrides the inference: the x_i + y_j claims fail, the odd one holds', () => {
    const report = checkManuscript({ files: { 'main.tex': paper('% scholium: set xy-minus', ...PLUS_PAPER) } })
    expect(report.conventions.inferred.doubleSign).toBeUndefined()
    expect(verdicts(report.claims)).toEqual([[4, 'mismatch'], [5, 'mismatch'], [6, 'mismatch'], [7, 'verified'], [8, 'mismatch']])
    for (const claim of report.claims) {
      expect(claim.conventions.doubleSign).toBe('xy-minus')
      expect(claim.breaksPaperConvention).toBeUndefined()
    }
  })

  it('a fixed setting (the command line\'s --convention) overrides the inference the same way', () => {
    const report = checkManuscript({ files: { 'main.tex': paper(...PLUS_PAPER) } }, { fixed: { doubleSign: 'xy-minus' } })
    expect(report.conventions.fixed).toEqual({ doubleSign: 'xy-minus' })
    expect(report.conventions.inferred.doubleSign).toBeUndefined()
    expect(report.conventions.used.doubleSign).toBe('xy-minus')
    expect(verdicts(report.claims)).toEqual([[3, 'mismatch'], [4, 'mismatch'], [5, 'mismatch'], [6, 'verified'], [7, 'mismatch']])
  })

  it('a "use xy-minus" tag on the odd claim alone makes it hold while the paper stays x_i + y_j', () => {
    const lines = [...PLUS_PAPER]
    lines[3] = `${lines[3]} % scholium: use xy-minus`
    const report = checkManuscript({ files: { 'main.tex': paper(...lines) } })
    expect(report.conventions.inferred.doubleSign).toBe('xy-plus')
    expect(verdicts(report.claims)).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified'], [6, 'verified'], [7, 'verified']])
    expect(report.claims[3]!.conventions.doubleSign).toBe('xy-minus')
  })

  it('a tag wins over a fixed setting', () => {
    const lines = [...PLUS_PAPER]
    lines[3] = `${lines[3]} % scholium: use xy-minus`
    const report = checkManuscript({ files: { 'main.tex': paper(...lines) } }, { fixed: { doubleSign: 'xy-plus' } })
    expect(verdicts(report.claims)).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified'], [6, 'verified'], [7, 'verified']])
  })
})

describe('w against w⁻¹', () => {
  // A paper whose S_w consistently means S_{w⁻¹}, with one claim written for w itself.
  const lines = [
    '\\[ \\mathfrak{S}_{231} = x_1^2 \\]', // 3: S_312
    '\\[ \\mathfrak{S}_{312} = x_1 x_2 \\]', // 4: S_231
    '\\[ \\mathfrak{S}_{1342} = x_1^2 + x_1 x_2 + x_2^2 \\]', // 5: S_1423
    '\\[ \\mathfrak{S}_{2341} = x_1 x_2 x_3 \\]', // 6: the odd one, S_2341 as written
    '\\[ \\mathfrak{S}_{1423} = x_1 x_2 + x_1 x_3 + x_2 x_3 \\]', // 7: S_1342
  ]
  it('infers perm-inverse and flags the claim written for w, which holds under perm-w', () => {
    const report = checkManuscript({ files: { 'main.tex': paper(...lines) } })
    expect(report.conventions.inferred.indexing).toBe('perm-inverse')
    expect(verdicts(report.claims)).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified'], [6, 'mismatch'], [7, 'verified']])
    expect(report.claims[3]!.holdsUnder).toEqual(['perm-w'])
    expect(report.claims[3]!.breaksPaperConvention).toEqual({ axis: 'indexing', paper: 'perm-inverse', claim: 'perm-w' })
    // The difference is against S_{4123} = x_1^3, what S_2341 means in this paper.
    expect(report.claims[3]!.diff).toEqual({ basis: 'monomial', missing: [{ term: 'x_{1}^{3}', coefficient: '1' }], extra: [{ term: 'x_{1}x_{2}x_{3}', coefficient: '1' }], wrongCoefficient: [] })
  })
  it('fixed perm-w turns it round: four mismatches, each still saying it would hold under perm-inverse', () => {
    const report = checkManuscript({ files: { 'main.tex': paper(...lines) } }, { fixed: { indexing: 'perm-w' } })
    expect(verdicts(report.claims)).toEqual([[3, 'mismatch'], [4, 'mismatch'], [5, 'mismatch'], [6, 'verified'], [7, 'mismatch']])
    expect(report.claims.map(c => c.holdsUnder)).toEqual([['perm-inverse'], ['perm-inverse'], ['perm-inverse'], [], ['perm-inverse']])
    // The axis was fixed from outside, so no claim "breaks the paper's convention" and nothing is inferred on it.
    expect(report.claims.every(c => c.breaksPaperConvention === undefined)).toBe(true)
    expect(report.conventions.inferred.indexing).toBeUndefined()
  })
})

describe('partitions: rows against columns', () => {
  // A paper that labels Schur polynomials by column lengths, with one claim labelled by rows.
  const lines = [
    '\\[ s_{11}(x_1,x_2) = x_1^2 + x_1 x_2 + x_2^2 \\]', // 3: h_2
    '\\[ s_{2}(x_1,x_2) = x_1 x_2 \\]', // 4: e_2
    '\\[ s_{111}(x_1,x_2) = x_1^3 + x_1^2 x_2 + x_1 x_2^2 + x_2^3 \\]', // 5: h_3
    '\\[ s_{2}(x_1,x_2,x_3) = x_1^2 + x_2^2 + x_3^2 + x_1 x_2 + x_1 x_3 + x_2 x_3 \\]', // 6: the odd one, h_2 by rows
  ]
  it('infers shape-columns and flags the claim labelled by rows', () => {
    const report = checkManuscript({ files: { 'main.tex': paper(...lines) } })
    expect(report.conventions.inferred.partition).toBe('shape-columns')
    expect(verdicts(report.claims)).toEqual([[3, 'verified'], [4, 'verified'], [5, 'verified'], [6, 'mismatch']])
    expect(report.claims[3]!.holdsUnder).toEqual(['shape-rows'])
    expect(report.claims[3]!.breaksPaperConvention).toEqual({ axis: 'partition', paper: 'shape-columns', claim: 'shape-rows' })
  })
  it('"set shape-rows" in the preamble overrides it', () => {
    const report = checkManuscript({ files: { 'main.tex': paper('% scholium: set shape-rows', ...lines) } })
    expect(verdicts(report.claims)).toEqual([[4, 'mismatch'], [5, 'mismatch'], [6, 'mismatch'], [7, 'verified']])
  })
})
