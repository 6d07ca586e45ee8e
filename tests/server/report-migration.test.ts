/**
 * migrations/20261202110000_report_document.ts against the real PostgreSQL: a database of its own
 * is migrated to the step before (every other migration, main's worker heartbeats and sessions
 * included: the document migration was renamed from 20261202100000, which it shared with them), given a finished run stored the old way (the report minus its
 * claims in check_runs.summary, each claim's details in its claims row), migrated up, where the run
 * must have one report document that the app's validator accepts, and down again, where the old
 * columns must hold what they held before. A second fresh database goes all the way up and down.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { promises as fs } from 'node:fs'
import path from 'node:path'
import { randomUUID } from 'node:crypto'
import { Kysely, Migrator, NO_MIGRATIONS, PostgresDialect, sql, type Migration, type MigrationProvider } from 'kysely'
import pg from 'pg'
import { parseReport, verdictCountsOf } from '../../shared/types/report-schema'
import { REFERENCE_CONVENTIONS } from '../../shared/types/conventions'

const BEFORE = '20261202100100_user_sessions'
const MIGRATIONS = path.join(import.meta.dirname, '../../migrations')
const baseUrl = process.env.NUXT_DATABASE_URL!
const name = `scholium_migration_${randomUUID().replace(/-/g, '').slice(0, 12)}`
let admin: Kysely<any>
let db: Kysely<any>
let migrator: Migrator

// What a version-1 worker wrote for a two-claim run: the head and the claims' columns and details.
const OLD_HEAD = {
  schema: 'scholium.report/1',
  engine: { version: '0.9.0' },
  conventions: { inferred: {}, fixed: {}, used: REFERENCE_CONVENTIONS, evidence: {} },
  summary: { claims: 2, verified: 1, mismatch: 1, unsupported: 0, error: 0, otherConvention: 0, skipped: 0, notRead: 0, durationMs: 12 },
  files: [{ path: 'main.tex', role: 'main', lines: 9, sha256: 'ab'.repeat(32) }],
  warnings: [],
  notRead: [],
}
const OLD_CLAIMS = [
  {
    file: 'main.tex', line: 4, end_line: 4, source: '\\Sch{132} = x_1 + x_2', kind: 'schubert', label: null, verdict: 'verified',
    holds_under: [], computed: 'x_{1}+x_{2}', content_key: 'k1',
    details: { id: 'main.tex:4:1', diff: null, message: 'Verified.', conventions: REFERENCE_CONVENTIONS, permutations: [[1, 3, 2]] },
  },
  {
    file: 'main.tex', line: 6, end_line: 7, source: '\\ell(2143) = 3', kind: 'length', label: 'eq:len', verdict: 'mismatch',
    holds_under: ['perm-inverse'], computed: '2', content_key: 'k2',
    details: { id: 'main.tex:6:1', diff: { basis: 'number', claimed: '3', computed: '2' }, message: 'Off by one.', conventions: REFERENCE_CONVENTIONS, permutations: [[2, 1, 4, 3]], skipped: true, correction: { fixed: false, reason: 'the statement spans several lines' } },
  },
]

// Kysely's FileMigrationProvider imports from node_modules, where .ts files do not load; this imports them here.
function migrationsFolder(folder: string): MigrationProvider {
  return {
    async getMigrations() {
      const files = (await fs.readdir(folder)).filter(f => f.endsWith('.ts')).sort()
      return Object.fromEntries(await Promise.all(files.map(async f => [f.replace(/\.ts$/, ''), await import(path.join(folder, f)) as Migration])))
    },
  }
}

beforeAll(async () => {
  admin = new Kysely<any>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: baseUrl, max: 1 }) }) })
  await sql`create database ${sql.id(name)}`.execute(admin)
  const url = new URL(baseUrl)
  url.pathname = `/${name}`
  db = new Kysely<any>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url.href, max: 1 }) }) })
  migrator = new Migrator({ db, provider: migrationsFolder(MIGRATIONS) })
  const { error } = await migrator.migrateTo(BEFORE)
  if (error) throw error
})

afterAll(async () => {
  await db?.destroy()
  await sql`drop database if exists ${sql.id(name)}`.execute(admin)
  await sql`drop database if exists ${sql.id(`${name}_fresh`)}`.execute(admin)
  await admin?.destroy()
})

async function oldRun(): Promise<string> {
  const user = await db.insertInto('users').values({ email: `${randomUUID()}@example.test`, display_name: 'Ada Quill', password_hash: 'x' }).returning('id').executeTakeFirstOrThrow()
  const manuscript = await db.insertInto('manuscripts').values({ title: 'Flags', owner_id: user.id, conventions: '{}' }).returning('id').executeTakeFirstOrThrow()
  const revision = await db.insertInto('revisions').values({ manuscript_id: manuscript.id, number: 1, uploaded_by: user.id }).returning('id').executeTakeFirstOrThrow()
  const run = await db.insertInto('check_runs').values({ revision_id: revision.id, status: 'finished', summary: JSON.stringify(OLD_HEAD), claims_total: 2, claims_done: 2, finished_at: new Date() }).returning('id').executeTakeFirstOrThrow()
  await db.insertInto('check_runs').values({ revision_id: revision.id, status: 'queued' }).execute()
  await db.insertInto('claims').values(OLD_CLAIMS.map((c, ordinal) => ({ ...c, check_run_id: run.id, ordinal, holds_under: JSON.stringify(c.holds_under), details: JSON.stringify(c.details) }))).execute()
  return run.id
}

describe('the report-document migration', () => {
  it('up makes one validated report per finished run, keeps claims rows as an index; down restores the old columns', async () => {
    const runId = await oldRun()

    const up = await migrator.migrateToLatest()
    expect(up.error).toBeUndefined()
    const after = await db.selectFrom('check_runs').select(['id', 'status', 'report', 'summary']).execute()
    const queued = after.find(r => r.status === 'queued')!
    expect(queued.report).toBeNull()
    expect(queued.summary).toEqual({})
    const finished = after.find(r => r.id === runId)!
    const report = parseReport(finished.report)
    expect(report.schema).toBe('scholium.report/2')
    expect(report.summary).toEqual(OLD_HEAD.summary)
    expect(report.files).toEqual(OLD_HEAD.files)
    expect(report.claims).toEqual([
      { id: 'main.tex:4:1', file: 'main.tex', line: 4, endLine: 4, kind: 'schubert', verdict: 'verified', holdsUnder: [], source: '\\Sch{132} = x_1 + x_2', computed: 'x_{1}+x_{2}', diff: null, message: 'Verified.', conventions: REFERENCE_CONVENTIONS, permutations: [[1, 3, 2]] },
      { id: 'main.tex:6:1', file: 'main.tex', line: 6, endLine: 7, kind: 'length', verdict: 'mismatch', holdsUnder: ['perm-inverse'], source: '\\ell(2143) = 3', computed: '2', diff: { basis: 'number', claimed: '3', computed: '2' }, message: 'Off by one.', label: 'eq:len', conventions: REFERENCE_CONVENTIONS, permutations: [[2, 1, 4, 3]], skipped: true, correction: { fixed: false, reason: 'the statement spans several lines' } },
    ])
    // The head the database derives is what lists, mail and audit read counts from.
    expect(verdictCountsOf(finished.summary)).toEqual({ claims: 2, verified: 1, mismatch: 1, unsupported: 0, error: 0 })
    expect(finished.summary).not.toHaveProperty('claims')
    const index = await db.selectFrom('claims').selectAll().where('check_run_id', '=', runId).orderBy('ordinal').execute()
    expect(index.map(r => r.report_id)).toEqual(['main.tex:4:1', 'main.tex:6:1'])
    expect(index[0]).not.toHaveProperty('details')
    await expect(sql`update check_runs set summary = '{}' where id = ${runId}`.execute(db)).rejects.toThrow(/can only be updated to DEFAULT/)

    const down = await migrator.migrateDown()
    expect(down.error).toBeUndefined()
    const restored = await db.selectFrom('check_runs').select(['summary']).where('id', '=', runId).executeTakeFirstOrThrow()
    expect(restored.summary).toEqual(OLD_HEAD)
    const rows = await db.selectFrom('claims').select(['details', 'holds_under', 'computed']).where('check_run_id', '=', runId).orderBy('ordinal').execute()
    expect(rows).toEqual(OLD_CLAIMS.map(c => ({ details: c.details, holds_under: c.holds_under, computed: c.computed })))
    const columns = await sql<{ column_name: string }>`select column_name from information_schema.columns where table_name = 'check_runs'`.execute(db)
    expect(columns.rows.map(c => c.column_name)).not.toContain('report')
  })

  it('a fresh database takes every migration in order, the document last, and every one undoes', async () => {
    await sql`create database ${sql.id(`${name}_fresh`)}`.execute(admin)
    const url = new URL(baseUrl)
    url.pathname = `/${name}_fresh`
    const fresh = new Kysely<any>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url.href, max: 1 }) }) })
    try {
      const freshMigrator = new Migrator({ db: fresh, provider: migrationsFolder(MIGRATIONS) })
      const up = await freshMigrator.migrateToLatest()
      expect(up.error).toBeUndefined()
      const applied = up.results!.map(r => r.migrationName)
      expect(applied).toEqual([...applied].sort())
      expect(applied.slice(-3)).toEqual(['20261202100000_worker_heartbeats', BEFORE, '20261202110000_report_document'])
      const down = await freshMigrator.migrateTo(NO_MIGRATIONS)
      expect(down.error).toBeUndefined()
      expect(down.results!.map(r => r.migrationName)).toEqual([...applied].reverse())
    }
    finally {
      await fresh.destroy()
    }
  })
})
