import { listAllVenues } from '../../repositories/venues'

/** Every venue, so an author can choose where to submit. */
export default defineEventHandler(async (event) => {
  await authorize(event, { signedIn: true })
  return listAllVenues(useDb())
})
