import { z } from 'zod'
import { setManuscriptConventions } from '../../../services/conventions'

const Body = z.object({ conventions: ConventionChoices })

/**
 * The owner fixes the manuscript's conventions (axes left out are inferred) and re-checks its
 * newest revision; the change is audited. Coauthors change conventions through a decision
 * (convention-decisions), which every member accepts.
 */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id, owner: true })
  const { conventions } = await readBodyAs(event, Body)
  const result = await setManuscriptConventions(useDb(), await useQueue(), { manuscriptId: id, actorId: grant.user.id, conventions: conventions as Record<string, string> })
  return { conventions: result.conventions, checkRunId: result.checkRunId }
})
