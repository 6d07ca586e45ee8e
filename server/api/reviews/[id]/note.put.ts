import { z } from 'zod'
import { saveOverallNote } from '../../../services/referees'

const Body = z.object({ overallNote: z.string().max(50_000, 'At most 50,000 characters') })

/** The referee replaces the overall note of an assignment (until it is released). */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { refereeAssignment: id })
  const { overallNote } = await readBodyAs(event, Body)
  await saveOverallNote(useDb(), grant, overallNote)
  return { overallNote }
})
