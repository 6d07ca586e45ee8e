import { LOCAL_DEFAULTS } from '../config/defaults'
import type { S3Settings } from '../storage/source-store'

export interface WorkerSettings {
  databaseUrl: string
  s3: S3Settings
  /** Runs checked at once by this process (one worker thread each). */
  concurrency: number
  leaseSeconds: number
  runBudgetMs: number
  /** How often this worker sweeps unreferenced sources from S3, and how old they must be. */
  storageSweepIntervalMs: number
  storageSweepGraceSeconds: number
}

/** The worker reads the same NUXT_* variables as the web server, with the same local defaults. */
export function workerSettingsFromEnv(env: NodeJS.ProcessEnv = process.env): WorkerSettings {
  const d = LOCAL_DEFAULTS
  const positive = (name: string, fallback: number) => {
    const value = Number(env[name] ?? fallback)
    if (!Number.isFinite(value) || value <= 0) throw new Error(`${name} must be a positive number`)
    return value
  }
  return {
    databaseUrl: env.NUXT_DATABASE_URL ?? d.databaseUrl,
    s3: {
      endpoint: env.NUXT_S3_ENDPOINT ?? d.s3.endpoint,
      region: env.NUXT_S3_REGION ?? d.s3.region,
      bucket: env.NUXT_S3_BUCKET ?? d.s3.bucket,
      accessKeyId: env.NUXT_S3_ACCESS_KEY_ID ?? d.s3.accessKeyId,
      secretAccessKey: env.NUXT_S3_SECRET_ACCESS_KEY ?? d.s3.secretAccessKey,
      forcePathStyle: (env.NUXT_S3_FORCE_PATH_STYLE ?? String(d.s3.forcePathStyle)) !== 'false',
    },
    concurrency: positive('SCHOLIUM_WORKER_CONCURRENCY', 2),
    leaseSeconds: positive('SCHOLIUM_LEASE_SECONDS', 30),
    runBudgetMs: positive('SCHOLIUM_RUN_BUDGET_SECONDS', 120) * 1000,
    storageSweepIntervalMs: positive('SCHOLIUM_SWEEP_INTERVAL_SECONDS', 6 * 60 * 60) * 1000,
    storageSweepGraceSeconds: positive('SCHOLIUM_SWEEP_GRACE_SECONDS', 60 * 60),
  }
}
