// Issue 11, deliverables 3 and 4: attempt limits that hold under parallel requests and
// back off per account+address pair, limited reset mails, a real password minimum, a
// sign-up that does not reveal accounts, and sessions that can be revoked.
import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { baseUrl, Client, db, mailsTo, newMember, waitForMail } from './helpers'

const PASSWORD = 'correct horse battery'
const pairKey = (email: string) => `${email.toLowerCase()} 127.0.0.1`
const pairRow = (email: string) => db.selectFrom('attempt_limits').selectAll().where('scope', '=', 'sign-in-pair').where('key', '=', pairKey(email)).executeTakeFirst()

describe('sign-in attempt limits', () => {
  it('60 parallel wrong sign-ins get at most 5 password checks; the rest are refused with 429', async () => {
    const me = await newMember('parallel')
    const answers = await Promise.all(Array.from({ length: 60 }, (_, i) => new Client().post('/api/auth/sign-in', { email: me.email, password: `parallel guess ${i}` })))
    const checked = answers.filter(a => a.status === 401).length
    expect(checked).toBeLessThanOrEqual(5)
    expect(answers.filter(a => a.status === 429).length).toBe(60 - checked)
    expect((await pairRow(me.email))?.attempts).toBeLessThanOrEqual(5)
  })

  it('backs off exponentially: after the 5th failure the pair waits 30 s, after the 6th 60 s', async () => {
    const me = await newMember('backoff')
    for (let i = 0; i < 5; i++) expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: `guess ${i}` })).status).toBe(401)
    const first = (await pairRow(me.email))!
    expect((first.blocked_until!.getTime() - first.last_attempt_at.getTime()) / 1000).toBeCloseTo(30, 0)
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: PASSWORD })).status).toBe(429)
    // Let the 30 s pass, as the clock would.
    await db.updateTable('attempt_limits').set({ blocked_until: new Date(Date.now() - 1000) }).where('scope', '=', 'sign-in-pair').where('key', '=', pairKey(me.email)).execute()
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: 'guess 6' })).status).toBe(401)
    const second = (await pairRow(me.email))!
    expect((second.blocked_until!.getTime() - second.last_attempt_at.getTime()) / 1000).toBeCloseTo(60, 0)
  })

  it('a stranger locked out of an account from their address does not lock the owner out from theirs', async () => {
    const me = await newMember('admin-like')
    await db.insertInto('attempt_limits').values({ scope: 'sign-in-pair', key: `${me.email.toLowerCase()} 203.0.113.9`, attempts: 40, last_attempt_at: new Date(), blocked_until: new Date(Date.now() + 3600_000) }).execute()
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: PASSWORD })).status).toBe(200)
  })

  it('a correct password clears its pair, so earlier typos do not pile up', async () => {
    const me = await newMember('typo')
    for (let i = 0; i < 3; i++) await new Client().post('/api/auth/sign-in', { email: me.email, password: `typo ${i}` })
    expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: PASSWORD })).status).toBe(200)
    expect(await pairRow(me.email)).toBeUndefined()
  })

  it('ten parallel reset requests for one address send at most 3 mails', async () => {
    const me = await newMember('reset-flood')
    const answers = await Promise.all(Array.from({ length: 10 }, () => new Client().post('/api/auth/password-reset', { email: me.email })))
    expect(answers.every(a => a.status === 202)).toBe(true)
    await waitForMail(me.email, /new Scholium password/)
    await new Promise(resolve => setTimeout(resolve, 1500))
    const mails = (await mailsTo(me.email)).filter(m => /new Scholium password/.test(m.subject))
    expect(mails.length).toBeGreaterThanOrEqual(1)
    expect(mails.length).toBeLessThanOrEqual(3)
  })
})

describe('passwords and sign-up', () => {
  it('refuses all-space, too-short and one-character passwords; accepts a 13-character passphrase', async () => {
    for (const password of [' '.repeat(20), 'elevenchars', 'x'.repeat(16)]) {
      const res = await new Client().post('/api/auth/sign-up', { email: `weak-${randomUUID().slice(0, 8)}@tests.scholium.example`, displayName: 'Weak', password })
      expect(res.status, JSON.stringify(password)).toBe(400)
      expect(Object.keys(res.body.data.fields)).toEqual(['password'])
    }
    const ok = await new Client().post('/api/auth/sign-up', { email: `ok-${randomUUID().slice(0, 8)}@tests.scholium.example`, displayName: 'Ok', password: 'scholium-demo' })
    expect(ok.status).toBe(202)
  })

  it('answers a sign-up for an existing address exactly like a new one, sets no session, and mails the owner', async () => {
    const me = await newMember('exists')
    const fresh = `fresh-${randomUUID().slice(0, 8)}@tests.scholium.example`
    const forNew = await new Client().post('/api/auth/sign-up', { email: fresh, displayName: 'Fresh', password: 'a long fresh password' })
    const taker = new Client()
    const forExisting = await taker.post('/api/auth/sign-up', { email: me.email, displayName: 'Twin', password: 'a long other password' })
    expect(forExisting.status).toBe(forNew.status)
    expect(forExisting.text).toBe(forNew.text)
    expect((await taker.get('/api/desk')).status).toBe(401)
    await waitForMail(me.email, /already exists/)
  })
})

describe('sessions can be revoked', () => {
  it('signing out makes a copy of the cookie stop working', async () => {
    const me = await newMember('copied')
    const copy = me.client.copy()
    expect((await copy.get('/api/desk')).status).toBe(200)
    expect((await me.client.post('/api/auth/sign-out')).status).toBe(200)
    expect((await copy.get('/api/desk')).status).toBe(401)
    expect((await copy.get('/api/_auth/session')).body.user).toBeUndefined()
  })

  it('a cookie already unsealed and remembered (server/utils/unsealed-sessions.ts) still stops working at once on sign-out; an altered copy is refused (issue 11)', async () => {
    const me = await newMember('remembered')
    const copy = me.client.copy()
    // Several reads, so the copy's cookie text has been unsealed once and is served from memory.
    for (let i = 0; i < 3; i++) expect((await copy.get('/api/desk')).status).toBe(200)
    const sealed = /nuxt-session=([^;]+)/.exec(copy.cookieHeader())![1]!
    const at = Math.floor(sealed.length / 2)
    const altered = sealed.slice(0, at) + (sealed[at] === 'A' ? 'B' : 'A') + sealed.slice(at + 1)
    const forged = await fetch(new URL('/api/desk', baseUrl), { headers: { cookie: `nuxt-session=${altered}` } })
    expect(forged.status).toBe(401)
    expect((await me.client.post('/api/auth/sign-out')).status).toBe(200)
    expect((await copy.get('/api/desk')).status).toBe(401)
    expect((await copy.get('/api/_auth/session')).body.user).toBeUndefined()
    // Removing the row by hand (another process) is seen at once as well: the check itself is not remembered.
    const other = await newMember('remembered-row')
    for (let i = 0; i < 3; i++) expect((await other.client.get('/api/desk')).status).toBe(200)
    await db.deleteFrom('user_sessions').where('user_id', '=', other.id).execute()
    expect((await other.client.get('/api/desk')).status).toBe(401)
  })

  it('ordinary sign-out ends this session only: the same account signed in elsewhere stays signed in (issue 11)', async () => {
    const me = await newMember('one-of-two')
    const laptop = new Client()
    expect((await laptop.post('/api/auth/sign-in', { email: me.email, password: PASSWORD })).status).toBe(200)
    const copy = me.client.copy()
    expect((await me.client.post('/api/auth/sign-out')).status).toBe(200)
    expect((await me.client.get('/api/desk')).status).toBe(401)
    expect((await copy.get('/api/desk')).status).toBe(401)
    expect((await laptop.get('/api/desk')).status).toBe(200)
    expect((await laptop.get('/api/_auth/session')).body.user.id).toBe(me.id)
    // One session row left: the laptop's.
    expect(await db.selectFrom('user_sessions').select('id').where('user_id', '=', me.id).execute()).toHaveLength(1)
  })

  it('a sealed session without a session row (signed before sessions had rows, or forged from an old cookie) is refused', async () => {
    const me = await newMember('rowless')
    await db.deleteFrom('user_sessions').where('user_id', '=', me.id).execute()
    expect((await me.client.get('/api/desk')).status).toBe(401)
  })

  it('sign out everywhere ends every other session, and is audited', async () => {
    const me = await newMember('everywhere')
    const laptop = new Client()
    expect((await laptop.post('/api/auth/sign-in', { email: me.email, password: PASSWORD })).status).toBe(200)
    expect((await me.client.post('/api/auth/sign-out-everywhere')).status).toBe(200)
    expect((await laptop.get('/api/desk')).status).toBe(401)
    expect((await me.client.get('/api/desk')).status).toBe(401)
    expect(await db.selectFrom('user_sessions').select('id').where('user_id', '=', me.id).execute()).toEqual([])
    const audit = await db.selectFrom('audit_log').select('action').where('subject_id', '=', me.id).where('action', '=', 'sessions.revoked').execute()
    expect(audit).toHaveLength(1)
  })

  it('a password reset ends the sessions signed in with the old password', async () => {
    const me = await newMember('reset-session')
    await new Client().post('/api/auth/password-reset', { email: me.email })
    const mail = await waitForMail(me.email, /new Scholium password/)
    const token = /\/password-reset\/([A-Za-z0-9_-]+)/.exec(mail.text)![1]
    const laptop = new Client()
    expect((await laptop.post('/api/auth/sign-in', { email: me.email, password: PASSWORD })).status).toBe(200)
    expect((await new Client().post(`/api/auth/password-reset/${token}`, { password: 'a brand new passphrase' })).status).toBe(200)
    expect((await me.client.get('/api/desk')).status).toBe(401)
    expect((await laptop.get('/api/desk')).status).toBe(401)
  })
})
