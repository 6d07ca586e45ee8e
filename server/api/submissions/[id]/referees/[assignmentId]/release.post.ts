import { z } from 'zod'
import { releaseRefereeNotes } from '../../../../../services/referees'

const Params = z.object({ id: z.string(), assignmentId: z.string() })

/** The submission's editor releases one referee's notes to the authors (who are told by e-mail). */
export default defineEventHandler(async (event) => {
  const { id, assignmentId } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { submissionEditor: id })
  if (!isUuid(assignmentId)) fail(404, 'not-found', 'No such referee for this submission')
  return releaseRefereeNotes(useDb(), grant, assignmentId, String(useRuntimeConfig().publicBaseUrl).replace(/\/+$/, ''))
})
