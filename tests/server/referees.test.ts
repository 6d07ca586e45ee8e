// Refereeing: invitations by e-mail (single use, expiring, for the invited address only),
// who may see what (a referee only assigned submissions, an editor only own venues, 404
// otherwise), notes hidden until released and then shown as "Referee N", the release mail,
// and that no JSON response an author can get names the referee.
//
// Expected verdicts are facts of the trade (common practice): S_{213} = x_1 and
// S_{132} = x_1 + x_2 (so "S_{132} = x_1" is wrong), S_{213}(x;y) = x_1 - y_1 with the
// reference sign, so "S_{213}(x;y) = x_1 + y_1" holds only with factors x_i + y_j, and a
// claim tagged `skip` is unsupported (docs/tags.md).
import { createHash, randomUUID } from 'node:crypto'
import { readdirSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { type ApiResponse, type Client, db, demoClient, filesForm, newMember, SMALL_TEX, mailsTo, waitForMail } from './helpers'
import { DEMO_PEOPLE } from '../../server/services/demo-people'

export const PAPER = [
  '\\documentclass{article}',
  '\\begin{document}',
  'First, $\\mathfrak{S}_{213} = x_1$.',
  'Second, $\\mathfrak{S}_{132} = x_1$.',
  'Third, $\\ell(2143) = 2$ % scholium: skip',
  'Fourth, $\\mathfrak{S}_{213}(x;y) = x_1 + y_1$.',
  '\\end{document}',
  '',
].join('\n')
const WRONG_ONLY = '\\documentclass{article}\n\\begin{document}\n$\\mathfrak{S}_{132} = x_1$\n\\end{document}\n'

type Member = Awaited<ReturnType<typeof newMember>>

/** Polls until the revision's newest run has finished (the test profile runs a worker). */
async function waitForFinishedRun(revisionId: string): Promise<void> {
  const deadline = Date.now() + 90_000
  while (Date.now() < deadline) {
    const runs = await db.selectFrom('check_runs').select('status').where('revision_id', '=', revisionId).execute()
    if (runs.length && runs.every(r => r.status === 'finished')) return
    if (runs.some(r => r.status === 'failed')) throw new Error('a check run failed')
    await new Promise(resolve => setTimeout(resolve, 250))
  }
  throw new Error('no finished check run within 90 s')
}

/** Waits for a mail to `address` whose subject contains `subject`. */
function mailTo(address: string, subject: string) {
  return waitForMail(address, new RegExp(subject.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')), 10_000)
}

/** The token of the newest referee invitation link mailed to `address`. */
async function invitationToken(address: string): Promise<string> {
  const mail = await mailTo(address, 'Invitation to referee')
  const match = /\/referee-invitations\/([\w-]+)/.exec(mail.text)
  if (!match) throw new Error('the invitation mail has no link')
  return match[1]!
}

async function newVenue(editorId: string, name: string): Promise<string> {
  const { id } = await db.insertInto('venues').values({ slug: `venue-${randomUUID()}`, name }).returning('id').executeTakeFirstOrThrow()
  await db.insertInto('venue_editors').values({ venue_id: id, user_id: editorId }).execute()
  return id
}

/** A manuscript with one checked revision; every response the author received is kept in `seen`. */
async function checkedManuscript(author: Member, title: string, tex: string, seen: ApiResponse[]) {
  const created = await author.client.post('/api/manuscripts', { title })
  seen.push(created)
  const upload = await author.client.post(`/api/manuscripts/${created.body.id}/revisions`, filesForm([{ name: 'paper.tex', content: tex }]))
  seen.push(upload)
  expect(upload.status).toBe(201)
  await waitForFinishedRun(upload.body.id)
  return { manuscriptId: created.body.id as string, revisionId: upload.body.id as string }
}

async function submit(author: Member, manuscriptId: string, revisionId: string, venueId: string, seen: ApiResponse[]): Promise<string> {
  const res = await author.client.post(`/api/manuscripts/${manuscriptId}/submissions`, { revisionId, venueId })
  seen.push(res)
  expect(res.status).toBe(201)
  return res.body.id
}

async function invite(editor: Client, submissionId: string, email: string) {
  return editor.post(`/api/submissions/${submissionId}/referees`, { email })
}

// One scenario shared by the tests below: a venue with three submissions, one of them refereed.
const seen: ApiResponse[] = []
let author: Member, coauthor: Member, editor: Member, otherEditor: Member, referee: Member, otherReferee: Member
let venueId: string, otherVenueId: string
let paper: { manuscriptId: string, revisionId: string }
let submissionId: string, otherSubmissionId: string, otherRevisionId: string, assignmentId: string, otherAssignmentId: string
let acceptToken: string

beforeAll(async () => {
  const members = await Promise.all(['author', 'coauthor', 'editor', 'other-editor', 'referee', 'other-referee'].map(label => newMember(label)))
  ;[author, coauthor, editor, otherEditor, referee, otherReferee] = members as [Member, Member, Member, Member, Member, Member]
  venueId = await newVenue(editor.id, 'Tidewater Letters in Flag Combinatorics')
  otherVenueId = await newVenue(otherEditor.id, 'Quillmoor Studies in Tableaux')
  paper = await checkedManuscript(author, `Alpha: transpositions ${randomUUID().slice(0, 6)}`, PAPER, seen)
  await db.insertInto('manuscript_members').values({ manuscript_id: paper.manuscriptId, user_id: coauthor.id, role: 'coauthor' }).execute()
  const beta = await checkedManuscript(author, 'Beta: one simple reflection', SMALL_TEX, seen)
  const gamma = await checkedManuscript(author, 'Gamma: a slip in a simple reflection', WRONG_ONLY, seen)
  submissionId = await submit(author, paper.manuscriptId, paper.revisionId, venueId, seen)
  await submit(author, beta.manuscriptId, beta.revisionId, venueId, seen)
  await submit(author, gamma.manuscriptId, gamma.revisionId, venueId, seen)
  // Another venue's submission with its own referee.
  const other = await checkedManuscript(otherEditor, 'Delta: elsewhere', SMALL_TEX, [])
  otherRevisionId = other.revisionId
  otherSubmissionId = await submit(otherEditor, other.manuscriptId, other.revisionId, otherVenueId, [])
  expect((await invite(otherEditor.client, otherSubmissionId, otherReferee.email)).status).toBe(201)
  otherAssignmentId = (await otherReferee.client.post(`/api/referee-invitations/${await invitationToken(otherReferee.email)}/accept`)).body.assignmentId

  expect((await invite(editor.client, submissionId, referee.email)).status).toBe(201)
  acceptToken = await invitationToken(referee.email)
  const accepted = await referee.client.post(`/api/referee-invitations/${acceptToken}/accept`)
  expect(accepted.status).toBe(201)
  assignmentId = accepted.body.assignmentId
}, 240_000)

describe('referee invitations', () => {
  it('mail the referee a link; accepting it makes the assignment and puts the submission in review', async () => {
    const row = await db.selectFrom('referee_assignments').selectAll().where('id', '=', assignmentId).executeTakeFirstOrThrow()
    expect(row).toMatchObject({ submission_id: submissionId, referee_id: referee.id, invited_by: editor.id })
    const submission = await db.selectFrom('submissions').select('status').where('id', '=', submissionId).executeTakeFirstOrThrow()
    expect(submission.status).toBe('in-review')
    // Only the hash of the token is stored.
    const invitation = await db.selectFrom('invitations').selectAll().where('submission_id', '=', submissionId).executeTakeFirstOrThrow()
    expect(invitation.token_hash).toBe(createHash('sha256').update(acceptToken).digest('hex'))
    expect(invitation.token_hash).not.toContain(acceptToken)
    expect(invitation.used_at).not.toBeNull()
  })

  it('work once: a second use, by anyone, is refused with 410', async () => {
    const again = await referee.client.post(`/api/referee-invitations/${acceptToken}/accept`)
    expect(again.status).toBe(410)
    expect(again.body.data.code).toBe('invitation-used')
    const stranger = await newMember('stranger')
    expect((await stranger.client.post(`/api/referee-invitations/${acceptToken}/accept`)).status).toBe(410)
    expect(await db.selectFrom('referee_assignments').select('id').where('submission_id', '=', submissionId).execute()).toHaveLength(1)
  })

  it('expire: an expired link is refused with 410 and assigns no one', async () => {
    const late = await newMember('late-referee')
    expect((await invite(editor.client, submissionId, late.email)).status).toBe(201)
    const token = await invitationToken(late.email)
    await db.updateTable('invitations').set({ expires_at: new Date(Date.now() - 1000) })
      .where('token_hash', '=', createHash('sha256').update(token).digest('hex')).execute()
    const res = await late.client.post(`/api/referee-invitations/${token}/accept`)
    expect(res.status).toBe(410)
    expect(res.body.data.code).toBe('invitation-expired')
    expect(await db.selectFrom('referee_assignments').select('id').where('referee_id', '=', late.id).execute()).toEqual([])
  })

  it('are for the invited address only (403), and an unknown token is 404', async () => {
    const invited = `someone-${randomUUID().slice(0, 8)}@tests.scholium.example`
    expect((await invite(editor.client, submissionId, invited)).status).toBe(201)
    const token = await invitationToken(invited)
    const intruder = await newMember('intruder')
    const res = await intruder.client.post(`/api/referee-invitations/${token}/accept`)
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('invitation-other-address')
    expect((await intruder.client.post(`/api/referee-invitations/${'x'.repeat(43)}/accept`)).status).toBe(404)
  })

  it('an author of the manuscript cannot become its referee (409)', async () => {
    expect((await invite(editor.client, submissionId, coauthor.email)).status).toBe(201)
    const res = await coauthor.client.post(`/api/referee-invitations/${await invitationToken(coauthor.email)}/accept`)
    expect(res.status).toBe(409)
  })

  it('only the submission\'s editor may invite: everyone else gets 404 and no mail is sent', async () => {
    const target = `nobody-${randomUUID().slice(0, 8)}@tests.scholium.example`
    for (const client of [author.client, referee.client, otherEditor.client, (await newMember('outsider')).client]) {
      const res = await invite(client, submissionId, target)
      expect(res.status).toBe(404)
      expect(res.body.data.code).toBe('not-found')
    }
    expect((await invite(editor.client, 'not-a-uuid', target)).status).toBe(404)
    expect((await invite(editor.client, submissionId, 'not an address')).status).toBe(400)
    await new Promise(resolve => setTimeout(resolve, 300))
    expect(await mailsTo(target)).toEqual([])
  })
})

describe('permission boundaries', () => {
  it('a referee sees only assigned submissions (404 for others)', async () => {
    const list = await referee.client.get('/api/reviews')
    expect(list.body.map((r: { assignmentId: string }) => r.assignmentId)).toEqual([assignmentId])
    for (const path of [`/api/reviews/${otherAssignmentId}`, `/api/reviews/${otherAssignmentId}/notes`, `/api/revisions/${otherRevisionId}/report`, `/api/revisions/${otherRevisionId}/sources`]) {
      expect((await referee.client.get(path)).status, path).toBe(404)
    }
    expect((await referee.client.request('PUT', `/api/reviews/${otherAssignmentId}/note`, { overallNote: 'x' })).status).toBe(404)
    // A referee is not an editor: no venue table, no audit, no release, no invitations.
    for (const path of [`/api/venues/${venueId}/submissions`, `/api/submissions/${submissionId}/audit.json`, `/api/submissions/${submissionId}/audit.csv`]) {
      expect((await referee.client.get(path)).status, path).toBe(404)
    }
    expect((await referee.client.post(`/api/submissions/${submissionId}/referees/${assignmentId}/release`)).status).toBe(404)
  })

  it('an editor of one venue sees nothing of another (404)', async () => {
    const c = otherEditor.client
    for (const path of [`/api/venues/${venueId}/submissions`, `/api/submissions/${submissionId}/audit.json`, `/api/submissions/${submissionId}/audit.csv`, `/api/revisions/${paper.revisionId}/report`]) {
      const res = await c.get(path)
      expect(res.status, path).toBe(404)
      expect(res.text).not.toContain(paper.manuscriptId)
    }
    expect((await c.post(`/api/submissions/${submissionId}/referees/${assignmentId}/release`)).status).toBe(404)
    // The other way round as well, and an assignment of another submission cannot be released through this one.
    expect((await editor.client.get(`/api/submissions/${otherSubmissionId}/audit.json`)).status).toBe(404)
    expect((await editor.client.post(`/api/submissions/${submissionId}/referees/${otherAssignmentId}/release`)).status).toBe(404)
    const other = await db.selectFrom('referee_assignments').select('released_at').where('id', '=', otherAssignmentId).executeTakeFirstOrThrow()
    expect(other.released_at).toBeNull()
  })

  it('the referee may re-check the submitted revision under another convention', async () => {
    const res = await referee.client.post(`/api/revisions/${paper.revisionId}/checks`, { conventions: { doubleSign: 'xy-minus' } })
    expect(res.status).toBe(202)
    await waitForFinishedRun(paper.revisionId)
    const audit = await db.selectFrom('audit_log').selectAll().where('subject_id', '=', paper.revisionId).where('action', '=', 'check.requested').execute()
    expect(audit.map(a => a.actor_id)).toContain(referee.id)
  })
})

describe('referee notes', () => {
  let claimId: string
  it('the referee writes an overall note and a note on a claim of the submitted revision', async () => {
    const notes = await referee.client.get(`/api/reviews/${assignmentId}/notes`)
    expect(notes.status).toBe(200)
    const wrong = notes.body.claims.find((c: { line: number }) => c.line === 4)
    expect(wrong).toMatchObject({ file: 'paper.tex', verdict: 'mismatch' })
    claimId = wrong.id
    expect((await referee.client.request('PUT', `/api/reviews/${assignmentId}/note`, { overallNote: 'Clear and short. One reflection is off.' })).status).toBe(200)
    const added = await referee.client.post(`/api/reviews/${assignmentId}/claim-notes`, { claimId, body: 'S_132 is x_1 + x_2.' })
    expect(added.status).toBe(201)
    const after = await referee.client.get(`/api/reviews/${assignmentId}/notes`)
    expect(after.body.overallNote).toBe('Clear and short. One reflection is off.')
    expect(after.body.claimNotes).toEqual([expect.objectContaining({ body: 'S_132 is x_1 + x_2.', file: 'paper.tex', line: 4 })])
    const row = await db.selectFrom('claim_comments').selectAll().where('id', '=', added.body.id).executeTakeFirstOrThrow()
    expect(row).toMatchObject({ referee_assignment_id: assignmentId, author_id: referee.id, manuscript_id: paper.manuscriptId })
  })

  it('a note on a claim of another revision, or an empty note, is refused', async () => {
    const foreign = await db.selectFrom('claims as c').innerJoin('check_runs as r', 'r.id', 'c.check_run_id')
      .select('c.id').where('r.revision_id', '=', otherRevisionId).executeTakeFirstOrThrow()
    expect((await referee.client.post(`/api/reviews/${assignmentId}/claim-notes`, { claimId: foreign.id, body: 'x' })).status).toBe(404)
    const empty = await referee.client.post(`/api/reviews/${assignmentId}/claim-notes`, { claimId, body: '   ' })
    expect(empty.status).toBe(400)
    expect(Object.keys(empty.body.data.fields)).toEqual(['body'])
  })

  it('authors see nothing before the release', async () => {
    const res = await author.client.get(`/api/manuscripts/${paper.manuscriptId}/referee-notes`)
    seen.push(res)
    expect(res.status).toBe(200)
    expect(res.body).toEqual([])
  })

  it('only the editor releases; the authors then see "Referee 1" with the claim\'s place, and are told by mail', async () => {
    expect((await author.client.post(`/api/submissions/${submissionId}/referees/${assignmentId}/release`)).status).toBe(404)
    const released = await editor.client.post(`/api/submissions/${submissionId}/referees/${assignmentId}/release`)
    expect(released.status).toBe(200)
    expect(released.body.referee).toBe('Referee 1')
    for (const member of [author, coauthor]) {
      const res = await member.client.get(`/api/manuscripts/${paper.manuscriptId}/referee-notes`)
      seen.push(res)
      expect(res.body).toEqual([expect.objectContaining({
        referee: 'Referee 1',
        overallNote: 'Clear and short. One reflection is off.',
        claimNotes: [expect.objectContaining({ body: 'S_132 is x_1 + x_2.', file: 'paper.tex', line: 4, source: '\\mathfrak{S}_{132} = x_1' })],
      })])
      const mail = await mailTo(member.email, 'Referee notes released')
      expect(mail.text).toContain('Referee 1')
      for (const identity of [referee.displayName, referee.email, referee.email.split('@')[0]!]) {
        expect(mail.text).not.toContain(identity)
        expect(mail.subject).not.toContain(identity)
      }
    }
    // Releasing again sends no second mail.
    expect((await editor.client.post(`/api/submissions/${submissionId}/referees/${assignmentId}/release`)).status).toBe(200)
    await new Promise(resolve => setTimeout(resolve, 300))
    expect((await mailsTo(author.email)).filter(m => m.subject.includes('Referee notes released'))).toHaveLength(1)
  })

  it('released notes can no longer be changed (409)', async () => {
    expect((await referee.client.request('PUT', `/api/reviews/${assignmentId}/note`, { overallNote: 'changed' })).status).toBe(409)
    expect((await referee.client.post(`/api/reviews/${assignmentId}/claim-notes`, { claimId, body: 'later' })).status).toBe(409)
  })
})

/** Every GET route under server/api, as a URL pattern like /api/manuscripts/[id]/referee-notes. */
function getRoutes(): string[] {
  const root = join(process.cwd(), 'server/api')
  const walk = (dir: string): string[] => readdirSync(dir, { withFileTypes: true }).flatMap(e => e.isDirectory() ? walk(join(dir, e.name)) : [join(dir, e.name)])
  return walk(root).filter(f => f.endsWith('.get.ts'))
    .map(f => `/api/${relative(root, f).replace(/\.get\.ts$/, '').replace(/(^|\/)index$/, '')}`.replace(/\/$/, ''))
}

describe('anonymity', () => {
  it('no JSON response an author or coauthor can get names the referee', async () => {
    const ids: Record<string, string> = { 'manuscripts': paper.manuscriptId, 'revisions': paper.revisionId, 'reviews': assignmentId, 'venues': venueId, 'submissions': submissionId, 'referee-invitations': acceptToken }
    const anyId = [paper.manuscriptId, paper.revisionId, submissionId, assignmentId, venueId]
    const urls = new Set<string>()
    for (const route of getRoutes()) {
      // A parameter takes the id of the resource it follows; an unknown one gets every id in turn.
      let expanded = [route]
      for (const param of route.match(/\[[^\]]+\]/g) ?? []) {
        expanded = expanded.flatMap((url) => {
          const resource = url.slice(0, url.indexOf(param)).split('/').filter(Boolean).pop() ?? ''
          const known = param === '[assignmentId]' ? assignmentId : ids[resource]
          return (known ? [known] : anyId).map(value => url.replace(param, value))
        })
      }
      for (const url of expanded) urls.add(url)
    }
    expect(urls.size).toBeGreaterThan(10)
    for (const client of [author.client, coauthor.client]) {
      const responses = [...seen, ...await Promise.all([...urls].map(url => client.get(url)))]
      for (const res of responses) {
        for (const identity of [referee.displayName, referee.email, referee.id]) expect(res.text).not.toContain(identity)
      }
      // The scan reached the pages that matter: they answered, and the notes were among them.
      const texts = responses.filter(r => r.status === 200).map(r => r.text).join('\n')
      expect(texts).toContain('Clear and short. One reflection is off.')
      expect(texts).toContain(paper.revisionId)
    }
  })
})

describe('the editor\'s table', () => {
  const titles = (res: ApiResponse<any>) => res.body.submissions.map((s: { manuscriptTitle: string }) => s.manuscriptTitle.split(':')[0])

  it('sorts by verdict counts, title and date, and carries the newest check\'s counts', async () => {
    // Beta (S_132 = x_1 + x_2) has no mismatch, Gamma one; Alpha two since the referee's re-check
    // fixed x_i - y_j, under which its plus-sign claim fails too.
    const byMismatch = await editor.client.get(`/api/venues/${venueId}/submissions?sort=mismatch&order=desc`)
    expect(byMismatch.status).toBe(200)
    expect(titles(byMismatch)).toEqual(['Alpha', 'Gamma', 'Beta'])
    const alpha = byMismatch.body.submissions[0]
    expect(alpha.checkCounts).toEqual({ claims: 4, verified: 1, mismatch: 2, unsupported: 1, error: 0 })
    expect(byMismatch.body.submissions[2].checkCounts).toEqual({ claims: 1, verified: 1, mismatch: 0, unsupported: 0, error: 0 })
    expect(alpha.referees.map((r: { email: string }) => r.email)).toEqual([referee.email])
    expect(titles(await editor.client.get(`/api/venues/${venueId}/submissions?sort=title&order=asc`))).toEqual(['Alpha', 'Beta', 'Gamma'])
    expect(titles(await editor.client.get(`/api/venues/${venueId}/submissions?sort=title&order=desc`))).toEqual(['Gamma', 'Beta', 'Alpha'])
    expect(titles(await editor.client.get(`/api/venues/${venueId}/submissions?sort=date&order=asc`))).toEqual(['Alpha', 'Beta', 'Gamma'])
    expect(titles(await editor.client.get(`/api/venues/${venueId}/submissions?sort=mismatch&order=asc`))).toEqual(['Beta', 'Gamma', 'Alpha'])
    expect(titles(await editor.client.get(`/api/venues/${venueId}/submissions?sort=verified&order=asc`))[0]).toBe('Gamma')
  })

  it('filters by status and text and pages on the server', async () => {
    const inReview = await editor.client.get(`/api/venues/${venueId}/submissions?status=in-review`)
    expect(titles(inReview)).toEqual(['Alpha'])
    expect(inReview.body.total).toBe(1)
    expect(titles(await editor.client.get(`/api/venues/${venueId}/submissions?q=gAmMa`))).toEqual(['Gamma'])
    expect((await editor.client.get(`/api/venues/${venueId}/submissions?q=${encodeURIComponent('%')}`)).body.total).toBe(0)
    const first = await editor.client.get(`/api/venues/${venueId}/submissions?sort=title&order=asc&pageSize=2&page=1`)
    const second = await editor.client.get(`/api/venues/${venueId}/submissions?sort=title&order=asc&pageSize=2&page=2`)
    expect([first.body.total, titles(first), titles(second)]).toEqual([3, ['Alpha', 'Beta'], ['Gamma']])
  })

  it('refuses bad query parameters with field reasons', async () => {
    for (const [query, field] of [['pageSize=101', 'pageSize'], ['page=0', 'page'], ['sort=referee', 'sort'], ['order=up', 'order'], ['status=lost', 'status']]) {
      const res = await editor.client.get(`/api/venues/${venueId}/submissions?${query}`)
      expect(res.status, query).toBe(400)
      expect(Object.keys(res.body.data.fields)).toEqual([field])
    }
  })
})

describe('the audit summary', () => {
  it('JSON: counts, inferred conventions, engine version, source hashes, who ran what', async () => {
    const res = await editor.client.get(`/api/submissions/${submissionId}/audit.json`)
    expect(res.status).toBe(200)
    const audit = res.body
    // The first run inferred the paper's x_i + y_j; the referee's re-check fixed x_i - y_j.
    const [first, recheck] = audit.runs
    expect(first.counts).toEqual({ claims: 4, verified: 2, mismatch: 1, unsupported: 1, error: 0 })
    expect(first.inferred).toEqual({ doubleSign: 'xy-plus' })
    expect(recheck.conventions).toMatchObject({ doubleSign: 'xy-minus' })
    expect(recheck.requestedBy).toBe(referee.displayName)
    expect(audit.counts).toEqual(recheck.counts)
    expect(audit.counts).toEqual({ claims: 4, verified: 1, mismatch: 2, unsupported: 1, error: 0 })
    const runRow = await db.selectFrom('check_runs').select('engine_version').where('id', '=', recheck.id).executeTakeFirstOrThrow()
    expect(audit.engineVersion).toBe(runRow.engine_version)
    expect(audit.engineVersion).toMatch(/^\d+\.\d+\.\d+/)
    expect(audit.conventions.used.doubleSign).toBe('xy-minus')
    // A run with a fixed sign infers nothing on that axis.
    expect(audit.conventions.inferred).toEqual({})
    expect(audit.files).toEqual([{ path: 'paper.tex', sha256: createHash('sha256').update(PAPER).digest('hex'), sizeBytes: Buffer.byteLength(PAPER) }])
    const actions = audit.events.map((e: { action: string, whoRole: string }) => `${e.action}:${e.whoRole}`)
    for (const expected of ['revision.uploaded:author', 'submission.created:author', 'referee.invited:editor', 'referee.accepted:referee', 'check.requested:referee', 'review.note-saved:referee', 'review.claim-note-added:referee', 'review.released:editor']) {
      expect(actions).toContain(expected)
    }
  })

  it('CSV: the same counts and hashes, one record per line', async () => {
    const res = await editor.client.get(`/api/submissions/${submissionId}/audit.csv`)
    expect(res.status).toBe(200)
    const lines = res.text.trimEnd().split('\r\n')
    expect(lines[0]).toBe('record,name,value,at,who,details')
    for (const [key, value] of Object.entries({ claims: 4, verified: 1, mismatch: 2, unsupported: 1, error: 0 })) expect(lines).toContain(`count,${key},${value},,,`)
    expect(lines).toContain(`file,paper.tex,${createHash('sha256').update(PAPER).digest('hex')},,,${Buffer.byteLength(PAPER)} bytes`)
    expect(lines.some(l => l.startsWith('run-convention-inferred,doubleSign,xy-plus,'))).toBe(true)
    expect(lines).toContain('convention-used,doubleSign,xy-minus,,,')
    expect(lines.filter(l => l.startsWith('run,'))).toHaveLength(2)
    expect(lines.some(l => l.startsWith('event,referee.accepted,referee,') && l.includes(referee.displayName))).toBe(true)
  })

  it('the audit log cannot be changed: no route does it and the database refuses', async () => {
    expect(getRoutes().every(r => !r.includes('audit') || r.endsWith('.json') || r.endsWith('.csv'))).toBe(true)
    await expect(db.updateTable('audit_log').set({ action: 'forged' }).where('subject_id', '=', submissionId).execute()).rejects.toThrow(/append-only/)
    await expect(db.deleteFrom('audit_log').where('subject_id', '=', submissionId).execute()).rejects.toThrow(/append-only/)
  })
})

describe('the demo', () => {
  it('the tilings manuscript has released notes, the claim note on line 28, and no referee in sight', async () => {
    const tilings = await db.selectFrom('manuscripts').select('id').where('title', '=', 'A note on bumpless tilings of small permutations').executeTakeFirstOrThrow()
    const revision = await db.selectFrom('revisions').select('id').where('manuscript_id', '=', tilings.id).executeTakeFirstOrThrow()
    await waitForFinishedRun(revision.id)
    const res = await (await demoClient('soloAuthor')).get(`/api/manuscripts/${tilings.id}/referee-notes`)
    expect(res.status).toBe(200)
    // Line 28 of server/assets/demo/bumpless-tilings/rev1/tilings.tex writes S_213(x;y) = x_1 - y_1.
    expect(res.body).toEqual([expect.objectContaining({
      referee: 'Referee 1',
      venueName: 'Ledgerfield Journal of Algebraic Combinatorics',
      claimNotes: [expect.objectContaining({ file: 'tilings.tex', line: 28, source: '\\dS{213} = x_1 - y_1' })],
    })])
    expect(res.body[0].overallNote.length).toBeGreaterThan(20)
    for (const identity of [DEMO_PEOPLE.referee.displayName, DEMO_PEOPLE.referee.email]) expect(res.text).not.toContain(identity)
  })
})

describe('issue 11: a referee stays outside the manuscript, and a submitted manuscript stays', () => {
  it('a referee cannot accept a coauthor invitation to the manuscript they referee while the review is open (409)', async () => {
    expect((await author.client.post(`/api/manuscripts/${paper.manuscriptId}/invitations`, { email: referee.email })).status).toBe(201)
    const mail = await waitForMail(referee.email, /coauthor/i)
    const token = /\/invitations\/([A-Za-z0-9_-]+)/.exec(mail.text)![1]
    const res = await referee.client.post(`/api/invitations/${token}/accept`)
    expect(res.status).toBe(409)
    expect(res.body.data.code).toBe('referee-of-manuscript')
    const member = await db.selectFrom('manuscript_members').select('user_id').where('manuscript_id', '=', paper.manuscriptId).where('user_id', '=', referee.id).execute()
    expect(member).toEqual([])
  })

  it('deleting a submitted manuscript is 409 and leaves the venue its submission', async () => {
    const res = await author.client.delete(`/api/manuscripts/${paper.manuscriptId}`)
    expect(res.status).toBe(409)
    expect(res.body.data.code).toBe('manuscript-submitted')
    expect(await db.selectFrom('submissions').select('id').where('id', '=', submissionId).executeTakeFirst()).toEqual({ id: submissionId })
  })
})
