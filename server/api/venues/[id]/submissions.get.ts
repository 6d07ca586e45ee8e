import { z } from 'zod'
import type { EditorSubmissionRow } from '#shared/types/api'
import { findVenue } from '../../../repositories/venues'
import { listRefereesForSubmissions, listSubmissionsForVenue } from '../../../repositories/submissions'
import { latestRunsByRevision } from '../../../repositories/check-runs'

const Params = z.object({ id: z.string() })

/** A venue's submissions, for its editors only (referee identities included: editors appoint them). */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  await authorize(event, { venueEditor: id })
  const db = useDb()
  const venue = await findVenue(db, id)
  const rows = await listSubmissionsForVenue(db, id)
  const [referees, runs] = await Promise.all([
    listRefereesForSubmissions(db, rows.map(r => r.id)),
    latestRunsByRevision(db, rows.map(r => r.revision_id)),
  ])
  const submissions: EditorSubmissionRow[] = rows.map(r => ({
    id: r.id,
    manuscriptTitle: r.title,
    revisionNumber: r.number,
    submittedBy: r.submittedBy,
    status: r.status,
    createdAt: r.created_at.toISOString(),
    referees: referees.filter(a => a.submission_id === r.id).map(a => ({ assignmentId: a.id, displayName: a.display_name, email: a.email, released: a.released_at !== null })),
    latestRun: runs.get(r.revision_id) ?? null,
  }))
  return { venue: { id, name: venue?.name ?? '', slug: venue?.slug ?? '' }, submissions }
})
