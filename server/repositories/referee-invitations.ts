/**
 * Referee invitations: rows of `invitations` with kind 'referee'. Only the
 * SHA-256 of a token is stored, so the table alone cannot be used to accept one.
 */
import type { Db } from '../database/connect'

export async function insertRefereeInvitation(db: Db, input: { tokenHash: string, email: string, submissionId: string, invitedBy: string, expiresAt: Date }): Promise<{ id: string }> {
  return db.insertInto('invitations')
    .values({ kind: 'referee', token_hash: input.tokenHash, email: input.email, submission_id: input.submissionId, invited_by: input.invitedBy, expires_at: input.expiresAt })
    .returning('id').executeTakeFirstOrThrow()
}

export async function findRefereeInvitationByHash(db: Db, tokenHash: string) {
  return db.selectFrom('invitations')
    .select(['id', 'email', 'submission_id', 'invited_by', 'expires_at', 'used_at'])
    .where('token_hash', '=', tokenHash).where('kind', '=', 'referee')
    .executeTakeFirst()
}

/**
 * Marks an invitation used if it is still unused and unexpired; false otherwise.
 * One conditional UPDATE, so two tabs accepting at once cannot both succeed.
 */
export async function consumeRefereeInvitation(db: Db, invitationId: string, now: Date): Promise<boolean> {
  const row = await db.updateTable('invitations').set({ used_at: now })
    .where('id', '=', invitationId).where('used_at', 'is', null).where('expires_at', '>', now)
    .returning('id').executeTakeFirst()
  return row !== undefined
}

/** Invitations sent for a submission, for its editor's table (newest first). */
export async function listRefereeInvitationsForSubmissions(db: Db, submissionIds: string[]) {
  if (submissionIds.length === 0) return []
  return db.selectFrom('invitations')
    .select(['id', 'submission_id', 'email', 'expires_at', 'used_at', 'created_at'])
    .where('kind', '=', 'referee').where('submission_id', 'in', submissionIds)
    .orderBy('created_at', 'desc')
    .execute()
}
