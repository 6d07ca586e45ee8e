/**
 * The editor's audit summary of one submission: what the newest finished check
 * found, under which conventions and engine version, the sources' hashes, every
 * check run, and every audit entry about the submission or its revision, with who
 * did it (referees included: only editors receive this). As JSON and as CSV.
 *
 * The audit log is read here, never changed: the database refuses updates and deletes.
 */
import { sql } from 'kysely'
import type { Db } from '../database/connect'
import type { AuditEvent, AuditRun, AuditSummary } from '#shared/types/editorial'
import { verdictCountsOf } from '#shared/types/report-schema'
import type { SubmissionGrant } from '../utils/access'
import { listRevisionFiles } from '../repositories/revisions'

export async function auditSummary(db: Db, grant: SubmissionGrant): Promise<AuditSummary> {
  const [files, runs, events, roles] = await Promise.all([
    listRevisionFiles(db, [grant.revisionId]),
    db.selectFrom('check_runs as c').leftJoin('users as u', 'u.id', 'c.requested_by')
      .select(['c.id', 'c.status', 'c.queued_at', 'c.finished_at', 'c.engine_version', 'c.conventions', 'c.summary', 'u.display_name as requestedBy'])
      .where('c.revision_id', '=', grant.revisionId).orderBy('c.queued_at').orderBy('c.id').execute(),
    db.selectFrom('audit_log as a').leftJoin('users as u', 'u.id', 'a.actor_id')
      .select(['a.id', 'a.at', 'a.action', 'a.subject_type', 'a.subject_id', 'a.details', 'a.actor_id', 'u.display_name'])
      .where(eb => eb.or([
        eb.and([eb('a.subject_type', '=', 'submission'), eb('a.subject_id', '=', grant.submissionId)]),
        eb.and([eb('a.subject_type', '=', 'revision'), eb('a.subject_id', '=', grant.revisionId)]),
        // The upload of the submitted revision is logged on the manuscript, with the revision's number.
        eb.and([eb('a.subject_type', '=', 'manuscript'), eb('a.subject_id', '=', grant.manuscriptId), eb('a.action', '=', 'revision.uploaded'),
          eb(sql<string>`a.details ->> 'revision'`, '=', String(grant.revisionNumber))]),
      ]))
      .orderBy('a.at').orderBy('a.id').execute(),
    rolesInSubmission(db, grant),
  ])
  const auditRuns: AuditRun[] = runs.map(r => ({
    ...conventionsOf(r.summary),
    id: r.id,
    status: r.status,
    requestedBy: r.requestedBy,
    queuedAt: r.queued_at.toISOString(),
    finishedAt: r.finished_at?.toISOString() ?? null,
    engineVersion: r.engine_version,
    conventions: r.conventions,
    counts: r.status === 'finished' ? verdictCountsOf(r.summary) : null,
  }))
  const newest = [...runs].filter(r => r.status === 'finished').sort((a, b) => (b.finished_at?.getTime() ?? 0) - (a.finished_at?.getTime() ?? 0))[0]
  const head = newest?.summary as { engine?: { version?: string } } | undefined
  const auditEvents: AuditEvent[] = events.map(e => ({
    at: e.at.toISOString(),
    action: e.action,
    who: e.display_name,
    whoRole: e.actor_id ? roles.get(e.actor_id) ?? 'other' : null,
    subjectType: e.subject_type,
    subjectId: e.subject_id,
    details: e.details,
  }))
  return {
    submission: { id: grant.submissionId, venueName: grant.venueName, manuscriptTitle: grant.title, revisionId: grant.revisionId, revisionNumber: grant.revisionNumber, status: grant.status, submittedBy: grant.submittedBy, createdAt: grant.createdAt.toISOString() },
    counts: newest ? verdictCountsOf(newest.summary) : null,
    engineVersion: newest ? newest.engine_version ?? head?.engine?.version ?? null : null,
    conventions: newest ? conventionsOf(newest.summary) : null,
    files: (files.get(grant.revisionId) ?? []).map(f => ({ path: f.path, sha256: f.sha256, sizeBytes: f.sizeBytes })),
    runs: auditRuns,
    events: auditEvents,
    generatedAt: new Date().toISOString(),
  }
}

function conventionsOf(runSummary: unknown): { inferred: Record<string, string>, used: Record<string, string> } {
  const c = (runSummary as { conventions?: { inferred?: Record<string, string>, used?: Record<string, string> } } | null)?.conventions
  return { inferred: c?.inferred ?? {}, used: c?.used ?? {} }
}

/** Each person's part in the submission; an editor who also wrote the paper counts as its author. */
async function rolesInSubmission(db: Db, grant: SubmissionGrant): Promise<Map<string, AuditEvent['whoRole']>> {
  const [members, referees, editors] = await Promise.all([
    db.selectFrom('manuscript_members').select(['user_id', 'role']).where('manuscript_id', '=', grant.manuscriptId).execute(),
    db.selectFrom('referee_assignments').select('referee_id').where('submission_id', '=', grant.submissionId).execute(),
    db.selectFrom('venue_editors').select('user_id').where('venue_id', '=', grant.venueId).execute(),
  ])
  const roles = new Map<string, AuditEvent['whoRole']>()
  for (const e of editors) roles.set(e.user_id, 'editor')
  for (const r of referees) roles.set(r.referee_id, 'referee')
  for (const m of members) roles.set(m.user_id, m.role)
  return roles
}

/**
 * The summary as one CSV table with the columns `record,name,value,at,who,details`
 * (RFC 4180 quoting; cells that a spreadsheet would run as a formula get a leading apostrophe).
 */
export function auditSummaryCsv(summary: AuditSummary): string {
  const rows: (string | number | null)[][] = [['record', 'name', 'value', 'at', 'who', 'details']]
  const s = summary.submission
  rows.push(['submission', 'id', s.id, s.createdAt, s.submittedBy, ''])
  rows.push(['submission', 'venue', s.venueName, '', '', ''])
  rows.push(['submission', 'manuscript', s.manuscriptTitle, '', '', ''])
  rows.push(['submission', 'revision', s.revisionNumber, '', '', s.revisionId])
  rows.push(['submission', 'status', s.status, '', '', ''])
  for (const key of ['claims', 'verified', 'mismatch', 'unsupported', 'error'] as const) rows.push(['count', key, summary.counts?.[key] ?? '', '', '', ''])
  rows.push(['engine', 'version', summary.engineVersion ?? '', '', '', ''])
  for (const [axis, id] of Object.entries(summary.conventions?.inferred ?? {})) rows.push(['convention-inferred', axis, id, '', '', ''])
  for (const [axis, id] of Object.entries(summary.conventions?.used ?? {})) rows.push(['convention-used', axis, id, '', '', ''])
  for (const f of summary.files) rows.push(['file', f.path, f.sha256, '', '', `${f.sizeBytes} bytes`])
  for (const r of summary.runs) {
    rows.push(['run', r.id, r.status, r.finishedAt ?? r.queuedAt, r.requestedBy ?? '', JSON.stringify({ engineVersion: r.engineVersion, fixed: r.conventions, counts: r.counts })])
    for (const [axis, id] of Object.entries(r.inferred)) rows.push(['run-convention-inferred', axis, id, r.queuedAt, r.requestedBy ?? '', r.id])
  }
  for (const e of summary.events) rows.push(['event', e.action, e.whoRole ?? '', e.at, e.who ?? '', JSON.stringify(e.details)])
  return rows.map(row => row.map(csvCell).join(',')).join('\r\n') + '\r\n'
}

function csvCell(value: string | number | null): string {
  let text = value === null ? '' : String(value)
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text
}
