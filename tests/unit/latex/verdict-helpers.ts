// Verdicts for one snippet, end to end (reader → engine → decision), for notation tests that
// must show a true claim verified and a wrong one flagged.
import { checkManuscript } from '../../../shared/check/index'

/** The verdicts of every claim read from a snippet, in order. */
export function verdictsOf(tex: string): string[] {
  return checkManuscript({ files: { 'snippet.tex': tex } }).claims.map(c => c.verdict)
}
