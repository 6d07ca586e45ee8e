import { z } from 'zod'
import { SUBMISSION_SORT_KEYS, SUBMISSION_STATUSES, type VenueSubmissionRow, type VenueSubmissionsPage } from '#shared/types/editorial'
import { findVenue } from '../../../repositories/venues'
import { listRefereesForSubmissions, pageSubmissionsForVenue } from '../../../repositories/submissions'
import { latestRunsByRevision } from '../../../services/check-runs'
import { verdictCountsOf } from '#shared/types/report-schema'

const Query = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
  sort: z.enum(SUBMISSION_SORT_KEYS as [string, ...string[]]).default('date'),
  order: z.enum(['asc', 'desc']).default('desc'),
  q: z.string().trim().max(200).optional(),
  status: z.enum(SUBMISSION_STATUSES as [string, ...string[]]).optional(),
})

/**
 * One page of a venue's submissions, for its editors only (referee identities included:
 * editors appoint them). Sorted, filtered and paged in the database.
 */
export default defineEventHandler(async (event): Promise<VenueSubmissionsPage> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  await authorize(event, { venueEditor: id })
  const parsed = await getValidatedQuery(event, query => Query.safeParse(query))
  if (!parsed.success) fail(400, 'invalid-input', 'The request is not valid', { fields: Object.fromEntries(parsed.error.issues.map(i => [i.path.join('.') || '_', i.message])) })
  const query = parsed.data as z.infer<typeof Query> & Parameters<typeof pageSubmissionsForVenue>[2]
  const db = useDb()
  const venue = await findVenue(db, id)
  const { total, rows } = await pageSubmissionsForVenue(db, id, query)
  const [referees, runs] = await Promise.all([
    listRefereesForSubmissions(db, rows.map(r => r.id)),
    latestRunsByRevision(db, rows.map(r => r.revision_id)),
  ])
  const submissions: VenueSubmissionRow[] = rows.map(r => ({
    id: r.id,
    manuscriptTitle: r.title,
    revisionNumber: r.number,
    submittedBy: r.submittedBy,
    status: r.status,
    createdAt: r.created_at.toISOString(),
    referees: referees.filter(a => a.submission_id === r.id).map(a => ({ assignmentId: a.id, displayName: a.display_name, email: a.email, released: a.released_at !== null })),
    latestRun: runs.get(r.revision_id) ?? null,
    checkCounts: verdictCountsOf(r.finishedSummary),
  }))
  return { venue: { id, name: venue?.name ?? '', slug: venue?.slug ?? '' }, submissions, page: query.page, pageSize: query.pageSize, total }
})
