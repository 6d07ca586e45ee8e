/**
 * The check pipeline (shared/check) on single claims: the kinds of difference it reports,
 * and what happens to claims it cannot or may not compute.
 *
 * Values: S_132 S_132 = S_231 + S_1423 (Monk's rule; also lrcalc's `schubmult 1 3 2 - 1 3 2`);
 * ℓ(2143) = 2 (two inversions, common practice); deg S_w = ℓ(w) (common practice), with ℓ counted
 * below by the definition; s_1 s_1 = s_2 + s_11 (the Pieri rule); c^{321}_{21,21} = 2 (lrcalc's documented example).
 */
import { describe, it, expect } from 'vitest'
import { assembleReport, checkManuscript, evaluateClaim } from '../../../shared/check'
import { readManuscript } from '../../../shared/latex'

const checkOne = (latex: string) => {
  const report = checkManuscript({ files: { 'main.tex': latex } })
  expect(report.claims).toHaveLength(1)
  return report.claims[0]!
}
const inversions = (w: number[]) => w.reduce((n, a, i) => n + w.slice(i + 1).filter(b => b < a).length, 0)

describe('differences', () => {
  it('a product written with a dropped term: the missing Schubert term, in the Schubert basis', () => {
    const claim = checkOne('\\[ \\mathfrak{S}_{132}\\,\\mathfrak{S}_{132} = \\mathfrak{S}_{231} \\]')
    expect(claim.verdict).toBe('mismatch')
    expect(claim.diff).toEqual({ basis: 'schubert', missing: [{ term: '\\mathfrak{S}_{1423}', coefficient: '1' }], extra: [], wrongCoefficient: [] })
    expect(claim.message).toBe('1 Schubert term missing.')
  })
  it('a product with a wrong coefficient and an extra term', () => {
    const claim = checkOne('\\[ \\mathfrak{S}_{132}\\,\\mathfrak{S}_{132} = 2\\,\\mathfrak{S}_{231} + \\mathfrak{S}_{1423} + \\mathfrak{S}_{312} \\]')
    expect(claim.diff).toEqual({
      basis: 'schubert', missing: [],
      extra: [{ term: '\\mathfrak{S}_{312}', coefficient: '1' }],
      wrongCoefficient: [{ term: '\\mathfrak{S}_{231}', claimed: '2', computed: '1' }],
    })
  })
  it('a Schur product with a dropped term, in the Schur basis', () => {
    const claim = checkOne('$s_{1}\\, s_{1} = s_{2}$')
    expect(claim.diff).toEqual({ basis: 'schur', missing: [{ term: 's_{11}', coefficient: '1' }], extra: [], wrongCoefficient: [] })
  })
  it('a number: the written and the computed value', () => {
    expect(checkOne('$\\ell(2143) = 3$').diff).toEqual({ basis: 'number', claimed: '3', computed: '2' })
    expect(checkOne('$c^{321}_{21,21} = 1$').diff).toEqual({ basis: 'number', claimed: '1', computed: '2' })
  })
  it('a large permutation (w in S_9) with a polynomial of the wrong degree: found by invariants, without expanding, fast', () => {
    const w = [1, 3, 9, 5, 8, 7, 2, 6, 4]
    const started = performance.now()
    const claim = checkOne(`\\[ \\mathfrak{S}_{${w.join('')}} = x_1^5 x_2 + x_1 x_2^5 \\]`)
    expect(performance.now() - started).toBeLessThan(3000)
    expect(claim.verdict).toBe('mismatch')
    expect(claim.diff).toEqual({ basis: 'invariant', invariant: 'degree', claimed: '6', computed: String(inversions(w)) })
    expect(claim.message).toMatch(/found without expanding/)
  })
  it('the same permutation with the right degree but far too few terms: the value at (1,…,1) differs', () => {
    const w = [1, 3, 9, 5, 8, 7, 2, 6, 4]
    const degree = inversions(w)
    const started = performance.now()
    const claim = checkOne(`\\[ \\mathfrak{S}_{${w.join('')}} = x_1^{${degree - 1}} x_2 \\]`)
    expect(performance.now() - started).toBeLessThan(3000)
    expect(claim.diff).toMatchObject({ basis: 'invariant', invariant: 'value at ones', claimed: '1' })
  })
})

describe('claims that cannot be computed', () => {
  it('over budget: verdict error with a reason, not a crash, and the other claims are still checked', () => {
    const read = readManuscript({ files: { 'main.tex': [
      '\\[ \\mathfrak{S}_{15432} = x_1^3 x_2^2 x_3 \\]',
      '$\\ell(2143) = 2$',
    ].join('\n') } })
    expect(read.claims).toHaveLength(2)
    const evaluations = read.claims.map(c => evaluateClaim(c, { budget: { maxTerms: 3 } }))
    const report = assembleReport(read, evaluations, { durationMs: 0 })
    expect(report.claims.map(c => c.verdict)).toEqual(['error', 'verified'])
    expect(report.claims[0]!.message).toMatch(/^over budget/)
    expect(report.summary).toMatchObject({ error: 1, verified: 1, mismatch: 0 })
  })
  it('a run stopped from outside: every claim is an error, nothing throws', () => {
    const controller = new AbortController()
    controller.abort()
    const report = checkManuscript({ files: { 'main.tex': '$\\ell(2143) = 2$ and $s_{1}\\, s_{1} = s_{2} + s_{11}$' } }, { signal: controller.signal })
    expect(report.claims.map(c => c.verdict)).toEqual(['error', 'error'])
    expect(report.claims.every(c => /over budget/.test(c.message))).toBe(true)
  })
  it('unsupported claims are reported with the reason and count neither as verified nor as mismatch', () => {
    const report = checkManuscript({ files: { 'main.tex': [
      '\\[ \\mathfrak{G}_{21} = x_1 \\ominus x_2 \\]',
      '\\[ s_{21} = x_1^2 x_2 + x_1 x_2^2 \\]',
      '$\\ell(2143) = 2$ % scholium: skip',
    ].join('\n') } })
    expect(report.claims.map(c => [c.line, c.verdict])).toEqual([[1, 'unsupported'], [2, 'unsupported'], [3, 'unsupported']])
    expect(report.claims[0]!.message).toMatch(/b a single variable y_j/)
    // The advice names the object written (s_{21}), not a generic s_λ.
    expect(report.claims[1]!.message).toMatch(/write s_\{21\}\(x_1,…,x_n\) to fix its variables/)
    expect(report.claims[2]!.message).toMatch(/^skipped/)
    expect(report.summary).toMatchObject({ claims: 3, verified: 0, mismatch: 0, error: 0, unsupported: 3, skipped: 1 })
  })
})
