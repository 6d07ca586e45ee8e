/**
 * Password reset by e-mail. Asking never reveals whether an account exists: the answer
 * is the same and the work happens after it. A link works once, for an hour; using it
 * sets the new password, closes any other reset links and clears failed sign-ins.
 */
import type { Db } from '../database/connect'
import { clearSignInFailures, findUserByEmail, updatePasswordHash } from '../repositories/users'
import { closeOpenInvitations, countRecentInvitations, insertInvitation, markInvitationUsed } from '../repositories/invitations'
import { appendAudit } from '../repositories/audit'
import { passwordResetMail } from '../mail/messages'
import { newLinkToken, openInvitation } from './invitations'

export const PASSWORD_RESET_MINUTES = 60
/** At most this many reset mails per address per window, so the form cannot flood an inbox. */
export const PASSWORD_RESET_LIMIT = { perAddress: 3, windowMinutes: 15 }

/** Makes a reset link and mails it, if the address has an account; otherwise does nothing. */
export async function requestPasswordReset(db: Db, email: string, baseUrl: string): Promise<'sent' | 'no-account' | 'limited'> {
  const user = await findUserByEmail(db, email)
  if (!user) return 'no-account'
  const since = new Date(Date.now() - PASSWORD_RESET_LIMIT.windowMinutes * 60_000)
  if (await countRecentInvitations(db, 'password-reset', user.email, since) >= PASSWORD_RESET_LIMIT.perAddress) return 'limited'
  const { token, tokenHash } = newLinkToken()
  await db.transaction().execute(async (trx) => {
    const { id } = await insertInvitation(trx, { kind: 'password-reset', tokenHash, email: user.email, expiresAt: new Date(Date.now() + PASSWORD_RESET_MINUTES * 60_000) })
    await appendAudit(trx, { actorId: null, action: 'password-reset.requested', subjectType: 'user', subjectId: user.id, details: { invitationId: id } })
    // Last in the transaction: when the mail cannot be sent, no unusable link is left behind.
    await sendMail(passwordResetMail({ to: user.email, link: `${baseUrl}/password-reset/${token}`, validMinutes: PASSWORD_RESET_MINUTES }))
  })
  return 'sent'
}

/** Sets the new password with the link's token; 404/410 as for any link. */
export async function completePasswordReset(db: Db, token: string, password: string): Promise<void> {
  const invitation = await openInvitation(db, 'password-reset', token)
  const user = await findUserByEmail(db, invitation.email)
  // The account was deleted after the link was sent: the link names nothing any more.
  if (!user) fail(404, 'not-found', 'No such invitation link')
  const passwordHash = await hashPassword(password)
  await db.transaction().execute(async (trx) => {
    if (!(await markInvitationUsed(trx, invitation.id))) fail(410, 'invitation-used', 'This link has already been used; ask for a new one')
    await updatePasswordHash(trx, user.id, passwordHash)
    await closeOpenInvitations(trx, 'password-reset', user.email)
    await clearSignInFailures(trx, user.email.toLowerCase())
    await appendAudit(trx, { actorId: user.id, action: 'password-reset.completed', subjectType: 'user', subjectId: user.id, details: { invitationId: invitation.id } })
  })
}
