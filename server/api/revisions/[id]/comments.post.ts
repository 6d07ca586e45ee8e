import { z } from 'zod'
import { postClaimComment } from '../../../services/discussion'

const Body = z.object({
  /** The claim's id in the report (`ReportClaim.id`, e.g. `main.tex:30:1`). */
  claimId: z.string().min(1).max(300),
  body: z.string().trim().min(1, 'Write something').max(4000, 'At most 4000 characters'),
  parentId: z.string().max(64).nullish(),
}).strict()

/** A member comments on a claim of this revision's newest report, or replies in its thread. Members only (404 otherwise). */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { revision: id })
  if (grant.viewer !== 'member') fail(404, 'not-found', 'No such discussion')
  const body = await readBodyAs(event, Body)
  const comment = await postClaimComment(useDb(), {
    manuscriptId: grant.manuscriptId,
    revisionId: id,
    revisionNumber: grant.revisionNumber,
    authorId: grant.user.id,
    authorName: grant.user.displayName,
    claimId: body.claimId,
    body: body.body,
    parentId: body.parentId ?? null,
  })
  setResponseStatus(event, 201)
  return comment
})
