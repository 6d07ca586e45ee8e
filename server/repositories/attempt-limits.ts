import { sql } from 'kysely'
import type { Db } from '../database/connect'

/**
 * How one scope of attempts is limited. The first `free - 1` attempts in a quiet
 * stretch pass at once; the `free`-th and every later one that passes closes the
 * scope for `baseSeconds`, doubling each time up to `maxSeconds`. A scope that saw
 * no attempt for `quietSeconds` (and is not closed) starts afresh.
 */
export interface AttemptPolicy { free: number, baseSeconds: number, maxSeconds: number, quietSeconds: number }

/**
 * Counts one attempt for (scope, key) in a single UPSERT and says whether it may
 * go ahead. The row lock taken by `on conflict do update` serializes parallel
 * attempts, so no more than the policy allows can pass, however many arrive at once.
 * A refused attempt leaves the count and the closing time as they were.
 * Example: `if (!(await takeAttempt(trx, 'sign-in-pair', key, policy)).allowed) fail(429, ...)`
 */
export async function takeAttempt(db: Db, scope: string, key: string, policy: AttemptPolicy): Promise<{ allowed: boolean, attempts: number, blockedUntil: Date | null }> {
  const closed = sql`a.blocked_until is not null and a.blocked_until > now()`
  const quiet = sql`a.last_attempt_at < now() - make_interval(secs => ${policy.quietSeconds})`
  const closeAfter = (attempts: ReturnType<typeof sql>) => sql`case when ${attempts} >= ${policy.free}
    then now() + make_interval(secs => least(${policy.maxSeconds}::float8, ${policy.baseSeconds}::float8 * power(2, ${attempts} - ${policy.free})))
    end`
  const { rows } = await sql<{ attempts: number, blocked_until: Date | null, last_refused: boolean }>`
    insert into attempt_limits as a (scope, key, attempts, last_attempt_at, blocked_until, last_refused)
    values (${scope}, ${key}, 1, now(), ${closeAfter(sql`1`)}, false)
    on conflict (scope, key) do update set
      attempts = case when ${closed} then a.attempts when ${quiet} then 1 else a.attempts + 1 end,
      blocked_until = case when ${closed} then a.blocked_until when ${quiet} then ${closeAfter(sql`1`)} else ${closeAfter(sql`a.attempts + 1`)} end,
      last_attempt_at = case when ${closed} then a.last_attempt_at else now() end,
      last_refused = ${closed}
    returning attempts, blocked_until, last_refused`.execute(db)
  const row = rows[0]!
  return { allowed: !row.last_refused, attempts: row.attempts, blockedUntil: row.blocked_until }
}

/** Forgets a scope's attempts (a successful sign-in clears its account+address pair). */
export async function clearAttempts(db: Db, scope: string, key: string): Promise<void> {
  await db.deleteFrom('attempt_limits').where('scope', '=', scope).where('key', '=', key).execute()
}

/** Forgets every attempt of a scope whose key starts with `prefix` (all pairs of one account). */
export async function clearAttemptsByPrefix(db: Db, scope: string, prefix: string): Promise<void> {
  await sql`delete from attempt_limits where scope = ${scope} and starts_with(key, ${prefix})`.execute(db)
}

/**
 * Takes back one counted attempt that turned out to be legitimate (a correct
 * password), reopening the scope if that brings it under its free allowance.
 */
export async function refundAttempt(db: Db, scope: string, key: string, policy: AttemptPolicy): Promise<void> {
  await sql`update attempt_limits set attempts = greatest(attempts - 1, 0),
      blocked_until = case when attempts - 1 < ${policy.free} then null else blocked_until end
    where scope = ${scope} and key = ${key}`.execute(db)
}
