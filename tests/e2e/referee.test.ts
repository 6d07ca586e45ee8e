// The referee flow in the browser, end to end: the author submits a checked manuscript to a
// venue, its editor invites a referee by e-mail, the referee accepts the link from the mail,
// opens the report, writes an overall note and a note on a claim, the editor releases them,
// and the author reads them as "Referee 1", with no trace of the referee's name or address.
//
// The wrong claim is a fact of the trade (common practice): S_{132} = x_1 + x_2, so the
// manuscript's "S_{132} = x_1" on line 4 is a mismatch.
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { baseUrl, launchBrowser, screenshotDir, signedInPage } from './browser'
import { db, filesForm, inboxUrl, newMember } from '../server/helpers'
import type { InboxMessage } from '../../shared/types/api'

const PAPER = [
  '\\documentclass{article}',
  '\\begin{document}',
  'First, $\\mathfrak{S}_{213} = x_1$.',
  'Second, $\\mathfrak{S}_{132} = x_1$.',
  '\\end{document}',
  '',
].join('\n')
const PASSWORD = 'correct horse battery' // what newMember signs up with

type Member = Awaited<ReturnType<typeof newMember>>
let browser: Browser
let author: Member, editor: Member, referee: Member
let manuscriptId: string, venueId: string
const venueName = `Fernhollow Review of Tableaux ${randomUUID().slice(0, 6)}`
const overallNote = 'A tidy note; the second example needs another term.'
const claimNote = 'The second example misses x_2.'

const signedIn = (who: Member) => signedInPage(browser, who, PASSWORD)

const shot = (page: Page, name: string) => page.screenshot({ path: join(screenshotDir, `referee-${name}.png`), fullPage: true })

beforeAll(async () => {
  mkdirSync(screenshotDir, { recursive: true })
  browser = await launchBrowser();
  [author, editor, referee] = await Promise.all([newMember('author'), newMember('editor'), newMember('referee')])
  const { id } = await db.insertInto('venues').values({ slug: `venue-${randomUUID()}`, name: venueName }).returning('id').executeTakeFirstOrThrow()
  venueId = id
  await db.insertInto('venue_editors').values({ venue_id: venueId, user_id: editor.id }).execute()
  manuscriptId = (await author.client.post('/api/manuscripts', { title: 'Small reflections, checked' })).body.id
  const upload = await author.client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'paper.tex', content: PAPER }]))
  const deadline = Date.now() + 90_000
  while ((await db.selectFrom('check_runs').select('status').where('revision_id', '=', upload.body.id).executeTakeFirst())?.status !== 'finished') {
    if (Date.now() > deadline) throw new Error('the check did not finish within 90 s')
    await new Promise(resolve => setTimeout(resolve, 250))
  }
}, 120_000)
afterAll(async () => {
  await browser?.close()
})

describe('refereeing in the browser', () => {
  let authorPage: Page, editorPage: Page, refereePage: Page

  it('the author submits the revision to the venue', async () => {
    authorPage = await signedIn(author)
    await authorPage.goto(`${baseUrl}/manuscripts/${manuscriptId}`)
    await authorPage.getByTestId('submit-venue').selectOption({ label: venueName })
    await authorPage.getByTestId('submit-form').getByRole('button', { name: 'Submit' }).click()
    await expect.poll(() => authorPage.getByTestId('submit-form').getByRole('status').innerText()).toContain(`submitted to ${venueName}`)
  })

  it('the editor finds it in the table and invites a referee by e-mail', async () => {
    editorPage = await signedIn(editor)
    await editorPage.goto(`${baseUrl}/venues/${venueId}`)
    const row = editorPage.getByTestId('submission-row').filter({ hasText: 'Small reflections, checked' })
    expect(await row.getByTestId('count-mismatch').innerText()).toBe('1')
    await row.getByTestId('invite-email').fill(referee.email)
    await row.getByTestId('invite-referee').click()
    await expect.poll(() => row.getByRole('status').innerText()).toContain(`Invitation sent to ${referee.email}`)
    await shot(editorPage, 'editor-invites')
  })

  it('the referee accepts the link from the mail and opens the report', async () => {
    const mails = await (await fetch(new URL('/messages', inboxUrl))).json() as InboxMessage[]
    const mail = mails.find(m => m.to.includes(referee.email) && m.subject.includes('Invitation to referee'))
    const link = /https?:\/\/\S+\/referee-invitations\/[\w-]+/.exec(mail?.text ?? '')?.[0]
    expect(link).toBeDefined()
    refereePage = await signedIn(referee)
    await refereePage.goto(link!)
    await refereePage.getByTestId('accept-invitation').click()
    await refereePage.waitForURL(/\/reviews\//)
    expect(await refereePage.getByTestId('review-title').innerText()).toBe('Small reflections, checked')
    await refereePage.getByTestId('open-report-1').click()
    await refereePage.waitForURL(/\/revisions\//)
    await refereePage.locator('[data-testid="source-line"][data-line="4"][data-mark="mismatch"]').waitFor()
    await shot(refereePage, 'report')
    await refereePage.goBack()
    await refereePage.waitForURL(/\/reviews\//)
  })

  it('the referee writes an overall note and a note on the wrong claim', async () => {
    await refereePage.getByLabel('Overall note').fill(overallNote)
    await refereePage.getByRole('button', { name: 'Save the note' }).click()
    await expect.poll(() => refereePage.getByTestId('overall-note').getByRole('status').innerText()).toBe('Saved.')
    const option = refereePage.getByTestId('claim-picker').locator('option', { hasText: 'paper.tex:4 ' })
    await refereePage.getByTestId('claim-picker').selectOption((await option.getAttribute('value'))!)
    await refereePage.getByTestId('claim-note-body').fill(claimNote)
    await refereePage.getByRole('button', { name: 'Add the note' }).click()
    await expect.poll(() => refereePage.getByTestId('claim-note').innerText()).toContain(claimNote)
    expect(await refereePage.getByTestId('claim-note').innerText()).toContain('paper.tex:4')
    await shot(refereePage, 'notes')
  })

  it('the editor releases the notes', async () => {
    await editorPage.reload()
    const row = editorPage.getByTestId('submission-row').filter({ hasText: 'Small reflections, checked' })
    expect(await row.innerText()).toContain(referee.displayName)
    await row.getByTestId('release-notes').click()
    await expect.poll(() => row.innerText()).toContain('notes released')
    await shot(editorPage, 'editor-released')
  })

  it('the author reads them as "Referee 1", with no trace of who wrote them', async () => {
    await authorPage.reload()
    const notes = authorPage.getByTestId('referee-notes')
    await notes.waitFor()
    const text = await notes.innerText()
    expect(text).toContain('Referee 1')
    expect(text).toContain(overallNote)
    expect(text).toContain(claimNote)
    expect(text).toContain('paper.tex:4')
    const whole = await authorPage.content()
    for (const identity of [referee.displayName, referee.email]) expect(whole).not.toContain(identity)
    await shot(authorPage, 'author-reads')
  })
})
