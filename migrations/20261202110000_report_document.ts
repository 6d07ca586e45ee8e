// Frozen in time: takes Kysely<any>, imports no app code.
// The report becomes one document, check_runs.report (schema scholium.report/2), instead of the
// report-minus-claims in check_runs.summary plus one details blob per claims row. summary stays as
// a column the database derives from the report (its head: everything but the claims, the macro
// table and the script library), so listings and sorting never read the whole document. Claim
// rows stay as the index threads, referee notes and comparisons join on, with the id the report
// gives the claim (report_id) instead of the details blob.
// Version 2 only changed claims[].reproduce (absent in every stored report, the worker never
// kept it), so a stored version-1 report is a version-2 report once its schema says so.
import { sql, type Kysely } from 'kysely'

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('check_runs').addColumn('report', 'jsonb').execute()
  await sql`
    update check_runs c
    set report = (c.summary - 'claims') || jsonb_build_object(
      'schema', 'scholium.report/2',
      'claims', coalesce((
        select jsonb_agg(
          (cl.details - 'id') || jsonb_build_object(
            'id', coalesce(cl.details -> 'id', to_jsonb(cl.file || ':' || cl.line || ':' || (cl.ordinal + 1))),
            'file', cl.file, 'line', cl.line, 'endLine', cl.end_line, 'kind', cl.kind,
            'verdict', coalesce(cl.verdict, 'error'), 'holdsUnder', cl.holds_under,
            'source', cl.source, 'computed', cl.computed)
          || case when cl.label is null then '{}'::jsonb else jsonb_build_object('label', cl.label) end
          order by cl.ordinal)
        from claims cl where cl.check_run_id = c.id), '[]'::jsonb))
    where c.status = 'finished'`.execute(db)
  await db.schema.alterTable('check_runs').dropColumn('summary').execute()
  await sql`alter table check_runs add column summary jsonb not null
    generated always as (coalesce(report - 'claims' - 'macros' - 'reproduceLibrary', '{}'::jsonb)) stored`.execute(db)

  await db.schema.alterTable('claims').addColumn('report_id', 'text').execute()
  await sql`update claims set report_id = details ->> 'id'`.execute(db)
  await sql`update claims set report_id = file || ':' || line || ':' || (ordinal + 1) where report_id is null`.execute(db)
  await sql`alter table claims alter column report_id set not null`.execute(db)
  await db.schema.createIndex('claims_run_report_id_idx').on('claims').columns(['check_run_id', 'report_id']).execute()
  await db.schema.alterTable('claims').dropColumn('details').dropColumn('computed').dropColumn('holds_under').execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('claims')
    .addColumn('holds_under', 'jsonb', c => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('computed', 'text')
    .addColumn('details', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .execute()
  // Back to what a version-1 worker wrote: the details blob and columns from the report's claim.
  await sql`
    update claims cl
    set holds_under = e.claim -> 'holdsUnder',
        computed = e.claim ->> 'computed',
        details = jsonb_strip_nulls(jsonb_build_object(
          'id', e.claim -> 'id', 'message', e.claim -> 'message', 'conventions', e.claim -> 'conventions',
          'permutations', e.claim -> 'permutations', 'breaksPaperConvention', e.claim -> 'breaksPaperConvention',
          'skipped', e.claim -> 'skipped', 'correction', e.claim -> 'correction')) || jsonb_build_object('diff', e.claim -> 'diff')
    from check_runs c, jsonb_array_elements(c.report -> 'claims') with ordinality as e(claim, n)
    where c.report is not null and cl.check_run_id = c.id and cl.ordinal = e.n - 1`.execute(db)
  await db.schema.dropIndex('claims_run_report_id_idx').execute()
  await db.schema.alterTable('claims').dropColumn('report_id').execute()

  await db.schema.alterTable('check_runs').dropColumn('summary').execute()
  await db.schema.alterTable('check_runs').addColumn('summary', 'jsonb', c => c.notNull().defaultTo(sql`'{}'::jsonb`)).execute()
  await sql`
    update check_runs
    set summary = (report - 'claims' - 'macros' - 'reproduceLibrary') || jsonb_build_object('schema', 'scholium.report/1')
    where report is not null`.execute(db)
  await db.schema.alterTable('check_runs').dropColumn('report').execute()
}
