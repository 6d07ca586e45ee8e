/** The queue every check run goes through. Shared by the web server (sends) and worker processes (consume). */
export const CHECK_QUEUE = 'scholium-check-run'

export interface CheckJobData { checkRunId: string }

/** pg-boss options for a check job: retried by pg-boss when a worker throws; leases handle workers that die. */
export const CHECK_JOB_OPTIONS = { retryLimit: 3, retryDelay: 5, expireInSeconds: 15 * 60 } as const
