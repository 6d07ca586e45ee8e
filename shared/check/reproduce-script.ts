/**
 * Joins a claim's script snippet with the report's shared definitions into the runnable script.
 * Kept apart from reproduce.ts (which needs the engine to write snippets) so the browser's report
 * panel can join scripts without loading the engine.
 */
import type { ReproduceLibrary, ReproduceSnippet } from '../types/report'

/**
 * The runnable, self-contained script of a claim: its first line (what it recomputes), the
 * library's imports, the helpers the snippet needs, then the snippet's lines; null when a helper
 * is missing from the library (a damaged report).
 * e.g. `reproduceScript(report.reproduceLibrary, claim.reproduce)` is what the report panel shows.
 */
export function reproduceScript(library: ReproduceLibrary, snippet: ReproduceSnippet): string | null {
  const helpers = snippet.needs.map(name => library.helpers[name])
  if (helpers.some(code => code === undefined)) return null
  const [comment, ...lines] = snippet.lines.trimEnd().split('\n')
  return [comment, library.imports, ...helpers, ...lines].join('\n\n') + '\n'
}
