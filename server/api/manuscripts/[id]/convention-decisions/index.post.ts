import { z } from 'zod'
import { CONVENTION_AXES, type ConventionAxis } from '#shared/types/conventions'
import { proposeConvention } from '../../../../services/conventions'

const Body = z.object({
  axis: z.enum(Object.keys(CONVENTION_AXES) as [ConventionAxis, ...ConventionAxis[]]),
  conventionId: z.string().max(40),
}).strict().refine(b => b.conventionId in CONVENTION_AXES[b.axis].choices, { message: 'Not a convention of this axis', path: ['conventionId'] })

/** A member proposes a convention; it is accepted when every other member has agreed (at once when there is no other member). */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  const { axis, conventionId } = await readBodyAs(event, Body)
  const outcome = await proposeConvention(useDb(), await useQueue(), { manuscriptId: id, userId: grant.user.id, axis, conventionId })
  setResponseStatus(event, 201)
  return outcome
})
