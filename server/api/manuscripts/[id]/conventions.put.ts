import { z } from 'zod'
import { appendAudit } from '../../../repositories/audit'
import { insertCheckRun } from '../../../repositories/check-runs'
import { listRevisions } from '../../../repositories/revisions'

const Params = z.object({ id: z.string() })
const Body = z.object({ conventions: ConventionChoices })

/** Fix the manuscript's conventions (axes left out are inferred) and re-check its newest revision. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  const { conventions } = await readBodyAs(event, Body)
  const db = useDb()
  const runId = await db.transaction().execute(async (trx) => {
    await trx.updateTable('manuscripts').set({ conventions: JSON.stringify(conventions), updated_at: new Date() }).where('id', '=', id).execute()
    await appendAudit(trx, { actorId: grant.user.id, action: 'manuscript.conventions-set', subjectType: 'manuscript', subjectId: id, details: { before: grant.conventions, after: conventions } })
    const [newest] = await listRevisions(trx, id)
    return newest ? (await insertCheckRun(trx, { revisionId: newest.id, requestedBy: grant.user.id, conventions })).id : null
  })
  if (runId) await enqueueCheckRun(runId)
  return { conventions, checkRunId: runId }
})
