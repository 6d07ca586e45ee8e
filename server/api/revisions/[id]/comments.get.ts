import type { RevisionCommentsView } from '#shared/types/discussion'
import { revisionComments } from '../../../services/discussion'

/**
 * The members' threads on this revision's claims. Only members of the manuscript may read
 * them: a referee or an editor who may see the report gets 404 here, as if there were no
 * discussion, so the authors' private talk never reaches them (referee notes are elsewhere).
 */
export default defineEventHandler(async (event): Promise<RevisionCommentsView> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { revision: id })
  if (grant.viewer !== 'member') fail(404, 'not-found', 'No such discussion')
  return revisionComments(useDb(), grant.manuscriptId, id)
})
