import { z } from 'zod'
import { inviteReferee } from '../../../../services/referees'

const Body = z.object({ email: z.string().trim().toLowerCase().pipe(z.email('Enter an e-mail address')) })

/** The submission's editor invites a referee by e-mail; anyone else gets 404. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { submissionEditor: id })
  const { email } = await readBodyAs(event, Body)
  const invitation = await inviteReferee(useDb(), grant, email, String(useRuntimeConfig().publicBaseUrl).replace(/\/+$/, ''))
  setResponseStatus(event, 201)
  return invitation
})
