/**
 * Refereeing a submission: the venue's editor invites a referee by e-mail with a
 * single-use link that expires; the invited person accepts it signed in and gets an
 * assignment; the referee writes an overall note and notes on claims; the editor
 * releases them to the authors, who are told by e-mail.
 *
 * Anonymity: nothing here that reaches an author (the release mail, the released
 * notes) names the referee; a referee is "Referee N", numbered per submission in
 * the order of assignment. Audit entries do name actors; only editors read them.
 *
 * Decision (as for coauthor invitations): only an account whose e-mail is the
 * invited address may accept, so a forwarded link cannot make a stranger a referee.
 * Notes can no longer be changed once released: what the authors read stays what
 * the editor released.
 */
import { createHash, randomBytes } from 'node:crypto'
import type { Db } from '../database/connect'
import type { SessionUser } from '#shared/types/api'
import type { AssignmentGrant, SubmissionGrant } from '../utils/access'
import { consumeRefereeInvitation, findRefereeInvitationByHash, insertRefereeInvitation } from '../repositories/referee-invitations'
import { findAssignmentOfSubmission, findClaimOfRevision, insertRefereeClaimNote, listManuscriptMemberEmails, markAssignmentReleased } from '../repositories/referee-notes'
import { insertRefereeAssignment, markSubmissionInReview, setRefereeNote } from '../repositories/submissions'
import { appendAudit } from '../repositories/audit'

export const REFEREE_INVITATION_DAYS = 14

/** The hex SHA-256 stored instead of a link token: `hashRefereeToken('abc')` → 'ba7816bf…'. */
export function hashRefereeToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex')
}

/** Sends a referee invitation; the row, its audit entry and the mail stand or fall together. */
export async function inviteReferee(db: Db, grant: SubmissionGrant, email: string, baseUrl: string): Promise<{ invitationId: string, expiresAt: string }> {
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + REFEREE_INVITATION_DAYS * 24 * 3600_000)
  return db.transaction().execute(async (trx) => {
    const { id } = await insertRefereeInvitation(trx, { tokenHash: hashRefereeToken(token), email, submissionId: grant.submissionId, invitedBy: grant.user.id, expiresAt })
    await appendAudit(trx, { actorId: grant.user.id, action: 'referee.invited', subjectType: 'submission', subjectId: grant.submissionId, details: { invitationId: id, email } })
    // Sent last, inside the transaction: a mail that fails rolls the invitation back.
    await sendMail({
      to: email,
      subject: `Invitation to referee "${grant.title}" for ${grant.venueName}`,
      text: [
        `${grant.user.displayName}, editor of ${grant.venueName}, invites you to referee revision ${grant.revisionNumber} of "${grant.title}" on Scholium.`,
        '',
        'Open this link, sign in (or create an account) with this e-mail address, and accept:',
        `${baseUrl}/referee-invitations/${token}`,
        '',
        `The link works once and expires on ${expiresAt.toUTCString()}.`,
        'The authors will not learn your name or e-mail address. If you did not expect this invitation, ignore this message.',
      ].join('\n'),
    })
    return { invitationId: id, expiresAt: expiresAt.toISOString() }
  })
}

/**
 * Accepts a referee invitation for the signed-in user: 404 for no such link,
 * 410 used / expired, 403 another address, 409 for an author of the manuscript.
 */
export async function acceptRefereeInvitation(db: Db, token: string, user: SessionUser): Promise<{ assignmentId: string }> {
  const invitation = await findRefereeInvitationByHash(db, hashRefereeToken(token))
  if (!invitation || !invitation.submission_id) fail(404, 'not-found', 'No such invitation link')
  if (invitation.used_at) fail(410, 'invitation-used', 'This link has already been used; ask the editor for a new one')
  if (invitation.expires_at.getTime() <= Date.now()) fail(410, 'invitation-expired', 'This link has expired; ask the editor for a new one')
  if (invitation.email.toLowerCase() !== user.email.toLowerCase()) fail(403, 'invitation-other-address', 'This invitation was sent to another e-mail address; sign in with that address')
  const submissionId = invitation.submission_id
  const isAuthor = await db.selectFrom('submissions as s').innerJoin('revisions as r', 'r.id', 's.revision_id')
    .innerJoin('manuscript_members as mm', 'mm.manuscript_id', 'r.manuscript_id')
    .select('mm.user_id').where('s.id', '=', submissionId).where('mm.user_id', '=', user.id).executeTakeFirst()
  if (isAuthor) fail(409, 'conflict', 'An author of a manuscript cannot referee it')
  return db.transaction().execute(async (trx) => {
    if (!(await consumeRefereeInvitation(trx, invitation.id, new Date()))) fail(410, 'invitation-used', 'This link has already been used; ask the editor for a new one')
    const assignment = await insertRefereeAssignment(trx, { submissionId, refereeId: user.id, invitedBy: invitation.invited_by ?? user.id })
    await markSubmissionInReview(trx, submissionId)
    await appendAudit(trx, { actorId: user.id, action: 'referee.accepted', subjectType: 'submission', subjectId: submissionId, details: { invitationId: invitation.id, assignmentId: assignment.id } })
    return { assignmentId: assignment.id }
  })
}

/** Replaces the referee's overall note (refused once released). */
export async function saveOverallNote(db: Db, grant: AssignmentGrant, note: string): Promise<void> {
  if (grant.released) fail(409, 'conflict', 'These notes have been released and can no longer be changed')
  await db.transaction().execute(async (trx) => {
    await setRefereeNote(trx, grant.assignmentId, note)
    // The audit keeps the length, not the text: the note itself is the record.
    await appendAudit(trx, { actorId: grant.user.id, action: 'review.note-saved', subjectType: 'submission', subjectId: grant.submissionId, details: { assignmentId: grant.assignmentId, length: note.length } })
  })
}

/** Adds a note on a claim of the submitted revision (any of its runs); 404 for another revision's claim. */
export async function addClaimNote(db: Db, grant: AssignmentGrant, claimId: string, body: string): Promise<{ id: string }> {
  if (grant.released) fail(409, 'conflict', 'These notes have been released and can no longer be changed')
  const claim = await findClaimOfRevision(db, claimId, grant.revisionId)
  if (!claim) fail(404, 'not-found', 'No such claim in this revision')
  return db.transaction().execute(async (trx) => {
    const note = await insertRefereeClaimNote(trx, { manuscriptId: grant.manuscriptId, contentKey: claim.content_key, claimId: claim.id, authorId: grant.user.id, assignmentId: grant.assignmentId, body })
    await appendAudit(trx, { actorId: grant.user.id, action: 'review.claim-note-added', subjectType: 'submission', subjectId: grant.submissionId, details: { assignmentId: grant.assignmentId, noteId: note.id, file: claim.file, line: claim.line } })
    return note
  })
}

/**
 * Releases one referee's notes to the authors and tells them by e-mail (naming
 * "Referee N", never the person). Releasing twice changes nothing and sends nothing.
 */
export async function releaseRefereeNotes(db: Db, grant: SubmissionGrant, assignmentId: string, baseUrl: string): Promise<{ referee: string, releasedAt: string }> {
  const assignment = await findAssignmentOfSubmission(db, grant.submissionId, assignmentId)
  if (!assignment) fail(404, 'not-found', 'No such referee for this submission')
  const referee = `Referee ${assignment.number}`
  if (assignment.released_at) return { referee, releasedAt: assignment.released_at.toISOString() }
  const at = new Date()
  await db.transaction().execute(async (trx) => {
    if (!(await markAssignmentReleased(trx, assignmentId, at))) return
    await appendAudit(trx, { actorId: grant.user.id, action: 'review.released', subjectType: 'submission', subjectId: grant.submissionId, details: { assignmentId, referee } })
    const link = `${baseUrl}/manuscripts/${grant.manuscriptId}`
    for (const to of await listManuscriptMemberEmails(trx, grant.manuscriptId)) {
      await sendMail({
        to,
        subject: `Referee notes released for "${grant.title}"`,
        text: [
          `The editor of ${grant.venueName} has released the notes of ${referee} on revision ${grant.revisionNumber} of "${grant.title}".`,
          '',
          'Read them on the manuscript\'s page:',
          link,
        ].join('\n'),
      })
    }
  })
  return { referee, releasedAt: at.toISOString() }
}
