import { z } from 'zod'
import type { RevisionComparisonView } from '#shared/types/discussion'
import { compareRevisions } from '../../../services/discussion'

const Params = z.object({ id: z.string() })
const Query = z.object({ from: z.string().min(1).max(64), to: z.string().min(1).max(64) })

/** Compares two revisions' newest finished checks claim by claim: fixed, newly failing, still failing, unchanged, added, removed. */
export default defineEventHandler(async (event): Promise<RevisionComparisonView> => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  const query = Query.safeParse(getQuery(event))
  if (!query.success) fail(400, 'invalid-input', 'Choose two revisions to compare', { fields: Object.fromEntries(query.error.issues.map(i => [i.path.join('.'), i.message])) })
  return compareRevisions(useDb(), { id, title: grant.title }, query.data.from, query.data.to)
})
