import { sql } from 'kysely'

/** Liveness for scripts and tests: the database answers, and the demo seed's state. */
export default defineEventHandler(async () => {
  await sql`select 1`.execute(useDb())
  return { ok: true, demo: demoSeed.state }
})
