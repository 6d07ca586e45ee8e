// What nuxt-auth-utils keeps in the sealed session cookie.
import type { SessionUser } from './api'

declare module '#auth-utils' {
  interface User extends SessionUser {}
}

export {}
