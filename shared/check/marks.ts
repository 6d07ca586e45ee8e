/**
 * The mark a report puts beside a line that carries a claim: one glyph and one word per
 * state, the same in the web report and the command line, so a referee reading either sees
 * the same thing. The words are the JSON verdicts, plus "other convention" for a mismatch
 * that holds under another convention and "skipped" for a claim a tag skipped.
 */
import type { ReportClaim } from '../types/report'

export type LineMark = 'mismatch' | 'otherConvention' | 'error' | 'unsupported' | 'skipped' | 'verified'

/** Worst first: a line with several claims shows the first of these that occurs. */
export const MARK_ORDER: readonly LineMark[] = ['mismatch', 'otherConvention', 'error', 'unsupported', 'skipped', 'verified']

export const LINE_MARKS: Record<LineMark, { glyph: string, word: string, meaning: string }> = {
  mismatch: { glyph: '≠', word: 'mismatch', meaning: 'the manuscript and the computation disagree' },
  otherConvention: { glyph: '⇄', word: 'other convention', meaning: 'holds only under another convention' },
  error: { glyph: '!', word: 'error', meaning: 'could not be computed (too large, malformed)' },
  unsupported: { glyph: '?', word: 'unsupported', meaning: 'notation Scholium cannot check' },
  skipped: { glyph: '?', word: 'skipped', meaning: 'skipped at the author\'s request' },
  verified: { glyph: '=', word: 'verified', meaning: 'the manuscript and the computation agree' },
}

/** The mark of one claim; e.g. a mismatch with `holdsUnder: ['xy-plus']` is 'otherConvention'. */
export function markOf(claim: Pick<ReportClaim, 'verdict' | 'holdsUnder'> & { skipped?: boolean }): LineMark {
  if (claim.verdict === 'mismatch') return claim.holdsUnder.length > 0 ? 'otherConvention' : 'mismatch'
  if (claim.verdict === 'unsupported' && claim.skipped) return 'skipped'
  return claim.verdict
}

/** The worst mark among claims; e.g. verified + mismatch gives 'mismatch'. */
export function worstMark(claims: readonly Parameters<typeof markOf>[0][]): LineMark {
  return MARK_ORDER.find(mark => claims.some(c => markOf(c) === mark)) ?? 'verified'
}
