// The line-by-line report in the browser: the demo author uploads the demo manuscript as a zip,
// waits for its check, finds the right lines marked, opens a wrong claim and sees its difference
// and the drawings of its permutation.
//
// Expected values are facts about the demo source (server/assets/demo/vexillary-flags/rev1), not
// our own output: S_{1432} = x1²x2 + x1²x3 + x1x2² + x1x2x3 + x2²x3 has five monomials, each with
// coefficient 1, so #PD(1432) = 5, not 4 (line 30); S_{1342} = x1x2 + x1x3 + x2x3, so line 41
// misses x2x3 and 1342 has three reduced pipe dreams (Macdonald, "Notes on Schubert polynomials",
// 1991, table of S_w for w in S_4 — recalled from memory); lines 25, 28 and 34 (S_132, S_231,
// S_312, S_1432 and Monk's rule S_213·S_132 = S_231 + S_312) are correct (common practice).
import { mkdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { baseUrl, launchBrowser, screenshotDir } from './browser'
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../server/services/demo-people'
import { makeZip } from '../helpers/archives'

const demo = join(process.cwd(), 'server/assets/demo/vexillary-flags/rev1')
const line = (page: Page, n: number) => page.locator(`[data-testid="source-line"][data-line="${n}"]`)

let browser: Browser
let page: Page
beforeAll(async () => {
  mkdirSync(screenshotDir, { recursive: true })
  browser = await launchBrowser()
  page = await (await browser.newContext({ viewport: { width: 1400, height: 1000 } })).newPage()
})
afterAll(async () => {
  await browser?.close()
})

describe('the report page', () => {
  it('the author uploads the demo manuscript and opens its report', async () => {
    await page.goto(`${baseUrl}/sign-in`)
    await page.getByLabel('E-mail').fill(DEMO_PEOPLE.author.email)
    await page.getByLabel('Password').fill(DEMO_PASSWORD)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/desk$/)
    await page.getByLabel('New manuscript').fill(`Report test ${Date.now()}`)
    await page.getByRole('button', { name: 'Create' }).click()
    await page.waitForURL(/\/manuscripts\//)
    // The multi-file picker keeps only base names, so the folder structure travels in a zip.
    const zip = makeZip([
      { path: 'main.tex', content: readFileSync(join(demo, 'main.tex')) },
      { path: 'sections/double.tex', content: readFileSync(join(demo, 'sections/double.tex')) },
    ])
    await page.getByTestId('upload-form').locator('input[type="file"]').setInputFiles({ name: 'vexillary-flags.zip', mimeType: 'application/zip', buffer: zip })
    await page.getByRole('button', { name: 'Upload revision' }).click()
    await page.getByTestId('open-report-1').click()
    await page.waitForURL(/\/revisions\//)
    expect(await page.getByTestId('report-title').innerText()).toMatch(/^Report test/)
  })

  it('marks the wrong lines and the right ones once the check has finished', async () => {
    // The page polls while the run is queued or running; the worker may take a while to start.
    await line(page, 41).and(page.locator('[data-mark]')).waitFor({ timeout: 90_000 })
    for (const n of [30, 41]) expect(await line(page, n).getAttribute('data-mark')).toBe('mismatch')
    for (const n of [25, 28, 34]) expect(await line(page, n).getAttribute('data-mark')).toBe('verified')
    for (const n of [24, 31, 43]) expect(await line(page, n).getAttribute('data-mark')).toBeNull()
    expect(await page.getByTestId('tally-mismatch').getAttribute('data-count')).toBe('2')
    expect(await page.getByTestId('report-summary').innerText()).toContain('not a proof')
  })

  it('opens the claim on line 41 with the missing term typeset and drawings of 1342', async () => {
    await line(page, 41).getByRole('button').click()
    const panel = page.getByTestId('claim-panel')
    await panel.waitFor()
    expect(await panel.getByRole('heading').first().innerText()).toBe('main.tex, line 41')
    const missing = panel.getByTestId('diff-missing')
    expect(await missing.locator('li').count()).toBe(1)
    const term = missing.getByLabel('missing term x_{2}x_{3}')
    expect(await term.locator('.katex').count()).toBe(1)
    expect(await panel.getByTestId('diff-extra').count()).toBe(0)
    expect(await panel.locator('svg').first().isVisible()).toBe(true)
    await panel.getByRole('button', { name: 'Pipe dreams', exact: true }).click()
    await expect.poll(() => panel.locator('figure svg').count()).toBe(3)
    expect(await panel.getByTestId('drawings').innerText()).toContain('3 in all')
    await page.screenshot({ path: join(screenshotDir, 'report.png'), fullPage: true })
  })

  it('steps from disagreement to disagreement with n and p, and Escape closes the panel', async () => {
    await page.keyboard.press('Escape')
    await expect.poll(() => page.getByTestId('claim-panel').count()).toBe(0)
    await page.keyboard.press('n')
    await expect.poll(() => page.getByTestId('claim-panel').getByRole('heading').first().innerText()).toBe('main.tex, line 30')
    await page.keyboard.press('n')
    await expect.poll(() => page.getByTestId('claim-panel').getByRole('heading').first().innerText()).toBe('main.tex, line 41')
    await page.keyboard.press('p')
    await expect.poll(() => page.getByTestId('claim-panel').getByRole('heading').first().innerText()).toBe('main.tex, line 30')
    const diff = page.getByTestId('claim-panel').getByTestId('claim-diff')
    expect(await diff.innerText()).toMatch(/has\s+4;.*computes\s+5/s)
  })

  it('the filter leaves marks only on lines that disagree', async () => {
    await page.getByTestId('filter-disagreements').check()
    expect(await line(page, 25).getAttribute('data-mark')).toBeNull()
    expect(await line(page, 41).getAttribute('data-mark')).toBe('mismatch')
  })
})
