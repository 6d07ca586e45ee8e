/**
 * Queries on worker_heartbeats: each check worker process upserts its row every
 * HEARTBEAT_SECONDS; a row seen within LIVE_WITHIN_SECONDS is a live worker.
 * Relative imports only: the worker process loads this file.
 */
import { sql } from 'kysely'
import type { Db } from '../database/connect'

/** How often a worker says it is alive. */
export const HEARTBEAT_SECONDS = 2
/** A worker not heard from for this long counts as dead (three missed heartbeats). */
export const LIVE_WITHIN_SECONDS = 3 * HEARTBEAT_SECONDS

export interface WorkerBeat { workerId: string, host: string, pid: number, concurrency: number }

export async function recordHeartbeat(db: Db, beat: WorkerBeat): Promise<void> {
  await db.insertInto('worker_heartbeats')
    .values({ worker_id: beat.workerId, host: beat.host, pid: beat.pid, concurrency: beat.concurrency })
    .onConflict(oc => oc.column('worker_id').doUpdateSet({ seen_at: sql`now()` }))
    .execute()
}

/** A worker stopping cleanly says so at once, rather than being missed for LIVE_WITHIN_SECONDS. */
export async function removeHeartbeat(db: Db, workerId: string): Promise<void> {
  await db.deleteFrom('worker_heartbeats').where('worker_id', '=', workerId).execute()
}

/** Workers heard from recently; rows of dead workers older than a day are tidied away. */
export async function listLiveWorkers(db: Db) {
  await db.deleteFrom('worker_heartbeats').where('seen_at', '<', sql<Date>`now() - interval '1 day'`).execute()
  return db.selectFrom('worker_heartbeats')
    .select(['worker_id', 'host', 'pid', 'concurrency', 'started_at', 'seen_at'])
    .where('seen_at', '>', sql<Date>`now() - make_interval(secs => ${LIVE_WITHIN_SECONDS})`)
    .orderBy('started_at')
    .execute()
}

/** Whether any worker is alive: one indexed lookup, for run status. */
export async function anyLiveWorker(db: Db): Promise<boolean> {
  const row = await db.selectFrom('worker_heartbeats').select('worker_id')
    .where('seen_at', '>', sql<Date>`now() - make_interval(secs => ${LIVE_WITHIN_SECONDS})`)
    .limit(1).executeTakeFirst()
  return row !== undefined
}
