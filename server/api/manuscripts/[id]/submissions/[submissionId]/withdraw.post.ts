import { lockSubmissionOfManuscript, markSubmissionWithdrawn } from '../../../../../repositories/submissions'
import { appendAudit } from '../../../../../repositories/audit'

/**
 * The owner withdraws a submission. A submitted manuscript cannot be deleted (its venue's
 * record would go with it); withdrawing is what the author does instead: the submission row,
 * its referees' notes and its audit trail stay with the venue, marked withdrawn.
 */
export default defineEventHandler(async (event) => {
  const { id, submissionId } = await routeParamsAs(event, uuidParams('id', 'submissionId'))
  const grant = await authorize(event, { manuscript: id, owner: true })
  await useDb().transaction().execute(async (trx) => {
    const submission = await lockSubmissionOfManuscript(trx, submissionId, id)
    if (!submission) fail(404, 'not-found', 'No such submission of this manuscript')
    if (submission.status === 'withdrawn') fail(409, 'conflict', 'This submission is already withdrawn')
    if (submission.status === 'decided') fail(409, 'conflict', 'The venue has already decided on this submission')
    await markSubmissionWithdrawn(trx, submissionId)
    await appendAudit(trx, {
      actorId: grant.user.id,
      action: 'submission.withdrawn',
      subjectType: 'submission',
      subjectId: submissionId,
      details: { manuscriptId: id, revision: submission.number, previousStatus: submission.status },
    })
  })
  return { withdrawn: true }
})
