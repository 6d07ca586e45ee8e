/**
 * The one owner of a check run's lifecycle: request a run (row and queue job in one
 * transaction), run it (called by the worker process), report its progress and status.
 *
 * Retries and expiry: the run row's lease is the only authority. pg-boss delivers jobs,
 * nothing more: jobs are sent with retryLimit 0 and the worker's handler never throws, so
 * pg-boss never redelivers on its own. A worker that dies leaves a lease that runs out; a
 * failed attempt leaves the run queued with a retry time in lease_until; in both cases the
 * sweeper (`sweepDueRuns`) re-sends the run, and `takeLease` counts the attempt, up to
 * MAX_ATTEMPTS. Why the lease and not pg-boss: the lease is in the run row the UI reads, it
 * fences a slow worker out of the final write, and it survives a lost or duplicated job.
 *
 * Imports are relative and no Nitro auto-imports are used: scripts/worker.ts and the CLI load this.
 */
import { MessageChannel } from 'node:worker_threads'
import { CompiledQuery } from 'kysely'
import type Piscina from 'piscina'
import type { Db } from '../database/connect'
import type { CheckRunHead } from '../database/schema'
import type { SourceStore } from '../storage/source-store'
import type { ConventionSet } from '../../shared/types/conventions'
import type { CheckRunView, CheckRunStatus } from '../../shared/types/api'
import { replaceRunClaims } from '../repositories/claims'
import {
  findCheckRun, insertCheckRun, latestAndReportRun, latestRunRowsByRevision, listQueuedRuns, loadRunSources, lockIfLeased, markAttemptFailed,
  markFinished, recordProgress, releaseDueRuns, renewLease, takeLease, type NewCheckRun,
} from '../repositories/check-runs'
import { anyLiveWorker } from '../repositories/workers'
import { CHECK_JOB_OPTIONS, CHECK_QUEUE, type CheckJobData } from '../jobs/queue-names'
import type { CheckTask, CheckThreadResult } from '../jobs/check-thread'

/** What this module needs of pg-boss: `send`, with its `db` option (an executor inside our transaction). */
export interface CheckQueue {
  send(name: string, data: object, options: object): Promise<string | null>
}

/** pg-boss's executor interface over a Kysely handle, so a job is inserted in the caller's transaction. */
export function queueExecutor(trx: Db): { executeSql(text: string, values?: unknown[]): Promise<{ rows: unknown[] }> } {
  return {
    async executeSql(text, values = []) {
      const result = await trx.executeQuery(CompiledQuery.raw(text, values))
      return { rows: result.rows as unknown[] }
    },
  }
}

/** Puts a job for an existing run on the queue, in `db`'s transaction when it is one. */
export async function sendCheckJob(db: Db, queue: CheckQueue, checkRunId: string): Promise<void> {
  await queue.send(CHECK_QUEUE, { checkRunId } satisfies CheckJobData, { ...CHECK_JOB_OPTIONS, db: queueExecutor(db) })
}

/**
 * Requests a check run. Call inside the caller's transaction: the run row and its queue job
 * commit or roll back together, so there is no "enqueue after commit" that can be lost.
 * Example: `await db.transaction().execute(trx => requestCheckRun(trx, queue, { revisionId, requestedBy, conventions }))`
 */
export async function requestCheckRun(trx: Db, queue: CheckQueue, input: NewCheckRun): Promise<{ id: string }> {
  const run = await insertCheckRun(trx, input)
  await sendCheckJob(trx, queue, run.id)
  return run
}

/**
 * The status a reader sees. The one place a run's stored state becomes what the UI shows,
 * so states derived from more than the column go here: a "running" run whose lease ran out
 * is not being checked by anyone, it waits to be taken again.
 */
export function runStatus(row: Pick<CheckRunHead, 'status' | 'lease_until'>, now: Date = new Date()): CheckRunStatus {
  if (row.status === 'running' && row.lease_until !== null && row.lease_until < now) return 'queued'
  return row.status
}

/** A run row as the API shows it. `liveWorker`: whether any check worker is alive (server/repositories/workers.ts). */
export function checkRunView(row: CheckRunHead, liveWorker = true): CheckRunView {
  const status = runStatus(row)
  return {
    id: row.id,
    status,
    engineVersion: row.engine_version,
    claimsTotal: row.claims_total,
    claimsDone: row.claims_done,
    queuedAt: row.queued_at.toISOString(),
    startedAt: row.started_at?.toISOString() ?? null,
    finishedAt: row.finished_at?.toISOString() ?? null,
    error: row.error,
    summary: row.summary,
    whatIf: row.what_if,
    waitingForWorker: status === 'queued' && !liveWorker,
  }
}

// Worker liveness is looked up only when some run still waits, so finished reports cost no extra query.
async function liveWorkerFor(db: Db, rows: CheckRunHead[]): Promise<boolean> {
  return rows.some(r => runStatus(r) === 'queued') ? anyLiveWorker(db) : true
}

/** The newest run of each revision, as the API shows it. */
export async function latestRunsByRevision(db: Db, revisionIds: string[]): Promise<Map<string, CheckRunView>> {
  const rows = await latestRunRowsByRevision(db, revisionIds)
  const live = await liveWorkerFor(db, rows)
  return new Map(rows.map(r => [r.revision_id, checkRunView(r, live)]))
}

/** A revision's newest run as the API shows it, and the id of the run whose report is current. */
export async function revisionRunState(db: Db, revisionId: string): Promise<{ run: CheckRunView | null, reportRunId: string | undefined }> {
  const found = await latestAndReportRun(db, revisionId)
  if (!found) return { run: null, reportRunId: undefined }
  return { run: checkRunView(found.latest, await liveWorkerFor(db, [found.latest])), reportRunId: found.reportRunId ?? undefined }
}

/** A run's progress and status, or null if there is no such run. */
export async function checkRunProgress(db: Db, checkRunId: string): Promise<CheckRunView | null> {
  const row = await findCheckRun(db, checkRunId)
  return row ? checkRunView(row, await liveWorkerFor(db, [row])) : null
}

/** Points where a fault test may stop the worker (scripts/worker.ts, SCHOLIUM_WORKER_HALT_AT). */
export type RunStep = 'claimed' | 'committing'

export interface CheckRunDeps {
  db: Db
  store: SourceStore
  pool: Piscina
  workerId: string
  leaseSeconds: number
  /** Time budget of one run; the thread is aborted outright at twice this. */
  runBudgetMs: number
  /** Called once a run's results are written (the "check finished" mail); its failure is only logged. */
  afterFinished?: (checkRunId: string) => Promise<unknown>
  /** Called at each step; only fault tests use it. */
  atStep?: (step: RunStep, checkRunId: string) => Promise<void>
}

export type CheckRunOutcome = 'finished' | 'failed' | 'retry' | 'not-ours'

/** Give up on a run after this many attempts (each attempt is a lease taken). */
export const MAX_ATTEMPTS = 3
/** Seconds a failed attempt waits before the sweeper re-sends it. */
export const RETRY_AFTER_SECONDS = 5

/**
 * Runs one check run: take its lease, fetch the sources, check them in a worker thread,
 * and write the report and its claims index in one transaction, only while the lease is ours.
 * Exactly-once results from at-least-once delivery: the final write replaces the run's
 * claims wholesale. Never throws for a failed check: the outcome says what happened.
 */
export async function runCheck(deps: CheckRunDeps, checkRunId: string): Promise<CheckRunOutcome> {
  const { db, workerId } = deps
  const run = await takeLease(db, checkRunId, workerId, deps.leaseSeconds)
  if (!run) return 'not-ours'
  const started = Date.now()
  const heartbeat = setInterval(() => {
    renewLease(db, checkRunId, workerId, deps.leaseSeconds).catch(error => console.error('[worker] lease renewal failed', error))
  }, Math.max(500, deps.leaseSeconds * 1000 / 3))
  let lastProgress = 0
  try {
    await deps.atStep?.('claimed', checkRunId)
    const sources = await loadRunSources(db, run.revision_id)
    const bytes = await Promise.all(sources.files.map(f => deps.store.get(f.storage_key)))
    const fetchMs = Date.now() - started

    const channel = new MessageChannel()
    channel.port1.on('message', ({ done, total }: { done: number, total: number }) => {
      const now = Date.now()
      if (done !== total && now - lastProgress < 300) return
      lastProgress = now
      recordProgress(db, checkRunId, workerId, done, total).catch(error => console.error('[worker] progress update failed', error))
    })
    const task: CheckTask = {
      files: Object.fromEntries(sources.files.map((f, i) => [f.path, bytes[i]!])),
      main: sources.mainFile ?? undefined,
      hashes: Object.fromEntries(sources.files.map(f => [f.path, f.sha256])),
      fixed: run.conventions as Partial<ConventionSet>,
      runBudgetMs: deps.runBudgetMs,
      progress: channel.port2,
    }
    let result: CheckThreadResult
    try {
      result = await deps.pool.run(task, { transferList: [channel.port2], signal: AbortSignal.timeout(deps.runBudgetMs * 2) }) as CheckThreadResult
    }
    finally {
      channel.port1.close()
    }

    const written = await db.transaction().execute(async (trx) => {
      if (!await lockIfLeased(trx, checkRunId, workerId)) return false
      await replaceRunClaims(trx, checkRunId, result.report.claims)
      await deps.atStep?.('committing', checkRunId)
      await markFinished(trx, checkRunId, { report: result.report, timings: { fetchMs, ...result.timings, totalMs: Date.now() - started } })
      return true
    })
    if (written) await runAfterFinished(deps, checkRunId)
    return written ? 'finished' : 'not-ours'
  }
  catch (error) {
    const aborted = (error as Error)?.name === 'AbortError' || /abort/i.test(String((error as Error)?.message))
    const message = aborted ? `over budget: the run took longer than ${Math.round(deps.runBudgetMs * 2 / 1000)} s and was stopped` : `the check failed: ${(error as Error)?.message ?? String(error)}`
    const final = aborted || run.attempts >= MAX_ATTEMPTS
    if (!final) console.error(`[worker] run ${checkRunId}: attempt ${run.attempts} failed; retrying in ${RETRY_AFTER_SECONDS} s`, error)
    await markAttemptFailed(db, checkRunId, workerId, { error: message, final, retryAfterSeconds: RETRY_AFTER_SECONDS })
    return final ? 'failed' : 'retry'
  }
  finally {
    clearInterval(heartbeat)
  }
}

// The run is already finished and committed: nothing here may turn it into a failure.
async function runAfterFinished(deps: CheckRunDeps, checkRunId: string): Promise<void> {
  if (!deps.afterFinished) return
  try {
    await deps.afterFinished(checkRunId)
  }
  catch (error) {
    console.error(`[worker] run ${checkRunId}: after-finish step failed`, error)
  }
}

/** The sweeper's step: re-sends runs whose lease ran out or whose retry is due. Returns their ids. */
export async function sweepDueRuns(db: Db, queue: CheckQueue): Promise<string[]> {
  // Released and re-sent in one transaction, so a failed send leaves the run to the next sweep.
  return db.transaction().execute(async (trx) => {
    const due = await releaseDueRuns(trx)
    for (const id of due) await sendCheckJob(trx, queue, id)
    return due
  })
}

/** At worker start: re-sends every run still waiting, in case its job was lost (e.g. the queue was reset). */
export async function resendQueuedRuns(db: Db, queue: CheckQueue): Promise<string[]> {
  const ids = await listQueuedRuns(db)
  for (const id of ids) await sendCheckJob(db, queue, id)
  return ids
}
