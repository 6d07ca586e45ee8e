import { z } from 'zod'
import { removeMember } from '../../../../services/invitations'

const Params = z.object({ id: z.string(), userId: z.string() })

/** The owner removes a coauthor; the removed person then gets 404 for the manuscript. */
export default defineEventHandler(async (event) => {
  const { id, userId } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id, owner: true })
  if (!isUuid(userId)) fail(404, 'not-found', 'No such member')
  await removeMember(useDb(), grant, userId)
  return { removed: true }
})
