import { z } from 'zod'
import { setManuscriptConventions } from '../../../services/conventions'

const Params = z.object({ id: z.string() })
const Body = z.object({ conventions: ConventionChoices })

/** Fix the manuscript's conventions (axes left out are inferred) and re-check its newest revision. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  const { conventions } = await readBodyAs(event, Body)
  const result = await setManuscriptConventions(useDb(), { manuscriptId: id, actorId: grant.user.id, conventions: conventions as Record<string, string> })
  return { conventions: result.conventions, checkRunId: result.checkRunId }
})
