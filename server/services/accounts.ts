import type { Db } from '../database/connect'
import type { SessionUser } from '#shared/types/api'
import { clearSignInFailures, countSignInFailures, findUserByEmail, insertUser, recordSignInFailure } from '../repositories/users'
import { appendAudit } from '../repositories/audit'

/** Failed sign-ins allowed in the window, per e-mail and per client address. */
export const SIGN_IN_LIMITS = { windowMinutes: 15, perEmail: 5, perAddress: 30 }

export async function signUp(db: Db, input: { email: string, displayName: string, password: string }): Promise<SessionUser> {
  if (await findUserByEmail(db, input.email)) fail(409, 'email-taken', 'An account with this e-mail already exists')
  const user = await insertUser(db, { email: input.email, displayName: input.displayName, passwordHash: await hashPassword(input.password) })
  await appendAudit(db, { actorId: user.id, action: 'account.created', subjectType: 'user', subjectId: user.id })
  return user
}

/**
 * Checks a password. Refuses with 429 once too many recent attempts failed for
 * the e-mail or from the address, before even looking at the password, so
 * guessing cannot continue at full speed.
 */
export async function signIn(db: Db, input: { email: string, password: string, clientAddress: string }): Promise<SessionUser> {
  const emailKey = input.email.toLowerCase()
  const since = new Date(Date.now() - SIGN_IN_LIMITS.windowMinutes * 60_000)
  const failures = await countSignInFailures(db, emailKey, input.clientAddress, since)
  if (failures.byEmail >= SIGN_IN_LIMITS.perEmail || failures.byAddress >= SIGN_IN_LIMITS.perAddress) {
    fail(429, 'rate-limited', `Too many failed sign-ins; try again in ${SIGN_IN_LIMITS.windowMinutes} minutes`)
  }
  const user = await findUserByEmail(db, input.email)
  const ok = user ? await verifyPassword(user.passwordHash, input.password) : false
  if (!user || !ok) {
    await recordSignInFailure(db, emailKey, input.clientAddress)
    fail(401, 'bad-credentials', 'E-mail or password is wrong')
  }
  await clearSignInFailures(db, emailKey)
  const { passwordHash: _omit, ...sessionUser } = user
  return sessionUser
}
