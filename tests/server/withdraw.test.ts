// Issue 11: a submitted manuscript is withdrawn, never deleted; the venue keeps its record.
import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { db, filesForm, newMember, SMALL_TEX } from './helpers'

async function submittedPaper() {
  const author = await newMember('withdrawing')
  const editor = await newMember('editor')
  const { id: venueId } = await db.insertInto('venues').values({ slug: `venue-${randomUUID()}`, name: 'Withdrawal Test Letters' }).returning('id').executeTakeFirstOrThrow()
  await db.insertInto('venue_editors').values({ venue_id: venueId, user_id: editor.id }).execute()
  const { body: m } = await author.client.post('/api/manuscripts', { title: 'A paper sent and taken back' })
  const upload = await author.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'main.tex', content: SMALL_TEX }]))
  expect(upload.status).toBe(201)
  const sent = await author.client.post(`/api/manuscripts/${m.id}/submissions`, { revisionId: upload.body.id, venueId })
  expect(sent.status).toBe(201)
  return { author, editor, venueId, manuscriptId: m.id as string, submissionId: sent.body.id as string }
}

describe('withdrawing a submission', () => {
  it('the owner withdraws: the row stays with the venue, marked withdrawn, with an audit entry; the editor still sees it', async () => {
    const { author, editor, venueId, manuscriptId, submissionId } = await submittedPaper()
    const res = await author.client.post(`/api/manuscripts/${manuscriptId}/submissions/${submissionId}/withdraw`)
    expect(res.status).toBe(200)
    expect(await db.selectFrom('submissions').select('status').where('id', '=', submissionId).executeTakeFirst()).toEqual({ status: 'withdrawn' })
    const audit = await db.selectFrom('audit_log').select(['action', 'actor_id']).where('subject_id', '=', submissionId).orderBy('at').execute()
    expect(audit.map(a => a.action)).toEqual(['submission.created', 'submission.withdrawn'])
    expect(audit[1]!.actor_id).toBe(author.id)
    const venueList = await editor.client.get(`/api/venues/${venueId}/submissions`)
    expect(venueList.status).toBe(200)
    expect(JSON.stringify(venueList.body)).toContain(submissionId)
    expect((await editor.client.get(`/api/submissions/${submissionId}/audit.json`)).status).toBe(200)
    const mine = await author.client.get(`/api/manuscripts/${manuscriptId}`)
    expect(mine.body.submissions).toEqual([expect.objectContaining({ id: submissionId, status: 'withdrawn' })])
  })

  it('a second withdrawal is 409, and the manuscript still cannot be deleted (409), its submission kept', async () => {
    const { author, manuscriptId, submissionId } = await submittedPaper()
    expect((await author.client.post(`/api/manuscripts/${manuscriptId}/submissions/${submissionId}/withdraw`)).status).toBe(200)
    const again = await author.client.post(`/api/manuscripts/${manuscriptId}/submissions/${submissionId}/withdraw`)
    expect(again.status).toBe(409)
    expect(again.body.data.code).toBe('conflict')
    const del = await author.client.delete(`/api/manuscripts/${manuscriptId}`)
    expect(del.status).toBe(409)
    expect(del.body.data.code).toBe('manuscript-submitted')
    expect(await db.selectFrom('submissions').select('id').where('id', '=', submissionId).executeTakeFirst()).toEqual({ id: submissionId })
    expect(await db.selectFrom('audit_log').select('id').where('subject_id', '=', submissionId).where('action', '=', 'submission.withdrawn').execute()).toHaveLength(1)
  })

  it('only the owner may withdraw: a coauthor is refused, a stranger and the editor see nothing (404), and nothing changes', async () => {
    const { author, editor, manuscriptId, submissionId } = await submittedPaper()
    const coauthor = await newMember('coauthor')
    await db.insertInto('manuscript_members').values({ manuscript_id: manuscriptId, user_id: coauthor.id, role: 'coauthor' }).execute()
    const stranger = await newMember('stranger')
    const path = `/api/manuscripts/${manuscriptId}/submissions/${submissionId}/withdraw`
    expect((await coauthor.client.post(path)).status).toBe(403)
    expect((await stranger.client.post(path)).status).toBe(404)
    expect((await editor.client.post(path)).status).toBe(404)
    // Another manuscript's submission is not found through this one.
    const other = await submittedPaper()
    expect((await author.client.post(`/api/manuscripts/${manuscriptId}/submissions/${other.submissionId}/withdraw`)).status).toBe(404)
    const statuses = await db.selectFrom('submissions').select('status').where('id', 'in', [submissionId, other.submissionId]).execute()
    expect(statuses.map(s => s.status)).toEqual(['submitted', 'submitted'])
  })
})
