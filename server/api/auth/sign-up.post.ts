import { z } from 'zod'
import { signUp } from '../../services/accounts'

const SignUp = z.object({
  email: z.string().trim().email('Enter a valid e-mail address').max(254),
  displayName: z.string().trim().min(1, 'Enter your name').max(120),
  password: newPasswordSchema,
})

/**
 * Always 202 with the same body and no session: when the address already has an
 * account its owner gets a mail instead, so the answer does not tell whether it exists.
 * The sign-up page signs in as a second step.
 */
export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, SignUp)
  await signUp(useDb(), body, publicBaseUrl())
  setResponseStatus(event, 202)
  return { accepted: true }
})
