import type { ReleasedRefereeNotes } from '#shared/types/editorial'
import { listClaimNotes, listReleasedAssignmentsForManuscript } from '../../../repositories/referee-notes'

/**
 * Released referee notes for the manuscript's members. Referees are "Referee N" (numbered per
 * submission); nothing here is read from a referee's user row, so no name or e-mail can leak.
 */
export default defineEventHandler(async (event): Promise<ReleasedRefereeNotes[]> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  const db = useDb()
  const released = await listReleasedAssignmentsForManuscript(db, grant.manuscriptId)
  const notes = (await Promise.all([...new Set(released.map(a => a.revisionId))].map(revisionId =>
    listClaimNotes(db, released.filter(a => a.revisionId === revisionId).map(a => a.id), revisionId)))).flat()
  return released.map(a => ({
    submissionId: a.submission_id,
    venueName: a.venueName,
    revisionNumber: a.number,
    referee: `Referee ${a.ordinal}`,
    releasedAt: a.released_at!.toISOString(),
    overallNote: a.overall_note,
    claimNotes: notes.filter(n => n.assignmentId === a.id).map(({ assignmentId: _a, ...note }) => note),
  }))
})
