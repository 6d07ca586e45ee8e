import { z } from 'zod'
import { acceptRefereeInvitation } from '../../../services/referees'

// Tokens are 32 random bytes in base64url; anything else cannot be one.
const Params = z.object({ token: z.string().regex(/^[\w-]{20,100}$/, 'Not an invitation link') })

/** The signed-in invitee accepts a referee invitation and gets the assignment. */
export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  const { token } = await routeParamsAs(event, Params)
  const result = await acceptRefereeInvitation(useDb(), token, user)
  setResponseStatus(event, 201)
  return result
})
