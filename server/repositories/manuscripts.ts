import type { Db } from '../database/connect'
import type { ManuscriptListItem, ManuscriptRole, MemberView, RevisionViewer } from '#shared/types/api'

export async function insertManuscript(db: Db, input: { title: string, ownerId: string }): Promise<{ id: string }> {
  const row = await db.insertInto('manuscripts').values({ title: input.title, owner_id: input.ownerId, conventions: '{}' })
    .returning('id').executeTakeFirstOrThrow()
  await db.insertInto('manuscript_members').values({ manuscript_id: row.id, user_id: input.ownerId, role: 'author' }).execute()
  return row
}

export async function addManuscriptMember(db: Db, manuscriptId: string, userId: string, role: ManuscriptRole): Promise<void> {
  await db.insertInto('manuscript_members').values({ manuscript_id: manuscriptId, user_id: userId, role })
    .onConflict(oc => oc.columns(['manuscript_id', 'user_id']).doNothing()).execute()
}

/** The caller's membership of a manuscript, or undefined when they have none. */
export async function findManuscriptMembership(db: Db, manuscriptId: string, userId: string) {
  return db.selectFrom('manuscripts as m')
    .innerJoin('manuscript_members as mm', 'mm.manuscript_id', 'm.id')
    .select(['m.id', 'm.title', 'm.owner_id as ownerId', 'm.conventions', 'mm.role'])
    .where('m.id', '=', manuscriptId)
    .where('mm.user_id', '=', userId)
    .executeTakeFirst()
}

export async function listManuscriptsForUser(db: Db, userId: string): Promise<ManuscriptListItem[]> {
  const rows = await db.selectFrom('manuscripts as m')
    .innerJoin('manuscript_members as mm', 'mm.manuscript_id', 'm.id')
    .leftJoin('revisions as r', 'r.manuscript_id', 'm.id')
    .select(eb => ['m.id', 'm.title', 'mm.role', 'm.updated_at', eb.fn.count<number>('r.id').as('revisionCount'), eb.fn.max('r.created_at').as('latestRevisionAt')])
    .where('mm.user_id', '=', userId)
    .groupBy(['m.id', 'm.title', 'mm.role', 'm.updated_at'])
    .orderBy('m.updated_at', 'desc')
    .execute()
  return rows.map(r => ({
    id: r.id,
    title: r.title,
    role: r.role,
    revisionCount: Number(r.revisionCount),
    latestRevisionAt: r.latestRevisionAt ? new Date(r.latestRevisionAt).toISOString() : null,
    updatedAt: r.updated_at.toISOString(),
  }))
}

export async function listManuscriptMembers(db: Db, manuscriptId: string): Promise<MemberView[]> {
  const rows = await db.selectFrom('manuscript_members as mm')
    .innerJoin('users as u', 'u.id', 'mm.user_id')
    .select(['u.id', 'u.display_name', 'u.email', 'mm.role'])
    .where('mm.manuscript_id', '=', manuscriptId)
    .orderBy('mm.created_at')
    .execute()
  return rows.map(r => ({ userId: r.id, displayName: r.display_name, email: r.email, role: r.role }))
}

export async function touchManuscript(db: Db, manuscriptId: string): Promise<void> {
  await db.updateTable('manuscripts').set({ updated_at: new Date() }).where('id', '=', manuscriptId).execute()
}

export async function deleteManuscript(db: Db, manuscriptId: string): Promise<void> {
  await db.deleteFrom('manuscripts').where('id', '=', manuscriptId).execute()
}

export async function findManuscriptByTitleForOwner(db: Db, ownerId: string, title: string) {
  return db.selectFrom('manuscripts').select('id').where('owner_id', '=', ownerId).where('title', '=', title).executeTakeFirst()
}

/**
 * How a user may see a revision: as a member of its manuscript, as a referee of a
 * submission of it, or as the editor of a venue it was submitted to. Undefined: not at all.
 */
export async function findRevisionAccess(db: Db, revisionId: string, userId: string) {
  // One round trip: the revision and the three ways of seeing it, each an EXISTS (every report
  // read and most revision routes pass here; four queries in a row were a tenth of a report read).
  const revision = await db.selectFrom('revisions as r')
    .innerJoin('manuscripts as m', 'm.id', 'r.manuscript_id')
    .select(eb => [
      'r.id', 'r.number', 'm.id as manuscriptId', 'm.title', 'm.conventions',
      eb.exists(eb.selectFrom('manuscript_members as mm').select('mm.user_id')
        .whereRef('mm.manuscript_id', '=', 'm.id').where('mm.user_id', '=', userId)).as('isMember'),
      eb.exists(eb.selectFrom('referee_assignments as a').innerJoin('submissions as s', 's.id', 'a.submission_id').select('a.id')
        .whereRef('s.revision_id', '=', 'r.id').where('a.referee_id', '=', userId).where('a.status', '!=', 'withdrawn')).as('isReferee'),
      eb.exists(eb.selectFrom('venue_editors as ve').innerJoin('submissions as s', 's.venue_id', 've.venue_id').select('ve.venue_id')
        .whereRef('s.revision_id', '=', 'r.id').where('ve.user_id', '=', userId)).as('isEditor'),
    ])
    .where('r.id', '=', revisionId)
    .executeTakeFirst()
  if (!revision) return undefined
  const viewer: RevisionViewer | undefined = revision.isMember ? 'member' : revision.isReferee ? 'referee' : revision.isEditor ? 'editor' : undefined
  if (!viewer) return undefined
  return { revisionId: revision.id, revisionNumber: revision.number, manuscriptId: revision.manuscriptId, title: revision.title, conventions: revision.conventions, viewer }
}

/** Whether the address belongs to a member of the manuscript (case-insensitively). */
export async function isMemberByEmail(db: Db, manuscriptId: string, email: string): Promise<boolean> {
  const row = await db.selectFrom('manuscript_members as mm').innerJoin('users as u', 'u.id', 'mm.user_id')
    .select('mm.user_id').where('mm.manuscript_id', '=', manuscriptId)
    .where(eb => eb(eb.fn('lower', ['u.email']), '=', email.toLowerCase()))
    .executeTakeFirst()
  return row !== undefined
}

/** Removes one member; returns the removed row's role, or undefined when they were not a member. */
export async function deleteManuscriptMember(db: Db, manuscriptId: string, userId: string): Promise<'author' | 'coauthor' | undefined> {
  const row = await db.deleteFrom('manuscript_members').where('manuscript_id', '=', manuscriptId).where('user_id', '=', userId)
    .returning('role').executeTakeFirst()
  return row?.role
}
