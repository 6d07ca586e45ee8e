import type { ReviewView } from '#shared/types/api'
import { revisionViews } from '../../services/views'

/** A referee's view of one assigned submission: the submitted revision and its latest run. */
export default defineEventHandler(async (event): Promise<ReviewView> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { refereeAssignment: id })
  const [revision] = await revisionViews(useDb(), grant.manuscriptId, grant.revisionId)
  if (!revision) fail(404, 'not-found', 'No such review')
  return {
    assignmentId: grant.assignmentId,
    submissionId: grant.submissionId,
    manuscriptTitle: grant.title,
    venueName: grant.venueName,
    revision,
    overallNote: grant.overallNote,
    released: grant.released,
  }
})
