import PgBoss from 'pg-boss'

import { CHECK_JOB_OPTIONS, CHECK_QUEUE, ensureCheckQueue, type CheckJobData } from '../jobs/queue-names'

let boss: Promise<PgBoss> | undefined

/** The process's pg-boss client, started on first use against the app database. */
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

/** Puts a check run on the queue. The run row already exists, so a lost message can be re-sent from it. */
export async function enqueueCheckRun(checkRunId: string): Promise<void> {
  const queue = await useQueue()
  await queue.send(CHECK_QUEUE, { checkRunId } satisfies CheckJobData, CHECK_JOB_OPTIONS)
}

export async function stopQueue(): Promise<void> {
  if (!boss) return
  const instance = await boss
  boss = undefined
  await instance.stop({ graceful: true, timeout: 5000 })
}
