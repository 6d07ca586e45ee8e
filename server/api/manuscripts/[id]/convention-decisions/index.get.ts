import { z } from 'zod'
import type { ConventionDecisionsView } from '#shared/types/discussion'
import { conventionDecisionsView } from '../../../../services/conventions'

const Params = z.object({ id: z.string() })

/** The manuscript's conventions and every proposal about them: who proposed, who agreed and when, status. Members only. */
export default defineEventHandler(async (event): Promise<ConventionDecisionsView> => {
  const { id } = await routeParamsAs(event, Params)
  await authorize(event, { manuscript: id })
  return conventionDecisionsView(useDb(), id)
})
