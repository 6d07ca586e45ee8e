import { bumpSessionVersion } from '../../repositories/users'

/**
 * Ends the session. The session version is per account, so this also ends the
 * account's other sessions: a copied cookie stops working with the original.
 */
export default defineEventHandler(async (event) => {
  const session = await getUserSession(event)
  if (session.user) await bumpSessionVersion(useDb(), session.user.id)
  await clearUserSession(event)
  return { signedOut: true }
})
