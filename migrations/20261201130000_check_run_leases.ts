// Frozen in time: takes Kysely<any>, imports no app code.
// A worker holds a run by a lease it renews; a run whose lease ran out (its worker
// died) goes back on the queue and is redone from the start.
import type { Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('check_runs')
    .addColumn('lease_owner', 'text')
    .addColumn('lease_until', 'timestamptz')
    .execute()
  await db.schema.createIndex('check_runs_running_lease_idx').on('check_runs').columns(['status', 'lease_until']).execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('check_runs_running_lease_idx').execute()
  await db.schema.alterTable('check_runs').dropColumn('lease_owner').dropColumn('lease_until').execute()
}
