import { agreeToConvention } from '../../../../../services/conventions'

/** A member other than the proposer agrees to an open proposal; the last agreement accepts it and re-checks. */
export default defineEventHandler(async (event) => {
  const { id, decisionId } = await routeParamsAs(event, uuidParams('id', 'decisionId'))
  const grant = await authorize(event, { manuscript: id })
  return agreeToConvention(useDb(), await useQueue(), { manuscriptId: id, userId: grant.user.id, decisionId })
})
