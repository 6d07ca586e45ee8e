// Frozen in time: takes Kysely<any>, imports no app code.
// A re-check asked for by someone who is not a member of the manuscript (a referee, an
// editor) is a "what-if" run: kept and shown to whoever asks for it by id, never the
// members' current report.
import type { Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('check_runs').addColumn('what_if', 'boolean', col => col.notNull().defaultTo(false)).execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('check_runs').dropColumn('what_if').execute()
}
