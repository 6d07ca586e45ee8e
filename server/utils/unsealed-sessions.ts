import type { H3Event } from 'h3'

/**
 * Unsealed session cookies, remembered for a minute. Unsealing a cookie (two PBKDF2 key
 * derivations, AES and an HMAC) cost about 0.7 ms of the main thread on every signed-in request;
 * the same sealed text always unseals to the same session, so it is done once per cookie text.
 * Only the cryptography is remembered: the revocation check (server/middleware/01.session.ts)
 * still reads the database on every request, and a session past its maximum age is never
 * restored from here. Bounded; oldest out first.
 */
const MAX_ENTRIES = 2000
const KEEP_MS = 60_000

interface Entry { session: Record<string, unknown>, until: number }
const entries = new Map<string, Entry>()

type Sessions = Record<string, Record<string, unknown> | undefined>

function sessionMaxAgeMs(): number {
  const maxAge = Number((useRuntimeConfig().session as { maxAge?: number } | undefined)?.maxAge ?? 0)
  return maxAge > 0 ? maxAge * 1000 : Number.POSITIVE_INFINITY
}

/** Puts a copy of the remembered session for this cookie text where h3 looks first; false when there is none. */
export function restoreUnsealedSession(event: H3Event, name: string, sealed: string): boolean {
  const entry = entries.get(sealed)
  if (!entry) return false
  if (entry.until <= Date.now()) {
    entries.delete(sealed)
    return false
  }
  const sessions = (event.context.sessions ??= Object.create(null)) as Sessions
  if (sessions[name]) return false
  sessions[name] = structuredClone(entry.session)
  return true
}

/** Remembers the session h3 unsealed from this cookie text in this request (not one it made or changed). */
export function rememberUnsealedSession(event: H3Event, name: string, sealed: string): void {
  const session = (event.context.sessions as Sessions | undefined)?.[name]
  const createdAt = Number(session?.createdAt)
  if (!session || typeof session.id !== 'string' || !session.id || !Number.isFinite(createdAt)) return
  const until = Math.min(Date.now() + KEEP_MS, createdAt + sessionMaxAgeMs())
  if (until <= Date.now()) return
  entries.set(sealed, { session: structuredClone({ id: session.id, createdAt, data: session.data }), until })
  if (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value!)
}

/** Drops a cookie text whose session was revoked. */
export function forgetUnsealedSession(sealed: string): void {
  entries.delete(sealed)
}
