import { z } from 'zod'
import { withdrawConvention } from '../../../../../services/conventions'

const Params = z.object({ id: z.string(), decisionId: z.string() })

/** The proposer withdraws an open proposal. */
export default defineEventHandler(async (event) => {
  const { id, decisionId } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  if (!isUuid(decisionId)) fail(404, 'not-found', 'No such convention decision')
  return withdrawConvention(useDb(), { manuscriptId: id, userId: grant.user.id, decisionId })
})
