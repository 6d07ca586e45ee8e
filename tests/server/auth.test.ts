import { describe, expect, it } from 'vitest'
import { randomUUID } from 'node:crypto'
import { sql } from 'kysely'
import { Client, db, newMember } from './helpers'

describe('sign-up, sign-in and sign-out', () => {
  it('stores a library hash, never the password, and makes no second account for the same e-mail', async () => {
    const me = await newMember('hash')
    const row = await db.selectFrom('users').select('password_hash').where('id', '=', me.id).executeTakeFirstOrThrow()
    expect(row.password_hash).not.toContain('correct horse')
    expect(row.password_hash).toMatch(/^\$scrypt\$/)
    await new Client().post('/api/auth/sign-up', { email: me.email.toUpperCase(), displayName: 'Twin', password: 'another long password' })
    const rows = await db.selectFrom('users').select('id').where(eb => eb(eb.fn('lower', ['email']), '=', me.email.toLowerCase())).execute()
    expect(rows).toEqual([{ id: me.id }])
  })
  it('signs in with the right password, and signing out ends the session', async () => {
    const me = await newMember('cycle')
    const client = new Client()
    expect((await client.post('/api/auth/sign-in', { email: me.email, password: 'correct horse battery' })).status).toBe(200)
    expect((await client.get('/api/desk')).status).toBe(200)
    expect((await client.post('/api/auth/sign-out')).status).toBe(200)
    expect((await client.get('/api/desk')).status).toBe(401)
  })
  it('a wrong password is 401 without saying whether the account exists', async () => {
    const me = await newMember('wrong')
    const wrongPassword = await new Client().post('/api/auth/sign-in', { email: me.email, password: 'not the password' })
    const noAccount = await new Client().post('/api/auth/sign-in', { email: `nobody-${randomUUID()}@tests.scholium.example`, password: 'whatever it is' })
    expect(wrongPassword.status).toBe(401)
    expect(noAccount.status).toBe(401)
    expect(wrongPassword.body.message).toBe(noAccount.body.message)
  })
  it('rate-limits failed sign-ins per e-mail: the sixth try is refused even with the right password', async () => {
    const me = await newMember('limited')
    for (let i = 0; i < 5; i++) {
      expect((await new Client().post('/api/auth/sign-in', { email: me.email, password: `guess number ${i}` })).status).toBe(401)
    }
    const blocked = await new Client().post('/api/auth/sign-in', { email: me.email, password: 'correct horse battery' })
    expect(blocked.status).toBe(429)
    expect(blocked.body.data.code).toBe('rate-limited')
  })
  it('reports which fields are invalid on sign-up', async () => {
    const res = await new Client().post('/api/auth/sign-up', { email: 'not an address', displayName: '', password: 'short' })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fields).sort()).toEqual(['displayName', 'email', 'password'])
  })
})

describe('audit log', () => {
  it('refuses updates and deletes at the database level', async () => {
    await expect(sql`update audit_log set action = 'rewritten'`.execute(db)).rejects.toThrow(/append-only/)
    await expect(sql`delete from audit_log`.execute(db)).rejects.toThrow(/append-only/)
  })
})
