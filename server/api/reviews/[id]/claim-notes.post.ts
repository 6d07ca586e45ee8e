import { z } from 'zod'
import { addClaimNote } from '../../../services/referees'

const Body = z.object({
  claimId: z.string().uuid('Choose a claim'),
  body: z.string().trim().min(1, 'Write a note').max(10_000, 'At most 10,000 characters'),
})

/** The referee adds a note on one claim of the submitted revision (until the notes are released). */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { refereeAssignment: id })
  const body = await readBodyAs(event, Body)
  const note = await addClaimNote(useDb(), grant, body.claimId, body.body)
  setResponseStatus(event, 201)
  return note
})
