import { withdrawConvention } from '../../../../../services/conventions'

/** The proposer withdraws an open proposal. */
export default defineEventHandler(async (event) => {
  const { id, decisionId } = await routeParamsAs(event, uuidParams('id', 'decisionId'))
  const grant = await authorize(event, { manuscript: id })
  return withdrawConvention(useDb(), { manuscriptId: id, userId: grant.user.id, decisionId })
})
