/**
 * Debian's chromium through playwright-core; never a downloaded browser.
 * playwright gives every launch a fresh temporary profile (its own --user-data-dir).
 */
import { join } from 'node:path'
import { chromium, type Browser, type Page } from 'playwright-core'

export const baseUrl = process.env.SCHOLIUM_TEST_BASE_URL ?? 'http://127.0.0.1:3101'
export const screenshotDir = join(process.cwd(), 'test-results', 'screenshots')

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: [
      '--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--no-first-run',
    ],
  })
}

/** A new browser context signed in as `who` (a member made by newMember, whose password is given), on its desk. */
export async function signedInPage(browser: Browser, who: { email: string }, password: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1400, height: 1000 } })).newPage()
  await page.goto(`${baseUrl}/sign-in`)
  await page.getByLabel('E-mail').fill(who.email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(/\/desk$/)
  return page
}
