import type { Db } from '../database/connect'
import type { SessionUser } from '#shared/types/api'
import { findUserByEmail, insertUser } from '../repositories/users'
import { appendAudit } from '../repositories/audit'
import { clearAttempts, refundAttempt, takeAttempt, type AttemptPolicy } from '../repositories/attempt-limits'
import { accountExistsMail } from '../mail/messages'

/**
 * Sign-in attempts are counted before the password is looked at, in three scopes:
 * - the account+address pair backs off exponentially after 5 tries (30 s, 1 min, 2 min, … up to 1 h),
 *   so a stranger guessing slows down only themselves;
 * - one address across all accounts (password spraying): 50 failures before it backs off;
 * - one account across all addresses (distributed guessing): 50 failures, which takes many addresses.
 * A correct password clears its pair and gives back its address and account attempts,
 * so only failures accumulate there.
 */
export const SIGN_IN_POLICIES = {
  pair: { free: 5, baseSeconds: 30, maxSeconds: 3600, quietSeconds: 900 },
  address: { free: 50, baseSeconds: 60, maxSeconds: 3600, quietSeconds: 900 },
  account: { free: 50, baseSeconds: 60, maxSeconds: 3600, quietSeconds: 900 },
} satisfies Record<string, AttemptPolicy>

/** The attempt_limits keys of one sign-in (exported for tests, which read the counts). */
export function signInKeys(email: string, clientAddress: string) {
  const account = email.trim().toLowerCase()
  return { pair: `${account} ${clientAddress}`, address: clientAddress, account }
}

/**
 * Makes an account, or, when the address already has one, mails its owner instead.
 * Either way the caller learns nothing: the route answers the same.
 */
export async function signUp(db: Db, input: { email: string, displayName: string, password: string }, baseUrl: string): Promise<SessionUser | undefined> {
  // Hash first in both cases, so the time taken does not tell either.
  const passwordHash = await hashPassword(input.password)
  const existing = await findUserByEmail(db, input.email)
  if (existing) {
    // A mail failure must not change the answer either: log it and answer as usual.
    await sendMail(accountExistsMail({ to: existing.email, signInLink: `${baseUrl}/sign-in`, resetLink: `${baseUrl}/password-reset` }))
      .catch(error => console.error('[sign-up] account-exists mail failed', error))
    return undefined
  }
  const user = await insertUser(db, { email: input.email, displayName: input.displayName, passwordHash })
  await appendAudit(db, { actorId: user.id, action: 'account.created', subjectType: 'user', subjectId: user.id })
  return user
}

let dummyHash: Promise<string> | undefined
/** A hash to verify against when the account does not exist, so both cases cost one scrypt. */
function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hashPassword('no account has this password; it only spends time')
  return dummyHash
}

/**
 * Checks a password. Refuses with 429, before looking at the password, when any of the
 * attempt scopes is closed; the counting and the decision are one UPSERT per scope in
 * one transaction, so parallel attempts cannot pass the limit. Unknown accounts are
 * checked against a dummy hash and take as long as known ones.
 */
export async function signIn(db: Db, input: { email: string, password: string, clientAddress: string }): Promise<SessionUser & { sessionVersion: number }> {
  const keys = signInKeys(input.email, input.clientAddress)
  // A refusal throws inside the transaction, which rolls back the scopes counted before it.
  await db.transaction().execute(async (trx) => {
    for (const scope of ['pair', 'address', 'account'] as const) {
      const attempt = await takeAttempt(trx, `sign-in-${scope}`, keys[scope], SIGN_IN_POLICIES[scope])
      if (!attempt.allowed) fail(429, 'rate-limited', 'Too many sign-in attempts; wait a little and try again')
    }
  })
  const user = await findUserByEmail(db, input.email)
  const ok = await verifyPassword(user?.passwordHash ?? await dummyPasswordHash(), input.password)
  if (!user || !ok) fail(401, 'bad-credentials', 'E-mail or password is wrong')
  await db.transaction().execute(async (trx) => {
    await clearAttempts(trx, 'sign-in-pair', keys.pair)
    await refundAttempt(trx, 'sign-in-address', keys.address, SIGN_IN_POLICIES.address)
    await refundAttempt(trx, 'sign-in-account', keys.account, SIGN_IN_POLICIES.account)
  })
  const { passwordHash: _omit, ...sessionUser } = user
  return sessionUser
}
