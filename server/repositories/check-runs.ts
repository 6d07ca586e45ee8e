/**
 * Queries on check_runs: the run row is the authoritative state of a check (status,
 * lease, attempts, progress). The lifecycle around these queries lives in
 * server/services/check-runs.ts. Relative imports only: the worker process loads this file.
 */
import { sql } from 'kysely'
import type { Db } from '../database/connect'
import type { CheckRunHead } from '../database/schema'
import type { Report } from '../../shared/types/report'
import { parseReport } from '../../shared/types/report-schema'

export interface NewCheckRun {
  revisionId: string
  requestedBy: string | null
  conventions?: Record<string, unknown>
  /** A non-member's re-check: it never becomes the members' current report. */
  whatIf?: boolean
}

/** Inserts a queued run. Call inside the transaction that also sends its job (see requestCheckRun). */
export async function insertCheckRun(db: Db, input: NewCheckRun): Promise<{ id: string }> {
  return db.insertInto('check_runs')
    .values({ revision_id: input.revisionId, requested_by: input.requestedBy, conventions: JSON.stringify(input.conventions ?? {}), timings: '{}', what_if: input.whatIf ?? false })
    .returning('id')
    .executeTakeFirstOrThrow()
}

// Every column but the report document: progress polls and lists never read a whole report.
// A column left out fails to compile where the rows are returned as CheckRunHead.
const HEAD_COLUMNS = [
  'id', 'revision_id', 'status', 'engine_version', 'conventions', 'claims_total', 'claims_done', 'timings', 'summary', 'error',
  'attempts', 'requested_by', 'queued_at', 'started_at', 'finished_at', 'lease_owner', 'lease_until', 'what_if',
] as const satisfies readonly (keyof CheckRunHead)[]

/** The newest members' run row of each revision (what-if runs left out). */
export async function latestRunRowsByRevision(db: Db, revisionIds: string[]): Promise<CheckRunHead[]> {
  if (revisionIds.length === 0) return []
  return db.selectFrom('check_runs').select(HEAD_COLUMNS)
    .distinctOn('revision_id')
    .where('revision_id', 'in', revisionIds)
    .where('what_if', '=', false)
    .orderBy('revision_id').orderBy('queued_at', 'desc')
    .execute()
}

/**
 * The report route's question about a revision's runs, in one query: its newest members' run and
 * the id of its newest finished members' run (the current report; what-if runs are neither).
 * Undefined when the revision has no members' run.
 */
export async function latestAndReportRun(db: Db, revisionId: string): Promise<{ latest: CheckRunHead, reportRunId: string | null } | undefined> {
  const row = await db.selectFrom('check_runs').select(HEAD_COLUMNS)
    .select(eb => eb.selectFrom('check_runs as f').select('f.id')
      .where('f.revision_id', '=', revisionId).where('f.status', '=', 'finished').where('f.what_if', '=', false)
      .orderBy('f.finished_at', 'desc').limit(1).as('report_run_id'))
    .where('revision_id', '=', revisionId).where('what_if', '=', false)
    .orderBy('queued_at', 'desc').limit(1)
    .executeTakeFirst()
  if (!row) return undefined
  const { report_run_id: reportRunId, ...latest } = row
  return { latest, reportRunId: reportRunId ?? null }
}

/** One run row, or undefined. */
export async function findCheckRun(db: Db, checkRunId: string): Promise<CheckRunHead | undefined> {
  return db.selectFrom('check_runs').select(HEAD_COLUMNS).where('id', '=', checkRunId).executeTakeFirst()
}

/** The report of a finished run, validated (`parseReport` throws on a damaged document); null for any other run. */
export async function loadRunReport(db: Db, checkRunId: string): Promise<Report | null> {
  const run = await db.selectFrom('check_runs').select(['status', 'report']).where('id', '=', checkRunId).executeTakeFirst()
  if (!run || run.status !== 'finished' || run.report === null) return null
  return parseReport(run.report)
}

/** The newest finished members' run of a revision: the current report (what-if runs never are). */
export async function latestFinishedRun(db: Db, revisionId: string): Promise<{ id: string } | undefined> {
  return db.selectFrom('check_runs').select('id').where('revision_id', '=', revisionId).where('status', '=', 'finished').where('what_if', '=', false)
    .orderBy('finished_at', 'desc').limit(1).executeTakeFirst()
}

/**
 * Takes the run for `workerId` if it is waiting (and its retry delay, if any, is over),
 * or if its previous worker's lease ran out. Counts one attempt.
 */
export async function takeLease(db: Db, checkRunId: string, workerId: string, leaseSeconds: number) {
  return db.updateTable('check_runs')
    .set(eb => ({
      status: 'running',
      lease_owner: workerId,
      lease_until: sql<Date>`now() + make_interval(secs => ${leaseSeconds})`,
      attempts: eb('attempts', '+', 1),
      started_at: new Date(),
      claims_done: 0,
    }))
    .where('id', '=', checkRunId)
    .where(eb => eb.or([
      eb.and([eb('status', '=', 'queued'), eb.or([eb('lease_until', 'is', null), eb('lease_until', '<', sql<Date>`now()`)])]),
      eb.and([eb('status', '=', 'running'), eb('lease_until', '<', sql<Date>`now()`)]),
    ]))
    .returning(['id', 'revision_id', 'conventions', 'attempts'])
    .executeTakeFirst()
}

/** Extends the lease while `workerId` still holds it. */
export async function renewLease(db: Db, checkRunId: string, workerId: string, leaseSeconds: number): Promise<void> {
  await db.updateTable('check_runs')
    .set({ lease_until: sql<Date>`now() + make_interval(secs => ${leaseSeconds})` })
    .where('id', '=', checkRunId).where('lease_owner', '=', workerId)
    .execute()
}

/** Records progress while `workerId` holds the lease. */
export async function recordProgress(db: Db, checkRunId: string, workerId: string, done: number, total: number): Promise<void> {
  await db.updateTable('check_runs').set({ claims_done: done, claims_total: total })
    .where('id', '=', checkRunId).where('lease_owner', '=', workerId).execute()
}

/** The revision's main file and its stored files, for the worker to fetch. */
export async function loadRunSources(db: Db, revisionId: string) {
  const revision = await db.selectFrom('revisions').select(['id', 'main_file']).where('id', '=', revisionId).executeTakeFirstOrThrow()
  const files = await db.selectFrom('revision_files').select(['path', 'storage_key', 'sha256']).where('revision_id', '=', revisionId).execute()
  return { mainFile: revision.main_file, files }
}

/** Inside the finishing transaction: locks the run if `workerId` still holds its lease. */
export async function lockIfLeased(trx: Db, checkRunId: string, workerId: string): Promise<boolean> {
  const row = await trx.selectFrom('check_runs').select('id').where('id', '=', checkRunId).where('lease_owner', '=', workerId).forUpdate().executeTakeFirst()
  return row !== undefined
}

/** Marks the run finished with its report and timings, releasing the lease. */
export async function markFinished(trx: Db, checkRunId: string, input: { report: Report, timings: Record<string, number> }): Promise<void> {
  await trx.updateTable('check_runs').set({
    status: 'finished',
    engine_version: input.report.engine.version,
    report: JSON.stringify(input.report),
    claims_total: input.report.claims.length,
    claims_done: input.report.claims.length,
    timings: JSON.stringify(input.timings),
    error: null,
    finished_at: new Date(),
    lease_owner: null,
    lease_until: null,
  }).where('id', '=', checkRunId).execute()
}

/**
 * Ends an attempt that failed while `workerId` held the lease: `final` marks the run failed;
 * otherwise it waits `retryAfterSeconds` as queued (lease_until is then the earliest retry).
 */
export async function markAttemptFailed(db: Db, checkRunId: string, workerId: string, input: { error: string, final: boolean, retryAfterSeconds: number }): Promise<void> {
  await db.updateTable('check_runs').set({
    status: input.final ? 'failed' : 'queued',
    error: input.error,
    lease_owner: null,
    lease_until: input.final ? null : sql<Date>`now() + make_interval(secs => ${input.retryAfterSeconds})`,
    ...(input.final ? { finished_at: new Date() } : {}),
  }).where('id', '=', checkRunId).where('lease_owner', '=', workerId).execute()
}

/**
 * Runs due again: those whose worker died (lease ran out) go back to 'queued', and
 * queued runs whose retry delay is over lose the delay. Returns their ids, to be re-sent.
 */
export async function releaseDueRuns(db: Db): Promise<string[]> {
  const rows = await db.updateTable('check_runs')
    .set({ status: 'queued', lease_owner: null, lease_until: null })
    .where('status', 'in', ['running', 'queued'])
    .where('lease_until', '<', sql<Date>`now()`)
    .returning('id')
    .execute()
  return rows.map(r => r.id)
}

/** Runs waiting with no retry delay, oldest first (re-sent when a worker starts, in case a job was lost). */
export async function listQueuedRuns(db: Db): Promise<string[]> {
  const rows = await db.selectFrom('check_runs').select('id').where('status', '=', 'queued').where('lease_until', 'is', null).orderBy('queued_at').execute()
  return rows.map(r => r.id)
}

/** The check queue's depth as the run rows tell it: waiting, being checked, and running on a lease that ran out. */
export async function countUnfinishedRuns(db: Db): Promise<{ waiting: number, running: number, leaseExpired: number }> {
  const row = await db.selectFrom('check_runs')
    .select(eb => [
      eb.fn.countAll<number>().filterWhere('status', '=', 'queued').as('waiting'),
      eb.fn.countAll<number>().filterWhere(w => w.and([w('status', '=', 'running'), w('lease_until', '>=', sql<Date>`now()`)])).as('running'),
      eb.fn.countAll<number>().filterWhere(w => w.and([w('status', '=', 'running'), w('lease_until', '<', sql<Date>`now()`)])).as('leaseExpired'),
    ])
    .where('status', 'in', ['queued', 'running'])
    .executeTakeFirstOrThrow()
  return { waiting: Number(row.waiting), running: Number(row.running), leaseExpired: Number(row.leaseExpired) }
}
