// Frozen in time: takes Kysely<any>, imports no app code.
// user_sessions: one row per sign-in. The sealed cookie carries the row's id; ordinary
// sign-out deletes that row only, so the account's other sessions go on. Sign out
// everywhere and a password reset still bump users.session_version, which ends them all.
import { sql, type Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('user_sessions')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', c => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('user_sessions_user_id').on('user_sessions').column('user_id').execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('user_sessions').execute()
}
