/**
 * Members' threads on claims, and the comparison of two revisions.
 *
 * A thread belongs to the manuscript and the claim's content key (kind + normalised
 * source), not to one claim row: the same claim in a later revision, or in a re-check,
 * shows the same thread. Each comment also remembers the claim row it was written on,
 * for "written on revision n".
 */
import type { Db } from '../database/connect'
import type { ClaimCommentView, ClaimThreadView, ComparedClaim, RevisionCommentsView, RevisionComparisonView } from '#shared/types/discussion'
import { compareRevisionClaims } from '#shared/check/compare-revisions'
import { appendAudit } from '../repositories/audit'
import { claimContentKey } from '../repositories/claims'
import { latestFinishedRun, loadRunReport } from '../repositories/check-runs'
import { findMemberComment, findRunClaimByReportId, insertMemberComment, listMemberComments, listRunClaimKeys } from '../repositories/comments'
import { findRevision } from '../repositories/revisions'

/** Every members' thread on the claims of the revision's newest finished run. */
export async function revisionComments(db: Db, manuscriptId: string, revisionId: string): Promise<RevisionCommentsView> {
  const run = await latestFinishedRun(db, revisionId)
  if (!run) return { checkRunId: null, threads: [] }
  const claims = await listRunClaimKeys(db, run.id)
  const claimIdsByKey = new Map<string, string[]>()
  for (const c of claims) claimIdsByKey.set(c.contentKey, [...(claimIdsByKey.get(c.contentKey) ?? []), c.reportId])
  const comments = await listMemberComments(db, manuscriptId, [...claimIdsByKey.keys()])
  const threads = new Map<string, ClaimThreadView>()
  for (const { contentKey, ...comment } of comments) {
    const thread = threads.get(contentKey) ?? { contentKey, claimIds: claimIdsByKey.get(contentKey) ?? [], comments: [] }
    thread.comments.push(comment)
    threads.set(contentKey, thread)
  }
  return { checkRunId: run.id, threads: [...threads.values()] }
}

/** A member comments on a claim of the revision's newest finished run, or replies within its thread. */
export async function postClaimComment(db: Db, input: { manuscriptId: string, revisionId: string, revisionNumber: number, authorId: string, authorName: string, claimId: string, body: string, parentId: string | null }): Promise<ClaimCommentView & { contentKey: string }> {
  return db.transaction().execute(async (trx) => {
    const run = await latestFinishedRun(trx, input.revisionId)
    if (!run) fail(409, 'conflict', 'This revision has no finished check yet, so it has no claims to discuss')
    const claim = await findRunClaimByReportId(trx, run.id, input.claimId)
    if (!claim) fail(404, 'not-found', 'No such claim in this revision\'s newest report')
    if (input.parentId) {
      const parent = isUuid(input.parentId) ? await findMemberComment(trx, input.manuscriptId, input.parentId) : undefined
      if (!parent) fail(404, 'not-found', 'No such comment to reply to')
      if (parent.contentKey !== claim.contentKey) fail(400, 'invalid-input', 'A reply must be on the same claim as its parent', { fields: { parentId: 'belongs to another claim' } })
    }
    const row = await insertMemberComment(trx, { manuscriptId: input.manuscriptId, contentKey: claim.contentKey, claimId: claim.id, parentId: input.parentId, authorId: input.authorId, body: input.body })
    // The body stays in its row; the audit entry records that it was written, where, and how long it was.
    await appendAudit(trx, { actorId: input.authorId, action: 'claim.comment-posted', subjectType: 'manuscript', subjectId: input.manuscriptId, details: { commentId: row.id, contentKey: claim.contentKey, revision: input.revisionNumber, claim: input.claimId, parentId: input.parentId, length: input.body.length } })
    return { id: row.id, parentId: input.parentId, authorId: input.authorId, authorName: input.authorName, body: input.body, createdAt: row.created_at.toISOString(), revisionNumber: input.revisionNumber, contentKey: claim.contentKey }
  })
}

/** Compares the newest finished runs of two revisions of a manuscript, claim by claim. */
export async function compareRevisions(db: Db, manuscript: { id: string, title: string }, fromId: string, toId: string): Promise<RevisionComparisonView> {
  const side = async (revisionId: string) => {
    const revision = isUuid(revisionId) ? await findRevision(db, revisionId) : undefined
    if (!revision || revision.manuscript_id !== manuscript.id) fail(404, 'not-found', 'No such revision of this manuscript')
    const run = await latestFinishedRun(db, revision.id)
    const report = run ? await loadRunReport(db, run.id) : null
    if (!run || !report) fail(409, 'conflict', `Revision ${revision.number} has no finished check to compare yet`)
    const claims: ComparedClaim[] = report.claims.map(c => ({
      id: c.id, file: c.file, line: c.line, endLine: c.endLine, kind: c.kind, verdict: c.verdict, source: c.source, message: c.message, label: c.label ?? null, contentKey: claimContentKey(c),
    }))
    return { ref: { id: revision.id, number: revision.number, checkRunId: run.id }, claims, macros: report.macros ?? {} }
  }
  const from = await side(fromId)
  const to = await side(toId)
  const { entries, counts } = compareRevisionClaims(from.claims, to.claims)
  return { manuscript, from: from.ref, to: to.ref, entries, counts, macros: { ...from.macros, ...to.macros } }
}
