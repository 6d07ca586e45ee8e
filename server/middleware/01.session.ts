import type { H3Event } from 'h3'
import { findSessionState } from '../repositories/sessions'
import { forgetUnsealedSession, rememberUnsealedSession, restoreUnsealedSession } from '../utils/unsealed-sessions'

const SESSION_COOKIE = 'nuxt-session'

/** Set once a session has been read: nuxt-auth-utils has then taken its cookie options for good. */
let cookieOptionsTaken = false

/**
 * Runs before every route. A sealed session carries its own id (a user_sessions row) and the
 * user's session version. When the row is gone (this session signed out), the version has
 * moved on (sign out everywhere, password reset) or the account is gone, the session is
 * cleared here, so no route, page or /api/_auth/session ever sees a revoked cookie as signed in.
 * That check reads the database on every request; only the unsealing of the cookie (the
 * cryptography) is remembered (server/utils/unsealed-sessions.ts).
 */
export default defineEventHandler(async (event) => {
  if (!cookieOptionsTaken) secureCookieWhenHttps(event)
  if (event.path.startsWith('/_nuxt/')) return
  const sealed = getCookie(event, SESSION_COOKIE)
  if (!sealed) return
  const restored = restoreUnsealedSession(event, SESSION_COOKIE, sealed)
  const session = await getUserSession(event)
  cookieOptionsTaken = true
  if (!session.user) return
  if (!restored) rememberUnsealedSession(event, SESSION_COOKIE, sealed)
  const sessionId = typeof session.sessionId === 'string' && isUuid(session.sessionId) ? session.sessionId : undefined
  const state = sessionId ? await findSessionState(useDb(), session.user.id, sessionId) : undefined
  if (!state || !state.sessionLive || state.sessionVersion !== session.sessionVersion) {
    forgetUnsealedSession(sealed)
    await clearUserSession(event)
    // h3 reads the session from the request's Cookie header on every call, so the
    // revoked cookie is also taken out of this request: later reads find no session.
    const headers = event.node.req.headers
    headers.cookie = (headers.cookie ?? '').split(';').filter(part => part.trim().split('=')[0] !== SESSION_COOKIE).join(';')
  }
})

/**
 * nuxt-auth-utils reads its cookie options once, from the runtime config of the first request
 * that reads a session; setting Secure there before any session is touched makes every session
 * cookie Secure whenever the site's public base URL is https. Until a session has been read,
 * every request sets it on its own copy of the config (`useRuntimeConfig(event)` copies the
 * whole config and re-reads the environment, which cost about 1 ms a request when done on all).
 */
function secureCookieWhenHttps(event: H3Event): void {
  const config = useRuntimeConfig(event)
  const cookie = (config.session as { cookie?: Record<string, unknown> }).cookie
  if (cookie) cookie.secure = publicBaseUrl().startsWith('https:')
}
