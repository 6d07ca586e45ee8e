import { listManuscriptsForUser } from '../../repositories/manuscripts'

export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  return listManuscriptsForUser(useDb(), user.id)
})
