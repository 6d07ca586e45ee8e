/**
 * "Fetch from arXiv" through the API, against the fake e-print endpoint that scripts/test.sh starts
 * (NUXT_ARXIV_BASE_URL): the e-print becomes a revision through the upload path, is checked like
 * any upload, and every failure stores nothing.
 */
import { describe, expect, it } from 'vitest'
import { db, newMember, waitForRun } from './helpers'

async function freshManuscript() {
  const me = await newMember('arxiv')
  const { body } = await me.client.post('/api/manuscripts', { title: 'From arXiv' })
  return { ...me, manuscriptId: body.id as string }
}

const revisionCount = async (manuscriptId: string) => (await db.selectFrom('revisions').select(db.fn.countAll<string>().as('n')).where('manuscript_id', '=', manuscriptId).executeTakeFirstOrThrow()).n

describe('fetching a revision from arXiv', () => {
  it('stores a gzipped-tar e-print as the next revision with its files, and checks it', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions/arxiv`, { identifier: 'arXiv:2612.00001v1' })
    expect(res.status).toBe(201)
    expect(res.body.arxiv).toBe('2612.00001v1')
    expect(res.body.files.map((f: { path: string }) => f.path).sort()).toEqual(['main.tex', 'sections/double.tex'])
    const revision = await db.selectFrom('revisions').selectAll().where('id', '=', res.body.id).executeTakeFirstOrThrow()
    expect(revision.note).toBe('Fetched from arXiv: 2612.00001v1')
    expect(revision.main_file).toBe('main.tex')
    expect((await waitForRun(res.body.checkRunId)).status).toBe('finished')
    const report = await client.get(`/api/revisions/${res.body.id}/report`)
    expect(report.status).toBe(200)
    expect(report.body.report.claims.length).toBeGreaterThan(0)
  })

  it('stores a single gzipped .tex and an old-style identifier', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const single = await client.post(`/api/manuscripts/${manuscriptId}/revisions/arxiv`, { identifier: '2612.00002' })
    expect(single.status).toBe(201)
    expect(single.body.files.map((f: { path: string }) => f.path)).toEqual(['2612.00002.tex'])
    const old = await client.post(`/api/manuscripts/${manuscriptId}/revisions/arxiv`, { identifier: 'math/0613001' })
    expect(old.status).toBe(201)
    expect(old.body.number).toBe(2)
  })

  it('refuses a PDF-only submission, an unknown id, a malformed id and a long rate limit, storing nothing', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const cases: [string, number, string][] = [
      ['2612.00003', 422, 'arxiv-pdf-only'],
      ['2612.09999', 404, 'arxiv-not-found'],
      ['not/an-id', 400, 'arxiv-invalid-id'],
      ['2612.00005', 503, 'arxiv-rate-limited'],
    ]
    for (const [identifier, status, code] of cases) {
      const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions/arxiv`, { identifier })
      expect(res.status, identifier).toBe(status)
      expect(res.body.data.code, identifier).toBe(code)
    }
    expect(Number(await revisionCount(manuscriptId))).toBe(0)
    const empty = await client.post(`/api/manuscripts/${manuscriptId}/revisions/arxiv`, { identifier: '' })
    expect(empty.status).toBe(400)
    expect(empty.body.data.code).toBe('invalid-input')
  })

  it('is refused on a manuscript the caller is not a member of', async () => {
    const { manuscriptId } = await freshManuscript()
    const stranger = await newMember('stranger')
    const res = await stranger.client.post(`/api/manuscripts/${manuscriptId}/revisions/arxiv`, { identifier: '2612.00002' })
    expect(res.status).toBe(404)
  })
})

describe('a new manuscript from arXiv', () => {
  it('creates the manuscript and its first revision', async () => {
    const { client, id: userId } = await newMember('arxiv-new')
    const res = await client.post('/api/manuscripts/arxiv', { identifier: '2612.00001' })
    expect(res.status).toBe(201)
    expect(res.body.arxiv).toBe('2612.00001')
    const manuscript = await db.selectFrom('manuscripts').selectAll().where('id', '=', res.body.id).executeTakeFirstOrThrow()
    expect(manuscript.title).toBe('arXiv:2612.00001')
    expect(manuscript.owner_id).toBe(userId)
    expect(res.body.revision.number).toBe(1)
  })

  it('creates nothing when the e-print cannot be stored', async () => {
    const { client, id: userId } = await newMember('arxiv-none')
    const res = await client.post('/api/manuscripts/arxiv', { identifier: '2612.00003' })
    expect(res.status).toBe(422)
    const owned = await db.selectFrom('manuscripts').select('id').where('owner_id', '=', userId).execute()
    expect(owned).toEqual([])
  })
})
