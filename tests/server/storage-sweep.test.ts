// Issue 11: S3 objects no revision references are removed by the storage sweep, and the
// sweep never removes an object an upload in flight is about to reference.
import { createHash, randomUUID } from 'node:crypto'
import { afterAll, describe, expect, it } from 'vitest'
import { db, filesForm, newMember } from './helpers'
import { createSourceStore, sourceKey } from '../../server/storage/source-store'
import { workerSettingsFromEnv } from '../../server/jobs/worker-settings'
import { holdSources, sweepUnreferencedSources } from '../../server/services/storage-sweep'

const store = createSourceStore(workerSettingsFromEnv().s3)
const HOUR = 3600
/** As if the grace period had long passed: every object counts as old. */
const muchLater = () => new Date(Date.now() + 2 * HOUR * 1000)

function uniqueTex(label: string): string {
  return `\\documentclass{article}\n\\begin{document}\n% ${label} ${randomUUID()}\n$\\mathfrak{S}_{132} = x_1 + x_2$\n\\end{document}\n`
}

async function orphan(): Promise<{ key: string, bytes: Uint8Array, sha256: string }> {
  const bytes = new TextEncoder().encode(`orphan ${randomUUID()}`)
  const sha256 = createHash('sha256').update(bytes).digest('hex')
  const { key } = await store.put(bytes, sha256)
  return { key, bytes, sha256 }
}

async function uploaded(label: string) {
  const me = await newMember(label)
  const { body: m } = await me.client.post('/api/manuscripts', { title: `Swept ${label}` })
  const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'main.tex', content: uniqueTex(label) }]))
  expect(upload.status).toBe(201)
  const file = await db.selectFrom('revision_files').select(['storage_key', 'revision_id']).where('revision_id', '=', upload.body.id).executeTakeFirstOrThrow()
  return { ...me, manuscriptId: m.id as string, revisionId: upload.body.id as string, key: file.storage_key, checkRunId: upload.body.checkRunId as string }
}

afterAll(async () => {
  await db.deleteFrom('revision_files').where('path', 'like', 'sweep-race-%').execute()
})

describe('the storage sweep', () => {
  it('keeps everything younger than the grace period, then removes only what no revision references', async () => {
    const lost = await orphan()
    const kept = await uploaded('sweep-kept')
    const early = await sweepUnreferencedSources(db, store, { graceSeconds: HOUR })
    expect(early.removed).not.toContain(lost.key)
    expect(await store.exists(lost.key)).toBe(true)

    const late = await sweepUnreferencedSources(db, store, { graceSeconds: HOUR, now: muchLater() })
    expect(late.removed).toContain(lost.key)
    expect(late.removed).not.toContain(kept.key)
    expect(await store.exists(lost.key)).toBe(false)
    expect(await store.exists(kept.key)).toBe(true)
    // The referenced source still checks.
    expect((await kept.client.get(`/api/revisions/${kept.revisionId}/sources`)).status).toBe(200)
  })

  it('removes the sources a deleted manuscript left behind', async () => {
    const paper = await uploaded('sweep-deleted')
    // Wait for its check so the worker is done reading the sources.
    for (let i = 0; i < 300; i++) {
      const run = await db.selectFrom('check_runs').select('status').where('id', '=', paper.checkRunId).executeTakeFirstOrThrow()
      if (run.status === 'finished' || run.status === 'failed') break
      await new Promise(resolve => setTimeout(resolve, 200))
    }
    expect((await paper.client.delete(`/api/manuscripts/${paper.manuscriptId}`)).status).toBe(200)
    expect(await store.exists(paper.key)).toBe(true)
    const swept = await sweepUnreferencedSources(db, store, { graceSeconds: HOUR, now: muchLater() })
    expect(swept.removed).toContain(paper.key)
    expect(await store.exists(paper.key)).toBe(false)
  })

  it('waits for an upload that holds its objects, and then sees the upload\'s reference and keeps the object', async () => {
    const inFlight = await orphan()
    const host = await uploaded('sweep-race-host')
    let sweep: Promise<unknown> | undefined
    await db.transaction().execute(async (trx) => {
      await holdSources(trx, store, [{ storageKey: inFlight.key, sha256: inFlight.sha256, bytes: inFlight.bytes }])
      sweep = sweepUnreferencedSources(db, store, { graceSeconds: HOUR, now: muchLater() })
      await new Promise(resolve => setTimeout(resolve, 500))
      // The sweep is blocked on the lock: the object is still there while the upload has not committed.
      expect(await store.exists(inFlight.key)).toBe(true)
      await trx.insertInto('revision_files').values({ revision_id: host.revisionId, path: `sweep-race-${randomUUID()}.tex`, storage_key: inFlight.key, sha256: inFlight.sha256, size_bytes: inFlight.bytes.length, uploaded_by: host.id }).execute()
    })
    const result = await sweep as { removed: string[] }
    expect(result.removed).not.toContain(inFlight.key)
    expect(await store.exists(inFlight.key)).toBe(true)
  })

  it('an upload whose object the sweep removed after it was written stores it again before referencing it', async () => {
    const bytes = new TextEncoder().encode(uniqueTex('re-stored'))
    const sha256 = createHash('sha256').update(bytes).digest('hex')
    await store.put(bytes, sha256)
    const key = sourceKey(sha256)
    await store.remove(key) // the sweep got there between the upload's write and its transaction
    await db.transaction().execute(trx => holdSources(trx, store, [{ storageKey: key, sha256, bytes }]))
    expect(Buffer.from(await store.get(key)).toString()).toBe(Buffer.from(bytes).toString())
  })
})
