import { z } from 'zod'
import { inviteCoauthor } from '../../../services/invitations'

const Body = z.object({ email: z.string().trim().email('Enter a valid e-mail address').max(254) })

/** The owner invites a coauthor by e-mail; the mail carries a single-use link. Coauthors get 403, strangers 404. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id, owner: true })
  const { email } = await readBodyAs(event, Body)
  const invitation = await inviteCoauthor(useDb(), grant, email, publicBaseUrl())
  setResponseStatus(event, 201)
  return invitation
})
