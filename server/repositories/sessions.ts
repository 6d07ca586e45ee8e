/**
 * Queries on user_sessions: one row per sign-in, its id sealed in the cookie. Deleting the
 * row ends that session alone; users.session_version still ends them all at once.
 */
import type { Db } from '../database/connect'

export async function insertSession(db: Db, userId: string): Promise<string> {
  const row = await db.insertInto('user_sessions').values({ user_id: userId }).returning('id').executeTakeFirstOrThrow()
  return row.id
}

/** Ends one session (ordinary sign-out). */
export async function deleteSession(db: Db, userId: string, sessionId: string): Promise<void> {
  await db.deleteFrom('user_sessions').where('id', '=', sessionId).where('user_id', '=', userId).execute()
}

/** Ends every session of the account (with a session version bump: sign out everywhere, password reset). */
export async function deleteAllSessions(db: Db, userId: string): Promise<void> {
  await db.deleteFrom('user_sessions').where('user_id', '=', userId).execute()
}

/**
 * What the session check on every request needs, in one query: the account's session
 * version, and whether this session's row is still there. Undefined when the account is gone.
 */
export async function findSessionState(db: Db, userId: string, sessionId: string): Promise<{ sessionVersion: number, sessionLive: boolean } | undefined> {
  const row = await db.selectFrom('users as u')
    .leftJoin('user_sessions as s', join => join.onRef('s.user_id', '=', 'u.id').on('s.id', '=', sessionId))
    .select(['u.session_version', 's.id as session_id'])
    .where('u.id', '=', userId)
    .executeTakeFirst()
  return row && { sessionVersion: row.session_version, sessionLive: row.session_id !== null }
}
