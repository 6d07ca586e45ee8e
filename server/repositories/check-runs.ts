import type { Db } from '../database/connect'
import type { CheckRunView } from '#shared/types/api'

export async function insertCheckRun(db: Db, input: { revisionId: string, requestedBy: string | null, conventions?: Record<string, unknown> }): Promise<{ id: string }> {
  return db.insertInto('check_runs')
    .values({ revision_id: input.revisionId, requested_by: input.requestedBy, conventions: JSON.stringify(input.conventions ?? {}), timings: '{}', summary: '{}' })
    .returning('id')
    .executeTakeFirstOrThrow()
}

/** The newest run of each revision. */
export async function latestRunsByRevision(db: Db, revisionIds: string[]): Promise<Map<string, CheckRunView>> {
  const runs = new Map<string, CheckRunView>()
  if (revisionIds.length === 0) return runs
  const rows = await db.selectFrom('check_runs').selectAll()
    .distinctOn('revision_id')
    .where('revision_id', 'in', revisionIds)
    .orderBy('revision_id').orderBy('queued_at', 'desc')
    .execute()
  for (const r of rows) {
    runs.set(r.revision_id, {
      id: r.id,
      status: r.status,
      engineVersion: r.engine_version,
      claimsTotal: r.claims_total,
      claimsDone: r.claims_done,
      queuedAt: r.queued_at.toISOString(),
      startedAt: r.started_at?.toISOString() ?? null,
      finishedAt: r.finished_at?.toISOString() ?? null,
      error: r.error,
      summary: r.summary,
    })
  }
  return runs
}
