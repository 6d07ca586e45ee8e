import { z } from 'zod'
import { requestPasswordReset } from '../../services/password-reset'

const Body = z.object({ email: z.string().trim().email('Enter a valid e-mail address').max(254) })

/**
 * Always 202, at once: the lookup and the mail happen after the answer, so neither
 * the status nor the time taken tells whether an account exists.
 */
export default defineEventHandler(async (event) => {
  const { email } = await readBodyAs(event, Body)
  const work = requestPasswordReset(useDb(), email, publicBaseUrl(), getRequestIP(event, { xForwardedFor: false }) ?? 'unknown')
    .catch(error => console.error('[password-reset] request failed', error))
  event.waitUntil(work)
  setResponseStatus(event, 202)
  return { accepted: true }
})
