import type { Db } from '../database/connect'
import type { VenueListItem } from '#shared/types/api'

export async function listVenuesForEditor(db: Db, userId: string): Promise<VenueListItem[]> {
  const rows = await db.selectFrom('venues as v')
    .innerJoin('venue_editors as ve', 've.venue_id', 'v.id')
    .leftJoin('submissions as s', 's.venue_id', 'v.id')
    .select(eb => ['v.id', 'v.slug', 'v.name', eb.fn.count<number>('s.id').as('submissionCount')])
    .where('ve.user_id', '=', userId)
    .groupBy(['v.id', 'v.slug', 'v.name'])
    .orderBy('v.name')
    .execute()
  return rows.map(r => ({ id: r.id, slug: r.slug, name: r.name, submissionCount: Number(r.submissionCount) }))
}

export async function isVenueEditor(db: Db, venueId: string, userId: string): Promise<boolean> {
  const row = await db.selectFrom('venue_editors').select('venue_id').where('venue_id', '=', venueId).where('user_id', '=', userId).executeTakeFirst()
  return row !== undefined
}

export async function findVenue(db: Db, venueId: string) {
  return db.selectFrom('venues').selectAll().where('id', '=', venueId).executeTakeFirst()
}

export async function listAllVenues(db: Db) {
  return db.selectFrom('venues').select(['id', 'slug', 'name', 'description']).orderBy('name').execute()
}

export async function upsertVenue(db: Db, venue: { slug: string, name: string, description: string }): Promise<{ id: string }> {
  return db.insertInto('venues').values(venue)
    .onConflict(oc => oc.column('slug').doUpdateSet({ name: venue.name, description: venue.description }))
    .returning('id').executeTakeFirstOrThrow()
}

export async function addVenueEditor(db: Db, venueId: string, userId: string): Promise<void> {
  await db.insertInto('venue_editors').values({ venue_id: venueId, user_id: userId })
    .onConflict(oc => oc.columns(['venue_id', 'user_id']).doNothing()).execute()
}
