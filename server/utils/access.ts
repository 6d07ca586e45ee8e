import type { H3Event } from 'h3'
import type { ManuscriptRole, RevisionViewer, SessionUser } from '#shared/types/api'
import { findManuscriptMembership, findRevisionAccess } from '../repositories/manuscripts'
import { isVenueEditor } from '../repositories/venues'
import { findSubmissionForEditor, listAssignmentsForReferee } from '../repositories/submissions'

/**
 * What a route needs from its caller. Every route that is not public goes
 * through `authorize`, the one guard, with one of these.
 *
 * Where a caller may not even know that a thing exists (someone else's
 * manuscript, another venue, an unassigned submission), refusal is 404,
 * so the answer does not confirm that it exists.
 */
export type Requirement
  = | { signedIn: true }
    | { siteAdmin: true }
    | { manuscript: string, owner?: boolean }
    | { venueEditor: string }
    | { refereeAssignment: string }
    | { revision: string }
    | { submissionEditor: string }

export interface ManuscriptGrant { user: SessionUser, manuscriptId: string, role: ManuscriptRole, isOwner: boolean, title: string, conventions: Record<string, string> }
export interface RevisionGrant { user: SessionUser, revisionId: string, revisionNumber: number, manuscriptId: string, title: string, conventions: Record<string, string>, viewer: RevisionViewer }
export interface SubmissionGrant { user: SessionUser, submissionId: string, venueId: string, venueName: string, revisionId: string, revisionNumber: number, manuscriptId: string, title: string, status: string, submittedBy: string, createdAt: Date }
export interface AssignmentGrant { user: SessionUser, assignmentId: string, submissionId: string, revisionId: string, manuscriptId: string, title: string, venueName: string, revisionNumber: number, overallNote: string, released: boolean }

export async function authorize(event: H3Event, need: { manuscript: string, owner?: boolean }): Promise<ManuscriptGrant>
export async function authorize(event: H3Event, need: { refereeAssignment: string }): Promise<AssignmentGrant>
export async function authorize(event: H3Event, need: { revision: string }): Promise<RevisionGrant>
export async function authorize(event: H3Event, need: { submissionEditor: string }): Promise<SubmissionGrant>
export async function authorize(event: H3Event, need: Requirement): Promise<{ user: SessionUser }>
export async function authorize(event: H3Event, need: Requirement): Promise<{ user: SessionUser } | ManuscriptGrant | AssignmentGrant | RevisionGrant | SubmissionGrant> {
  const session = await getUserSession(event)
  const user = session.user as SessionUser | undefined
  if (!user) fail(401, 'not-signed-in', 'Please sign in')
  const db = useDb()

  if ('signedIn' in need) return { user }
  if ('siteAdmin' in need) {
    if (user.siteRole !== 'admin') fail(403, 'forbidden', 'Only a site administrator may do this')
    return { user }
  }
  if ('manuscript' in need) {
    const membership = isUuid(need.manuscript) ? await findManuscriptMembership(db, need.manuscript, user.id) : undefined
    if (!membership) fail(404, 'not-found', 'No such manuscript')
    const isOwner = membership.ownerId === user.id
    if (need.owner && !isOwner) fail(403, 'forbidden', 'Only the manuscript\'s owner may do this')
    return { user, manuscriptId: membership.id, role: membership.role, isOwner, title: membership.title, conventions: membership.conventions }
  }
  if ('venueEditor' in need) {
    if (!isUuid(need.venueEditor) || !(await isVenueEditor(db, need.venueEditor, user.id))) fail(404, 'not-found', 'No such venue')
    return { user }
  }
  if ('submissionEditor' in need) {
    // Only an editor of the venue it was sent to; everyone else (authors and referees included) gets 404.
    const s = isUuid(need.submissionEditor) ? await findSubmissionForEditor(db, need.submissionEditor, user.id) : undefined
    if (!s) fail(404, 'not-found', 'No such submission')
    return { user, submissionId: s.id, venueId: s.venue_id, venueName: s.venueName, revisionId: s.revision_id, revisionNumber: s.number, manuscriptId: s.manuscriptId, title: s.title, status: s.status, submittedBy: s.submittedBy, createdAt: s.created_at }
  }
  if ('revision' in need) {
    const access = isUuid(need.revision) ? await findRevisionAccess(db, need.revision, user.id) : undefined
    if (!access) fail(404, 'not-found', 'No such revision')
    return { user, ...access }
  }
  const assignment = isUuid(need.refereeAssignment)
    ? (await listAssignmentsForReferee(db, user.id)).find(a => a.id === need.refereeAssignment)
    : undefined
  if (!assignment) fail(404, 'not-found', 'No such review')
  return {
    user,
    assignmentId: assignment.id,
    submissionId: assignment.submission_id,
    revisionId: assignment.revisionId,
    manuscriptId: assignment.manuscriptId,
    title: assignment.title,
    venueName: assignment.venueName,
    revisionNumber: assignment.number,
    overallNote: assignment.overall_note,
    released: assignment.released_at !== null,
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i
/** Malformed ids are simply "not found"; they never reach PostgreSQL as a cast error. */
export function isUuid(value: string): boolean {
  return UUID.test(value)
}
