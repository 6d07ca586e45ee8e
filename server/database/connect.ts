import { Kysely, PostgresDialect } from 'kysely'
import pg from 'pg'
import type { Database } from './schema'

// BIGINT comes back as a string by default; our sizes and counters fit in a double.
pg.types.setTypeParser(20, value => Number(value))

/** A Kysely handle on PostgreSQL. Example: `const db = connectDatabase(process.env.NUXT_DATABASE_URL!)` */
export function connectDatabase(connectionString: string, max = 10): Kysely<Database> {
  return new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString, max }) }),
  })
}

export type Db = Kysely<Database>
