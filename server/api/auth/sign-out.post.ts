import { deleteSession } from '../../repositories/sessions'

/**
 * Ends this session: its user_sessions row goes, so this cookie and any copy of it stop
 * working, while the account's other sessions (another browser) go on. "Sign out
 * everywhere" ends them all.
 */
export default defineEventHandler(async (event) => {
  const session = await getUserSession(event)
  if (session.user && typeof session.sessionId === 'string' && isUuid(session.sessionId)) {
    await deleteSession(useDb(), session.user.id, session.sessionId)
  }
  await clearUserSession(event)
  return { signedOut: true }
})
