/** The queue every check run goes through. Shared by the web server (sends) and worker processes (consume). */
export const CHECK_QUEUE = 'scholium-check-run'

export interface CheckJobData { checkRunId: string }

/**
 * pg-boss options for a check job. pg-boss never retries (retryLimit 0): the run row's lease
 * decides retries and expiry (see server/services/check-runs.ts). The expiry only tidies
 * pg-boss's own table after a killed worker; it is far above any run budget.
 */
export const CHECK_JOB_OPTIONS = { retryLimit: 0, expireInSeconds: 6 * 60 * 60 } as const

/**
 * Creates the check queue if it is missing (the migration script does it before anything
 * else starts). Several processes starting at once against a
 * fresh database (web server, workers, the migration script) can deadlock inside pg-boss's
 * queue creation; PostgreSQL then aborts one of them, which simply tries again.
 */
export async function ensureCheckQueue(boss: { createQueue(name: string): Promise<void>, getQueue(name: string): Promise<unknown> }, attempts = 5): Promise<void> {
  // pg-boss's creation takes table locks even when the queue exists, so look first.
  if (await boss.getQueue(CHECK_QUEUE)) return
  for (let attempt = 1; ; attempt++) {
    try {
      await boss.createQueue(CHECK_QUEUE)
      return
    }
    catch (error) {
      if ((error as { code?: string }).code !== '40P01' || attempt >= attempts) throw error
      await new Promise(resolve => setTimeout(resolve, 50 + Math.random() * 200 * attempt))
    }
  }
}
