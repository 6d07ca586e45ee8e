import { listPendingInvitations } from '../../../repositories/invitations'

/** The owner's list of coauthor invitations that can still be accepted. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id, owner: true })
  return listPendingInvitations(useDb(), grant.manuscriptId)
})
