/**
 * The claims index: one row per claim of a finished run, for what joins on claims (members'
 * threads, referee notes, revision comparison). The claims themselves live in the run's report
 * document (check_runs.report, read by `loadRunReport` in ./check-runs). Relative imports only:
 * the worker process loads this file.
 */
import { createHash } from 'node:crypto'
import type { Db } from '../database/connect'
import type { ReportClaim } from '../../shared/types/report'

/** A claim's identity across revisions: its kind and normalised source, not its line. */
export function claimContentKey(claim: Pick<ReportClaim, 'kind' | 'source'>): string {
  return createHash('sha256').update(`${claim.kind}\n${claim.source.replace(/\s+/g, ' ').trim()}`).digest('hex').slice(0, 32)
}

/**
 * Replaces every index row of a run with the report's claims. Call inside the
 * transaction that finishes the run, so a retried run never duplicates or loses claims.
 */
export async function replaceRunClaims(db: Db, checkRunId: string, claims: readonly ReportClaim[]): Promise<void> {
  await db.deleteFrom('claims').where('check_run_id', '=', checkRunId).execute()
  const now = new Date()
  for (let start = 0; start < claims.length; start += 500) {
    await db.insertInto('claims').values(claims.slice(start, start + 500).map((c, i) => ({
      check_run_id: checkRunId,
      ordinal: start + i,
      report_id: c.id,
      file: c.file,
      line: c.line,
      end_line: c.endLine,
      source: c.source,
      kind: c.kind,
      label: c.label ?? null,
      content_key: claimContentKey(c),
      verdict: c.verdict,
      checked_at: now,
    }))).execute()
  }
}
