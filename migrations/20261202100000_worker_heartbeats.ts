// Frozen in time: takes Kysely<any>, imports no app code.
// worker_heartbeats: each check worker process upserts its row every few seconds. A row
// seen recently is a live worker; the health route counts them and a run whose lease ran
// out with none alive is shown as waiting for a worker. A table of our own rather than
// pg-boss state: pg-boss 10 keeps no registry of consumers (a killed worker's job simply
// stays "active" until it expires), so from its tables a dead worker looks like a busy one.
import { sql, type Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('worker_heartbeats')
    .addColumn('worker_id', 'text', c => c.primaryKey())
    .addColumn('host', 'text', c => c.notNull())
    .addColumn('pid', 'integer', c => c.notNull())
    .addColumn('concurrency', 'integer', c => c.notNull())
    .addColumn('started_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('seen_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('worker_heartbeats_seen_at').on('worker_heartbeats').column('seen_at').execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('worker_heartbeats').execute()
}
