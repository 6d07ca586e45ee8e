/**
 * The storage sweep: removes source objects in S3 that no revision file references any
 * more (a deleted manuscript's sources, an upload whose clean-up did not get through).
 *
 * Safe against an upload in flight. An upload writes its objects to S3 first and references
 * them in one transaction afterwards, so for a while an object is stored and not referenced.
 * 1. The sweep only considers objects older than a grace period (an hour by default).
 * 2. Each removal runs in a transaction holding that object's advisory lock exclusively, and
 *    checks for a reference inside it. An upload's transaction takes the same locks shared
 *    (`holdSources`) before it inserts its references, then makes sure each object is still
 *    there and stores it again if the sweep got to it first. Either the sweep removes first
 *    and the upload puts the bytes back, or the upload commits first and the sweep sees the
 *    reference; an object is never referenced and missing.
 *
 * Imports are relative and no Nitro auto-imports are used: the worker and scripts load this.
 */
import type { Db } from '../database/connect'
import type { SourceStore } from '../storage/source-store'
import { lockStorageKeyExclusive, lockStorageKeysShared, referencedStorageKeys } from '../repositories/revisions'

/** Only this prefix holds sources (see sourceKey); nothing else in the bucket is touched. */
export const SOURCE_PREFIX = 'sources/'

export interface StorageSweepResult {
  scanned: number
  removed: string[]
  /** Unreferenced, or not yet known, but younger than the grace period: left for a later sweep. */
  young: number
  referenced: number
}

export async function sweepUnreferencedSources(db: Db, store: Pick<SourceStore, 'list' | 'remove'>, options: { graceSeconds: number, now?: Date }): Promise<StorageSweepResult> {
  const cutoff = (options.now ?? new Date()).getTime() - options.graceSeconds * 1000
  const result: StorageSweepResult = { scanned: 0, removed: [], young: 0, referenced: 0 }
  const candidates: string[] = []
  for await (const object of store.list(SOURCE_PREFIX)) {
    result.scanned++
    if (object.lastModified.getTime() > cutoff) result.young++
    else candidates.push(object.key)
  }
  for (const key of candidates) {
    const removed = await db.transaction().execute(async (trx) => {
      await lockStorageKeyExclusive(trx, key)
      if ((await referencedStorageKeys(trx, [key])).has(key)) return false
      await store.remove(key)
      return true
    })
    if (removed) result.removed.push(key)
    else result.referenced++
  }
  return result
}

/**
 * In an upload's transaction, before it references its objects: takes their locks shared
 * (held until commit) and stores again any object a sweep removed since it was written.
 */
export async function holdSources(trx: Db, store: Pick<SourceStore, 'exists' | 'put'>, files: { storageKey: string, sha256: string, bytes: Uint8Array }[]): Promise<void> {
  await lockStorageKeysShared(trx, files.map(f => f.storageKey))
  for (const file of files) {
    if (!await store.exists(file.storageKey)) await store.put(file.bytes, file.sha256)
  }
}
