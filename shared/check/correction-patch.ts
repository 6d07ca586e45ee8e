/**
 * The patch of suggested corrections (see correction.ts): a unified diff built from the report's
 * claims alone, so the browser can offer it without the sources. Kept apart from correction.ts so
 * that the report page does not load the reader and the engine to build it.
 */
import type { ClaimCorrection, ReportClaim } from '../types/report'

/** Unchanged lines shown on each side of a changed one in the patch (git's default). */
export const CONTEXT_LINES = 3

type FixedCorrection = Extract<ClaimCorrection, { fixed: true }>

/**
 * The fixed corrections of `claims` as a unified diff (`git apply` reads it), one hunk per changed
 * line unless lines are close enough for their context to meet. `locate` names a file in the
 * caller's tree (the command line puts the checked folder in front). Empty when nothing is fixed.
 */
export function correctionsPatch(claims: readonly Pick<ReportClaim, 'correction'>[], locate: (path: string) => string = p => p): string {
  const byFile = new Map<string, Map<number, FixedCorrection>>()
  for (const c of claims) {
    if (!c.correction?.fixed) continue
    const lines = byFile.get(c.correction.file) ?? new Map<number, FixedCorrection>()
    lines.set(c.correction.line, c.correction)
    byFile.set(c.correction.file, lines)
  }
  const out: string[] = []
  for (const [path, changes] of byFile) {
    const name = locate(path)
    out.push(`diff --git a/${name} b/${name}`, `--- a/${name}`, `+++ b/${name}`)
    const sorted = [...changes.values()].sort((a, b) => a.line - b.line)
    const groups: FixedCorrection[][] = []
    for (const c of sorted) {
      const last = groups[groups.length - 1]
      if (last && c.line - last[last.length - 1]!.line <= 2 * CONTEXT_LINES + 1) last.push(c)
      else groups.push([c])
    }
    for (const group of groups) out.push(...hunk(group))
  }
  return out.length === 0 ? '' : `${out.join('\n')}\n`
}

function hunk(group: readonly FixedCorrection[]): string[] {
  const known = new Map<number, string>()
  const changed = new Map<number, FixedCorrection>()
  for (const c of group) {
    c.above.forEach((l, i) => known.set(c.line - c.above.length + i, l))
    c.below.forEach((l, i) => known.set(c.line + 1 + i, l))
    changed.set(c.line, c)
  }
  const first = group[0]!
  const last = group[group.length - 1]!
  const from = first.line - first.above.length
  const to = last.line + last.below.length
  const endsAt = group.some(c => c.noNewlineAtEnd) ? to : -1
  const body: string[] = []
  const noNewline = '\\ No newline at end of file'
  for (let n = from; n <= to; n++) {
    const c = changed.get(n)
    const lastLine = n === endsAt
    const ending = c?.crlf && !lastLine ? '\r' : ''
    if (c) {
      body.push(`-${c.before}${ending}`)
      if (lastLine) body.push(noNewline)
      body.push(`+${c.after}${ending}`)
    }
    else body.push(` ${known.get(n) ?? ''}`)
    if (lastLine) body.push(noNewline)
  }
  const count = to - from + 1
  return [`@@ -${from},${count} +${from},${count} @@`, ...body]
}
