// Withdrawing a submitted manuscript in the browser (issue 11): the owner opens the manuscript,
// asks to withdraw its submission, first keeps it, then withdraws it; the page shows it withdrawn
// with no withdraw button left, the row stays with the venue marked withdrawn (the editor's
// table shows it), and exactly one audit entry records it.
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { baseUrl, launchBrowser, screenshotDir, signedInPage } from './browser'
import { db, filesForm, newMember, SMALL_TEX } from '../server/helpers'

const PASSWORD = 'correct horse battery' // what newMember signs up with

type Member = Awaited<ReturnType<typeof newMember>>
let browser: Browser
let author: Member, editor: Member
let manuscriptId: string, venueId: string, submissionId: string
const venueName = `Quillmere Notes on Tableaux ${randomUUID().slice(0, 6)}`
const title = `A paper sent and taken back ${randomUUID().slice(0, 6)}`

const signedIn = (who: Member) => signedInPage(browser, who, PASSWORD)

const shot = (page: Page, name: string) => page.screenshot({ path: join(screenshotDir, `withdraw-${name}.png`), fullPage: true })

beforeAll(async () => {
  mkdirSync(screenshotDir, { recursive: true })
  browser = await launchBrowser();
  [author, editor] = await Promise.all([newMember('withdrawing'), newMember('editor')])
  venueId = (await db.insertInto('venues').values({ slug: `venue-${randomUUID()}`, name: venueName }).returning('id').executeTakeFirstOrThrow()).id
  await db.insertInto('venue_editors').values({ venue_id: venueId, user_id: editor.id }).execute()
  manuscriptId = (await author.client.post('/api/manuscripts', { title })).body.id
  const upload = await author.client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'main.tex', content: SMALL_TEX }]))
  expect(upload.status).toBe(201)
  const sent = await author.client.post(`/api/manuscripts/${manuscriptId}/submissions`, { revisionId: upload.body.id, venueId })
  expect(sent.status).toBe(201)
  submissionId = sent.body.id
}, 120_000)
afterAll(async () => {
  await browser?.close()
})

describe('withdrawing a submission in the browser', () => {
  let page: Page

  it('the owner asks to withdraw, reads what it means, and keeps it: nothing changes', async () => {
    page = await signedIn(author)
    await page.goto(`${baseUrl}/manuscripts/${manuscriptId}`)
    const item = page.getByTestId('manuscript-submissions').locator('li').filter({ hasText: venueName })
    await expect.poll(() => item.getAttribute('data-status')).toBe('submitted')
    await item.getByTestId('withdraw-submission').click()
    await expect.poll(() => item.innerText()).toContain('The venue keeps its record of this submission, marked withdrawn')
    await shot(page, 'confirm')
    await item.getByRole('button', { name: 'Keep it' }).click()
    await expect.poll(() => item.getByTestId('withdraw-submission').count()).toBe(1)
    expect(await db.selectFrom('submissions').select('status').where('id', '=', submissionId).executeTakeFirst()).toEqual({ status: 'submitted' })
  })

  it('then withdraws it: the page shows it withdrawn, with no withdraw button, and the database and audit log agree', async () => {
    const item = page.getByTestId('manuscript-submissions').locator('li').filter({ hasText: venueName })
    await item.getByTestId('withdraw-submission').click()
    await item.getByTestId('withdraw-confirm').click()
    await expect.poll(() => item.getAttribute('data-status')).toBe('withdrawn')
    expect(await item.innerText()).toContain(`${venueName} — revision 1, withdrawn`)
    expect(await item.getByTestId('withdraw-submission').count()).toBe(0)
    await shot(page, 'withdrawn')
    expect(await db.selectFrom('submissions').select('status').where('id', '=', submissionId).executeTakeFirst()).toEqual({ status: 'withdrawn' })
    const audit = await db.selectFrom('audit_log').select(['action', 'actor_id']).where('subject_id', '=', submissionId).where('action', '=', 'submission.withdrawn').execute()
    expect(audit).toEqual([{ action: 'submission.withdrawn', actor_id: author.id }])
    // After a reload it is still withdrawn (the page read it back, not only its own state).
    await page.reload()
    const reloaded = page.getByTestId('manuscript-submissions').locator('li').filter({ hasText: venueName })
    await expect.poll(() => reloaded.getAttribute('data-status')).toBe('withdrawn')
    expect(await reloaded.getByTestId('withdraw-submission').count()).toBe(0)
  })

  it('the venue keeps its record: the editor still sees the submission in the table, marked withdrawn', async () => {
    const editorPage = await signedIn(editor)
    await editorPage.goto(`${baseUrl}/venues/${venueId}`)
    const row = editorPage.getByTestId('submission-row').filter({ hasText: title })
    await expect.poll(() => row.getByTestId('submission-status').innerText()).toBe('withdrawn')
    await shot(editorPage, 'editor-table')
  })
})
