import { deskSummary } from '../../services/views'

export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  return (await deskSummary(useDb(), user)).reviews
})
