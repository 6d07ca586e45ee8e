import { z } from 'zod'
import { requestCheckRun } from '../../../services/check-runs'
import { appendAudit } from '../../../repositories/audit'

const Body = z.object({ conventions: ConventionChoices.optional() })

/**
 * Re-check a revision, optionally fixing conventions for this run only. A referee's or an
 * editor's re-check is a what-if run: its report is theirs to read by run id, and the
 * members' current report stays as it was.
 */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { revision: id })
  const body = await readBodyAs(event, Body)
  const conventions = { ...grant.conventions, ...body.conventions }
  const whatIf = grant.viewer !== 'member'
  const queue = await useQueue()
  const run = await useDb().transaction().execute(async (trx) => {
    const created = await requestCheckRun(trx, queue, { revisionId: id, requestedBy: grant.user.id, conventions, whatIf })
    await appendAudit(trx, { actorId: grant.user.id, action: 'check.requested', subjectType: 'revision', subjectId: id, details: { conventions, as: grant.viewer, whatIf } })
    return created
  })
  setResponseStatus(event, 202)
  return { checkRunId: run.id, whatIf }
})
