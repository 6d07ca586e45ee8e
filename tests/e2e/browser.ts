/**
 * Debian's chromium through playwright-core; never a downloaded browser.
 * playwright gives every launch a fresh temporary profile (its own --user-data-dir).
 */
import { join } from 'node:path'
import { chromium, type Browser } from 'playwright-core'

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
