import { listUsers } from '../../repositories/users'

export default defineEventHandler(async (event) => {
  await authorize(event, { siteAdmin: true })
  return listUsers(useDb())
})
