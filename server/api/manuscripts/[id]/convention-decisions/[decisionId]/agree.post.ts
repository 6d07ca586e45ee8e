import { z } from 'zod'
import { agreeToConvention } from '../../../../../services/conventions'

const Params = z.object({ id: z.string(), decisionId: z.string() })

/** A member other than the proposer agrees to an open proposal; the last agreement accepts it and re-checks. */
export default defineEventHandler(async (event) => {
  const { id, decisionId } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  if (!isUuid(decisionId)) fail(404, 'not-found', 'No such convention decision')
  return agreeToConvention(useDb(), await useQueue(), { manuscriptId: id, userId: grant.user.id, decisionId })
})
