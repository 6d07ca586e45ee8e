import type { Db } from '../database/connect'
import type { ClaimCommentView } from '#shared/types/discussion'

/**
 * Members' threads on claims. Referee notes live in the same table with
 * `referee_assignment_id` set; every query here leaves them out, so a member's
 * thread can never show a referee's note (or who wrote it).
 */

/** The claims of a run with the ids the report gives them and their content keys. */
export async function listRunClaimKeys(db: Db, checkRunId: string): Promise<{ id: string, reportId: string, contentKey: string }[]> {
  return db.selectFrom('claims')
    .select(['id', 'content_key as contentKey', 'report_id as reportId'])
    .where('check_run_id', '=', checkRunId)
    .orderBy('ordinal')
    .execute()
}

/** One claim of a run, found by its report id (`main.tex:30:1`). */
export async function findRunClaimByReportId(db: Db, checkRunId: string, reportId: string): Promise<{ id: string, contentKey: string } | undefined> {
  return db.selectFrom('claims')
    .select(['id', 'content_key as contentKey'])
    .where('check_run_id', '=', checkRunId)
    .where('report_id', '=', reportId)
    .executeTakeFirst()
}

/** Members' comments of a manuscript on the given content keys, oldest first. */
export async function listMemberComments(db: Db, manuscriptId: string, contentKeys: string[]): Promise<(ClaimCommentView & { contentKey: string })[]> {
  if (contentKeys.length === 0) return []
  const rows = await db.selectFrom('claim_comments as cc')
    .innerJoin('users as u', 'u.id', 'cc.author_id')
    .leftJoin('claims as cl', 'cl.id', 'cc.claim_id')
    .leftJoin('check_runs as run', 'run.id', 'cl.check_run_id')
    .leftJoin('revisions as r', 'r.id', 'run.revision_id')
    .select(['cc.id', 'cc.parent_id', 'cc.author_id', 'u.display_name', 'cc.body', 'cc.created_at', 'cc.content_key', 'r.number'])
    .where('cc.manuscript_id', '=', manuscriptId)
    .where('cc.referee_assignment_id', 'is', null)
    .where('cc.content_key', 'in', contentKeys)
    .orderBy('cc.created_at').orderBy('cc.id')
    .execute()
  return rows.map(r => ({
    id: r.id,
    parentId: r.parent_id,
    authorId: r.author_id,
    authorName: r.display_name,
    body: r.body,
    createdAt: r.created_at.toISOString(),
    revisionNumber: r.number ?? null,
    contentKey: r.content_key,
  }))
}

/** A member comment of a manuscript, for checking a reply's parent. */
export async function findMemberComment(db: Db, manuscriptId: string, commentId: string): Promise<{ id: string, contentKey: string } | undefined> {
  return db.selectFrom('claim_comments')
    .select(['id', 'content_key as contentKey'])
    .where('id', '=', commentId)
    .where('manuscript_id', '=', manuscriptId)
    .where('referee_assignment_id', 'is', null)
    .executeTakeFirst()
}

export async function insertMemberComment(db: Db, input: { manuscriptId: string, contentKey: string, claimId: string, parentId: string | null, authorId: string, body: string }) {
  return db.insertInto('claim_comments')
    .values({ manuscript_id: input.manuscriptId, content_key: input.contentKey, claim_id: input.claimId, parent_id: input.parentId, author_id: input.authorId, body: input.body })
    .returning(['id', 'created_at'])
    .executeTakeFirstOrThrow()
}
