/**
 * Joins a claim's script snippet with the report's shared definitions into the runnable script.
 * Kept apart from reproduce.ts (which needs the engine to write snippets) so the browser's report
 * panel can join scripts without loading the engine.
 */
import type { ReportClaim, ReproduceLibrary } from '../types/report'

/**
 * The runnable, self-contained script of a claim: a comment naming the claim, the library's
 * imports, the helpers the snippet needs, the two sides, and the library's closing lines, which
 * print "matches" or the difference; null when the claim has no snippet or a helper is missing
 * from the library (a damaged report).
 * e.g. `reproduceScript(report.reproduceLibrary, claim)` is what the report panel shows.
 */
export function reproduceScript(library: ReproduceLibrary | undefined, claim: Pick<ReportClaim, 'source' | 'reproduce'>): string | null {
  const snippet = claim.reproduce
  if (!library || !snippet) return null
  const helpers = snippet.needs.map(name => library.helpers[name])
  if (helpers.some(code => code === undefined)) return null
  const comment = `# Recomputes, from the definitions and without Scholium: ${claim.source.replace(/\s+/g, ' ').trim().slice(0, 160)}`
  return [comment, library.imports, ...helpers, `left = ${snippet.left}`, `right = ${snippet.right}`, library.ending].join('\n\n') + '\n'
}
