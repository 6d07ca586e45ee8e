import { z } from 'zod'
import { findRevision } from '../../../../repositories/revisions'
import { findVenue } from '../../../../repositories/venues'
import { insertSubmission } from '../../../../repositories/submissions'
import { appendAudit } from '../../../../repositories/audit'

const Body = z.object({ revisionId: z.string().uuid('Choose a revision'), venueId: z.string().uuid('Choose a venue') })

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  const body = await readBodyAs(event, Body)
  const db = useDb()
  const revision = await findRevision(db, body.revisionId)
  if (!revision || revision.manuscript_id !== id) fail(404, 'not-found', 'No such revision')
  if (!(await findVenue(db, body.venueId))) fail(404, 'not-found', 'No such venue')
  const submission = await db.transaction().execute(async (trx) => {
    const created = await insertSubmission(trx, { revisionId: revision.id, venueId: body.venueId, submittedBy: grant.user.id })
    await appendAudit(trx, { actorId: grant.user.id, action: 'submission.created', subjectType: 'submission', subjectId: created.id, details: { revision: revision.number } })
    return created
  })
  setResponseStatus(event, 201)
  return { id: submission.id }
})
