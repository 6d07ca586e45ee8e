import { z } from 'zod'
import type { RevisionComparisonView } from '#shared/types/discussion'
import { compareRevisions } from '../../../services/discussion'

const Query = z.object({ from: z.string().min(1).max(64), to: z.string().min(1).max(64) })

/** Compares two revisions' newest finished checks claim by claim: fixed, newly failing, still failing, unchanged, added, removed. */
export default defineEventHandler(async (event): Promise<RevisionComparisonView> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  const query = await queryAs(event, Query)
  return compareRevisions(useDb(), { id, title: grant.title }, query.from, query.to)
})
