/**
 * Comparing two revisions: claims pair up by content, then by label, then by left-hand side;
 * line numbers alone never pair them.
 *
 * Values in the end-to-end case (common practice, checkable by hand from the pipe dream / monomial
 * expansions): S_1432 = x1^2x2 + x1^2x3 + x1x2^2 + x1x2x3 + x2^2x3 has five monomials, each with
 * coefficient 1, so #PD(1432) = 5, not 4; S_1342 = x1x2 + x1x3 + x2x3 (Macdonald, "Notes on Schubert
 * polynomials" (1991), table for S_4, recalled from memory), so the two-term version is wrong.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { categorise, claimSubject, compareRevisionClaims, type ComparableClaim } from '../../../shared/check/compare-revisions'
import { checkManuscript } from '../../../shared/check'
import type { Verdict } from '../../../shared/types/report'

// The same identity as the server's content key (kind + whitespace-normalised source), unhashed.
const keyOf = (kind: string, source: string) => `${kind}\n${source.replace(/\s+/g, ' ').trim()}`

function claim(id: string, line: number, source: string, verdict: Verdict, extra: Partial<ComparableClaim> = {}): ComparableClaim {
  const kind = extra.kind ?? 'schubert'
  return { id, file: 'main.tex', line, kind, verdict, source, contentKey: keyOf(kind, source), ...extra }
}

describe('claimSubject', () => {
  it('takes the text before the first top-level equals sign, without spacing', () => {
    expect(claimSubject('\\Sch{213}\\,\\Sch{132} = \\Sch{231} + \\Sch{312}')).toBe('\\Sch{213}\\Sch{132}')
    expect(claimSubject('\\#\\PD(1432) = 4')).toBe('\\#\\PD(1432)')
    expect(claimSubject('a = b = c')).toBe('a')
  })
  it('ignores an equals sign inside braces or escaped, and has no subject without one', () => {
    expect(claimSubject('\\frac{a=b}{2} = 1')).toBe('\\frac{a=b}{2}')
    expect(claimSubject('x \\= y')).toBeNull()
    expect(claimSubject('\\mathfrak{S}_{132}')).toBeNull()
    expect(claimSubject(' = 3')).toBeNull()
  })
})

describe('categorise', () => {
  it('names every transition', () => {
    expect(categorise('mismatch', 'verified')).toBe('fixed')
    expect(categorise('error', 'verified')).toBe('fixed')
    expect(categorise('verified', 'mismatch')).toBe('newlyFailing')
    expect(categorise('verified', 'error')).toBe('newlyFailing')
    expect(categorise('unsupported', 'mismatch')).toBe('newlyFailing')
    expect(categorise(null, 'error')).toBe('newlyFailing')
    expect(categorise('mismatch', 'error')).toBe('stillFailing')
    expect(categorise('verified', 'verified')).toBe('unchangedVerified')
    expect(categorise('unsupported', 'verified')).toBe('unchecked')
    expect(categorise('mismatch', 'unsupported')).toBe('unchecked')
    expect(categorise(null, 'verified')).toBe('added')
    expect(categorise(null, 'unsupported')).toBe('added')
    expect(categorise('verified', null)).toBe('removed')
    expect(() => categorise(null, null)).toThrow(/at least one side/)
  })
})

describe('compareRevisionClaims', () => {
  it('pairs an unchanged claim that moved lines by its content, not by the line it is on', () => {
    const from = [claim('a', 10, '\\Sch{132} = x_1 + x_2', 'verified'), claim('b', 12, '\\Sch{231} = x_1 x_2', 'verified')]
    // Both claims moved down, and a new claim now sits on line 10.
    const to = [claim('n', 10, '\\Sch{312} = x_1^2', 'verified'), claim('a2', 14, '\\Sch{132}  =  x_1 + x_2', 'verified'), claim('b2', 16, '\\Sch{231} = x_1 x_2', 'verified')]
    const { entries, counts } = compareRevisionClaims(from, to)
    expect(entries.map(e => [e.to?.id, e.from?.id ?? null, e.matchedBy, e.category])).toEqual([
      ['n', null, null, 'added'],
      ['a2', 'a', 'content', 'unchangedVerified'],
      ['b2', 'b', 'content', 'unchangedVerified'],
    ])
    expect(counts).toEqual({ fixed: 0, newlyFailing: 0, stillFailing: 0, unchangedVerified: 2, unchecked: 0, added: 1, removed: 0 })
  })

  it('recognises an edited equation by its label and marks it changed', () => {
    const from = [claim('a', 5, '\\Sch{1342} = x_1 x_2', 'mismatch', { label: 'eq:g' })]
    const to = [claim('b', 9, '\\mathfrak{S}_{1342} = x_1x_2 + x_1x_3 + x_2x_3', 'verified', { label: 'eq:g' })]
    const [entry] = compareRevisionClaims(from, to).entries
    expect(entry).toMatchObject({ category: 'fixed', matchedBy: 'label', changed: true })
    expect(entry?.from?.id).toBe('a')
  })

  it('recognises a corrected value by its left-hand side, preferring the same file and the nearest line', () => {
    const from = [
      claim('far', 3, '\\#\\PD(1432) = 6', 'mismatch', { kind: 'count' }),
      claim('near', 30, '\\#\\PD(1432) = 4', 'mismatch', { kind: 'count' }),
      claim('other-file', 30, '\\#\\PD(1432) = 7', 'mismatch', { kind: 'count', file: 'b.tex' }),
    ]
    const to = [claim('fixed', 31, '\\#\\PD(1432) = 5', 'verified', { kind: 'count' })]
    const { entries, counts } = compareRevisionClaims(from, to)
    expect(entries[0]).toMatchObject({ category: 'fixed', matchedBy: 'subject', changed: true })
    expect(entries[0]?.from?.id).toBe('near')
    expect(entries.slice(1).map(e => [e.from?.id, e.category])).toEqual([['far', 'removed'], ['other-file', 'removed']])
    expect(counts.removed).toBe(2)
  })

  it('does not pair claims that only share a line, or a subject of another kind', () => {
    const from = [claim('a', 7, '\\Sch{132} = x_1 + x_2', 'verified'), claim('c', 8, '\\ell(w) = 2', 'verified', { kind: 'length' })]
    const to = [claim('b', 7, '\\Sch{213} = x_1', 'mismatch'), claim('d', 8, '\\ell(w) = 3', 'verified', { kind: 'count' })]
    const { entries } = compareRevisionClaims(from, to)
    expect(entries.map(e => [e.to?.id ?? null, e.from?.id ?? null, e.category])).toEqual([
      ['b', null, 'newlyFailing'],
      ['d', null, 'added'],
      [null, 'a', 'removed'],
      [null, 'c', 'removed'],
    ])
  })

  it('pairs repeated claims in order, and a claim that starts failing is newly failing', () => {
    const same = '\\Sch{231} = x_1 x_2'
    const from = [claim('a1', 1, same, 'verified'), claim('a2', 2, same, 'verified')]
    const to = [claim('b1', 1, same, 'verified'), claim('b2', 2, same, 'error'), claim('b3', 3, same, 'verified')]
    const { entries, counts } = compareRevisionClaims(from, to)
    expect(entries.map(e => [e.to?.id, e.from?.id ?? null])).toEqual([['b1', 'a1'], ['b2', 'a2'], ['b3', null]])
    expect(counts).toMatchObject({ unchangedVerified: 1, newlyFailing: 1, added: 1, removed: 0 })
  })

  it('keeps a claim that was failing and still fails, and a label match wins over a subject match', () => {
    const from = [claim('x', 1, '\\Sch{1423} = x_1^2', 'mismatch', { label: 'eq:a' }), claim('y', 2, '\\Sch{1423} = x_2^2', 'mismatch')]
    const to = [claim('z', 5, '\\Sch{1423} = x_1^2 + x_2^2', 'mismatch', { label: 'eq:a' })]
    const { entries } = compareRevisionClaims(from, to)
    expect(entries.map(e => [e.to?.id ?? null, e.from?.id ?? null, e.matchedBy, e.category])).toEqual([
      ['z', 'x', 'label', 'stillFailing'],
      [null, 'y', null, 'removed'],
    ])
  })
})

describe('the demo manuscript, revision 1 against revision 2', () => {
  const demo = (path: string) => readFileSync(`server/assets/demo/vexillary-flags/${path}`, 'utf8')
  const checked = (rev: string) => checkManuscript({ files: { 'main.tex': demo(`${rev}/main.tex`), 'sections/double.tex': demo(`${rev}/sections/double.tex`) } })
    .claims.map(c => ({ ...c, contentKey: keyOf(c.kind, c.source) }))

  it('shows exactly the two corrected lines as fixed and everything else as the same verified claim', () => {
    const from = checked('rev1')
    const to = checked('rev2')
    const { entries, counts } = compareRevisionClaims(from, to)
    const fixed = entries.filter(e => e.category === 'fixed')
    expect(fixed.map(e => [e.from?.file, e.from?.line, e.to?.line, e.matchedBy])).toEqual([
      ['main.tex', 30, 30, 'subject'],
      ['main.tex', 41, 41, 'subject'],
    ])
    expect(counts.fixed + counts.unchangedVerified).toBe(to.length)
    expect(entries.filter(e => e.category === 'unchangedVerified').every(e => e.matchedBy === 'content' && !e.changed)).toBe(true)
    expect(counts.removed + counts.added + counts.newlyFailing + counts.stillFailing).toBe(0)
  })
})
