import { z } from 'zod'
import { completePasswordReset } from '../../../services/password-reset'

const Params = z.object({ token: z.string().max(200) })
const Body = z.object({ password: newPasswordSchema })

/** Sets a new password with a reset link's token. The link works once. */
export default defineEventHandler(async (event) => {
  const { token } = await routeParamsAs(event, Params)
  const { password } = await readBodyAs(event, Body)
  await completePasswordReset(useDb(), token, password)
  return { passwordChanged: true }
})
