/**
 * A check worker process: consumes the check queue and runs each check in a worker
 * thread. Start as many as you like, on as many machines as you like, against one
 * database and one S3 bucket: leases make sure each run is written once.
 *
 *   node --import tsx scripts/worker.ts            # consume the queue until stopped
 *   node --import tsx scripts/worker.ts --run <id> # process one run and exit (maintenance)
 */
import { hostname } from 'node:os'
import { randomUUID } from 'node:crypto'
import PgBoss from 'pg-boss'
import { Piscina } from 'piscina'
import { connectDatabase } from '../server/database/connect'
import { createSourceStore } from '../server/storage/source-store'
import { CHECK_QUEUE, ensureCheckQueue, type CheckJobData } from '../server/jobs/queue-names'
import { resendQueuedRuns, runCheck, sweepDueRuns, type CheckRunDeps, type RunStep } from '../server/services/check-runs'
import { workerSettingsFromEnv } from '../server/jobs/worker-settings'
import { createMailSender, smtpSettingsFromEnv } from '../server/mail/transport'
import { checkMailSettingsFromEnv, mailIfLongRun } from '../server/mail/check-finished'
import { HEARTBEAT_SECONDS, recordHeartbeat, removeHeartbeat } from '../server/repositories/workers'
import { sweepUnreferencedSources } from '../server/services/storage-sweep'

const settings = workerSettingsFromEnv()
const workerId = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`
const db = connectDatabase(settings.databaseUrl, settings.concurrency + 2)
const pool = new Piscina({
  filename: new URL('../server/jobs/check-thread.ts', import.meta.url).href,
  minThreads: 1,
  maxThreads: settings.concurrency,
  // A run that needs more than this is refused rather than allowed to take the machine down.
  resourceLimits: { maxOldGenerationSizeMb: 2048 },
})
// The "check finished" mail for long runs, through the same SMTP relay as the web server.
const checkMail = checkMailSettingsFromEnv(createMailSender(smtpSettingsFromEnv()))
const afterFinished = async (checkRunId: string) => {
  if (await mailIfLongRun(db, checkMail, checkRunId) === 'sent') console.log(`[worker] run ${checkRunId}: mailed the requester`)
}
// Fault tests only: stop for good at one step (the test then kills this process).
const haltAt = process.env.SCHOLIUM_WORKER_HALT_AT as RunStep | undefined
const atStep = haltAt
  ? async (step: RunStep, checkRunId: string) => {
    if (step !== haltAt) return
    console.log(`[worker] halted at ${step} of run ${checkRunId}`)
    await new Promise(() => {})
  }
  : undefined
const store = createSourceStore(settings.s3)
const deps: CheckRunDeps = { db, store, pool, workerId, leaseSeconds: settings.leaseSeconds, runBudgetMs: settings.runBudgetMs, afterFinished, atStep }

const onlyRun = process.argv.indexOf('--run')
if (onlyRun !== -1) {
  const id = process.argv[onlyRun + 1]
  if (!id) throw new Error('--run needs a check run id')
  console.log(`[worker ${workerId}] run ${id}: ${await runCheck(deps, id)}`)
  await pool.destroy()
  await db.destroy()
  process.exit(0)
}

const boss = new PgBoss({ connectionString: settings.databaseUrl, max: 3 })
boss.on('error', error => console.error('[worker] queue error', error))
await boss.start()
await ensureCheckQueue(boss)

for (let i = 0; i < settings.concurrency; i++) {
  await boss.work<CheckJobData>(CHECK_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) => {
    if (!job) return
    // Never throws: retries belong to the run's lease (server/services/check-runs.ts), not to pg-boss.
    const outcome = await runCheck(deps, job.data.checkRunId).catch((error) => {
      console.error(`[worker] run ${job.data.checkRunId}: could not be processed; the lease sweep retries it`, error)
      return 'retry'
    })
    if (outcome !== 'not-ours') console.log(`[worker] run ${job.data.checkRunId}: ${outcome}`)
  })
}

// Liveness for /api/health and for runs waiting with no worker (server/repositories/workers.ts).
const beat = { workerId, host: hostname(), pid: process.pid, concurrency: settings.concurrency }
await recordHeartbeat(db, beat)
const heartbeat = setInterval(() => {
  recordHeartbeat(db, beat).catch(error => console.error('[worker] heartbeat failed', error))
}, HEARTBEAT_SECONDS * 1000)

// Sources no revision references any more; every worker may sweep, removal is idempotent.
const storageSweeper = setInterval(() => {
  sweepUnreferencedSources(db, store, { graceSeconds: settings.storageSweepGraceSeconds })
    .then(swept => console.log(`[worker] storage sweep: ${swept.removed.length} removed, ${swept.young} too young, ${swept.referenced} in use`))
    .catch(error => console.error('[worker] storage sweep failed', error))
}, settings.storageSweepIntervalMs)

// Jobs lost while no worker ran (e.g. a reset queue) are covered by re-sending what waits.
await resendQueuedRuns(db, boss)
const sweeper = setInterval(() => {
  sweepDueRuns(db, boss).catch(error => console.error('[worker] sweep failed', error))
}, Math.max(1000, settings.leaseSeconds * 500))

console.log(`[worker ${workerId}] consuming ${CHECK_QUEUE} with ${settings.concurrency} thread(s)`)

let stopping = false
async function stop() {
  if (stopping) return
  stopping = true
  clearInterval(sweeper)
  clearInterval(storageSweeper)
  clearInterval(heartbeat)
  await removeHeartbeat(db, workerId).catch(() => {})
  await boss.stop({ graceful: true, timeout: 10_000 })
  await pool.destroy()
  await db.destroy()
  process.exit(0)
}
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
