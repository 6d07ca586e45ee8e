/**
 * Runs one check run: take its lease, fetch the sources, check them in a worker
 * thread, and write every claim and the summary in one transaction.
 *
 * Exactly-once results from at-least-once delivery: a run is only worked on by the
 * worker holding its lease; the final write replaces the run's claims wholesale
 * and only if the lease is still ours. A worker that dies leaves an expiring lease;
 * the sweeper puts the run back on the queue and another worker redoes it.
 */
import { MessageChannel } from 'node:worker_threads'
import { sql } from 'kysely'
import type Piscina from 'piscina'
import type { Db } from '../database/connect'
import type { SourceStore } from '../storage/source-store'
import type { ConventionSet } from '../../shared/types/conventions'
import { replaceRunClaims } from '../repositories/claims'
import type { CheckTask, CheckThreadResult } from './check-thread'

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
}

export type CheckRunOutcome = 'finished' | 'failed' | 'not-ours'

/** Give up on a run after this many attempts (each attempt is a lease taken). */
const MAX_ATTEMPTS = 3

export async function processCheckRun(deps: CheckRunDeps, checkRunId: string): Promise<CheckRunOutcome> {
  const { db } = deps
  const run = await takeLease(deps, checkRunId)
  if (!run) return 'not-ours'
  const started = Date.now()
  const heartbeat = setInterval(() => {
    renewLease(deps, checkRunId).catch(error => console.error('[worker] lease renewal failed', error))
  }, Math.max(500, deps.leaseSeconds * 1000 / 3))
  let lastProgress = 0
  try {
    const revision = await db.selectFrom('revisions').select(['id', 'main_file']).where('id', '=', run.revision_id).executeTakeFirstOrThrow()
    const files = await db.selectFrom('revision_files').select(['path', 'storage_key', 'sha256']).where('revision_id', '=', revision.id).execute()
    const bytes = await Promise.all(files.map(f => deps.store.get(f.storage_key)))
    const fetchMs = Date.now() - started

    const channel = new MessageChannel()
    channel.port1.on('message', ({ done, total }: { done: number, total: number }) => {
      const now = Date.now()
      if (done !== total && now - lastProgress < 300) return
      lastProgress = now
      db.updateTable('check_runs').set({ claims_done: done, claims_total: total })
        .where('id', '=', checkRunId).where('lease_owner', '=', deps.workerId).execute()
        .catch(error => console.error('[worker] progress update failed', error))
    })
    const task: CheckTask = {
      files: Object.fromEntries(files.map((f, i) => [f.path, bytes[i]!])),
      main: revision.main_file ?? undefined,
      hashes: Object.fromEntries(files.map(f => [f.path, f.sha256])),
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

    const { claims, ...head } = result.report
    const written = await db.transaction().execute(async (trx) => {
      const stillOurs = await trx.selectFrom('check_runs').select('id').where('id', '=', checkRunId).where('lease_owner', '=', deps.workerId).forUpdate().executeTakeFirst()
      if (!stillOurs) return false
      await replaceRunClaims(trx, checkRunId, claims)
      await trx.updateTable('check_runs').set({
        status: 'finished',
        engine_version: head.engine.version,
        summary: JSON.stringify(head),
        claims_total: claims.length,
        claims_done: claims.length,
        timings: JSON.stringify({ fetchMs, ...result.timings, totalMs: Date.now() - started }),
        error: null,
        finished_at: new Date(),
        lease_owner: null,
        lease_until: null,
      }).where('id', '=', checkRunId).execute()
      return true
    })
    if (written) await runAfterFinished(deps, checkRunId)
    return written ? 'finished' : 'not-ours'
  }
  catch (error) {
    const aborted = (error as Error)?.name === 'AbortError' || /abort/i.test(String((error as Error)?.message))
    const message = aborted ? `over budget: the run took longer than ${Math.round(deps.runBudgetMs * 2 / 1000)} s and was stopped` : `the check failed: ${(error as Error)?.message ?? String(error)}`
    const final = aborted || run.attempts >= MAX_ATTEMPTS
    await db.updateTable('check_runs').set({
      status: final ? 'failed' : 'queued',
      error: message,
      lease_owner: null,
      lease_until: null,
      ...(final ? { finished_at: new Date() } : {}),
    }).where('id', '=', checkRunId).where('lease_owner', '=', deps.workerId).execute()
    if (!final) throw error
    return 'failed'
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

/** Take the run if it is waiting, or if its previous worker's lease ran out. */
async function takeLease(deps: CheckRunDeps, checkRunId: string) {
  return deps.db.updateTable('check_runs')
    .set(eb => ({
      status: 'running',
      lease_owner: deps.workerId,
      lease_until: sql<Date>`now() + make_interval(secs => ${deps.leaseSeconds})`,
      attempts: eb('attempts', '+', 1),
      started_at: new Date(),
      claims_done: 0,
    }))
    .where('id', '=', checkRunId)
    .where(eb => eb.or([
      eb('status', '=', 'queued'),
      eb.and([eb('status', '=', 'running'), eb('lease_until', '<', sql<Date>`now()`)]),
    ]))
    .returning(['id', 'revision_id', 'conventions', 'attempts'])
    .executeTakeFirst()
}

async function renewLease(deps: CheckRunDeps, checkRunId: string): Promise<void> {
  await deps.db.updateTable('check_runs')
    .set({ lease_until: sql<Date>`now() + make_interval(secs => ${deps.leaseSeconds})` })
    .where('id', '=', checkRunId).where('lease_owner', '=', deps.workerId)
    .execute()
}

/**
 * Runs whose worker died (lease ran out) go back to 'queued'; returns their ids
 * so the caller can put them on the queue again.
 */
export async function releaseExpiredLeases(db: Db): Promise<string[]> {
  const rows = await db.updateTable('check_runs')
    .set({ status: 'queued', lease_owner: null, lease_until: null })
    .where('status', '=', 'running')
    .where('lease_until', '<', sql<Date>`now()`)
    .returning('id')
    .execute()
  return rows.map(r => r.id)
}

/** Runs still waiting, oldest first (re-sent when a worker starts, in case a message was lost). */
export async function listQueuedRuns(db: Db): Promise<string[]> {
  const rows = await db.selectFrom('check_runs').select('id').where('status', '=', 'queued').orderBy('queued_at').execute()
  return rows.map(r => r.id)
}
