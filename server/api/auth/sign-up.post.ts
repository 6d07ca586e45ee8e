import { z } from 'zod'
import { signUp } from '../../services/accounts'

const SignUp = z.object({
  email: z.string().trim().email('Enter a valid e-mail address').max(254),
  displayName: z.string().trim().min(1, 'Enter your name').max(120),
  password: z.string().min(10, 'Use at least 10 characters').max(200),
})

export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, SignUp)
  const user = await signUp(useDb(), body)
  await setUserSession(event, { user, loggedInAt: Date.now() })
  setResponseStatus(event, 201)
  return { user }
})
