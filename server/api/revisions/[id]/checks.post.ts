import { z } from 'zod'
import { insertCheckRun } from '../../../repositories/check-runs'
import { appendAudit } from '../../../repositories/audit'

const Params = z.object({ id: z.string() })
const Body = z.object({ conventions: ConventionChoices.optional() })

/** Re-check a revision, optionally fixing conventions for this run only. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { revision: id })
  const body = await readBodyAs(event, Body)
  const conventions = { ...grant.conventions, ...body.conventions }
  const db = useDb()
  const run = await db.transaction().execute(async (trx) => {
    const created = await insertCheckRun(trx, { revisionId: id, requestedBy: grant.user.id, conventions })
    await appendAudit(trx, { actorId: grant.user.id, action: 'check.requested', subjectType: 'revision', subjectId: id, details: { conventions, as: grant.viewer } })
    return created
  })
  await enqueueCheckRun(run.id)
  setResponseStatus(event, 202)
  return { checkRunId: run.id }
})
