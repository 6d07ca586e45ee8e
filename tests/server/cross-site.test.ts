// Issue 11, deliverable 5: state-changing requests from another site are refused
// (CSRF, login CSRF included), and every response carries the security headers.
import { describe, expect, it } from 'vitest'
import { baseUrl, Client, demoClient, newMember, waitForMail } from './helpers'

const EVIL = 'https://elsewhere.example'

async function raw(method: string, path: string, headers: Record<string, string>, body?: BodyInit) {
  const response = await fetch(new URL(path, baseUrl), { method, headers, body, redirect: 'manual' })
  const text = await response.text()
  return { status: response.status, headers: response.headers, body: (() => {
    try { return JSON.parse(text) }
    catch { return text }
  })() }
}

describe('cross-site requests', () => {
  it('refuses a form-encoded sign-in posted from a foreign Origin (login CSRF)', async () => {
    const res = await raw('POST', '/api/auth/sign-in', { 'origin': EVIL, 'content-type': 'application/x-www-form-urlencoded' }, 'email=a%40b.example&password=whatever')
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('cross-site-request')
  })

  it('refuses a DELETE with the victim\'s cookie from a cross-site page, and the manuscript stays', async () => {
    const me = await newMember('csrf-victim')
    const made = await me.client.post('/api/manuscripts', { title: 'Kept despite a forged request' })
    expect(made.status).toBe(201)
    const id = made.body.id
    const res = await raw('DELETE', `/api/manuscripts/${id}`, { 'cookie': me.client.cookieHeader(), 'sec-fetch-site': 'cross-site' })
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('cross-site-request')
    expect((await me.client.get(`/api/manuscripts/${id}`)).status).toBe(200)
  })

  it('refuses Origin: null and same-site (another subdomain), accepts its own origin and plain non-browser clients', async () => {
    expect((await raw('POST', '/api/auth/sign-out', { origin: 'null' })).status).toBe(403)
    expect((await raw('POST', '/api/auth/sign-out', { 'sec-fetch-site': 'same-site' })).status).toBe(403)
    expect((await raw('POST', '/api/auth/sign-out', { 'origin': new URL(baseUrl).origin, 'sec-fetch-site': 'same-origin' })).status).toBe(200)
    expect((await raw('POST', '/api/auth/sign-out', {})).status).toBe(200)
  })
})

describe('security headers', () => {
  it('every response carries CSP with frame-ancestors none, nosniff and a referrer policy', async () => {
    for (const path of ['/sign-in', '/api/health', '/api/desk']) {
      const res = await raw('GET', path, {})
      const csp = res.headers.get('content-security-policy') ?? ''
      expect(csp, path).toContain('frame-ancestors \'none\'')
      // Nitro answers API errors with its own stricter policy (script-src 'none'); pages need KaTeX's fonts.
      if (path === '/sign-in') expect(csp).toContain('font-src \'self\' data:')
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff')
      expect(res.headers.get('referrer-policy'), path).toBe('no-referrer')
    }
  })
})

describe('admin mailbox', () => {
  it('masks live password-reset links', async () => {
    const me = await newMember('masked')
    await new Client().post('/api/auth/password-reset', { email: me.email })
    const sent = await waitForMail(me.email, /new Scholium password/)
    const token = /\/password-reset\/([A-Za-z0-9_-]+)/.exec(sent.text)![1]!
    const admin = await demoClient('admin')
    const res = await admin.get('/api/admin/mail')
    expect(res.status).toBe(200)
    const shown = res.body.messages.find((m: { id: string }) => m.id === sent.id)
    expect(shown.text).toContain('/password-reset/[hidden]')
    expect(res.text).not.toContain(token)
  })
})
