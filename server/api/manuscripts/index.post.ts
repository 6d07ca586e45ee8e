import { z } from 'zod'
import { insertManuscript } from '../../repositories/manuscripts'
import { appendAudit } from '../../repositories/audit'

const NewManuscript = z.object({ title: z.string().trim().min(1, 'Give the manuscript a title').max(300) })

export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  const { title } = await readBodyAs(event, NewManuscript)
  const db = useDb()
  const manuscript = await db.transaction().execute(async (trx) => {
    const created = await insertManuscript(trx, { title, ownerId: user.id })
    await appendAudit(trx, { actorId: user.id, action: 'manuscript.created', subjectType: 'manuscript', subjectId: created.id })
    return created
  })
  setResponseStatus(event, 201)
  return { id: manuscript.id, title }
})
