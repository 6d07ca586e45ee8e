// The "check finished" mail: a run that took at least SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS
// from queued to finished mails its requester the counts and a link; a quick run does not;
// a mail relay that is down never fails the run. Each run here is processed by a worker
// started by the test (`--run <id>`, off the queue), so the threshold is the test's own.
import { spawn } from 'node:child_process'
import { describe, expect, it } from 'vitest'
import { baseUrl, db, filesForm, mailsTo, newMember, SMALL_TEX, waitForRun } from './helpers'

async function checkMailsTo(to: string) {
  return (await mailsTo(to)).filter(m => /^Check finished/.test(m.subject))
}

/** A member with an uploaded one-claim revision whose own first run has finished. */
async function memberWithRevision(label: string) {
  const me = await newMember(label)
  const { body: m } = await me.client.post('/api/manuscripts', { title: `Mail after checking (${label})` })
  const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'paper.tex', content: SMALL_TEX }]))
  expect(upload.status).toBe(201)
  await waitForRun(upload.body.checkRunId)
  // If that first run was slow, the test profile's worker mails right after it commits; let that land first.
  await new Promise(resolve => setTimeout(resolve, 500))
  return { ...me, revisionId: upload.body.id as string }
}

/** Runs one check run in a worker process started here; resolves with its output once it exits. */
function runWorker(checkRunId: string, env: Record<string, string>): Promise<{ code: number | null, output: string }> {
  const worker = spawn(process.execPath, ['--import', 'tsx', 'scripts/worker.ts', '--run', checkRunId], { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] })
  let output = ''
  worker.stdout.on('data', (chunk: Buffer) => { output += chunk.toString() })
  worker.stderr.on('data', (chunk: Buffer) => { output += chunk.toString() })
  return new Promise(resolve => worker.once('exit', code => resolve({ code, output })))
}

/** A run off the queue, requested by `userId`, that has waited `waitedSeconds` already. */
async function insertRun(revisionId: string, userId: string, waitedSeconds: number): Promise<string> {
  const { id } = await db.insertInto('check_runs').values({
    revision_id: revisionId, requested_by: userId, conventions: '{}', timings: '{}',
    queued_at: new Date(Date.now() - waitedSeconds * 1000),
  }).returning('id').executeTakeFirstOrThrow()
  return id
}

describe('check finished mail', () => {
  it('a run that took longer than the threshold mails its requester the counts and a link to the revision', async () => {
    const me = await memberWithRevision('long-run')
    const before = (await checkMailsTo(me.email)).length
    const runId = await insertRun(me.revisionId, me.id, 120)
    const worker = await runWorker(runId, { SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS: '60' })
    expect(worker.code, worker.output).toBe(0)
    expect((await waitForRun(runId)).status).toBe('finished')
    const mails = await checkMailsTo(me.email)
    expect(mails).toHaveLength(before + 1)
    const text = mails[0]!.text
    expect(text).toContain(`${baseUrl}/revisions/${me.revisionId}`)
    // SMALL_TEX has one claim, S_{132} = x_1 + x_2, which is right (common practice: S_{s_2} = x_1 + x_2).
    expect(text).toMatch(/Claims found: 1\b/)
    expect(text).toMatch(/verified: +1\b/)
    expect(text).toMatch(/mismatch: +0\b/)
  })

  it('a run quicker than the threshold sends nothing', async () => {
    const me = await memberWithRevision('short-run')
    const before = (await checkMailsTo(me.email)).length
    const runId = await insertRun(me.revisionId, me.id, 0)
    const worker = await runWorker(runId, { SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS: '60' })
    expect(worker.code, worker.output).toBe(0)
    expect((await waitForRun(runId)).status).toBe('finished')
    await new Promise(resolve => setTimeout(resolve, 1000))
    expect(await checkMailsTo(me.email)).toHaveLength(before)
  })

  it('a mail relay that does not answer is logged and the run still finishes', async () => {
    const me = await memberWithRevision('relay-down')
    const runId = await insertRun(me.revisionId, me.id, 120)
    // Port 9 on loopback: nothing listens there, so the connection is refused at once.
    const worker = await runWorker(runId, { SCHOLIUM_MAIL_RUNS_LONGER_THAN_SECONDS: '60', NUXT_SMTP_PORT: '9' })
    expect(worker.code, worker.output).toBe(0)
    const run = await waitForRun(runId)
    expect(run.status).toBe('finished')
    expect(run.error).toBeNull()
    expect(worker.output).toMatch(/after-finish step failed/)
  })
})
