// What a user does around the check, in the browser against the fake e-print server that
// scripts/test.sh starts: fetching a paper from arXiv by identifier (and a PDF-only one refused),
// dropping a folder onto the manuscript page (refusals shown before upload, per-file progress),
// the suggested corrections (copy and download, the patch applies and leaves no mismatch), and the
// notation page with its live examples.
//
// Expected values are facts about the demo source the fake serves (server/assets/demo/vexillary-flags/rev1):
// #PD(1432) = 5, since S_1432 has five monomials with coefficient 1 (line 30 says 4), and
// S_1342 = x1x2 + x1x3 + x2x3 (line 41 misses x2x3) (Macdonald, "Notes on Schubert polynomials",
// 1991, table for S_4, recalled from memory).
import { execFileSync } from 'node:child_process'
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { baseUrl, launchBrowser, screenshotDir } from './browser'
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../server/services/demo-people'
import { checkManuscript } from '../../shared/check'

const demo = join(process.cwd(), 'server/assets/demo/vexillary-flags/rev1')
const line = (page: Page, n: number) => page.locator(`[data-testid="source-line"][data-line="${n}"]`)

let browser: Browser
let context: BrowserContext
let page: Page
let manuscriptUrl: string
beforeAll(async () => {
  mkdirSync(screenshotDir, { recursive: true })
  browser = await launchBrowser()
  context = await browser.newContext({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true })
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseUrl })
  page = await context.newPage()
  await page.goto(`${baseUrl}/sign-in`)
  await page.getByLabel('E-mail').fill(DEMO_PEOPLE.author.email)
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(/\/desk$/)
})
afterAll(async () => {
  await browser?.close()
})

describe('fetching from arXiv', () => {
  it('a new manuscript from an identifier with its version, stored as revision 1', async () => {
    await page.getByTestId('arxiv-identifier').fill('2612.00001v1')
    await page.getByTestId('arxiv-fetch').click()
    await page.waitForURL(/\/manuscripts\/[^/]+$/)
    manuscriptUrl = page.url()
    await page.getByTestId('open-report-1').waitFor()
    expect(await page.locator('h1').first().innerText()).toBe('arXiv:2612.00001v1')
  })

  it('a PDF-only submission is refused with a clear message and nothing is stored', async () => {
    await page.getByTestId('arxiv-identifier').fill('2612.00003')
    await page.getByTestId('arxiv-fetch').click()
    const error = page.getByTestId('arxiv-error')
    await error.waitFor()
    expect(await error.innerText()).toContain('only a PDF')
    expect(await page.getByTestId('open-report-2').count()).toBe(0)
  })

  it('a malformed identifier is named before anything is sent', async () => {
    await page.getByTestId('arxiv-identifier').fill('2612.1')
    expect(await page.getByTestId('arxiv-shape').isVisible()).toBe(true)
    expect(await page.getByTestId('arxiv-fetch').isDisabled()).toBe(true)
    await page.getByTestId('arxiv-identifier').fill('')
  })
})

/** Drops `files` (path → content) on the page as a folder would arrive: entries walked through webkitGetAsEntry. */
async function dropFolder(target: Page, folder: string, files: Record<string, string>) {
  await target.locator('[data-testid="upload-drop"][data-listening="true"]').waitFor()
  await target.evaluate(({ folder, files }) => {
    type Node = { name: string, fullPath: string, isFile: boolean, isDirectory: boolean, file?: (ok: (f: File) => void) => void, createReader?: () => { readEntries: (ok: (e: Node[]) => void) => void } }
    const root: Node & { children: Map<string, Node & { children?: Map<string, unknown> }> } = { name: folder, fullPath: `/${folder}`, isFile: false, isDirectory: true, children: new Map() } as never
    const dirOf = (parts: string[]) => {
      let dir = root as { fullPath: string, children: Map<string, any> }
      for (const part of parts) {
        if (!dir.children.has(part)) dir.children.set(part, { name: part, fullPath: `${dir.fullPath}/${part}`, isFile: false, isDirectory: true, children: new Map() })
        dir = dir.children.get(part)
      }
      return dir
    }
    for (const [path, content] of Object.entries(files)) {
      const parts = path.split('/')
      const name = parts.pop()!
      const dir = dirOf(parts)
      const file = new File([content], name, { type: 'text/plain' })
      dir.children.set(name, { name, fullPath: `${dir.fullPath}/${name}`, isFile: true, isDirectory: false, file: (ok: (f: File) => void) => ok(file) })
    }
    const withReaders = (node: any): Node => {
      if (node.isDirectory) {
        const children = [...node.children.values()].map(withReaders)
        // Answers in two batches and then an empty one, as browsers do.
        node.createReader = () => {
          const batches = [children.slice(0, 1), children.slice(1), []]
          return { readEntries: (ok: (e: Node[]) => void) => ok(batches.shift() ?? []) }
        }
      }
      return node
    }
    const entry = withReaders(root)
    const transfer = { types: ['Files'], files: [], items: [{ kind: 'file', webkitGetAsEntry: () => entry }] }
    for (const type of ['dragenter', 'dragover', 'drop']) {
      const event = new Event(type, { bubbles: true, cancelable: true })
      Object.defineProperty(event, 'dataTransfer', { value: transfer })
      document.body.dispatchEvent(event)
    }
  }, { folder, files })
}

describe('drag and drop on the manuscript page', () => {
  it('a dropped folder lists what will be refused, with the reason, before anything is sent', async () => {
    await page.goto(manuscriptUrl)
    await dropFolder(page, 'paper', {
      'main.tex': readFileSync(join(demo, 'main.tex'), 'utf8'),
      'sections/double.tex': readFileSync(join(demo, 'sections/double.tex'), 'utf8'),
      'main.aux': '\\relax\n',
      '.git/config': '[core]\n',
    })
    await page.getByTestId('drop-list').waitFor()
    expect(await page.getByTestId('drop-file-main.tex').getAttribute('data-status')).toBe('accepted')
    expect(await page.getByTestId('drop-file-sections/double.tex').getAttribute('data-status')).toBe('accepted')
    const aux = page.getByTestId('drop-file-main.aux')
    expect(await aux.getAttribute('data-status')).toBe('refused')
    expect(await aux.innerText()).toContain('.aux files are not part of a LaTeX source')
    expect(await page.getByTestId('drop-file-.git/config').getAttribute('data-status')).toBe('left-out')
    expect(await page.getByTestId('open-report-2').count()).toBe(0)
  })

  it('uploads the accepted files as one revision, keeping the folder\'s paths, with progress per file', async () => {
    await page.getByTestId('drop-upload').click()
    await page.getByTestId('drop-done').waitFor()
    expect(await page.getByTestId('drop-done').innerText()).toMatch(/^Revision 2 stored with 2 files/)
    for (const path of ['main.tex', 'sections/double.tex']) {
      expect(await page.getByTestId(`drop-progress-${path}`).evaluate(e => (e as HTMLProgressElement).value)).toBe(1)
    }
    await page.getByTestId('open-report-2').waitFor()
  })

  it('a drop with no .tex file is refused as a whole and cannot be sent', async () => {
    await page.getByRole('button', { name: 'Done' }).click()
    await dropFolder(page, 'refs', { 'refs.bib': '@book{x, title={An invented book}}\n' })
    const refusal = page.getByTestId('drop-refusal')
    await refusal.waitFor()
    expect(await refusal.getAttribute('data-code')).toBe('no-tex')
    expect(await page.getByTestId('drop-upload').isDisabled()).toBe(true)
    await page.screenshot({ path: join(screenshotDir, 'drop.png'), fullPage: true })
  })
})

describe('suggested corrections', () => {
  it('shows the corrected statement in the paper\'s macros beside the claim, and copies it', async () => {
    await page.goto(manuscriptUrl)
    await page.getByTestId('open-report-1').click()
    await page.waitForURL(/\/revisions\//)
    await line(page, 41).and(page.locator('[data-mark]')).waitFor({ timeout: 90_000 })
    await line(page, 41).getByRole('button').click()
    const panel = page.getByTestId('claim-panel')
    const statement = panel.getByTestId('correction-statement')
    await statement.waitFor()
    expect(await statement.innerText()).toBe('\\Sch{1342} = x_1 x_2 + x_1 x_3 + x_2 x_3')
    await panel.getByTestId('correction-copy').click()
    await expect.poll(() => page.evaluate(() => navigator.clipboard.readText())).toBe('\\Sch{1342} = x_1 x_2 + x_1 x_3 + x_2 x_3')
  })

  it('downloads a patch that git apply takes, after which the manuscript checks with no mismatch', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('corrections-download-button').click()])
    const patch = readFileSync((await download.path())!, 'utf8')
    expect(patch.match(/^@@ /gm)).toHaveLength(2)
    const dir = mkdtempSync(join(tmpdir(), 'scholium-e2e-fix-'))
    try {
      cpSync(demo, dir, { recursive: true })
      writeFileSync(join(dir, 'fix.patch'), patch)
      execFileSync('git', ['apply', 'fix.patch'], { cwd: dir })
      const main = readFileSync(join(dir, 'main.tex'), 'utf8')
      expect(main).toContain('$\\#\\PD(1432) = 5$')
      const report = checkManuscript({ files: { 'main.tex': main, 'sections/double.tex': readFileSync(join(dir, 'sections/double.tex'), 'utf8') } })
      expect(report.summary.mismatch).toBe(0)
    }
    finally {
      rmSync(dir, { recursive: true, force: true })
    }
  })
})

describe('the notation page', () => {
  it('is linked from the report and checks every example live in the browser', async () => {
    await page.getByTestId('notation-link').click()
    await page.waitForURL(/\/notation$/)
    const checks = page.getByTestId('notation-check')
    await checks.first().waitFor()
    const verdicts = await checks.evaluateAll(list => list.map(e => e.getAttribute('data-verdict')))
    expect(verdicts.length).toBeGreaterThan(15)
    expect(new Set(verdicts)).toEqual(new Set(['verified']))
    expect(await page.locator('[data-testid="notation-check"] .katex').count()).toBeGreaterThanOrEqual(verdicts.length)
    expect(await page.getByTestId('notation-tags').innerText()).toContain('scholium: \\Sch means schubert')
  })

  it('checks what the reader types: a missing term is a mismatch, prose is not read', async () => {
    const result = page.getByTestId('notation-try-result')
    await page.getByTestId('notation-try').fill('\\mathfrak{S}_{2143} = x_1^2 + x_1x_2')
    await expect.poll(() => result.getAttribute('data-verdict')).toBe('mismatch')
    await page.getByTestId('notation-try').fill('\\mathfrak{S}_{2143} = x_1^2 + x_1x_2 + x_1x_3')
    await expect.poll(() => result.getAttribute('data-verdict')).toBe('verified')
    await page.getByTestId('notation-try').fill('q = 0')
    await expect.poll(() => result.getAttribute('data-verdict')).toBe('none')
    await page.screenshot({ path: join(screenshotDir, 'notation.png'), fullPage: true })
  })
})
