import { z } from 'zod'
import { previewInvitation } from '../../services/invitations'

const Params = z.object({ token: z.string().max(200) })

/** What a coauthor link is for. Public: whoever holds the link was sent it. */
export default defineEventHandler(async (event) => {
  const { token } = await routeParamsAs(event, Params)
  return previewInvitation(useDb(), token)
})
