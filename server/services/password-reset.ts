/**
 * Password reset by e-mail. Asking never reveals whether an account exists: the answer
 * is the same and the work happens after it. A link works once, for an hour; using it
 * sets the new password, closes any other reset links and clears failed sign-ins.
 */
import type { Db } from '../database/connect'
import { findUserByEmail, updatePasswordHash } from '../repositories/users'
import { clearAttempts, clearAttemptsByPrefix, takeAttempt, type AttemptPolicy } from '../repositories/attempt-limits'
import { closeOpenInvitations, insertInvitation, markInvitationUsed } from '../repositories/invitations'
import { appendAudit } from '../repositories/audit'
import { passwordResetMail } from '../mail/messages'
import { newLinkToken, openInvitation } from './invitations'

export const PASSWORD_RESET_MINUTES = 60
/**
 * Reset requests are counted like sign-ins, one UPSERT per scope before anything else:
 * per e-mail address (3 mails, then backing off from 15 minutes), so the form cannot flood
 * an inbox, and per client address (20), so one client cannot mail many inboxes.
 */
export const PASSWORD_RESET_POLICIES = {
  email: { free: 3, baseSeconds: 900, maxSeconds: 4 * 3600, quietSeconds: 3600 },
  address: { free: 20, baseSeconds: 900, maxSeconds: 4 * 3600, quietSeconds: 3600 },
} satisfies Record<string, AttemptPolicy>

/** Makes a reset link and mails it, if the address has an account and the limits allow; otherwise does nothing. */
export async function requestPasswordReset(db: Db, email: string, baseUrl: string, clientAddress = 'unknown'): Promise<'sent' | 'no-account' | 'limited'> {
  const allowed = await db.transaction().execute(async (trx) => {
    if (!(await takeAttempt(trx, 'reset-email', email.trim().toLowerCase(), PASSWORD_RESET_POLICIES.email)).allowed) throw new ResetLimited()
    if (!(await takeAttempt(trx, 'reset-address', clientAddress, PASSWORD_RESET_POLICIES.address)).allowed) throw new ResetLimited()
    return true
  }).catch((error: unknown) => {
    if (error instanceof ResetLimited) return false
    throw error
  })
  if (!allowed) return 'limited'
  const user = await findUserByEmail(db, email)
  if (!user) return 'no-account'
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
    // The owner has proven control of the address: guesses at the account no longer slow it down.
    await clearAttempts(trx, 'sign-in-account', user.email.toLowerCase())
    await clearAttemptsByPrefix(trx, 'sign-in-pair', `${user.email.toLowerCase()} `)
    await appendAudit(trx, { actorId: user.id, action: 'password-reset.completed', subjectType: 'user', subjectId: user.id, details: { invitationId: invitation.id } })
  })
}

/** Thrown inside the counting transaction to roll back the scopes counted before the refusing one. */
class ResetLimited extends Error {}
