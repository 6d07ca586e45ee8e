/**
 * The report as text for people: per file, each line that carries a claim with its mark,
 * the reason when it is not verified and the term-by-term difference, then a summary.
 *
 * Marks (a glyph and a word, so that the text survives without colour):
 *   = verified   ≠ mismatch   ⇄ other convention (holds only under another convention)
 *   ? unsupported   ? skipped   ! error (could not be computed: too large, malformed)
 * — the same marks as the web report (shared/check/marks.ts).
 * Colour is applied by the caller's `paint` (a no-op when stdout is not a terminal or NO_COLOR is set).
 */
import { CONVENTION_AXES, REFERENCE_CONVENTIONS, type ConventionAxis } from '../../shared/types/conventions'
import type { ClaimDiff, Report, ReportClaim } from '../../shared/types/report'
import { LINE_MARKS, markOf, type LineMark } from '../../shared/check/marks'

export type Tone = 'good' | 'bad' | 'shift' | 'quiet' | 'strong' | 'warn'
export type Paint = (tone: Tone, text: string) => string

const ANSI: Record<Tone, [string, string]> = {
  good: ['\u001b[32m', '\u001b[39m'],
  bad: ['\u001b[31m', '\u001b[39m'],
  shift: ['\u001b[35m', '\u001b[39m'],
  quiet: ['\u001b[2m', '\u001b[22m'],
  strong: ['\u001b[1m', '\u001b[22m'],
  warn: ['\u001b[33m', '\u001b[39m'],
}

/** ANSI colours, or none; e.g. `painter(process.stdout.isTTY && !process.env.NO_COLOR)`. */
export function painter(colour: boolean): Paint {
  return colour ? (tone, text) => `${ANSI[tone][0]}${text}${ANSI[tone][1]}` : (_tone, text) => text
}

const TONES: Record<LineMark, Tone> = { verified: 'good', mismatch: 'bad', otherConvention: 'shift', unsupported: 'quiet', skipped: 'quiet', error: 'warn' }

/** The mark of a report line, the same glyph and word as the web report; e.g. `mark(claim).word === 'mismatch'`. */
export function mark(claim: ReportClaim): { glyph: string, word: string, tone: Tone } {
  const which = markOf(claim)
  return { ...LINE_MARKS[which], tone: TONES[which] }
}

const SOURCE_WIDTH = 90
const COMPUTED_WIDTH = 160

/** The whole text report; `source` is what the user pointed at. */
export function renderReport(report: Report, source: string, paint: Paint, skipped: { path: string, reason: string }[] = [], options: { showUnread?: boolean } = {}): string {
  const out: string[] = []
  const { summary } = report
  out.push(paint('strong', `Scholium check of ${source}`) + paint('quiet', ` — ${report.files.length} file${report.files.length === 1 ? '' : 's'}, ${summary.claims} claim${summary.claims === 1 ? '' : 's'}, engine ${report.engine.version}`))

  const byFile = new Map<string, ReportClaim[]>()
  for (const claim of report.claims) {
    const list = byFile.get(claim.file) ?? []
    list.push(claim)
    byFile.set(claim.file, list)
  }
  const width = String(Math.max(1, ...report.claims.map(c => c.line))).length
  for (const file of report.files) {
    const claims = byFile.get(file.path)
    if (!claims) continue
    byFile.delete(file.path)
    out.push('', paint('strong', file.path))
    for (const claim of claims) out.push(...renderClaim(claim, width, paint))
  }
  for (const [path, claims] of byFile) { // claims in a file the file list does not name (should not happen)
    out.push('', paint('strong', path))
    for (const claim of claims) out.push(...renderClaim(claim, width, paint))
  }

  if (report.warnings.length > 0 || skipped.length > 0) {
    out.push('', paint('warn', 'Notes'))
    for (const w of report.warnings) out.push(`  ${w.file ? `${w.file}${w.line ? `:${w.line}` : ''}: ` : ''}${w.message}`)
    for (const s of skipped) out.push(`  ${s.path}: left out, ${s.reason}`)
  }

  const unread = report.notRead ?? []
  if (options.showUnread && unread.length > 0) {
    out.push('', paint('quiet', 'Not read (no verdict; Scholium could not be sure what this math says)'))
    for (const n of unread) out.push(`  ${n.file}:${n.line}  ${shorten(oneLine(n.source), SOURCE_WIDTH)}`, paint('quiet', `      ${n.reason}`))
  }

  out.push('', paint('strong', 'Summary'))
  const parts = [
    paint('good', `${summary.verified} verified`),
    paint(summary.mismatch > 0 ? 'bad' : 'quiet', `${summary.mismatch} mismatch${summary.otherConvention > 0 ? ` (${summary.otherConvention} holding under another convention)` : ''}`),
    paint(summary.error > 0 ? 'warn' : 'quiet', `${summary.error} error`),
    paint('quiet', `${summary.unsupported} unsupported${summary.skipped > 0 ? ` (${summary.skipped} skipped)` : ''}`),
  ]
  out.push(`  ${parts.join(', ')} — ${summary.durationMs} ms`)
  const unreadCount = summary.notRead ?? unread.length
  out.push(paint('quiet', `  ${unreadCount} piece${unreadCount === 1 ? '' : 's'} of math not read${unreadCount > 0 && !options.showUnread ? ' (list them with --show-unread)' : ''}`))
  if (summary.claims === 0) out.push('  No checkable claim was found.')
  out.push(`  Conventions: ${describeConventions(report)}`)
  out.push(paint('quiet', '  A verified example shows that the example was computed correctly; it does not prove the statement around it.'))
  return out.join('\n') + '\n'
}

function renderClaim(claim: ReportClaim, width: number, paint: Paint): string[] {
  const look = mark(claim)
  const lines = claim.endLine > claim.line ? `${claim.line}–${claim.endLine}` : String(claim.line)
  const head = `  ${lines.padStart(width)}  ${paint(look.tone, `${look.glyph} ${look.word.padEnd(16)}`)} ${shorten(oneLine(claim.source), SOURCE_WIDTH)}`
  const indent = ' '.repeat(width + 4)
  if (claim.verdict === 'verified') return [head]
  const out = [head, `${indent}${claim.message}`]
  if (claim.verdict === 'mismatch') {
    out.push(...renderDiff(claim.diff, indent, paint))
    if (claim.computed !== null && claim.diff?.basis !== 'number') out.push(paint('quiet', `${indent}computed: ${shorten(claim.computed, COMPUTED_WIDTH)}`))
    if (claim.correction?.fixed) out.push(`${indent}corrected: ${paint('good', shorten(claim.correction.statement, COMPUTED_WIDTH))}`)
    else if (claim.correction) out.push(paint('quiet', `${indent}no automatic correction: ${claim.correction.reason}`))
  }
  return out
}

function renderDiff(diff: ClaimDiff | null, indent: string, paint: Paint): string[] {
  if (!diff) return []
  switch (diff.basis) {
    case 'number': return [`${indent}written ${paint('bad', diff.claimed)}, computed ${paint('good', diff.computed)}`]
    case 'invariant': return [`${indent}${diff.invariant}: written ${paint('bad', diff.claimed)}, computed ${paint('good', diff.computed)}`]
    case 'property': return [`${indent}${diff.property} fails: ${paint('bad', diff.computed)}`]
    default: {
      const out: string[] = []
      const more = (shown: number, total: number | undefined) => total !== undefined && total > shown ? paint('quiet', ` … and ${total - shown} more`) : ''
      if (diff.missing.length > 0) out.push(`${indent}missing   ${diff.missing.map(t => paint('good', signed(t.coefficient, t.term))).join('  ')}${more(diff.missing.length, diff.truncated?.missing)}`)
      if (diff.extra.length > 0) out.push(`${indent}extra     ${diff.extra.map(t => paint('bad', signed(t.coefficient, t.term))).join('  ')}${more(diff.extra.length, diff.truncated?.extra)}`)
      for (const w of diff.wrongCoefficient) out.push(`${indent}coefficient of ${w.term}: written ${paint('bad', w.claimed)}, computed ${paint('good', w.computed)}`)
      if (diff.truncated && diff.truncated.wrongCoefficient > diff.wrongCoefficient.length) out.push(paint('quiet', `${indent}… and ${diff.truncated.wrongCoefficient - diff.wrongCoefficient.length} more wrong coefficients`))
      for (const note of diff.notes ?? []) out.push(`${indent}${note}`)
      return out
    }
  }
}

function signed(coefficient: string, term: string): string {
  const negative = coefficient.startsWith('-')
  const magnitude = negative ? coefficient.slice(1) : coefficient
  return `${negative ? '−' : '+'}${magnitude === '1' && term !== '1' ? '' : magnitude}${term}`
}

function describeConventions(report: Report): string {
  const { inferred, fixed, used, evidence } = report.conventions
  return (Object.keys(CONVENTION_AXES) as ConventionAxis[]).map((axis) => {
    const id = used[axis]
    const how = fixed[axis] !== undefined
      ? 'fixed'
      : inferred[axis] !== undefined
        ? `inferred from ${evidence[id] ?? 0} claim${(evidence[id] ?? 0) === 1 ? '' : 's'}`
        : id === REFERENCE_CONVENTIONS[axis] ? 'default' : 'set'
    return `${id} (${how})`
  }).join(', ')
}

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim()
}

function shorten(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, max - 1)}…`
}
