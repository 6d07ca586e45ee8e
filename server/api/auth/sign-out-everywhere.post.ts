import { appendAudit } from '../../repositories/audit'
import { bumpSessionVersion } from '../../repositories/users'
import { deleteAllSessions } from '../../repositories/sessions'

/** Revokes every session of the signed-in account, this one included, and says so in the audit log. */
export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  const db = useDb()
  await db.transaction().execute(async (trx) => {
    await bumpSessionVersion(trx, user.id)
    await deleteAllSessions(trx, user.id)
    await appendAudit(trx, { actorId: user.id, action: 'sessions.revoked', subjectType: 'user', subjectId: user.id })
  })
  await clearUserSession(event)
  return { signedOut: true }
})
