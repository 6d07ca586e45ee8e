import { findCheckRun } from '../../repositories/check-runs'
import { checkRunProgress } from '../../services/check-runs'

/** A run's status and progress: the small answer the report and compare pages poll. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const db = useDb()
  const row = await findCheckRun(db, id)
  if (!row) fail(404, 'not-found', 'No such check run')
  await authorize(event, { revision: row.revision_id })
  return checkRunProgress(db, id)
})
