import { releaseRefereeNotes } from '../../../../../services/referees'

/** The submission's editor releases one referee's notes to the authors (who are told by e-mail). */
export default defineEventHandler(async (event) => {
  const { id, assignmentId } = await routeParamsAs(event, uuidParams('id', 'assignmentId'))
  const grant = await authorize(event, { submissionEditor: id })
  return releaseRefereeNotes(useDb(), grant, assignmentId, String(useRuntimeConfig().publicBaseUrl).replace(/\/+$/, ''))
})
