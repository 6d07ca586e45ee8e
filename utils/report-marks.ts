/**
 * The marks the report puts beside a line of source, one per claim state.
 *
 * Conventions: a mark is never colour alone — each has a glyph, a word (both from
 * shared/check/marks.ts, so the command line shows the same) and a colour;
 * `MARK_ORDER` lists them worst first, and a line with several claims shows its worst one.
 * "otherConvention" is a mismatch that holds under another convention (non-empty `holdsUnder`).
 */
import type { ReportClaim } from '#shared/types/report'
import { CONVENTION_AXES, axisOfConvention, type ConventionId } from '#shared/types/conventions'
import { LINE_MARKS, MARK_ORDER, markOf, worstMark, type LineMark } from '#shared/check/marks'

export { MARK_ORDER, markOf, worstMark, type LineMark }

const TONES: Record<LineMark, string> = {
  mismatch: 'bg-madder-500 text-vellum-50 border-madder-700',
  otherConvention: 'bg-ochre-100 text-ochre-700 border-ochre-500',
  error: 'bg-slateblue-100 text-slateblue-700 border-slateblue-500',
  unsupported: 'bg-vellum-100 text-ink-400 border-vellum-300 border-dashed',
  skipped: 'bg-vellum-100 text-ink-400 border-vellum-300 border-dashed',
  verified: 'bg-verdigris-100 text-verdigris-700 border-verdigris-500/50',
}

/** Glyph and word (shared with the command line) and Tailwind classes of each mark; e.g. `MARKS.mismatch.glyph === '≠'`. */
export const MARKS = Object.fromEntries(
  (Object.keys(LINE_MARKS) as LineMark[]).map(mark => [mark, { ...LINE_MARKS[mark], tone: TONES[mark] }]),
) as Record<LineMark, { glyph: string, word: string, meaning: string, tone: string }>

/** Whether a mark means the manuscript and the engine disagree under the paper's conventions. */
export function isDisagreement(mark: LineMark): boolean {
  return mark === 'mismatch' || mark === 'otherConvention'
}

/** Axis label and choice text of a convention id; e.g. 'xy-plus' → Double polynomial factors: x_i + y_j. */
export function conventionLabel(id: ConventionId | string): { axis: string, choice: string } {
  const axis = axisOfConvention(id)
  if (!axis) return { axis: 'Unknown convention', choice: id }
  const def = CONVENTION_AXES[axis]
  return { axis: def.label, choice: (def.choices as Record<string, string>)[id] ?? id }
}

/** Claims grouped by file, then by first line. */
export function claimsByLine(claims: readonly ReportClaim[]): Map<string, Map<number, ReportClaim[]>> {
  const out = new Map<string, Map<number, ReportClaim[]>>()
  for (const claim of claims) {
    const lines = out.get(claim.file) ?? new Map<number, ReportClaim[]>()
    lines.set(claim.line, [...(lines.get(claim.line) ?? []), claim])
    out.set(claim.file, lines)
  }
  return out
}
