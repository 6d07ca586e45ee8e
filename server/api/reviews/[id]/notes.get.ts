import type { ReviewNotesView } from '#shared/types/editorial'
import { listClaimNotes, listClaimOptions } from '../../../repositories/referee-notes'

/** The referee's own notes on an assignment, and the claims they can be written on. */
export default defineEventHandler(async (event): Promise<ReviewNotesView> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { refereeAssignment: id })
  const db = useDb()
  const [claimNotes, claims] = await Promise.all([listClaimNotes(db, [grant.assignmentId], grant.revisionId), listClaimOptions(db, grant.revisionId)])
  return {
    overallNote: grant.overallNote,
    released: grant.released,
    claimNotes: claimNotes.map(({ assignmentId: _a, ...note }) => note),
    claims,
  }
})
