import PgBoss from 'pg-boss'

import { ensureCheckQueue } from '../jobs/queue-names'

let boss: Promise<PgBoss> | undefined

/**
 * The process's pg-boss client, started on first use against the app database. Check runs
 * are sent through server/services/check-runs.ts (`requestCheckRun`), inside the caller's transaction.
 */
export function useQueue(): Promise<PgBoss> {
  boss ??= (async () => {
    const { databaseUrl } = useRuntimeConfig()
    const instance = new PgBoss({ connectionString: databaseUrl, max: 3 })
    instance.on('error', error => console.error('[queue]', error))
    await instance.start()
    await ensureCheckQueue(instance)
    return instance
  })()
  return boss
}

export async function stopQueue(): Promise<void> {
  if (!boss) return
  const instance = await boss
  boss = undefined
  await instance.stop({ graceful: true, timeout: 5000 })
}
