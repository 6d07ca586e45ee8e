import { removeMember } from '../../../../services/invitations'

/** The owner removes a coauthor; the removed person then gets 404 for the manuscript. */
export default defineEventHandler(async (event) => {
  const { id, userId } = await routeParamsAs(event, uuidParams('id', 'userId'))
  const grant = await authorize(event, { manuscript: id, owner: true })
  await removeMember(useDb(), grant, userId)
  return { removed: true }
})
