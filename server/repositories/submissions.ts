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
