// Coauthor invitations by e-mail and the boundaries of manuscript membership:
// the owner invites and removes; coauthors read, upload and re-check; strangers see nothing.
import { createHash } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { baseUrl, Client, db, filesForm, newMember, SMALL_TEX, waitForMail } from './helpers'

const linkPattern = new RegExp(`${baseUrl.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}/invitations/([A-Za-z0-9_-]+)`)

/** The owner invites `email`; returns the token from the link in the mail. */
async function invite(owner: Client, manuscriptId: string, email: string): Promise<string> {
  const res = await owner.post(`/api/manuscripts/${manuscriptId}/invitations`, { email })
  expect(res.status).toBe(201)
  const mail = await waitForMail(email, /Invitation to coauthor/)
  const token = linkPattern.exec(mail.text)?.[1]
  if (!token) throw new Error(`no invitation link in the mail: ${mail.text}`)
  return token
}

async function manuscriptWithCoauthor(title: string) {
  const owner = await newMember('owner')
  const coauthor = await newMember('coauthor')
  const { body: m } = await owner.client.post('/api/manuscripts', { title })
  const token = await invite(owner.client, m.id, coauthor.email)
  expect((await coauthor.client.post(`/api/invitations/${token}/accept`)).status).toBe(200)
  return { owner, coauthor, manuscriptId: m.id as string }
}

describe('inviting a coauthor', () => {
  it('mails a link whose token is stored only as a hash; accepting it makes the invitee a coauthor, with audit entries', async () => {
    const owner = await newMember('owner')
    const { body: m } = await owner.client.post('/api/manuscripts', { title: 'Descent cycles in flagged tableaux' })
    const invitee = await newMember('invitee')
    const token = await invite(owner.client, m.id, invitee.email.toUpperCase())

    const mail = await waitForMail(invitee.email, /Invitation to coauthor/)
    expect(mail.text).toContain('Descent cycles in flagged tableaux')
    expect(mail.text).toContain(owner.displayName)
    const row = await db.selectFrom('invitations').selectAll().where('manuscript_id', '=', m.id).executeTakeFirstOrThrow()
    expect(row.kind).toBe('coauthor')
    expect(row.token_hash).not.toContain(token)
    expect(row.token_hash).toBe(createHash('sha256').update(token).digest('hex'))
    // About seven days, give or take the test's own duration.
    expect(Math.abs(row.expires_at.getTime() - Date.now() - 7 * 24 * 3600_000)).toBeLessThan(60_000)

    // The page shows what the link is for before anyone signs in.
    const preview = await new Client().get(`/api/invitations/${token}`)
    expect(preview.status).toBe(200)
    expect(preview.body).toMatchObject({ kind: 'coauthor', manuscriptTitle: 'Descent cycles in flagged tableaux', invitedBy: owner.displayName })
    expect(preview.text).not.toContain(row.token_hash)

    // Accepting needs an account.
    expect((await new Client().post(`/api/invitations/${token}/accept`)).status).toBe(401)
    const accepted = await invitee.client.post(`/api/invitations/${token}/accept`)
    expect(accepted.status).toBe(200)
    expect(accepted.body.manuscriptId).toBe(m.id)
    const seen = await invitee.client.get(`/api/manuscripts/${m.id}`)
    expect(seen.status).toBe(200)
    expect(seen.body.myRole).toBe('coauthor')
    expect(seen.body.isOwner).toBe(false)

    const audit = await db.selectFrom('audit_log').select(['action', 'actor_id']).where('subject_id', '=', m.id).execute()
    expect(audit).toEqual(expect.arrayContaining([
      { action: 'invitation.sent', actor_id: owner.id },
      { action: 'invitation.accepted', actor_id: invitee.id },
    ]))
  })

  it('works once: the same link a second time is 410 invitation-used', async () => {
    const owner = await newMember('owner')
    const { body: m } = await owner.client.post('/api/manuscripts', { title: 'Once only' })
    const invitee = await newMember('invitee')
    const token = await invite(owner.client, m.id, invitee.email)
    expect((await invitee.client.post(`/api/invitations/${token}/accept`)).status).toBe(200)
    const again = await invitee.client.post(`/api/invitations/${token}/accept`)
    expect(again.status).toBe(410)
    expect(again.body.data.code).toBe('invitation-used')
    expect((await new Client().get(`/api/invitations/${token}`)).body.data.code).toBe('invitation-used')
  })

  it('refuses an expired link with 410 invitation-expired and adds no member', async () => {
    const owner = await newMember('owner')
    const { body: m } = await owner.client.post('/api/manuscripts', { title: 'Too late' })
    const invitee = await newMember('invitee')
    const token = await invite(owner.client, m.id, invitee.email)
    await db.updateTable('invitations').set({ expires_at: new Date(Date.now() - 60_000) }).where('manuscript_id', '=', m.id).execute()
    const res = await invitee.client.post(`/api/invitations/${token}/accept`)
    expect(res.status).toBe(410)
    expect(res.body.data.code).toBe('invitation-expired')
    expect((await new Client().get(`/api/invitations/${token}`)).status).toBe(410)
    expect((await invitee.client.get(`/api/manuscripts/${m.id}`)).status).toBe(404)
  })

  it('answers 404 for an unknown link', async () => {
    const me = await newMember()
    const unknown = 'x'.repeat(43)
    expect((await new Client().get(`/api/invitations/${unknown}`)).status).toBe(404)
    const res = await me.client.post(`/api/invitations/${unknown}/accept`)
    expect(res.status).toBe(404)
    expect(res.body.data.code).toBe('not-found')
  })

  it('may only be accepted by the invited address: another account gets 403 and the link stays usable', async () => {
    const owner = await newMember('owner')
    const { body: m } = await owner.client.post('/api/manuscripts', { title: 'Forwarded link' })
    const invitee = await newMember('invitee')
    const other = await newMember('forwarded-to')
    const token = await invite(owner.client, m.id, invitee.email)
    const refused = await other.client.post(`/api/invitations/${token}/accept`)
    expect(refused.status).toBe(403)
    expect(refused.body.data.code).toBe('invitation-other-address')
    expect((await other.client.get(`/api/manuscripts/${m.id}`)).status).toBe(404)
    expect((await invitee.client.post(`/api/invitations/${token}/accept`)).status).toBe(200)
  })

  it('only the owner invites: a coauthor gets 403, a stranger 404, and neither makes an invitation', async () => {
    const { coauthor, manuscriptId } = await manuscriptWithCoauthor('Owner invites')
    const stranger = await newMember('stranger')
    const before = await db.selectFrom('invitations').select('id').where('manuscript_id', '=', manuscriptId).execute()
    const byCoauthor = await coauthor.client.post(`/api/manuscripts/${manuscriptId}/invitations`, { email: 'friend-a@tests.scholium.example' })
    expect(byCoauthor.status).toBe(403)
    expect(byCoauthor.body.data.code).toBe('forbidden')
    const byStranger = await stranger.client.post(`/api/manuscripts/${manuscriptId}/invitations`, { email: 'friend-b@tests.scholium.example' })
    expect(byStranger.status).toBe(404)
    expect((await stranger.client.get(`/api/manuscripts/${manuscriptId}/invitations`)).status).toBe(404)
    const after = await db.selectFrom('invitations').select('id').where('manuscript_id', '=', manuscriptId).execute()
    expect(after).toHaveLength(before.length)
  })

  it('refuses to invite a current member (409) and an invalid address (400)', async () => {
    const { owner, coauthor, manuscriptId } = await manuscriptWithCoauthor('Already in')
    const twice = await owner.client.post(`/api/manuscripts/${manuscriptId}/invitations`, { email: coauthor.email })
    expect(twice.status).toBe(409)
    expect(twice.body.data.code).toBe('already-member')
    const bad = await owner.client.post(`/api/manuscripts/${manuscriptId}/invitations`, { email: 'not an address' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fields)).toEqual(['email'])
  })

  it('lists open invitations to the owner only', async () => {
    const owner = await newMember('owner')
    const { body: m } = await owner.client.post('/api/manuscripts', { title: 'Pending list' })
    const invitee = await newMember('invitee')
    await invite(owner.client, m.id, invitee.email)
    const list = await owner.client.get(`/api/manuscripts/${m.id}/invitations`)
    expect(list.status).toBe(200)
    expect(list.body.map((i: { email: string }) => i.email)).toEqual([invitee.email])
  })
})

describe('what a coauthor may do', () => {
  it('sees the manuscript, its revisions and reports, uploads a revision and asks for a re-check', async () => {
    const { owner, coauthor, manuscriptId } = await manuscriptWithCoauthor('Shared draft')
    const upload = await owner.client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'paper.tex', content: SMALL_TEX }]))
    expect(upload.status).toBe(201)
    const view = await coauthor.client.get(`/api/manuscripts/${manuscriptId}`)
    expect(view.body.revisions.map((r: { id: string }) => r.id)).toEqual([upload.body.id])
    const report = await coauthor.client.get(`/api/revisions/${upload.body.id}/report`)
    expect(report.status).toBe(200)
    expect(report.body.viewer).toBe('member')
    const mine = await coauthor.client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'paper.tex', content: SMALL_TEX }], 'coauthor edit'))
    expect(mine.status).toBe(201)
    expect(mine.body.number).toBe(2)
    const recheck = await coauthor.client.post(`/api/revisions/${upload.body.id}/checks`, {})
    expect(recheck.status).toBe(202)
    const run = await db.selectFrom('check_runs').select('requested_by').where('id', '=', recheck.body.checkRunId).executeTakeFirstOrThrow()
    expect(run.requested_by).toBe(coauthor.id)
  })

  it('may neither delete the manuscript nor remove members (403), and both stay', async () => {
    const { owner, coauthor, manuscriptId } = await manuscriptWithCoauthor('Not yours to delete')
    expect((await coauthor.client.delete(`/api/manuscripts/${manuscriptId}`)).status).toBe(403)
    const removeOwner = await coauthor.client.delete(`/api/manuscripts/${manuscriptId}/members/${owner.id}`)
    expect(removeOwner.status).toBe(403)
    expect(removeOwner.body.data.code).toBe('forbidden')
    const removeSelf = await coauthor.client.delete(`/api/manuscripts/${manuscriptId}/members/${coauthor.id}`)
    expect(removeSelf.status).toBe(403)
    const members = await db.selectFrom('manuscript_members').select('user_id').where('manuscript_id', '=', manuscriptId).execute()
    expect(members.map(r => r.user_id).sort()).toEqual([owner.id, coauthor.id].sort())
  })
})

describe('removing a member', () => {
  it('the owner removes a coauthor, who then gets 404 for the manuscript and its reports; audited', async () => {
    const { owner, coauthor, manuscriptId } = await manuscriptWithCoauthor('Parting ways')
    const upload = await owner.client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'paper.tex', content: SMALL_TEX }]))
    expect((await coauthor.client.get(`/api/revisions/${upload.body.id}/report`)).status).toBe(200)
    const res = await owner.client.delete(`/api/manuscripts/${manuscriptId}/members/${coauthor.id}`)
    expect(res.status).toBe(200)
    expect((await coauthor.client.get(`/api/manuscripts/${manuscriptId}`)).status).toBe(404)
    expect((await coauthor.client.get(`/api/revisions/${upload.body.id}/report`)).status).toBe(404)
    const view = await owner.client.get(`/api/manuscripts/${manuscriptId}`)
    expect(view.body.members.map((mm: { userId: string }) => mm.userId)).toEqual([owner.id])
    const audit = await db.selectFrom('audit_log').select(['action', 'actor_id', 'details']).where('subject_id', '=', manuscriptId).where('action', '=', 'member.removed').execute()
    expect(audit).toEqual([{ action: 'member.removed', actor_id: owner.id, details: { userId: coauthor.id, role: 'coauthor' } }])
  })

  it('the owner cannot be removed (409); a non-member or malformed id is 404; a stranger gets 404', async () => {
    const { owner, manuscriptId } = await manuscriptWithCoauthor('Who stays')
    const stranger = await newMember('stranger')
    const self = await owner.client.delete(`/api/manuscripts/${manuscriptId}/members/${owner.id}`)
    expect(self.status).toBe(409)
    expect(self.body.data.code).toBe('owner-not-removable')
    expect((await owner.client.delete(`/api/manuscripts/${manuscriptId}/members/${stranger.id}`)).status).toBe(404)
    expect((await owner.client.delete(`/api/manuscripts/${manuscriptId}/members/not-a-uuid`)).status).toBe(404)
    expect((await stranger.client.delete(`/api/manuscripts/${manuscriptId}/members/${owner.id}`)).status).toBe(404)
  })
})
