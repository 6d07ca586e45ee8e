// Frozen in time: takes Kysely<any>, imports no app code.
// attempt_limits: one row per (scope, key) counting attempts (sign-in per account,
// per address and per account+address pair; password-reset requests), bumped by a
// single UPSERT so parallel requests cannot all slip under the limit.
// users.session_version: sealed sessions carry it; bumping it revokes every cookie.
import { sql, type Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('attempt_limits')
    .addColumn('scope', 'text', c => c.notNull())
    .addColumn('key', 'text', c => c.notNull())
    .addColumn('attempts', 'integer', c => c.notNull())
    .addColumn('last_attempt_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('blocked_until', 'timestamptz')
    .addColumn('last_refused', 'boolean', c => c.notNull().defaultTo(false))
    .addPrimaryKeyConstraint('attempt_limits_pkey', ['scope', 'key'])
    .execute()
  await db.schema.alterTable('users')
    .addColumn('session_version', 'integer', c => c.notNull().defaultTo(1))
    .execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('users').dropColumn('session_version').execute()
  await db.schema.dropTable('attempt_limits').execute()
}
