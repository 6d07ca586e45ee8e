import { sql } from 'kysely'
import { countUnfinishedRuns } from '../repositories/check-runs'
import { listLiveWorkers } from '../repositories/workers'

interface Probe { ok: boolean, ms: number, error?: string }

/** Runs one check with a time limit; a failure is reported, never thrown. */
async function probe(check: () => Promise<unknown>, timeoutMs = 2000): Promise<Probe> {
  const started = performance.now()
  let timer: ReturnType<typeof setTimeout> | undefined
  try {
    await Promise.race([check(), new Promise((_, reject) => { timer = setTimeout(() => reject(new Error('no answer in time')), timeoutMs) })])
    return { ok: true, ms: Math.round(performance.now() - started) }
  }
  catch (error) {
    // A code or a name only (ECONNREFUSED, NoSuchBucket, timeout): never a message that could name a host or a user.
    const e = error as { code?: unknown, name?: unknown, message?: unknown }
    const reason = e?.message === 'no answer in time' ? 'timeout' : typeof e?.code === 'string' ? e.code : typeof e?.name === 'string' && e.name !== 'Error' ? e.name : 'failed'
    return { ok: false, ms: Math.round(performance.now() - started), error: reason }
  }
  finally {
    clearTimeout(timer)
  }
}

// S3 and the mail relay are asked at most every few seconds, however often health is polled
// (start scripts poll it five times a second; a relay handshake costs tens of milliseconds).
const REMOTE_PROBE_TTL_MS = 5000
const remembered = new Map<string, { at: number, result: Promise<Probe> }>()
function probeRemembered(name: string, check: () => Promise<unknown>): Promise<Probe> {
  const last = remembered.get(name)
  if (last && Date.now() - last.at < REMOTE_PROBE_TTL_MS) return last.result
  const result = probe(check)
  remembered.set(name, { at: Date.now(), result })
  return result
}

/**
 * Health of the parts checking depends on: database, S3, the mail relay, the check queue's
 * depth and the live check workers (server/repositories/workers.ts). Public, for scripts and
 * monitors (and the demo seed's state); the site admin also gets each worker's host and pid.
 * S3 and mail answers may be up to 5 s old. 503 when the database does not answer; otherwise 200, with `ok` false while any part is down
 * or no worker is alive.
 */
export default defineEventHandler(async (event) => {
  const db = useDb()
  const [database, storage, mail] = await Promise.all([probe(() => sql`select 1`.execute(db)), probeRemembered('storage', pingStorage), probeRemembered('mail', pingMailRelay)])
  if (!database.ok) {
    setResponseStatus(event, 503)
    return { ok: false, demo: demoSeed.state, database, storage, mail, queue: null, workers: null }
  }
  const [queue, live] = await Promise.all([countUnfinishedRuns(db), listLiveWorkers(db)])
  const { user } = await getUserSession(event)
  const workers = {
    live: live.length,
    threads: live.reduce((sum, w) => sum + w.concurrency, 0),
    ...(user?.siteRole === 'admin'
      ? { list: live.map(w => ({ host: w.host, pid: w.pid, threads: w.concurrency, startedAt: w.started_at.toISOString(), seenAt: w.seen_at.toISOString() })) }
      : {}),
  }
  return { ok: storage.ok && mail.ok && live.length > 0, demo: demoSeed.state, database, storage, mail, queue, workers }
})
