// Members' threads on claims (they follow a claim into the next revision; referees and strangers
// never see them) and convention decisions (proposal → agreement → accepted → conventions set and re-checked).
import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { db, filesForm, newMember, type Client, waitForRun } from './helpers'

const paper = (...lines: string[]) => `\\documentclass{article}\n\\begin{document}\n${lines.join('\n')}\n\\end{document}\n`
// S_132 = x_1 + x_2 and S_231 = x_1 x_2 (common practice: the smallest Schubert polynomials of S_3).
const REV1 = paper('$\\mathfrak{S}_{132} = x_1 + x_2$', '$\\mathfrak{S}_{231} = x_1 x_2$')
// Revision 2 puts two lines in front, so the same claims sit on other lines with other report ids.
const REV2 = paper('Some words first.', '', '$\\mathfrak{S}_{132} = x_1 + x_2$', '$\\mathfrak{S}_{231} = x_1 x_2$')

async function upload(client: Client, manuscriptId: string, tex: string) {
  const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'main.tex', content: tex }]))
  expect(res.status).toBe(201)
  expect((await waitForRun(res.body.checkRunId)).status).toBe('finished')
  return res.body.id as string
}

async function claimOn(client: Client, revisionId: string, line: number) {
  const report = (await client.get(`/api/revisions/${revisionId}/report`)).body.report
  const claim = report.claims.find((c: any) => c.line === line)
  expect(claim, `a claim on line ${line}`).toBeDefined()
  return claim as { id: string, line: number, source: string }
}

/** A manuscript owned by a new member, with a coauthor added directly (inviting is tested elsewhere). */
async function manuscriptWithCoauthor(title: string) {
  const owner = await newMember('owner')
  const coauthor = await newMember('coauthor')
  const { body: m } = await owner.client.post('/api/manuscripts', { title })
  await db.insertInto('manuscript_members').values({ manuscript_id: m.id, user_id: coauthor.id, role: 'coauthor' }).execute()
  return { owner, coauthor, manuscriptId: m.id as string }
}

async function auditActions(subjectIds: string[]) {
  const rows = await db.selectFrom('audit_log').select(['action', 'subject_id', 'actor_id', 'details']).where('subject_id', 'in', subjectIds).orderBy('id').execute()
  return rows
}

describe('threads on claims', () => {
  it('keeps a thread on the same claim in the next revision, with replies, and writes the audit log', async () => {
    const { owner, coauthor, manuscriptId } = await manuscriptWithCoauthor('Threads follow claims')
    const rev1 = await upload(owner.client, manuscriptId, REV1)
    const first = await claimOn(owner.client, rev1, 3)
    const posted = await owner.client.post(`/api/revisions/${rev1}/comments`, { claimId: first.id, body: '  Is this the right normalisation?  ' })
    expect(posted.status).toBe(201)
    expect(posted.body.body).toBe('Is this the right normalisation?')
    const reply = await coauthor.client.post(`/api/revisions/${rev1}/comments`, { claimId: first.id, body: 'Yes, as in the introduction.', parentId: posted.body.id })
    expect(reply.status).toBe(201)

    const rev2 = await upload(coauthor.client, manuscriptId, REV2)
    const moved = await claimOn(owner.client, rev2, 5)
    expect(moved.source).toBe(first.source)
    expect(moved.id).not.toBe(first.id)
    const threads = (await owner.client.get(`/api/revisions/${rev2}/comments`)).body.threads
    expect(threads).toHaveLength(1)
    expect(threads[0].claimIds).toEqual([moved.id])
    expect(threads[0].comments.map((c: any) => [c.body, c.authorName, c.parentId, c.revisionNumber])).toEqual([
      ['Is this the right normalisation?', owner.displayName, null, 1],
      ['Yes, as in the introduction.', coauthor.displayName, posted.body.id, 1],
    ])
    // The other claim (line 6 now) has no thread.
    const other = await claimOn(owner.client, rev2, 6)
    expect(threads.some((t: any) => t.claimIds.includes(other.id))).toBe(false)

    const audit = (await auditActions([manuscriptId])).filter(a => a.action === 'claim.comment-posted')
    expect(audit.map(a => [a.actor_id, (a.details as any).commentId])).toEqual([[owner.id, posted.body.id], [coauthor.id, reply.body.id]])
  })

  it('refuses empty or long comments, unknown claims, and replies across claims', async () => {
    const { owner, manuscriptId } = await manuscriptWithCoauthor('Comment validation')
    const rev = await upload(owner.client, manuscriptId, REV1)
    const [a, b] = [await claimOn(owner.client, rev, 3), await claimOn(owner.client, rev, 4)]
    const empty = await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: a.id, body: '   ' })
    expect([empty.status, empty.body.data.code, empty.body.data.fields.body]).toEqual([400, 'invalid-input', 'Write something'])
    expect((await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: a.id, body: 'x'.repeat(4001) })).status).toBe(400)
    expect((await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: 'main.tex:99:1', body: 'hello' })).status).toBe(404)
    const root = await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: a.id, body: 'on a' })
    const across = await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: b.id, body: 'reply on b', parentId: root.body.id })
    expect([across.status, across.body.data.code]).toEqual([400, 'invalid-input'])
    expect((await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: a.id, body: 'reply', parentId: randomUUID() })).status).toBe(404)
    const stored = await db.selectFrom('claim_comments').select('body').where('manuscript_id', '=', manuscriptId).execute()
    expect(stored.map(r => r.body)).toEqual(['on a'])
  })

  it('hides members\' threads from strangers and from a referee who may read the report (404)', async () => {
    const { owner, manuscriptId } = await manuscriptWithCoauthor('Private threads')
    const rev = await upload(owner.client, manuscriptId, REV1)
    const claim = await claimOn(owner.client, rev, 3)
    expect((await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: claim.id, body: 'between us' })).status).toBe(201)

    const referee = await newMember('referee')
    const venue = await db.insertInto('venues').values({ slug: `v-${randomUUID().slice(0, 8)}`, name: 'Test venue for threads' }).returning('id').executeTakeFirstOrThrow()
    const submission = await db.insertInto('submissions').values({ revision_id: rev, venue_id: venue.id, submitted_by: owner.id }).returning('id').executeTakeFirstOrThrow()
    await db.insertInto('referee_assignments').values({ submission_id: submission.id, referee_id: referee.id, invited_by: owner.id }).execute()
    // The referee does see the report, so the 404 below is about the threads alone.
    expect((await referee.client.get(`/api/revisions/${rev}/report`)).status).toBe(200)
    const refereeRead = await referee.client.get(`/api/revisions/${rev}/comments`)
    expect([refereeRead.status, refereeRead.body.data.code]).toEqual([404, 'not-found'])
    expect(refereeRead.text).not.toContain('between us')
    expect((await referee.client.post(`/api/revisions/${rev}/comments`, { claimId: claim.id, body: 'may I?' })).status).toBe(404)

    const stranger = await newMember('stranger')
    expect((await stranger.client.get(`/api/revisions/${rev}/comments`)).status).toBe(404)
    expect((await stranger.client.post(`/api/revisions/${rev}/comments`, { claimId: claim.id, body: 'hi' })).status).toBe(404)
    const count = await db.selectFrom('claim_comments').select(eb => eb.fn.countAll<number>().as('n')).where('manuscript_id', '=', manuscriptId).executeTakeFirstOrThrow()
    expect(Number(count.n)).toBe(1)
  })

  it('leaves referee notes out of the members\' threads', async () => {
    const { owner, manuscriptId } = await manuscriptWithCoauthor('Notes stay apart')
    const rev = await upload(owner.client, manuscriptId, REV1)
    const claim = await claimOn(owner.client, rev, 3)
    const referee = await newMember('referee')
    const venue = await db.insertInto('venues').values({ slug: `v-${randomUUID().slice(0, 8)}`, name: 'Test venue for notes' }).returning('id').executeTakeFirstOrThrow()
    const submission = await db.insertInto('submissions').values({ revision_id: rev, venue_id: venue.id, submitted_by: owner.id }).returning('id').executeTakeFirstOrThrow()
    const assignment = await db.insertInto('referee_assignments').values({ submission_id: submission.id, referee_id: referee.id, invited_by: owner.id }).returning('id').executeTakeFirstOrThrow()
    const row = await db.selectFrom('claims').select('content_key').where('check_run_id', '=', (await owner.client.get(`/api/revisions/${rev}/report`)).body.run.id).where('line', '=', 3).executeTakeFirstOrThrow()
    await db.insertInto('claim_comments').values({ manuscript_id: manuscriptId, content_key: row.content_key, author_id: referee.id, referee_assignment_id: assignment.id, body: 'a referee note' }).execute()
    await owner.client.post(`/api/revisions/${rev}/comments`, { claimId: claim.id, body: 'a member comment' })
    const res = await owner.client.get(`/api/revisions/${rev}/comments`)
    expect(res.body.threads.flatMap((t: any) => t.comments.map((c: any) => c.body))).toEqual(['a member comment'])
    expect(res.text).not.toContain(referee.displayName)
    expect(res.text).not.toContain(referee.email)
  })
})

describe('convention decisions', () => {
  it('accepts a proposal once the other member agrees, sets the conventions and re-checks with them fixed', async () => {
    const { owner, coauthor, manuscriptId } = await manuscriptWithCoauthor('Deciding conventions')
    await upload(owner.client, manuscriptId, REV1)
    const proposed = await owner.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions`, { axis: 'doubleSign', conventionId: 'xy-plus' })
    expect(proposed.status).toBe(201)
    expect(proposed.body).toMatchObject({ status: 'proposed', checkRunId: null })
    const decisionId = proposed.body.decisionId
    let list = (await coauthor.client.get(`/api/manuscripts/${manuscriptId}/convention-decisions`)).body
    expect(list.conventions).toEqual({})
    expect(list.decisions).toHaveLength(1)
    expect(list.decisions[0]).toMatchObject({ id: decisionId, axis: 'doubleSign', conventionId: 'xy-plus', status: 'proposed', proposedBy: { userId: owner.id, displayName: owner.displayName }, agreedBy: [], decidedAt: null })
    expect(list.decisions[0].waitingFor).toEqual([{ userId: coauthor.id, displayName: coauthor.displayName }])

    // A second proposal on the same axis, the proposer agreeing, and a stranger are all refused.
    expect((await coauthor.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions`, { axis: 'doubleSign', conventionId: 'xy-minus' })).status).toBe(409)
    expect((await owner.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${decisionId}/agree`)).status).toBe(409)
    const stranger = await newMember('stranger')
    expect((await stranger.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${decisionId}/agree`)).status).toBe(404)
    expect((await stranger.client.get(`/api/manuscripts/${manuscriptId}/convention-decisions`)).status).toBe(404)
    expect((await coauthor.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${decisionId}/withdraw`)).status).toBe(403)

    const agreed = await coauthor.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${decisionId}/agree`)
    expect(agreed.status).toBe(200)
    expect(agreed.body.status).toBe('accepted')
    expect(agreed.body.checkRunId).toMatch(/^[0-9a-f-]{36}$/)
    const manuscript = await db.selectFrom('manuscripts').select('conventions').where('id', '=', manuscriptId).executeTakeFirstOrThrow()
    expect(manuscript.conventions).toEqual({ doubleSign: 'xy-plus' })
    const run = await waitForRun(agreed.body.checkRunId)
    expect(run.status).toBe('finished')
    expect(run.conventions).toEqual({ doubleSign: 'xy-plus' })
    expect((run.summary as any).conventions.fixed).toEqual({ doubleSign: 'xy-plus' })

    list = (await owner.client.get(`/api/manuscripts/${manuscriptId}/convention-decisions`)).body
    expect(list.conventions).toEqual({ doubleSign: 'xy-plus' })
    expect(list.decisions[0].status).toBe('accepted')
    expect(list.decisions[0].agreedBy.map((a: any) => a.userId)).toEqual([coauthor.id])
    expect(Date.parse(list.decisions[0].agreedBy[0].at)).not.toBeNaN()
    expect(list.decisions[0].waitingFor).toEqual([])
    // Closed: no more agreeing or withdrawing.
    expect((await coauthor.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${decisionId}/agree`)).status).toBe(409)
    expect((await owner.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${decisionId}/withdraw`)).status).toBe(409)

    const audit = await auditActions([decisionId, manuscriptId])
    expect(audit.filter(a => a.subject_id === decisionId).map(a => [a.action, a.actor_id])).toEqual([
      ['convention.proposed', owner.id],
      ['convention.agreed', coauthor.id],
      ['convention.accepted', coauthor.id],
    ])
    const set = audit.filter(a => a.action === 'manuscript.conventions-set')
    expect(set.map(a => a.details)).toEqual([{ before: {}, after: { doubleSign: 'xy-plus' }, decisionId }])
  })

  it('accepts at once on a one-member manuscript, and the proposer may withdraw an open proposal', async () => {
    const solo = await newMember('solo')
    const { body: m } = await solo.client.post('/api/manuscripts', { title: 'Alone' })
    const at = await solo.client.post(`/api/manuscripts/${m.id}/convention-decisions`, { axis: 'indexing', conventionId: 'perm-inverse' })
    expect(at.body).toMatchObject({ status: 'accepted', checkRunId: null })
    expect((await db.selectFrom('manuscripts').select('conventions').where('id', '=', m.id).executeTakeFirstOrThrow()).conventions).toEqual({ indexing: 'perm-inverse' })
    expect((await solo.client.post(`/api/manuscripts/${m.id}/convention-decisions`, { axis: 'indexing', conventionId: 'perm-inverse' })).status).toBe(409)

    const { owner, manuscriptId } = await manuscriptWithCoauthor('Withdrawn')
    const proposed = await owner.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions`, { axis: 'beta', conventionId: 'beta-plus' })
    const withdrawn = await owner.client.post(`/api/manuscripts/${manuscriptId}/convention-decisions/${proposed.body.decisionId}/withdraw`)
    expect(withdrawn.body.status).toBe('withdrawn')
    const list = (await owner.client.get(`/api/manuscripts/${manuscriptId}/convention-decisions`)).body
    expect([list.conventions, list.decisions[0].status]).toEqual([{}, 'withdrawn'])
    expect((await auditActions([proposed.body.decisionId])).map(a => a.action)).toEqual(['convention.proposed', 'convention.withdrawn'])
  })

  it('refuses an unknown axis or a convention of another axis', async () => {
    const me = await newMember('owner')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Bad proposals' })
    const wrongAxis = await me.client.post(`/api/manuscripts/${m.id}/convention-decisions`, { axis: 'colour', conventionId: 'xy-plus' })
    expect([wrongAxis.status, wrongAxis.body.data.code]).toEqual([400, 'invalid-input'])
    const crossed = await me.client.post(`/api/manuscripts/${m.id}/convention-decisions`, { axis: 'beta', conventionId: 'xy-plus' })
    expect([crossed.status, crossed.body.data.fields.conventionId]).toEqual([400, 'Not a convention of this axis'])
    expect((await me.client.post(`/api/manuscripts/${m.id}/convention-decisions/not-a-uuid/agree`)).status).toBe(404)
  })

  it('still sets conventions directly through PUT, through the same service', async () => {
    const me = await newMember('owner')
    const { body: m } = await me.client.post('/api/manuscripts', { title: 'Direct setting' })
    await upload(me.client, m.id, REV1)
    const res = await me.client.request('PUT', `/api/manuscripts/${m.id}/conventions`, { conventions: { partition: 'shape-columns' } })
    expect(res.status).toBe(200)
    expect(res.body.conventions).toEqual({ partition: 'shape-columns' })
    const run = await waitForRun(res.body.checkRunId)
    expect(run.conventions).toEqual({ partition: 'shape-columns' })
  })
})
