import { connectDatabase, type Db } from '../database/connect'

let database: Db | undefined

/** The process-wide Kysely handle, created on first use from runtime config. */
export function useDb(): Db {
  if (!database) {
    const { databaseUrl } = useRuntimeConfig()
    database = connectDatabase(databaseUrl)
  }
  return database
}

/** Closes the pool (called from the shutdown plugin). */
export async function closeDb(): Promise<void> {
  await database?.destroy()
  database = undefined
}
