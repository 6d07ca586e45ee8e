import type { ConventionDecisionsView } from '#shared/types/discussion'
import { conventionDecisionsView } from '../../../../services/conventions'

/** The manuscript's conventions and every proposal about them: who proposed, who agreed and when, status. Members only. */
export default defineEventHandler(async (event): Promise<ConventionDecisionsView> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  await authorize(event, { manuscript: id })
  return conventionDecisionsView(useDb(), id)
})
