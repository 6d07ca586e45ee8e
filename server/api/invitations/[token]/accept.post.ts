import { z } from 'zod'
import { acceptInvitation } from '../../../services/invitations'

const Params = z.object({ token: z.string().max(200) })

/** The signed-in user, if the invited address is theirs, becomes a coauthor; the link is used up. */
export default defineEventHandler(async (event) => {
  const { token } = await routeParamsAs(event, Params)
  const { user } = await authorize(event, { signedIn: true })
  return acceptInvitation(useDb(), token, user)
})
