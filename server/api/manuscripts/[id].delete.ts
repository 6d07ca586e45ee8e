import { deleteManuscript } from '../../repositories/manuscripts'
import { appendAudit } from '../../repositories/audit'

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id, owner: true })
  const db = useDb()
  await db.transaction().execute(async (trx) => {
    // The venue's submission and its audit trail belong to the venue too: a submitted
    // manuscript is never deleted (issue 11).
    const submitted = await trx.selectFrom('submissions as s').innerJoin('revisions as r', 'r.id', 's.revision_id')
      .select('s.id').where('r.manuscript_id', '=', id).executeTakeFirst()
    if (submitted) fail(409, 'manuscript-submitted', 'A manuscript that was submitted to a venue cannot be deleted; withdraw the submission instead')
    await appendAudit(trx, { actorId: grant.user.id, action: 'manuscript.deleted', subjectType: 'manuscript', subjectId: id, details: { title: grant.title } })
    await deleteManuscript(trx, id)
  })
  return { deleted: true }
})
