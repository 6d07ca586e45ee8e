import type { H3Event } from 'h3'
import { findSessionState } from '../repositories/sessions'

const SESSION_COOKIE = 'nuxt-session'

/**
 * Runs before every route. A sealed session carries its own id (a user_sessions row) and the
 * user's session version. When the row is gone (this session signed out), the version has
 * moved on (sign out everywhere, password reset) or the account is gone, the session is
 * cleared here, so no route, page or /api/_auth/session ever sees a revoked cookie as signed in.
 */
export default defineEventHandler(async (event) => {
  secureCookieWhenHttps(event)
  if (event.path.startsWith('/_nuxt/') || !getCookie(event, SESSION_COOKIE)) return
  const session = await getUserSession(event)
  if (!session.user) return
  const sessionId = typeof session.sessionId === 'string' && isUuid(session.sessionId) ? session.sessionId : undefined
  const state = sessionId ? await findSessionState(useDb(), session.user.id, sessionId) : undefined
  if (!state || !state.sessionLive || state.sessionVersion !== session.sessionVersion) {
    await clearUserSession(event)
    // h3 reads the session from the request's Cookie header on every call, so the
    // revoked cookie is also taken out of this request: later reads find no session.
    const headers = event.node.req.headers
    headers.cookie = (headers.cookie ?? '').split(';').filter(part => part.trim().split('=')[0] !== SESSION_COOKIE).join(';')
  }
})

/**
 * nuxt-auth-utils reads its cookie options once, from the first request's runtime config;
 * setting Secure there before any session is touched makes every session cookie Secure
 * whenever the site's public base URL is https.
 */
function secureCookieWhenHttps(event: H3Event): void {
  const config = useRuntimeConfig(event)
  const cookie = (config.session as { cookie?: Record<string, unknown> }).cookie
  if (cookie) cookie.secure = publicBaseUrl().startsWith('https:')
}
