// Comparing two revisions through the API, with the demo manuscript's two drafts uploaded afresh.
// Revision 2 corrects main.tex line 30 (#PD(1432) = 5: S_1432 has five monomials, each with
// coefficient 1, common practice) and line 41 (S_1342 = x1x2 + x1x3 + x2x3, Macdonald, "Notes on
// Schubert polynomials" (1991), table for S_4, recalled from memory); nothing else changes.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { db, filesForm, newMember, type Client, waitForRun } from './helpers'
import { makeZip } from '../helpers/archives'

const demo = (path: string) => readFileSync(`server/assets/demo/vexillary-flags/${path}`, 'utf8')

async function uploadDraft(client: Client, manuscriptId: string, rev: 'rev1' | 'rev2', wait = true) {
  const zip = makeZip([
    { path: 'main.tex', content: demo(`${rev}/main.tex`) },
    { path: 'sections/double.tex', content: demo(`${rev}/sections/double.tex`) },
  ])
  const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: `${rev}.zip`, content: zip }]))
  expect(res.status).toBe(201)
  if (wait) expect((await waitForRun(res.body.checkRunId)).status).toBe('finished')
  return res.body.id as string
}

describe('comparing two revisions', () => {
  it('shows exactly the two corrected lines as fixed and every other claim as unchanged', async () => {
    const me = await newMember('author')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Compared drafts' })
    const rev1 = await uploadDraft(me.client, m.id, 'rev1')
    const rev2 = await uploadDraft(me.client, m.id, 'rev2')
    const res = await me.client.get(`/api/manuscripts/${m.id}/compare?from=${rev1}&to=${rev2}`)
    expect(res.status).toBe(200)
    expect([res.body.from.number, res.body.to.number]).toEqual([1, 2])
    const fixed = res.body.entries.filter((e: any) => e.category === 'fixed')
    expect(fixed.map((e: any) => [e.from.file, e.from.line, e.from.verdict, e.to.line, e.to.verdict, e.changed])).toEqual([
      ['main.tex', 30, 'mismatch', 30, 'verified', true],
      ['main.tex', 41, 'mismatch', 41, 'verified', true],
    ])
    expect(fixed[0].to.source).toBe('\\#\\PD(1432) = 5')
    const rest = res.body.entries.filter((e: any) => e.category !== 'fixed')
    expect(rest.length).toBeGreaterThan(0)
    expect(rest.every((e: any) => e.category === 'unchangedVerified' && e.matchedBy === 'content' && !e.changed && e.from.line === e.to.line)).toBe(true)
    const report2 = (await me.client.get(`/api/revisions/${rev2}/report`)).body.report
    expect(res.body.counts).toEqual({ fixed: 2, newlyFailing: 0, stillFailing: 0, unchangedVerified: report2.claims.length - 2, unchecked: 0, added: 0, removed: 0 })

    // The other way round, the two corrections are newly failing.
    const back = await me.client.get(`/api/manuscripts/${m.id}/compare?from=${rev2}&to=${rev1}`)
    expect(back.body.entries.filter((e: any) => e.category === 'newlyFailing').map((e: any) => e.to.line)).toEqual([30, 41])
  })

  it('refuses strangers, revisions of other manuscripts, missing parameters and unfinished checks', async () => {
    const me = await newMember('author')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Guarded comparison' })
    const rev1 = await uploadDraft(me.client, m.id, 'rev1')
    const stranger = await newMember('stranger')
    expect((await stranger.client.get(`/api/manuscripts/${m.id}/compare?from=${rev1}&to=${rev1}`)).status).toBe(404)
    const { body: other } = await me.client.post('/api/manuscripts', { title: 'Another one' })
    const elsewhere = await uploadDraft(me.client, other.id, 'rev2')
    const crossed = await me.client.get(`/api/manuscripts/${m.id}/compare?from=${rev1}&to=${elsewhere}`)
    expect([crossed.status, crossed.body.data.code]).toEqual([404, 'not-found'])
    const missing = await me.client.get(`/api/manuscripts/${m.id}/compare?from=${rev1}`)
    expect([missing.status, missing.body.data.code]).toEqual([400, 'invalid-input'])
    expect((await me.client.get(`/api/manuscripts/${m.id}/compare?from=${rev1}&to=nonsense`)).status).toBe(404)
    // A revision without a finished check (made directly, with no run at all) cannot be compared yet.
    const bare = await db.insertInto('revisions').values({ manuscript_id: m.id, number: 99, main_file: 'main.tex', uploaded_by: me.id }).returning('id').executeTakeFirstOrThrow()
    const pending = await me.client.get(`/api/manuscripts/${m.id}/compare?from=${rev1}&to=${bare.id}`)
    expect([pending.status, pending.body.data.code]).toEqual([409, 'conflict'])
  })
})
