/**
 * Invitation links (coauthor invitations, password resets) and what using one changes.
 * Only a SHA-256 of each link's token is stored: the database alone cannot produce a working link.
 */
import { sql } from 'kysely'
import type { Db } from '../database/connect'
import type { PendingInvitationView } from '#shared/types/api'

export type InvitationKind = 'coauthor' | 'password-reset'

export async function insertInvitation(db: Db, input: { kind: InvitationKind, tokenHash: string, email: string, manuscriptId?: string, invitedBy?: string, expiresAt: Date }): Promise<{ id: string }> {
  return db.insertInto('invitations').values({
    kind: input.kind,
    token_hash: input.tokenHash,
    email: input.email,
    manuscript_id: input.manuscriptId ?? null,
    invited_by: input.invitedBy ?? null,
    expires_at: input.expiresAt,
  }).returning('id').executeTakeFirstOrThrow()
}

/** An invitation of one kind by its token's hash, with the manuscript and inviter it names (if any). */
export async function findInvitationByTokenHash(db: Db, kind: InvitationKind, tokenHash: string) {
  return db.selectFrom('invitations as i')
    .leftJoin('manuscripts as m', 'm.id', 'i.manuscript_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .select(['i.id', 'i.email', 'i.manuscript_id as manuscriptId', 'i.expires_at as expiresAt', 'i.used_at as usedAt', 'm.title as manuscriptTitle', 'u.display_name as inviterName'])
    .where('i.kind', '=', kind)
    .where('i.token_hash', '=', tokenHash)
    .executeTakeFirst()
}

/**
 * Marks an invitation used if it is still open (unused, unexpired). False when another
 * request used it first or it has just expired: the link works exactly once.
 */
export async function markInvitationUsed(db: Db, id: string): Promise<boolean> {
  const row = await db.updateTable('invitations').set({ used_at: sql<Date>`now()` })
    .where('id', '=', id).where('used_at', 'is', null).where('expires_at', '>', sql<Date>`now()`)
    .returning('id').executeTakeFirst()
  return row !== undefined
}

/** Closes every other open link of a kind for an address (after a password reset, older reset links stop working). */
export async function closeOpenInvitations(db: Db, kind: InvitationKind, email: string): Promise<void> {
  await db.updateTable('invitations').set({ used_at: sql<Date>`now()` })
    .where('kind', '=', kind).where('used_at', 'is', null)
    .where(eb => eb(eb.fn('lower', ['email']), '=', email.toLowerCase()))
    .execute()
}

/** How many links of a kind were made for an address since `since` (to limit mail to one inbox). */
export async function countRecentInvitations(db: Db, kind: InvitationKind, email: string, since: Date): Promise<number> {
  const row = await db.selectFrom('invitations').select(eb => eb.fn.countAll<number>().as('n'))
    .where('kind', '=', kind).where('created_at', '>=', since)
    .where(eb => eb(eb.fn('lower', ['email']), '=', email.toLowerCase()))
    .executeTakeFirstOrThrow()
  return Number(row.n)
}

/** Coauthor invitations of a manuscript that can still be accepted, newest first. */
export async function listPendingInvitations(db: Db, manuscriptId: string): Promise<PendingInvitationView[]> {
  const rows = await db.selectFrom('invitations').select(['id', 'email', 'created_at', 'expires_at'])
    .where('kind', '=', 'coauthor').where('manuscript_id', '=', manuscriptId)
    .where('used_at', 'is', null).where('expires_at', '>', sql<Date>`now()`)
    .orderBy('created_at', 'desc').execute()
  return rows.map(r => ({ id: r.id, email: r.email, createdAt: r.created_at.toISOString(), expiresAt: r.expires_at.toISOString() }))
}
