import type { Db } from '../database/connect'
import type { SessionUser, SiteRole, AdminUserRow } from '#shared/types/api'

interface UserRecord extends SessionUser { passwordHash: string, sessionVersion: number }

const toUser = (row: { id: string, email: string, display_name: string, site_role: SiteRole, password_hash: string, session_version: number }): UserRecord => ({
  id: row.id,
  email: row.email,
  displayName: row.display_name,
  siteRole: row.site_role,
  passwordHash: row.password_hash,
  sessionVersion: row.session_version,
})

/** Finds a user by e-mail, case-insensitively. */
export async function findUserByEmail(db: Db, email: string): Promise<UserRecord | undefined> {
  const row = await db.selectFrom('users').selectAll()
    .where(eb => eb(eb.fn('lower', ['email']), '=', email.toLowerCase()))
    .executeTakeFirst()
  return row && toUser(row)
}

export async function findUserById(db: Db, id: string): Promise<UserRecord | undefined> {
  const row = await db.selectFrom('users').selectAll().where('id', '=', id).executeTakeFirst()
  return row && toUser(row)
}

export async function insertUser(db: Db, user: { email: string, displayName: string, passwordHash: string, siteRole?: SiteRole }): Promise<SessionUser> {
  const row = await db.insertInto('users')
    .values({ email: user.email, display_name: user.displayName, password_hash: user.passwordHash, site_role: user.siteRole ?? 'member' })
    .returningAll()
    .executeTakeFirstOrThrow()
  const { passwordHash: _omit, sessionVersion: _version, ...publicUser } = toUser(row)
  return publicUser
}

export async function listUsers(db: Db): Promise<AdminUserRow[]> {
  const rows = await db.selectFrom('users').select(['id', 'email', 'display_name', 'site_role', 'created_at']).orderBy('created_at').execute()
  return rows.map(r => ({ id: r.id, email: r.email, displayName: r.display_name, siteRole: r.site_role, createdAt: r.created_at.toISOString() }))
}

/** Failed sign-ins since `since`, for one e-mail and for one client address. */
export async function countSignInFailures(db: Db, emailKey: string, clientAddress: string, since: Date) {
  const row = await db.selectFrom('sign_in_failures')
    .select(eb => [
      eb.fn.countAll<number>().filterWhere('email_key', '=', emailKey).as('byEmail'),
      eb.fn.countAll<number>().filterWhere('client_address', '=', clientAddress).as('byAddress'),
    ])
    .where('failed_at', '>=', since)
    .executeTakeFirstOrThrow()
  return { byEmail: Number(row.byEmail), byAddress: Number(row.byAddress) }
}

export async function recordSignInFailure(db: Db, emailKey: string, clientAddress: string): Promise<void> {
  await db.insertInto('sign_in_failures').values({ email_key: emailKey, client_address: clientAddress }).execute()
}

export async function clearSignInFailures(db: Db, emailKey: string): Promise<void> {
  await db.deleteFrom('sign_in_failures').where('email_key', '=', emailKey).execute()
}

/** Sets a new password hash and bumps the session version, so every existing session ends (their rows go too). */
export async function updatePasswordHash(db: Db, userId: string, passwordHash: string): Promise<void> {
  await db.updateTable('users').set(eb => ({ password_hash: passwordHash, session_version: eb('session_version', '+', 1) })).where('id', '=', userId).execute()
  await db.deleteFrom('user_sessions').where('user_id', '=', userId).execute()
}

/** Bumps the session version: every session sealed with an older one is refused from now on. Returns the new version. */
export async function bumpSessionVersion(db: Db, userId: string): Promise<number> {
  const row = await db.updateTable('users').set(eb => ({ session_version: eb('session_version', '+', 1) })).where('id', '=', userId)
    .returning('session_version').executeTakeFirstOrThrow()
  return row.session_version
}
