// Password reset by e-mail: the answer never tells whether an account exists; the mailed
// link sets a new password once, within the hour, and clears the failed sign-in counter.
import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { baseUrl, Client, db, newMember, mailsTo } from './helpers'

/** Waits until `count` reset mails to `to` have arrived; returns the tokens of their links, newest first. */
async function waitForResetLinks(to: string, count = 1, timeoutMs = 15_000): Promise<string[]> {
  const pattern = new RegExp(`${baseUrl.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}/password-reset/([A-Za-z0-9_-]+)`)
  const started = Date.now()
  for (;;) {
    const tokens = (await mailsTo(to)).filter(m => /new Scholium password/.test(m.subject)).map(m => pattern.exec(m.text)?.[1]).filter((t): t is string => !!t)
    if (tokens.length >= count) return tokens
    if (Date.now() - started > timeoutMs) throw new Error(`${tokens.length} reset mail(s) to ${to} after ${timeoutMs} ms, wanted ${count}`)
    await new Promise(resolve => setTimeout(resolve, 150))
  }
}

const OLD = 'correct horse battery'
const NEW = 'a brand new passphrase'

describe('password reset', () => {
  it('mails a link that sets a new password; the old one stops working; the link works once; audited', async () => {
    const me = await newMember('forgetful')
    const asked = await new Client().post('/api/auth/password-reset', { email: me.email })
    expect(asked.status).toBe(202)
    const [token] = await waitForResetLinks(me.email)
    const row = await db.selectFrom('invitations').selectAll().where('kind', '=', 'password-reset').where('email', '=', me.email).executeTakeFirstOrThrow()
    // About an hour.
    expect(Math.abs(row.expires_at.getTime() - Date.now() - 3600_000)).toBeLessThan(60_000)
    expect(row.token_hash).not.toContain(token!)

    const set = await new Client().post(`/api/auth/password-reset/${token}`, { password: NEW })
    expect(set.status).toBe(200)
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: OLD })).status).toBe(401)
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: NEW })).status).toBe(200)

    const again = await new Client().post(`/api/auth/password-reset/${token}`, { password: 'yet another passphrase' })
    expect(again.status).toBe(410)
    expect(again.body.data.code).toBe('invitation-used')
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: NEW })).status).toBe(200)

    const audit = await db.selectFrom('audit_log').select(['action', 'actor_id']).where('subject_type', '=', 'user').where('subject_id', '=', me.id).execute()
    expect(audit).toEqual(expect.arrayContaining([
      { action: 'password-reset.requested', actor_id: null },
      { action: 'password-reset.completed', actor_id: me.id },
    ]))
  })

  it('answers an unknown address exactly like a known one, and sends nothing', async () => {
    const known = await newMember('known')
    const unknown = `nobody-${randomUUID().slice(0, 8)}@tests.scholium.example`
    const forKnown = await new Client().post('/api/auth/password-reset', { email: known.email })
    const forUnknown = await new Client().post('/api/auth/password-reset', { email: unknown })
    expect(forUnknown.status).toBe(202)
    expect(forUnknown.text).toBe(forKnown.text)
    // The known address's mail arriving shows the mail went out; by then the other would have too.
    await waitForResetLinks(known.email)
    await new Promise(resolve => setTimeout(resolve, 1000))
    expect(await mailsTo(unknown)).toEqual([])
    expect(await db.selectFrom('invitations').select('id').where('email', '=', unknown).execute()).toEqual([])
  })

  it('clears the failed sign-in counter: a locked-out account signs in with the new password', async () => {
    const me = await newMember('locked')
    for (let i = 0; i < 5; i++) await new Client().post('/api/auth/sign-in', { email: me.email, password: `wrong guess ${i}` })
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: OLD })).status).toBe(429)
    await new Client().post('/api/auth/password-reset', { email: me.email })
    const [token] = await waitForResetLinks(me.email)
    expect((await new Client().post(`/api/auth/password-reset/${token}`, { password: NEW })).status).toBe(200)
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: NEW })).status).toBe(200)
  })

  it('refuses an expired link (410), a too-short password (400, link still usable) and an unknown link (404)', async () => {
    const me = await newMember('late')
    await new Client().post('/api/auth/password-reset', { email: me.email })
    const [token] = await waitForResetLinks(me.email)
    const short = await new Client().post(`/api/auth/password-reset/${token}`, { password: 'short' })
    expect(short.status).toBe(400)
    expect(Object.keys(short.body.data.fields)).toEqual(['password'])
    await db.updateTable('invitations').set({ expires_at: new Date(Date.now() - 1000) }).where('kind', '=', 'password-reset').where('email', '=', me.email).execute()
    const late = await new Client().post(`/api/auth/password-reset/${token}`, { password: NEW })
    expect(late.status).toBe(410)
    expect(late.body.data.code).toBe('invitation-expired')
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: OLD })).status).toBe(200)
    const unknown = await new Client().post(`/api/auth/password-reset/${'y'.repeat(43)}`, { password: NEW })
    expect(unknown.status).toBe(404)
  })

  it('a reset link is not a coauthor invitation, and using one reset link closes the others', async () => {
    const me = await newMember('twice')
    await new Client().post('/api/auth/password-reset', { email: me.email })
    await waitForResetLinks(me.email, 1)
    await new Client().post('/api/auth/password-reset', { email: me.email })
    const [newest, older] = await waitForResetLinks(me.email, 2)
    expect((await me.client.post(`/api/invitations/${newest}/accept`)).status).toBe(404)
    expect((await new Client().post(`/api/auth/password-reset/${newest}`, { password: NEW })).status).toBe(200)
    const stale = await new Client().post(`/api/auth/password-reset/${older}`, { password: 'the older link tries' })
    expect(stale.status).toBe(410)
    expect(stale.body.data.code).toBe('invitation-used')
  })
})
