/**
 * Manuscript membership by e-mail: the owner invites a coauthor with a single-use link
 * that expires, the invited person accepts it signed in, and the owner may remove members.
 *
 * Decision: only an account whose e-mail is the invited address (case-insensitively)
 * may accept. A forwarded link therefore cannot make a stranger a coauthor; someone
 * who wants to use another address asks the owner for a new invitation.
 */
import { createHash, randomBytes } from 'node:crypto'
import type { Db } from '../database/connect'
import type { InvitationPreview, PendingInvitationView, SessionUser } from '#shared/types/api'
import type { ManuscriptGrant } from '../utils/access'
import { findInvitationByTokenHash, insertInvitation, markInvitationUsed, type InvitationKind } from '../repositories/invitations'
import { addManuscriptMember, deleteManuscriptMember, isMemberByEmail, touchManuscript } from '../repositories/manuscripts'
import { appendAudit } from '../repositories/audit'
import { coauthorInvitationMail } from '../mail/messages'

export const COAUTHOR_INVITATION_DAYS = 7

/** A fresh link token (32 random bytes, base64url) and the hash that is stored in its place. */
export function newLinkToken(): { token: string, tokenHash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, tokenHash: hashLinkToken(token) }
}

/** `hashLinkToken(token)` is the hex SHA-256 that `invitations.token_hash` holds. */
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex')
}

/**
 * The invitation a link names, if it can still be used: 404 for no such link (or another kind),
 * 410 'invitation-used' / 'invitation-expired' for one that no longer works.
 */
export async function openInvitation(db: Db, kind: InvitationKind, token: string) {
  const invitation = await findInvitationByTokenHash(db, kind, hashLinkToken(token))
  if (!invitation) fail(404, 'not-found', 'No such invitation link')
  if (invitation.usedAt) fail(410, 'invitation-used', 'This link has already been used; ask for a new one')
  if (invitation.expiresAt.getTime() <= Date.now()) fail(410, 'invitation-expired', 'This link has expired; ask for a new one')
  return invitation
}

/** Sends a coauthor invitation. The row, its audit entry and the mail stand or fall together. */
export async function inviteCoauthor(db: Db, grant: ManuscriptGrant, email: string, baseUrl: string): Promise<PendingInvitationView> {
  if (await isMemberByEmail(db, grant.manuscriptId, email)) fail(409, 'already-member', 'Someone with this e-mail is already a member of the manuscript')
  const { token, tokenHash } = newLinkToken()
  const expiresAt = new Date(Date.now() + COAUTHOR_INVITATION_DAYS * 24 * 3600_000)
  return db.transaction().execute(async (trx) => {
    const { id } = await insertInvitation(trx, { kind: 'coauthor', tokenHash, email, manuscriptId: grant.manuscriptId, invitedBy: grant.user.id, expiresAt })
    await appendAudit(trx, { actorId: grant.user.id, action: 'invitation.sent', subjectType: 'manuscript', subjectId: grant.manuscriptId, details: { invitationId: id, kind: 'coauthor', email } })
    // Sent last, inside the transaction: a message that cannot be sent leaves no invitation behind.
    try {
      await sendMail(coauthorInvitationMail({ to: email, inviterName: grant.user.displayName, manuscriptTitle: grant.title, link: `${baseUrl}/invitations/${token}`, expiresAt }))
    }
    catch (error) {
      console.error('[mail] invitation not sent', error)
      fail(502, 'mail-unavailable', 'The invitation could not be sent by e-mail; try again later')
    }
    return { id, email, createdAt: new Date().toISOString(), expiresAt: expiresAt.toISOString() }
  })
}

/** What a coauthor link is for, shown before anyone signs in. */
export async function previewInvitation(db: Db, token: string): Promise<InvitationPreview> {
  const invitation = await openInvitation(db, 'coauthor', token)
  return {
    kind: 'coauthor',
    manuscriptTitle: invitation.manuscriptTitle ?? '',
    invitedBy: invitation.inviterName ?? '',
    email: invitation.email,
    expiresAt: invitation.expiresAt.toISOString(),
  }
}

/** Whether `userId` is an active referee of a submission of the manuscript that is still open. */
async function isOpenRefereeOfManuscript(db: Db, manuscriptId: string, userId: string): Promise<boolean> {
  const row = await db.selectFrom('referee_assignments as a')
    .innerJoin('submissions as s', 's.id', 'a.submission_id')
    .innerJoin('revisions as r', 'r.id', 's.revision_id')
    .select('a.id')
    .where('r.manuscript_id', '=', manuscriptId).where('a.referee_id', '=', userId)
    .where('a.status', '=', 'active').where('s.status', 'in', ['submitted', 'in-review'])
    .executeTakeFirst()
  return row !== undefined
}

/** Makes the signed-in user a coauthor; the link is used up in the same transaction. */
export async function acceptInvitation(db: Db, token: string, user: SessionUser): Promise<{ manuscriptId: string }> {
  const invitation = await openInvitation(db, 'coauthor', token)
  if (invitation.email.toLowerCase() !== user.email.toLowerCase()) {
    fail(403, 'invitation-other-address', 'This invitation was sent to another e-mail address; sign in with that address')
  }
  const manuscriptId = invitation.manuscriptId
  if (!manuscriptId) fail(404, 'not-found', 'No such invitation link')
  await db.transaction().execute(async (trx) => {
    // Two tabs accepting at once: only one marks the link used, the other is told it was used.
    // A referee joining the authors would read their private threads and lose their anonymity.
    if (await isOpenRefereeOfManuscript(trx, manuscriptId, user.id)) fail(409, 'referee-of-manuscript', 'You referee this manuscript; you cannot join it while the review is open')
    if (!(await markInvitationUsed(trx, invitation.id))) fail(410, 'invitation-used', 'This link has already been used; ask for a new one')
    await addManuscriptMember(trx, manuscriptId, user.id, 'coauthor')
    await touchManuscript(trx, manuscriptId)
    await appendAudit(trx, { actorId: user.id, action: 'invitation.accepted', subjectType: 'manuscript', subjectId: manuscriptId, details: { invitationId: invitation.id, kind: 'coauthor' } })
  })
  return { manuscriptId }
}

/** The owner removes a member. The owner cannot be removed (delete the manuscript instead). */
export async function removeMember(db: Db, grant: ManuscriptGrant, userId: string): Promise<void> {
  if (userId === grant.user.id) fail(409, 'owner-not-removable', 'The owner cannot be removed from the manuscript')
  await db.transaction().execute(async (trx) => {
    const role = await deleteManuscriptMember(trx, grant.manuscriptId, userId)
    if (!role) fail(404, 'not-found', 'No such member')
    await appendAudit(trx, { actorId: grant.user.id, action: 'member.removed', subjectType: 'manuscript', subjectId: grant.manuscriptId, details: { userId, role } })
  })
}
