import { z } from 'zod'
import { listPendingInvitations } from '../../../repositories/invitations'

const Params = z.object({ id: z.string() })

/** The owner's list of coauthor invitations that can still be accepted. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id, owner: true })
  return listPendingInvitations(useDb(), grant.manuscriptId)
})
