import { z } from 'zod'
import { deleteManuscript } from '../../repositories/manuscripts'
import { appendAudit } from '../../repositories/audit'

const Params = z.object({ id: z.string() })

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id, owner: true })
  const db = useDb()
  await db.transaction().execute(async (trx) => {
    await appendAudit(trx, { actorId: grant.user.id, action: 'manuscript.deleted', subjectType: 'manuscript', subjectId: id, details: { title: grant.title } })
    await deleteManuscript(trx, id)
  })
  return { deleted: true }
})
