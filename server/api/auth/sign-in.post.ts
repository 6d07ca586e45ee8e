import { z } from 'zod'
import { signIn } from '../../services/accounts'

const SignIn = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(800),
})

export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, SignIn)
  const clientAddress = getRequestIP(event, { xForwardedFor: false }) ?? 'unknown'
  const { sessionVersion, ...user } = await signIn(useDb(), { ...body, clientAddress })
  await replaceUserSession(event, { user, sessionVersion, loggedInAt: Date.now() })
  return { user }
})
