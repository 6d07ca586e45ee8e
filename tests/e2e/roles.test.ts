// Signs in as each demo role and keeps a screenshot of what that role sees first.
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { baseUrl, launchBrowser, screenshotDir } from './browser'
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../server/services/demo-people'

let browser: Browser
beforeAll(async () => {
  mkdirSync(screenshotDir, { recursive: true })
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

const roles: { person: keyof typeof DEMO_PEOPLE, section: string, text: string }[] = [
  { person: 'admin', section: 'desk-admin', text: 'Administration' },
  { person: 'author', section: 'desk-manuscripts', text: 'Transition chains for vexillary flags' },
  { person: 'coauthor', section: 'desk-manuscripts', text: 'Transition chains for vexillary flags' },
  { person: 'editor', section: 'desk-venues', text: 'Ledgerfield Journal of Algebraic Combinatorics' },
  { person: 'referee', section: 'desk-reviews', text: 'A note on bumpless tilings of small permutations' },
]

describe('each demo role lands on its own desk', () => {
  it('an anonymous visitor gets the sign-in page', async () => {
    const page = await browser.newPage()
    await page.goto(`${baseUrl}/desk`)
    await page.waitForURL(/\/sign-in/)
    expect(await page.getByRole('heading', { name: 'Sign in' }).isVisible()).toBe(true)
    await page.screenshot({ path: join(screenshotDir, 'sign-in.png'), fullPage: true })
    await page.close()
  })

  for (const role of roles) {
    it(`${role.person} signs in and sees ${role.section}`, async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } })
      const page = await context.newPage()
      await page.goto(`${baseUrl}/sign-in`)
      await page.getByLabel('E-mail').fill(DEMO_PEOPLE[role.person].email)
      await page.getByLabel('Password').fill(DEMO_PASSWORD)
      await page.getByRole('button', { name: 'Sign in' }).click()
      await page.waitForURL(/\/desk$/)
      const section = page.getByTestId(role.section)
      await section.waitFor()
      expect(await section.innerText()).toContain(role.text)
      expect(await page.getByTestId('desk-owner').innerText()).toBe(DEMO_PEOPLE[role.person].displayName)
      await page.screenshot({ path: join(screenshotDir, `${role.person}.png`), fullPage: true })
      await context.close()
    })
  }

  it('a wrong password shows a clear message in the form', async () => {
    const page = await browser.newPage()
    await page.goto(`${baseUrl}/sign-in`)
    await page.getByLabel('E-mail').fill('nobody@tests.scholium.example')
    await page.getByLabel('Password').fill('not the password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(() => page.getByRole('alert').innerText()).toContain('E-mail or password is wrong')
    await page.close()
  })
})
