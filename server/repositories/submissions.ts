import { sql } from 'kysely'
import type { Db } from '../database/connect'
import type { SubmissionSummaryView } from '#shared/types/api'

export async function insertSubmission(db: Db, input: { revisionId: string, venueId: string, submittedBy: string }): Promise<{ id: string }> {
  return db.insertInto('submissions')
    .values({ revision_id: input.revisionId, venue_id: input.venueId, submitted_by: input.submittedBy })
    .onConflict(oc => oc.columns(['revision_id', 'venue_id']).doUpdateSet({ updated_at: new Date() }))
    .returning('id').executeTakeFirstOrThrow()
}

/** Submissions of a manuscript as its authors see them: no referee in sight. */
export async function listSubmissionsForManuscript(db: Db, manuscriptId: string): Promise<SubmissionSummaryView[]> {
  const rows = await db.selectFrom('submissions as s')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('venues as v', 'v.id', 's.venue_id')
    .select(['s.id', 'v.name as venueName', 'r.number', 's.status', 's.created_at'])
    .where('r.manuscript_id', '=', manuscriptId)
    .orderBy('s.created_at', 'desc')
    .execute()
  return rows.map(r => ({ id: r.id, venueName: r.venueName, revisionNumber: r.number, status: r.status, createdAt: r.created_at.toISOString() }))
}

/** A venue's submissions with what its editors need, newest first. */
export async function listSubmissionsForVenue(db: Db, venueId: string) {
  return db.selectFrom('submissions as s')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('manuscripts as m', 'm.id', 'r.manuscript_id')
    .innerJoin('users as u', 'u.id', 's.submitted_by')
    .select(['s.id', 's.revision_id', 's.status', 's.created_at', 'r.number', 'm.title', 'u.display_name as submittedBy'])
    .where('s.venue_id', '=', venueId)
    .orderBy('s.created_at', 'desc')
    .execute()
}

export async function listRefereesForSubmissions(db: Db, submissionIds: string[]) {
  if (submissionIds.length === 0) return []
  return db.selectFrom('referee_assignments as a')
    .innerJoin('users as u', 'u.id', 'a.referee_id')
    .select(['a.id', 'a.submission_id', 'a.released_at', 'u.display_name', 'u.email'])
    .where('a.submission_id', 'in', submissionIds)
    // In order of assignment, so the editor's list matches "Referee 1", "Referee 2" as the authors see them.
    .orderBy('a.created_at').orderBy('a.id')
    .execute()
}

export async function insertRefereeAssignment(db: Db, input: { submissionId: string, refereeId: string, invitedBy: string }): Promise<{ id: string }> {
  return db.insertInto('referee_assignments')
    .values({ submission_id: input.submissionId, referee_id: input.refereeId, invited_by: input.invitedBy })
    .onConflict(oc => oc.columns(['submission_id', 'referee_id']).doUpdateSet({ status: 'active' }))
    .returning('id').executeTakeFirstOrThrow()
}

export async function listAssignmentsForReferee(db: Db, refereeId: string) {
  return db.selectFrom('referee_assignments as a')
    .innerJoin('submissions as s', 's.id', 'a.submission_id')
    .innerJoin('venues as v', 'v.id', 's.venue_id')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('manuscripts as m', 'm.id', 'r.manuscript_id')
    .select(['a.id', 'a.submission_id', 'a.created_at', 'a.released_at', 'a.overall_note', 'v.name as venueName', 'r.id as revisionId', 'r.number', 'm.id as manuscriptId', 'm.title'])
    .where('a.referee_id', '=', refereeId)
    .where('a.status', '!=', 'withdrawn')
    .orderBy('a.created_at', 'desc')
    .execute()
}

export async function setRefereeNote(db: Db, assignmentId: string, note: string): Promise<void> {
  await db.updateTable('referee_assignments').set({ overall_note: note }).where('id', '=', assignmentId).execute()
}

export async function releaseRefereeNotes(db: Db, assignmentId: string): Promise<void> {
  await db.updateTable('referee_assignments').set({ released_at: new Date() }).where('id', '=', assignmentId).execute()
}

/** One page of a venue's submissions, filtered and sorted in the database (see `VenueSubmissionsQuery`). */
export async function pageSubmissionsForVenue(db: Db, venueId: string, query: VenueSubmissionsQuery) {
  const filtered = db.selectFrom('submissions as s')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('manuscripts as m', 'm.id', 'r.manuscript_id')
    .innerJoin('users as u', 'u.id', 's.submitted_by')
    // The newest finished run gives the verdict counts; a queued re-check has none yet.
    .leftJoinLateral(
      eb => eb.selectFrom('check_runs as c').select('c.summary')
        .whereRef('c.revision_id', '=', 'r.id').where('c.status', '=', 'finished')
        .orderBy('c.finished_at', 'desc').limit(1).as('lr'),
      join => join.onTrue(),
    )
    .where('s.venue_id', '=', venueId)
    .$if(query.status !== undefined, qb => qb.where('s.status', '=', query.status!))
    .$if(query.q !== undefined && query.q !== '', qb => qb.where(eb => eb.or([
      eb('m.title', 'ilike', likePattern(query.q!)),
      eb('u.display_name', 'ilike', likePattern(query.q!)),
    ])))
  const { total } = await filtered.select(eb => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow()
  const order = query.order === 'asc' ? sql`asc` : sql`desc`
  const sortColumn = query.sort === 'date'
    ? sql`s.created_at`
    : query.sort === 'title'
      ? sql`lower(m.title)`
      : query.sort === 'status'
        ? sql`s.status`
        // Runs that have not finished sort below every count.
        : sql`coalesce((lr.summary -> 'summary' ->> ${sql.lit(query.sort)})::int, -1)`
  const rows = await filtered
    .select(['s.id', 's.revision_id', 's.status', 's.created_at', 'r.number', 'm.title', 'u.display_name as submittedBy', 'lr.summary as finishedSummary'])
    .orderBy(sql`${sortColumn} ${order}`)
    .orderBy('s.created_at', 'desc').orderBy('s.id')
    .limit(query.pageSize).offset((query.page - 1) * query.pageSize)
    .execute()
  return { total: Number(total), rows }
}

export interface VenueSubmissionsQuery {
  page: number
  pageSize: number
  sort: 'date' | 'title' | 'status' | 'verified' | 'mismatch' | 'unsupported' | 'error'
  order: 'asc' | 'desc'
  q?: string
  status?: 'submitted' | 'in-review' | 'decided' | 'withdrawn'
}

/** `%text%` for ILIKE, with the pattern characters in the text taken literally. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, c => `\\${c}`)}%`
}

/** A submission as its venue's editor sees it; undefined when the user edits no venue it was sent to. */
export async function findSubmissionForEditor(db: Db, submissionId: string, editorId: string) {
  return db.selectFrom('submissions as s')
    .innerJoin('venue_editors as ve', 've.venue_id', 's.venue_id')
    .innerJoin('venues as v', 'v.id', 's.venue_id')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('manuscripts as m', 'm.id', 'r.manuscript_id')
    .innerJoin('users as u', 'u.id', 's.submitted_by')
    .select(['s.id', 's.venue_id', 's.revision_id', 's.status', 's.created_at', 'v.name as venueName', 'r.number', 'm.id as manuscriptId', 'm.title', 'u.display_name as submittedBy'])
    .where('s.id', '=', submissionId)
    .where('ve.user_id', '=', editorId)
    .executeTakeFirst()
}

/** Moves a submission from 'submitted' to 'in-review' (the first referee accepted); other states stay. */
export async function markSubmissionInReview(db: Db, submissionId: string): Promise<void> {
  await db.updateTable('submissions').set({ status: 'in-review', updated_at: new Date() })
    .where('id', '=', submissionId).where('status', '=', 'submitted').execute()
}

/** A submission of one manuscript, locked for the caller's transaction; undefined when it is not one of its submissions. */
export async function lockSubmissionOfManuscript(db: Db, submissionId: string, manuscriptId: string) {
  return db.selectFrom('submissions as s')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .select(['s.id', 's.status', 's.venue_id', 'r.number'])
    .where('s.id', '=', submissionId)
    .where('r.manuscript_id', '=', manuscriptId)
    .forUpdate('s')
    .executeTakeFirst()
}

/** Marks a submission withdrawn. The row stays: the venue keeps its record and audit trail. */
export async function markSubmissionWithdrawn(db: Db, submissionId: string): Promise<void> {
  await db.updateTable('submissions').set({ status: 'withdrawn', updated_at: new Date() }).where('id', '=', submissionId).execute()
}
