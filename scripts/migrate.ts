/**
 * Applies the migrations in migrations/ to DATABASE_URL (or NUXT_DATABASE_URL).
 * Idempotent: already-applied migrations are skipped. `--down` undoes the newest one.
 * Runs from a script because the built server does not contain the migrations folder.
 */
import { promises as fs } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { FileMigrationProvider, Kysely, Migrator, PostgresDialect } from 'kysely'
import pg from 'pg'
import PgBoss from 'pg-boss'
import { ensureCheckQueue } from '../server/jobs/queue-names'

const databaseUrl = process.env.NUXT_DATABASE_URL ?? process.env.DATABASE_URL
if (!databaseUrl) {
  console.error('migrate: set NUXT_DATABASE_URL (or DATABASE_URL)')
  process.exit(2)
}

const db = new Kysely<unknown>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: databaseUrl, max: 1 }) }) })
const migrator = new Migrator({
  db,
  provider: new FileMigrationProvider({
    fs,
    path,
    migrationFolder: path.join(path.dirname(fileURLToPath(import.meta.url)), '..', 'migrations'),
  }),
})

const { error, results } = process.argv.includes('--down') ? await migrator.migrateDown() : await migrator.migrateToLatest()
for (const r of results ?? []) {
  console.log(`migrate: ${r.status === 'Success' ? 'applied' : r.status.toLowerCase()} ${r.direction === 'Down' ? '(down) ' : ''}${r.migrationName}`)
}
await db.destroy()
if (error) {
  console.error('migrate: failed', error)
  process.exit(1)
}

// pg-boss keeps its own schema; creating it and the check queue here, before the web
// server and the workers start, spares them doing it all at once.
if (!process.argv.includes('--down')) {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 1 })
  await boss.start()
  await ensureCheckQueue(boss)
  await boss.stop({ graceful: false, wait: true })
  console.log('migrate: job queue ready')
}
