// What nuxt-auth-utils keeps in the sealed session cookie.
import type { SessionUser } from './api'

declare module '#auth-utils' {
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type -- the module augments by declaration merging
  interface User extends SessionUser {}
  interface UserSession {
    /** users.session_version when the session was sealed; an older one is refused (server/middleware/01.session.ts). */
    sessionVersion?: number
    /** This session's user_sessions row; ordinary sign-out deletes it (server/api/auth/sign-out.post.ts). */
    sessionId?: string
  }
}

export {}
