import { reviewList } from '../../services/views'

export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  return reviewList(useDb(), user.id)
})
