// The check-runs module: a run row and its queue job are written in one transaction.
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sql } from 'kysely'
import PgBoss from 'pg-boss'
import { db, filesForm, newMember, SMALL_TEX, waitForRun } from './helpers'
import { requestCheckRun } from '../../server/services/check-runs'
import { CHECK_QUEUE } from '../../server/jobs/queue-names'

let boss: PgBoss

beforeAll(async () => {
  boss = new PgBoss({ connectionString: process.env.NUXT_DATABASE_URL!, max: 2, supervise: false, schedule: false })
  await boss.start()
})
afterAll(async () => {
  await boss.stop({ graceful: false, wait: true })
})

async function finishedRevision(): Promise<string> {
  const me = await newMember('outbox')
  const { body: m } = await me.client.post('/api/manuscripts', { title: 'Queued draft' })
  const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'small.tex', content: SMALL_TEX }]))
  await waitForRun(upload.body.checkRunId)
  return upload.body.id
}

async function jobsFor(checkRunId: string): Promise<number> {
  const { rows } = await sql<{ n: number }>`select count(*)::int as n from pgboss.job where name = ${CHECK_QUEUE} and data->>'checkRunId' = ${checkRunId}`.execute(db)
  return rows[0]!.n
}

describe('requesting a check run', () => {
  it('a rolled-back transaction leaves neither the run row nor its queue job', async () => {
    const revisionId = await finishedRevision()
    let runId = ''
    await expect(db.transaction().execute(async (trx) => {
      runId = (await requestCheckRun(trx, boss, { revisionId, requestedBy: null })).id
      // Inside the transaction the job is there, beside the row.
      expect((await sql<{ n: number }>`select count(*)::int as n from pgboss.job where data->>'checkRunId' = ${runId}`.execute(trx)).rows[0]!.n).toBe(1)
      throw new Error('abandon the request')
    })).rejects.toThrow('abandon the request')
    expect(runId).not.toBe('')
    expect(await db.selectFrom('check_runs').select('id').where('id', '=', runId).execute()).toEqual([])
    expect(await jobsFor(runId)).toBe(0)
  })

  it('a committed request has exactly one job, and the worker finishes the run', async () => {
    const revisionId = await finishedRevision()
    const run = await db.transaction().execute(trx => requestCheckRun(trx, boss, { revisionId, requestedBy: null }))
    expect(await jobsFor(run.id)).toBe(1)
    expect((await waitForRun(run.id)).status).toBe('finished')
  })
})

describe('who a re-check is for', () => {
  it('an editor\'s re-check is a what-if run: the members\' current report stays theirs', async () => {
    const author = await newMember('what-if-author')
    const editor = await newMember('what-if-editor')
    const { id: venueId } = await db.insertInto('venues').values({ slug: `venue-${randomUUID()}`, name: 'Harrowgate Notes on Divided Differences' }).returning('id').executeTakeFirstOrThrow()
    await db.insertInto('venue_editors').values({ venue_id: venueId, user_id: editor.id }).execute()
    const { body: m } = await author.client.post('/api/manuscripts', { title: 'What-if draft' })
    const upload = await author.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'small.tex', content: SMALL_TEX }]))
    await waitForRun(upload.body.checkRunId)
    expect((await author.client.post(`/api/manuscripts/${m.id}/submissions`, { revisionId: upload.body.id, venueId })).status).toBe(201)

    const again = await editor.client.post(`/api/revisions/${upload.body.id}/checks`, { conventions: { doubleSign: 'xy-plus' } })
    expect(again.status).toBe(202)
    expect(again.body.whatIf).toBe(true)
    await waitForRun(again.body.checkRunId, status => status === 'finished')

    const members = (await author.client.get(`/api/revisions/${upload.body.id}/report`)).body
    expect(members.run.id).toBe(upload.body.checkRunId)
    expect(members.report.conventions.fixed).toEqual({})
    // The editor reads the what-if report by its run, and polls its progress.
    const whatIf = (await editor.client.get(`/api/revisions/${upload.body.id}/report?run=${again.body.checkRunId}`)).body
    expect(whatIf.run.whatIf).toBe(true)
    expect(whatIf.report.conventions.fixed).toEqual({ doubleSign: 'xy-plus' })
    const progress = await editor.client.get(`/api/check-runs/${again.body.checkRunId}`)
    expect(progress.body).toMatchObject({ id: again.body.checkRunId, status: 'finished', whatIf: true })
    // A member's own re-check still becomes the current report.
    const own = await author.client.post(`/api/revisions/${upload.body.id}/checks`, {})
    expect(own.body.whatIf).toBe(false)
    await waitForRun(own.body.checkRunId, status => status === 'finished')
    expect((await author.client.get(`/api/revisions/${upload.body.id}/report`)).body.run.id).toBe(own.body.checkRunId)
  })

  it('a coauthor cannot set conventions directly; the owner can, with an audit entry', async () => {
    const owner = await newMember('conv-owner')
    const coauthor = await newMember('conv-coauthor')
    const { body: m } = await owner.client.post('/api/manuscripts', { title: 'Convention draft' })
    await db.insertInto('manuscript_members').values({ manuscript_id: m.id, user_id: coauthor.id, role: 'coauthor' }).execute()
    const refused = await coauthor.client.request('PUT', `/api/manuscripts/${m.id}/conventions`, { conventions: { indexing: 'perm-inverse' } })
    expect(refused.status).toBe(403)
    expect((await db.selectFrom('manuscripts').select('conventions').where('id', '=', m.id).executeTakeFirstOrThrow()).conventions).toEqual({})
    const allowed = await owner.client.request('PUT', `/api/manuscripts/${m.id}/conventions`, { conventions: { indexing: 'perm-inverse' } })
    expect(allowed.status).toBe(200)
    const audit = await db.selectFrom('audit_log').select(['action', 'actor_id']).where('subject_id', '=', m.id).where('action', '=', 'manuscript.conventions-set').execute()
    expect(audit).toEqual([{ action: 'manuscript.conventions-set', actor_id: owner.id }])
  })

  // A malformed id names nothing: 404 as on every route (routeParamsAs), never looked up.
  it('params that are not UUIDs are not found, not looked up', async () => {
    const me = await newMember('bad-id')
    const res = await me.client.get('/api/check-runs/not-a-uuid')
    expect(res.status).toBe(404)
    expect(res.body.data.code).toBe('not-found')
  })
})

describe('the report of a finished run', () => {
  it('has an ETag, and a matching If-None-Match answers 304 with no body', async () => {
    const me = await newMember('etag')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Cached draft' })
    const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'small.tex', content: SMALL_TEX }]))
    await waitForRun(upload.body.checkRunId)
    const path = `/api/revisions/${upload.body.id}/report`
    const first = await me.client.raw('GET', path)
    expect(first.status).toBe(200)
    const etag = first.headers.get('etag')
    expect(etag).toMatch(/^".+"$/)
    const again = await me.client.raw('GET', path, { 'if-none-match': etag! })
    expect(again.status).toBe(304)
    expect(await again.text()).toBe('')
    // A new run changes the answer: the old tag no longer matches.
    const recheck = await me.client.post(`/api/revisions/${upload.body.id}/checks`, {})
    expect((await me.client.raw('GET', path, { 'if-none-match': etag! })).status).toBe(200)
    await waitForRun(recheck.body.checkRunId)
  })

  it('after a re-check finishes, the answer is the new run and its report, with a new tag; the revision head read from memory stays right (issue 11)', async () => {
    const me = await newMember('etag-next')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Cached draft, checked twice' })
    const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'small.tex', content: SMALL_TEX }]))
    await waitForRun(upload.body.checkRunId)
    const path = `/api/revisions/${upload.body.id}/report`
    const first = await me.client.raw('GET', path)
    const firstBody = await first.json()
    expect(firstBody.run).toMatchObject({ id: upload.body.checkRunId, status: 'finished' })
    expect(firstBody.revision).toMatchObject({ id: upload.body.id, number: 1, files: [expect.objectContaining({ path: 'small.tex' })] })
    expect(firstBody.report).not.toBeNull()
    const recheck = await me.client.post(`/api/revisions/${upload.body.id}/checks`, {})
    await waitForRun(recheck.body.checkRunId)
    const second = await me.client.raw('GET', path)
    const secondBody = await second.json()
    expect(secondBody.run).toMatchObject({ id: recheck.body.checkRunId, status: 'finished' })
    expect(secondBody.revision).toEqual(firstBody.revision)
    expect(secondBody.report).not.toBeNull()
    const etag = second.headers.get('etag')
    expect(etag).not.toBe(first.headers.get('etag'))
    expect((await me.client.raw('GET', path, { 'if-none-match': etag! })).status).toBe(304)
    // The first run stays reachable by its id, with its own report.
    const old = await me.client.get(`${path}?run=${upload.body.checkRunId}`)
    expect(old.body.run).toMatchObject({ id: upload.body.checkRunId, status: 'finished' })
    expect(old.body.report).not.toBeNull()
  })
})
