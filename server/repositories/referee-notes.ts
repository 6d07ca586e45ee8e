/**
 * Referee notes: the overall note lives on `referee_assignments.overall_note`;
 * per-claim notes are `claim_comments` rows with `referee_assignment_id` set.
 * A note keeps the claim's content key, so it can still be placed when the
 * claim row it was written on is gone (a later run, a removed run).
 */
import { sql } from 'kysely'
import type { Db } from '../database/connect'
import type { RefereeClaimNote, ReviewClaimOption } from '#shared/types/editorial'
import { latestFinishedRun } from './check-runs'

/** A claim of one of the revision's runs, or undefined (another revision's claim, no such claim). */
export async function findClaimOfRevision(db: Db, claimId: string, revisionId: string) {
  return db.selectFrom('claims as c').innerJoin('check_runs as r', 'r.id', 'c.check_run_id')
    .select(['c.id', 'c.content_key', 'c.file', 'c.line'])
    .where('c.id', '=', claimId).where('r.revision_id', '=', revisionId)
    .executeTakeFirst()
}

export async function insertRefereeClaimNote(db: Db, input: { manuscriptId: string, contentKey: string, claimId: string | null, authorId: string, assignmentId: string, body: string }): Promise<{ id: string }> {
  return db.insertInto('claim_comments')
    .values({ manuscript_id: input.manuscriptId, content_key: input.contentKey, claim_id: input.claimId, author_id: input.authorId, referee_assignment_id: input.assignmentId, body: input.body })
    .returning('id').executeTakeFirstOrThrow()
}

/** The claims of the revision's newest finished run, in reading order. */
export async function listClaimOptions(db: Db, revisionId: string): Promise<ReviewClaimOption[]> {
  const run = await latestFinishedRun(db, revisionId)
  if (!run) return []
  const rows = await db.selectFrom('claims').select(['id', 'file', 'line', 'kind', 'verdict', 'source'])
    .where('check_run_id', '=', run.id).orderBy('ordinal').execute()
  return rows
}

/** Per-claim notes of some assignments, oldest first, placed in the revision (by claim row, else by content key). */
export async function listClaimNotes(db: Db, assignmentIds: string[], revisionId: string): Promise<(RefereeClaimNote & { assignmentId: string })[]> {
  if (assignmentIds.length === 0) return []
  const rows = await db.selectFrom('claim_comments as n')
    .leftJoin('claims as c', 'c.id', 'n.claim_id')
    .select(['n.id', 'n.body', 'n.created_at', 'n.content_key', 'n.referee_assignment_id', 'c.file', 'c.line', 'c.source'])
    .where('n.referee_assignment_id', 'in', assignmentIds)
    .orderBy('n.created_at').orderBy('n.id')
    .execute()
  const unplaced = [...new Set(rows.filter(r => r.file === null).map(r => r.content_key))]
  const byKey = new Map<string, { file: string, line: number, source: string }>()
  const run = unplaced.length ? await latestFinishedRun(db, revisionId) : undefined
  if (run) {
    const claims = await db.selectFrom('claims').select(['content_key', 'file', 'line', 'source'])
      .where('check_run_id', '=', run.id).where('content_key', 'in', unplaced).orderBy('ordinal').execute()
    for (const c of claims) if (!byKey.has(c.content_key)) byKey.set(c.content_key, c)
  }
  return rows.map((r) => {
    const place = r.file !== null ? { file: r.file, line: r.line, source: r.source } : byKey.get(r.content_key)
    return {
      id: r.id,
      assignmentId: r.referee_assignment_id!,
      body: r.body,
      createdAt: r.created_at.toISOString(),
      file: place?.file ?? null,
      line: place?.line ?? null,
      source: place?.source ?? null,
    }
  })
}

/**
 * Released assignments of a manuscript's submissions with their number within the
 * submission ("Referee 1" is the first assigned, released or not, so numbers never shift).
 * Selects no column of the referee's user row: authors receive what this returns.
 */
export async function listReleasedAssignmentsForManuscript(db: Db, manuscriptId: string) {
  const numbered = db.selectFrom('referee_assignments as a')
    .select(['a.id', 'a.submission_id', 'a.overall_note', 'a.released_at',
      sql<number>`row_number() over (partition by a.submission_id order by a.created_at, a.id)`.as('ordinal')])
    .as('na')
  return db.selectFrom(numbered)
    .innerJoin('submissions as s', 's.id', 'na.submission_id')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('venues as v', 'v.id', 's.venue_id')
    .select(['na.id', 'na.submission_id', 'na.overall_note', 'na.released_at', 'na.ordinal', 'r.id as revisionId', 'r.number', 'v.name as venueName'])
    .where('r.manuscript_id', '=', manuscriptId)
    .where('na.released_at', 'is not', null)
    .orderBy('s.created_at', 'desc').orderBy('na.ordinal')
    .execute()
}

/** One assignment of one submission (for the editor's release), with the referee number. */
export async function findAssignmentOfSubmission(db: Db, submissionId: string, assignmentId: string) {
  const rows = await db.selectFrom('referee_assignments')
    .select(['id', 'released_at', 'status'])
    .where('submission_id', '=', submissionId)
    .orderBy('created_at').orderBy('id')
    .execute()
  const index = rows.findIndex(r => r.id === assignmentId)
  return index < 0 ? undefined : { ...rows[index]!, number: index + 1 }
}

/** Sets the release time once; a second release leaves the first time. */
export async function markAssignmentReleased(db: Db, assignmentId: string, at: Date): Promise<boolean> {
  const row = await db.updateTable('referee_assignments').set({ released_at: at })
    .where('id', '=', assignmentId).where('released_at', 'is', null)
    .returning('id').executeTakeFirst()
  return row !== undefined
}

/** E-mail addresses of a manuscript's members (owner and coauthors). */
export async function listManuscriptMemberEmails(db: Db, manuscriptId: string): Promise<string[]> {
  const rows = await db.selectFrom('manuscript_members as mm').innerJoin('users as u', 'u.id', 'mm.user_id')
    .select('u.email').where('mm.manuscript_id', '=', manuscriptId).execute()
  return rows.map(r => r.email)
}
