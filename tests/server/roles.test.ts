// For each role: one thing it can do and one thing it is refused.
// Refusals about things the caller may not know exist are 404, not 403.
import { describe, expect, it } from 'vitest'
import { Client, db, demoClient, filesForm, newMember, SMALL_TEX } from './helpers'
import { DEMO_PEOPLE } from '../../server/services/demo-people'

async function demoIds() {
  const venues = await db.selectFrom('venues').select(['id', 'slug']).execute()
  const manuscripts = await db.selectFrom('manuscripts').select(['id', 'title']).execute()
  const byTitle = (t: string) => manuscripts.find(m => m.title.startsWith(t))!.id
  return {
    ledgerfield: venues.find(v => v.slug === 'ledgerfield-jac')!.id,
    brackwater: venues.find(v => v.slug === 'brackwater-notes')!.id,
    flags: byTitle('Transition chains'),
    tilings: byTitle('A note on bumpless'),
  }
}

describe('anonymous visitor', () => {
  it('may ask whether the service is up', async () => {
    const res = await new Client().get('/api/health')
    expect(res.status).toBe(200)
    expect(res.body.ok).toBe(true)
  })
  it('is refused the desk with 401 and a code', async () => {
    const res = await new Client().get('/api/desk')
    expect(res.status).toBe(401)
    expect(res.body.data.code).toBe('not-signed-in')
  })
})

describe('member', () => {
  it('creates a manuscript and becomes its author, with an audit entry', async () => {
    const me = await newMember()
    const res = await me.client.post('/api/manuscripts', { title: 'Notes on descent cycles' })
    expect(res.status).toBe(201)
    const member = await db.selectFrom('manuscript_members').selectAll().where('manuscript_id', '=', res.body.id).execute()
    expect(member).toEqual([expect.objectContaining({ user_id: me.id, role: 'author' })])
    const audit = await db.selectFrom('audit_log').selectAll().where('subject_id', '=', res.body.id).execute()
    expect(audit.map(a => a.action)).toContain('manuscript.created')
  })
  it('is refused the administration API with 403', async () => {
    const me = await newMember()
    const res = await me.client.get('/api/admin/users')
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('forbidden')
  })
  it('gets field reasons for an invalid manuscript title', async () => {
    const me = await newMember()
    const res = await me.client.post('/api/manuscripts', { title: '   ' })
    expect(res.status).toBe(400)
    expect(res.body.data.code).toBe('invalid-input')
    expect(Object.keys(res.body.data.fields)).toEqual(['title'])
  })
})

describe('site administrator', () => {
  it('lists the accounts', async () => {
    const admin = await demoClient('admin')
    const res = await admin.get('/api/admin/users')
    expect(res.status).toBe(200)
    expect(res.body.map((u: { email: string }) => u.email)).toContain(DEMO_PEOPLE.referee.email)
    expect(res.text).not.toContain('password')
  })
  it('does not see manuscripts it is not a member of (404)', async () => {
    const { flags } = await demoIds()
    const res = await (await demoClient('admin')).get(`/api/manuscripts/${flags}`)
    expect(res.status).toBe(404)
  })
})

describe('author', () => {
  it('uploads a revision to an own manuscript', async () => {
    const me = await newMember('author')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Flagged determinants' })
    const res = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'paper.tex', content: SMALL_TEX }]))
    expect(res.status).toBe(201)
    expect(res.body.number).toBe(1)
    const runs = await db.selectFrom('check_runs').selectAll().where('revision_id', '=', res.body.id).execute()
    expect(runs).toHaveLength(1)
  })
  it('is refused someone else\'s manuscript with 404, for reading and for uploading', async () => {
    const { flags } = await demoIds()
    const stranger = await newMember('stranger')
    expect((await stranger.client.get(`/api/manuscripts/${flags}`)).status).toBe(404)
    const upload = await stranger.client.post(`/api/manuscripts/${flags}/revisions`, filesForm([{ name: 'x.tex', content: SMALL_TEX }]))
    expect(upload.status).toBe(404)
    expect(upload.body.data.code).toBe('not-found')
  })
  it('gets 404, not a server error, for a malformed id', async () => {
    const me = await newMember()
    expect((await me.client.get('/api/manuscripts/not-a-uuid')).status).toBe(404)
  })
})

describe('coauthor', () => {
  it('sees the manuscript and its revisions', async () => {
    const { flags } = await demoIds()
    const res = await (await demoClient('coauthor')).get(`/api/manuscripts/${flags}`)
    expect(res.status).toBe(200)
    expect(res.body.myRole).toBe('coauthor')
    expect(res.body.revisions.length).toBeGreaterThanOrEqual(2)
  })
  it('settled the demo paper\'s double-polynomial sign with the author by a decision', async () => {
    const { flags } = await demoIds()
    const res = await (await demoClient('coauthor')).get(`/api/manuscripts/${flags}/convention-decisions`)
    expect(res.status).toBe(200)
    expect(res.body.conventions).toEqual({ doubleSign: 'xy-minus' })
    const [decision] = res.body.decisions
    expect(decision).toMatchObject({ axis: 'doubleSign', conventionId: 'xy-minus', status: 'accepted', proposedBy: { displayName: DEMO_PEOPLE.author.displayName } })
    expect(decision.agreedBy.map((p: { displayName: string }) => p.displayName)).toEqual([DEMO_PEOPLE.coauthor.displayName])
  })
  it('may not delete the manuscript (403) and it stays', async () => {
    const { flags } = await demoIds()
    const res = await (await demoClient('coauthor')).delete(`/api/manuscripts/${flags}`)
    expect(res.status).toBe(403)
    expect(await db.selectFrom('manuscripts').select('id').where('id', '=', flags).executeTakeFirst()).toBeDefined()
  })
  it('the owner may delete an own manuscript', async () => {
    const me = await newMember('owner')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Short-lived draft' })
    expect((await me.client.delete(`/api/manuscripts/${m.id}`)).status).toBe(200)
    expect(await db.selectFrom('manuscripts').select('id').where('id', '=', m.id).executeTakeFirst()).toBeUndefined()
  })
})

describe('editor', () => {
  it('sees the submissions of an own venue, with their referees', async () => {
    const { ledgerfield } = await demoIds()
    const res = await (await demoClient('editor')).get(`/api/venues/${ledgerfield}/submissions`)
    expect(res.status).toBe(200)
    const row = res.body.submissions.find((s: { manuscriptTitle: string }) => s.manuscriptTitle.startsWith('A note on bumpless'))
    expect(row.referees.map((r: { displayName: string }) => r.displayName)).toEqual([DEMO_PEOPLE.referee.displayName])
  })
  it('sees nothing of another venue (404)', async () => {
    const { brackwater } = await demoIds()
    const res = await (await demoClient('editor')).get(`/api/venues/${brackwater}/submissions`)
    expect(res.status).toBe(404)
  })
})

describe('referee', () => {
  it('opens an assigned submission', async () => {
    const referee = await demoClient('referee')
    const list = await referee.get('/api/reviews')
    expect(list.status).toBe(200)
    expect(list.body).toHaveLength(1)
    const review = await referee.get(`/api/reviews/${list.body[0].assignmentId}`)
    expect(review.status).toBe(200)
    expect(review.body.revision.files.map((f: { path: string }) => f.path)).toEqual(['tilings.tex'])
  })
  it('is refused an assignment that is not theirs and the venue\'s table (404)', async () => {
    const list = await (await demoClient('referee')).get('/api/reviews')
    const stranger = await newMember('not-a-referee')
    expect((await stranger.client.get(`/api/reviews/${list.body[0].assignmentId}`)).status).toBe(404)
    const { ledgerfield } = await demoIds()
    expect((await (await demoClient('referee')).get(`/api/venues/${ledgerfield}/submissions`)).status).toBe(404)
  })
  it('stays anonymous to the authors: no response they receive names the referee', async () => {
    const { tilings } = await demoIds()
    const author = await demoClient('soloAuthor')
    const responses = await Promise.all([
      author.get('/api/desk'),
      author.get(`/api/manuscripts/${tilings}`),
      author.get('/api/manuscripts'),
      author.get('/api/reviews'),
    ])
    for (const res of responses) {
      expect(res.status).toBe(200)
      expect(res.text).not.toContain(DEMO_PEOPLE.referee.displayName)
      expect(res.text).not.toContain(DEMO_PEOPLE.referee.email)
      expect(res.text).not.toContain('Oyelaran')
    }
    const manuscript = responses[1]!.body
    expect(manuscript.submissions).toHaveLength(1)
  })
})
