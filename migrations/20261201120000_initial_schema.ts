// Frozen in time: this migration takes Kysely<any> and never imports app code.
import { sql, type Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('users')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('email', 'text', c => c.notNull())
    .addColumn('display_name', 'text', c => c.notNull())
    .addColumn('password_hash', 'text', c => c.notNull())
    .addColumn('site_role', 'text', c => c.notNull().defaultTo('member').check(sql`site_role in ('member', 'admin')`))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('users_email_lower_key').on('users').unique().expression(sql`lower(email)`).execute()

  await db.schema
    .createTable('sign_in_failures')
    .addColumn('id', 'bigserial', c => c.primaryKey())
    .addColumn('email_key', 'text', c => c.notNull())
    .addColumn('client_address', 'text', c => c.notNull())
    .addColumn('failed_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('sign_in_failures_email_idx').on('sign_in_failures').columns(['email_key', 'failed_at']).execute()
  await db.schema.createIndex('sign_in_failures_address_idx').on('sign_in_failures').columns(['client_address', 'failed_at']).execute()

  await db.schema
    .createTable('venues')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('slug', 'text', c => c.notNull().unique())
    .addColumn('name', 'text', c => c.notNull())
    .addColumn('description', 'text', c => c.notNull().defaultTo(''))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('venue_editors')
    .addColumn('venue_id', 'uuid', c => c.notNull().references('venues.id').onDelete('cascade'))
    .addColumn('user_id', 'uuid', c => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('venue_editors_pkey', ['venue_id', 'user_id'])
    .execute()
  await db.schema.createIndex('venue_editors_user_idx').on('venue_editors').column('user_id').execute()

  await db.schema
    .createTable('manuscripts')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('title', 'text', c => c.notNull())
    .addColumn('owner_id', 'uuid', c => c.notNull().references('users.id'))
    // Convention choices fixed for this manuscript (axis -> convention id); empty means "infer".
    .addColumn('conventions', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('manuscripts_owner_idx').on('manuscripts').column('owner_id').execute()

  await db.schema
    .createTable('manuscript_members')
    .addColumn('manuscript_id', 'uuid', c => c.notNull().references('manuscripts.id').onDelete('cascade'))
    .addColumn('user_id', 'uuid', c => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('role', 'text', c => c.notNull().check(sql`role in ('author', 'coauthor')`))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('manuscript_members_pkey', ['manuscript_id', 'user_id'])
    .execute()
  await db.schema.createIndex('manuscript_members_user_idx').on('manuscript_members').column('user_id').execute()

  await db.schema
    .createTable('revisions')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('manuscript_id', 'uuid', c => c.notNull().references('manuscripts.id').onDelete('cascade'))
    .addColumn('number', 'integer', c => c.notNull())
    .addColumn('main_file', 'text')
    .addColumn('note', 'text', c => c.notNull().defaultTo(''))
    .addColumn('uploaded_by', 'uuid', c => c.notNull().references('users.id'))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('revisions_manuscript_number_key', ['manuscript_id', 'number'])
    .execute()

  await db.schema
    .createTable('revision_files')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('revision_id', 'uuid', c => c.notNull().references('revisions.id').onDelete('cascade'))
    .addColumn('path', 'text', c => c.notNull())
    .addColumn('storage_key', 'text', c => c.notNull())
    .addColumn('sha256', 'text', c => c.notNull())
    .addColumn('size_bytes', 'bigint', c => c.notNull())
    .addColumn('uploaded_by', 'uuid', c => c.notNull().references('users.id'))
    .addColumn('uploaded_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('revision_files_revision_path_key', ['revision_id', 'path'])
    .execute()
  await db.schema.createIndex('revision_files_storage_key_idx').on('revision_files').column('storage_key').execute()

  await db.schema
    .createTable('check_runs')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('revision_id', 'uuid', c => c.notNull().references('revisions.id').onDelete('cascade'))
    .addColumn('status', 'text', c => c.notNull().defaultTo('queued').check(sql`status in ('queued', 'running', 'finished', 'failed', 'cancelled')`))
    .addColumn('engine_version', 'text')
    .addColumn('conventions', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('claims_total', 'integer')
    .addColumn('claims_done', 'integer', c => c.notNull().defaultTo(0))
    .addColumn('timings', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('summary', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('error', 'text')
    .addColumn('attempts', 'integer', c => c.notNull().defaultTo(0))
    .addColumn('requested_by', 'uuid', c => c.references('users.id'))
    .addColumn('queued_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('started_at', 'timestamptz')
    .addColumn('finished_at', 'timestamptz')
    .execute()
  await db.schema.createIndex('check_runs_revision_idx').on('check_runs').columns(['revision_id', 'queued_at']).execute()

  await db.schema
    .createTable('claims')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('check_run_id', 'uuid', c => c.notNull().references('check_runs.id').onDelete('cascade'))
    // Position of the claim in the reader's output; with the run it makes a retried run idempotent.
    .addColumn('ordinal', 'integer', c => c.notNull())
    .addColumn('file', 'text', c => c.notNull())
    .addColumn('line', 'integer', c => c.notNull())
    .addColumn('end_line', 'integer', c => c.notNull())
    .addColumn('source', 'text', c => c.notNull())
    .addColumn('kind', 'text', c => c.notNull())
    .addColumn('label', 'text')
    // A hash of the claim's normalised content, to match claims across revisions.
    .addColumn('content_key', 'text', c => c.notNull())
    .addColumn('verdict', 'text', c => c.check(sql`verdict in ('verified', 'mismatch', 'unsupported', 'error')`))
    .addColumn('holds_under', 'jsonb', c => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('computed', 'text')
    .addColumn('details', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('checked_at', 'timestamptz')
    .addUniqueConstraint('claims_run_ordinal_key', ['check_run_id', 'ordinal'])
    .execute()
  await db.schema.createIndex('claims_content_key_idx').on('claims').column('content_key').execute()

  await db.schema
    .createTable('submissions')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('revision_id', 'uuid', c => c.notNull().references('revisions.id').onDelete('cascade'))
    .addColumn('venue_id', 'uuid', c => c.notNull().references('venues.id'))
    .addColumn('submitted_by', 'uuid', c => c.notNull().references('users.id'))
    .addColumn('status', 'text', c => c.notNull().defaultTo('submitted').check(sql`status in ('submitted', 'in-review', 'decided', 'withdrawn')`))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('submissions_revision_venue_key', ['revision_id', 'venue_id'])
    .execute()
  await db.schema.createIndex('submissions_venue_idx').on('submissions').columns(['venue_id', 'created_at']).execute()

  await db.schema
    .createTable('referee_assignments')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('submission_id', 'uuid', c => c.notNull().references('submissions.id').onDelete('cascade'))
    .addColumn('referee_id', 'uuid', c => c.notNull().references('users.id'))
    .addColumn('invited_by', 'uuid', c => c.notNull().references('users.id'))
    .addColumn('status', 'text', c => c.notNull().defaultTo('active').check(sql`status in ('active', 'completed', 'withdrawn')`))
    .addColumn('overall_note', 'text', c => c.notNull().defaultTo(''))
    .addColumn('released_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('referee_assignments_submission_referee_key', ['submission_id', 'referee_id'])
    .execute()
  await db.schema.createIndex('referee_assignments_referee_idx').on('referee_assignments').column('referee_id').execute()

  await db.schema
    .createTable('claim_comments')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('manuscript_id', 'uuid', c => c.notNull().references('manuscripts.id').onDelete('cascade'))
    // Comments follow a claim across revisions through its content key.
    .addColumn('content_key', 'text', c => c.notNull())
    .addColumn('claim_id', 'uuid', c => c.references('claims.id').onDelete('set null'))
    .addColumn('parent_id', 'uuid', c => c.references('claim_comments.id').onDelete('cascade'))
    .addColumn('author_id', 'uuid', c => c.notNull().references('users.id'))
    // A referee's note belongs to an assignment and stays hidden from authors until released.
    .addColumn('referee_assignment_id', 'uuid', c => c.references('referee_assignments.id').onDelete('cascade'))
    .addColumn('body', 'text', c => c.notNull())
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('claim_comments_thread_idx').on('claim_comments').columns(['manuscript_id', 'content_key']).execute()

  await db.schema
    .createTable('convention_decisions')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('manuscript_id', 'uuid', c => c.notNull().references('manuscripts.id').onDelete('cascade'))
    .addColumn('axis', 'text', c => c.notNull())
    .addColumn('convention_id', 'text', c => c.notNull())
    .addColumn('proposed_by', 'uuid', c => c.notNull().references('users.id'))
    .addColumn('status', 'text', c => c.notNull().defaultTo('proposed').check(sql`status in ('proposed', 'accepted', 'withdrawn')`))
    .addColumn('agreed_by', 'jsonb', c => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('decided_at', 'timestamptz')
    .execute()

  await db.schema
    .createTable('invitations')
    .addColumn('id', 'uuid', c => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('kind', 'text', c => c.notNull().check(sql`kind in ('coauthor', 'referee', 'password-reset')`))
    .addColumn('token_hash', 'text', c => c.notNull().unique())
    .addColumn('email', 'text', c => c.notNull())
    .addColumn('manuscript_id', 'uuid', c => c.references('manuscripts.id').onDelete('cascade'))
    .addColumn('submission_id', 'uuid', c => c.references('submissions.id').onDelete('cascade'))
    .addColumn('invited_by', 'uuid', c => c.references('users.id'))
    .addColumn('expires_at', 'timestamptz', c => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('audit_log')
    .addColumn('id', 'bigserial', c => c.primaryKey())
    .addColumn('at', 'timestamptz', c => c.notNull().defaultTo(sql`now()`))
    .addColumn('actor_id', 'uuid', c => c.references('users.id'))
    .addColumn('action', 'text', c => c.notNull())
    .addColumn('subject_type', 'text', c => c.notNull())
    .addColumn('subject_id', 'text', c => c.notNull())
    .addColumn('details', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .execute()
  await db.schema.createIndex('audit_log_subject_idx').on('audit_log').columns(['subject_type', 'subject_id', 'at']).execute()
  // Append-only: the database itself refuses updates and deletes, whatever the app does.
  await sql`
    create function audit_log_refuse_change() returns trigger language plpgsql as $$
    begin
      raise exception 'audit_log is append-only';
    end $$`.execute(db)
  await sql`
    create trigger audit_log_append_only before update or delete on audit_log
    for each row execute function audit_log_refuse_change()`.execute(db)
  await sql`
    create trigger audit_log_no_truncate before truncate on audit_log
    for each statement execute function audit_log_refuse_change()`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists audit_log_no_truncate on audit_log`.execute(db)
  await sql`drop trigger if exists audit_log_append_only on audit_log`.execute(db)
  await sql`drop function if exists audit_log_refuse_change()`.execute(db)
  for (const table of [
    'audit_log', 'invitations', 'convention_decisions', 'claim_comments', 'referee_assignments',
    'submissions', 'claims', 'check_runs', 'revision_files', 'revisions', 'manuscript_members',
    'manuscripts', 'venue_editors', 'venues', 'sign_in_failures', 'users',
  ]) {
    await db.schema.dropTable(table).ifExists().execute()
  }
}
