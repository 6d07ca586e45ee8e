import { createHash } from 'node:crypto'
import type { Db } from '../database/connect'
import type { Report, ReportClaim } from '#shared/types/report'

/** What a claim row keeps beyond its columns. */
type ClaimDetails = Pick<ReportClaim, 'id' | 'diff' | 'message' | 'conventions' | 'breaksPaperConvention' | 'permutations' | 'skipped' | 'correction'>

/** A claim's identity across revisions: its kind and normalised source, not its line. */
export function claimContentKey(claim: Pick<ReportClaim, 'kind' | 'source'>): string {
  return createHash('sha256').update(`${claim.kind}\n${claim.source.replace(/\s+/g, ' ').trim()}`).digest('hex').slice(0, 32)
}

/**
 * Replaces every claim of a run with the report's claims. Call inside the
 * transaction that finishes the run, so a retried run never duplicates or loses claims.
 */
export async function replaceRunClaims(db: Db, checkRunId: string, claims: readonly ReportClaim[]): Promise<void> {
  await db.deleteFrom('claims').where('check_run_id', '=', checkRunId).execute()
  const now = new Date()
  for (let start = 0; start < claims.length; start += 500) {
    await db.insertInto('claims').values(claims.slice(start, start + 500).map((c, i) => {
      const details: ClaimDetails = {
        id: c.id, diff: c.diff, message: c.message, conventions: c.conventions, permutations: c.permutations,
        ...(c.breaksPaperConvention ? { breaksPaperConvention: c.breaksPaperConvention } : {}),
        ...(c.skipped ? { skipped: true } : {}),
        ...(c.correction ? { correction: c.correction } : {}),
      }
      return {
        check_run_id: checkRunId,
        ordinal: start + i,
        file: c.file,
        line: c.line,
        end_line: c.endLine,
        source: c.source,
        kind: c.kind,
        label: c.label ?? null,
        content_key: claimContentKey(c),
        verdict: c.verdict,
        holds_under: JSON.stringify(c.holdsUnder),
        computed: c.computed,
        details: JSON.stringify(details),
        checked_at: now,
      }
    })).execute()
  }
}

/** The stored report of a finished run: its summary row plus its claims in order. */
export async function loadRunReport(db: Db, checkRunId: string): Promise<Report | null> {
  const run = await db.selectFrom('check_runs').select(['status', 'summary']).where('id', '=', checkRunId).executeTakeFirst()
  if (!run || run.status !== 'finished') return null
  const rows = await db.selectFrom('claims').selectAll().where('check_run_id', '=', checkRunId).orderBy('ordinal').execute()
  const head = run.summary as unknown as Omit<Report, 'claims'>
  return {
    ...head,
    claims: rows.map((r) => {
      const d = r.details as unknown as ClaimDetails
      return {
        id: d.id,
        file: r.file,
        line: r.line,
        endLine: r.end_line,
        kind: r.kind as ReportClaim['kind'],
        verdict: r.verdict ?? 'error',
        holdsUnder: r.holds_under as ReportClaim['holdsUnder'],
        source: r.source,
        computed: r.computed,
        diff: d.diff,
        message: d.message,
        ...(r.label ? { label: r.label } : {}),
        conventions: d.conventions,
        ...(d.breaksPaperConvention ? { breaksPaperConvention: d.breaksPaperConvention } : {}),
        permutations: d.permutations,
        ...(d.skipped ? { skipped: true as const } : {}),
        ...(d.correction ? { correction: d.correction } : {}),
      }
    }),
  }
}

/** The newest finished members' run of a revision: the current report (what-if runs never are). */
export async function latestFinishedRun(db: Db, revisionId: string): Promise<{ id: string } | undefined> {
  return db.selectFrom('check_runs').select('id').where('revision_id', '=', revisionId).where('status', '=', 'finished').where('what_if', '=', false)
    .orderBy('finished_at', 'desc').limit(1).executeTakeFirst()
}
