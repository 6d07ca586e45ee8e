/**
 * One storage sweep by hand (the workers also run it every SCHOLIUM_SWEEP_INTERVAL_SECONDS):
 * removes source objects no revision references and older than the grace period.
 *
 *   node --import tsx scripts/sweep-storage.ts [--grace-seconds 3600]
 */
import { connectDatabase } from '../server/database/connect'
import { createSourceStore } from '../server/storage/source-store'
import { workerSettingsFromEnv } from '../server/jobs/worker-settings'
import { sweepUnreferencedSources } from '../server/services/storage-sweep'

const settings = workerSettingsFromEnv()
const at = process.argv.indexOf('--grace-seconds')
const graceSeconds = at === -1 ? settings.storageSweepGraceSeconds : Number(process.argv[at + 1])
if (!Number.isFinite(graceSeconds) || graceSeconds < 0) throw new Error('--grace-seconds needs a number of seconds, 0 or more')
const db = connectDatabase(settings.databaseUrl, 2)
try {
  const swept = await sweepUnreferencedSources(db, createSourceStore(settings.s3), { graceSeconds })
  console.log(`scanned ${swept.scanned}, removed ${swept.removed.length}, younger than ${graceSeconds} s ${swept.young}, in use ${swept.referenced}`)
  for (const key of swept.removed) console.log(`removed ${key}`)
}
finally {
  await db.destroy()
}
