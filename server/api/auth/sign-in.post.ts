import { z } from 'zod'
import { signIn } from '../../services/accounts'
import { insertSession } from '../../repositories/sessions'

const SignIn = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(800),
})

export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, SignIn)
  const clientAddress = getRequestIP(event, { xForwardedFor: false }) ?? 'unknown'
  const db = useDb()
  const { sessionVersion, ...user } = await signIn(db, { ...body, clientAddress })
  // A row of its own, so signing out here ends this session and no other (server/middleware/01.session.ts).
  const sessionId = await insertSession(db, user.id)
  await replaceUserSession(event, { user, sessionVersion, sessionId, loggedInAt: Date.now() })
  return { user }
})
