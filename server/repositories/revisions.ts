import { sql } from 'kysely'
import type { Db } from '../database/connect'
import type { RevisionFileView } from '#shared/types/api'

export interface StoredFile { path: string, storageKey: string, sha256: string, sizeBytes: number }

/**
 * Inserts the next revision of a manuscript with its files. Call inside a
 * transaction: the row lock on the manuscript serialises concurrent uploads,
 * so two revisions never get the same number.
 */
export async function insertRevisionWithFiles(db: Db, input: { manuscriptId: string, uploadedBy: string, mainFile: string | null, note: string, files: StoredFile[] }) {
  await sql`select 1 from manuscripts where id = ${input.manuscriptId} for update`.execute(db)
  const { next } = await db.selectFrom('revisions')
    .select(eb => eb(eb.fn.coalesce(eb.fn.max('number'), eb.lit(0)), '+', 1).as('next'))
    .where('manuscript_id', '=', input.manuscriptId)
    .executeTakeFirstOrThrow()
  const revision = await db.insertInto('revisions')
    .values({ manuscript_id: input.manuscriptId, number: Number(next), main_file: input.mainFile, note: input.note, uploaded_by: input.uploadedBy })
    .returning(['id', 'number'])
    .executeTakeFirstOrThrow()
  if (input.files.length > 0) {
    await db.insertInto('revision_files').values(input.files.map(f => ({
      revision_id: revision.id, path: f.path, storage_key: f.storageKey, sha256: f.sha256, size_bytes: f.sizeBytes, uploaded_by: input.uploadedBy,
    }))).execute()
  }
  return revision
}

export async function listRevisions(db: Db, manuscriptId: string) {
  return db.selectFrom('revisions as r')
    .innerJoin('users as u', 'u.id', 'r.uploaded_by')
    .select(['r.id', 'r.number', 'r.main_file', 'r.note', 'r.created_at', 'u.display_name as uploader'])
    .where('r.manuscript_id', '=', manuscriptId)
    .orderBy('r.number', 'desc')
    .execute()
}

export async function listRevisionFiles(db: Db, revisionIds: string[]): Promise<Map<string, RevisionFileView[]>> {
  const byRevision = new Map<string, RevisionFileView[]>()
  if (revisionIds.length === 0) return byRevision
  const rows = await db.selectFrom('revision_files').select(['id', 'revision_id', 'path', 'sha256', 'size_bytes'])
    .where('revision_id', 'in', revisionIds).orderBy('path').execute()
  for (const r of rows) {
    const list = byRevision.get(r.revision_id) ?? []
    list.push({ id: r.id, path: r.path, sha256: r.sha256, sizeBytes: Number(r.size_bytes) })
    byRevision.set(r.revision_id, list)
  }
  return byRevision
}

export async function findRevision(db: Db, revisionId: string) {
  return db.selectFrom('revisions').selectAll().where('id', '=', revisionId).executeTakeFirst()
}

/** Whether any stored revision file still points at this storage key. */
export async function isStorageKeyReferenced(db: Db, storageKey: string): Promise<boolean> {
  const row = await db.selectFrom('revision_files').select('id').where('storage_key', '=', storageKey).limit(1).executeTakeFirst()
  return row !== undefined
}

/**
 * Per-object advisory locks between uploads and the storage sweep, held to the end of the
 * caller's transaction: an upload takes them shared for the objects it is about to reference,
 * the sweep takes one exclusively before it removes an object (server/services/storage-sweep.ts).
 */
export async function lockStorageKeysShared(trx: Db, storageKeys: string[]): Promise<void> {
  for (const key of [...new Set(storageKeys)].sort()) await sql`select pg_advisory_xact_lock_shared(hashtextextended(${key}, 0))`.execute(trx)
}

export async function lockStorageKeyExclusive(trx: Db, storageKey: string): Promise<void> {
  await sql`select pg_advisory_xact_lock(hashtextextended(${storageKey}, 0))`.execute(trx)
}

/** Which of `storageKeys` some revision file still points at. */
export async function referencedStorageKeys(db: Db, storageKeys: string[]): Promise<Set<string>> {
  if (storageKeys.length === 0) return new Set()
  const rows = await db.selectFrom('revision_files').select('storage_key').distinct().where('storage_key', 'in', storageKeys).execute()
  return new Set(rows.map(r => r.storage_key))
}

export async function listRevisionFileKeys(db: Db, revisionId: string) {
  return db.selectFrom('revision_files').select(['path', 'storage_key', 'sha256']).where('revision_id', '=', revisionId).orderBy('path').execute()
}
