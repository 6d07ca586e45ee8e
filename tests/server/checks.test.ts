// The check pipeline end to end: upload → queue → worker → claims → report API.
import { spawn } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { db, filesForm, newMember, waitForRun } from './helpers'
import { makeZip } from '../helpers/archives'
import { readManuscript } from '../../shared/latex'
import { REPORT_SCHEMA } from '../../shared/types/report'

const demo = (path: string) => readFileSync(`server/assets/demo/${path}`, 'utf8')

async function uploadDemoDraft() {
  const me = await newMember('checker')
  const { body: m } = await me.client.post('/api/manuscripts', { title: 'Checked draft' })
  const zip = makeZip([
    { path: 'main.tex', content: demo('vexillary-flags/rev1/main.tex') },
    { path: 'sections/double.tex', content: demo('vexillary-flags/rev1/sections/double.tex') },
  ])
  const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'draft.zip', content: zip }]))
  expect(upload.status).toBe(201)
  return { ...me, manuscriptId: m.id as string, revisionId: upload.body.id as string, checkRunId: upload.body.checkRunId as string }
}

describe('checking an uploaded revision', () => {
  it('marks the deliberately wrong lines and verifies the others, with a difference a reader can act on', async () => {
    const { client, revisionId, checkRunId } = await uploadDemoDraft()
    await waitForRun(checkRunId, status => status === 'finished')
    const res = await client.get(`/api/revisions/${revisionId}/report`)
    expect(res.status).toBe(200)
    const report = res.body.report
    expect(report.schema).toBe(REPORT_SCHEMA)
    const at = (file: string, line: number) => report.claims.filter((c: any) => c.file === file && c.line === line)
    // Written wrong on purpose in the demo source: a pipe dream count and a dropped monomial.
    expect(at('main.tex', 30).map((c: any) => c.verdict)).toEqual(['mismatch'])
    expect(at('main.tex', 30)[0].diff).toEqual({ basis: 'number', claimed: '4', computed: '5' })
    const grassmannian = at('main.tex', 41)[0]
    expect(grassmannian.verdict).toBe('mismatch')
    expect(grassmannian.diff.missing).toEqual([{ term: 'x_{2}x_{3}', coefficient: '1' }])
    for (const line of [25, 28, 34, 37, 39]) expect(at('main.tex', line).every((c: any) => c.verdict === 'verified')).toBe(true)
    expect(report.summary.mismatch).toBe(2)
    expect(report.files.find((f: any) => f.path === 'main.tex').sha256).toMatch(/^[0-9a-f]{64}$/)
    // Every claim the reader finds is indexed once, under the id the report gives it.
    const stored = await db.selectFrom('claims').select(['ordinal', 'report_id']).where('check_run_id', '=', checkRunId).orderBy('ordinal').execute()
    expect(stored.map(c => c.ordinal)).toEqual(report.claims.map((_: unknown, i: number) => i))
    expect(stored.map(c => c.report_id)).toEqual(report.claims.map((c: any) => c.id))
  })

  it('the report carries what the page renders: the paper\'s macros, each claim\'s expansion, and one copy of the scripts\' definitions', async () => {
    const { client, revisionId, checkRunId } = await uploadDemoDraft()
    await waitForRun(checkRunId, status => status === 'finished')
    const report = (await client.get(`/api/revisions/${revisionId}/report`)).body.report
    // main.tex defines \Sch and \Groth with \newcommand.
    expect(report.macros).toMatchObject({ '\\Sch': '\\mathfrak{S}_{#1}', '\\Groth': '\\mathfrak{G}_{#1}' })
    const sch = report.claims.find((c: any) => c.source.includes('\\Sch{'))
    expect(sch.expanded).toContain('\\mathfrak{S}_{')
    const scripted = report.claims.filter((c: any) => c.reproduce)
    expect(scripted.length).toBeGreaterThan(3)
    for (const c of scripted) for (const name of c.reproduce.needs) expect(report.reproduceLibrary.helpers[name]).toBeDefined()
    // The small progress answer carries the head (counts), never the claims.
    const run = (await client.get(`/api/check-runs/${checkRunId}`)).body
    expect(run.summary.summary.claims).toBe(report.claims.length)
    expect(run.summary).not.toHaveProperty('claims')
  })

  it('re-checks with conventions fixed for one run, and the sources come back as uploaded', async () => {
    const { client, revisionId, checkRunId } = await uploadDemoDraft()
    await waitForRun(checkRunId, status => status === 'finished')
    const again = await client.post(`/api/revisions/${revisionId}/checks`, { conventions: { doubleSign: 'xy-plus' } })
    expect(again.status).toBe(202)
    await waitForRun(again.body.checkRunId, status => status === 'finished')
    const report = (await client.get(`/api/revisions/${revisionId}/report`)).body.report
    expect(report.conventions.fixed).toEqual({ doubleSign: 'xy-plus' })
    // Under x_i + y_j the double-polynomial lines of sections/double.tex no longer hold.
    const doubles = report.claims.filter((c: any) => c.file === 'sections/double.tex' && c.kind === 'schubert')
    expect(doubles.length).toBeGreaterThan(0)
    expect(doubles.every((c: any) => c.verdict === 'mismatch' && c.holdsUnder.includes('xy-minus'))).toBe(true)
    const sources = await client.get(`/api/revisions/${revisionId}/sources`)
    expect(sources.body.files.find((f: any) => f.path === 'main.tex').text).toBe(demo('vexillary-flags/rev1/main.tex'))
    // One file at a time, as the report page's file tabs load them.
    const one = await client.get(`/api/revisions/${revisionId}/source?path=sections/double.tex`)
    expect(one.body).toEqual({ path: 'sections/double.tex', text: demo('vexillary-flags/rev1/sections/double.tex') })
    expect((await client.get(`/api/revisions/${revisionId}/source?path=nowhere.tex`)).status).toBe(404)
    expect((await client.get(`/api/revisions/${revisionId}/source`)).status).toBe(400)
  })

  it('refuses bad conventions and strangers', async () => {
    const { client, revisionId } = await uploadDemoDraft()
    const bad = await client.post(`/api/revisions/${revisionId}/checks`, { conventions: { doubleSign: 'xy-sideways' } })
    expect(bad.status).toBe(400)
    expect(bad.body.data.code).toBe('invalid-input')
    const stranger = await newMember('stranger')
    expect((await stranger.client.get(`/api/revisions/${revisionId}/report`)).status).toBe(404)
    expect((await stranger.client.post(`/api/revisions/${revisionId}/checks`, {})).status).toBe(404)
  })

  it('a manuscript setting fixes a convention and re-checks the newest revision', async () => {
    const { client, manuscriptId, checkRunId } = await uploadDemoDraft()
    await waitForRun(checkRunId, status => status === 'finished')
    const res = await client.request('PUT', `/api/manuscripts/${manuscriptId}/conventions`, { conventions: { indexing: 'perm-inverse' } })
    expect(res.status).toBe(200)
    const run = await waitForRun(res.body.checkRunId, status => status === 'finished')
    expect(run.conventions).toEqual({ indexing: 'perm-inverse' })
    const audit = await db.selectFrom('audit_log').select('action').where('subject_id', '=', manuscriptId).execute()
    expect(audit.map(a => a.action)).toContain('manuscript.conventions-set')
  })
})

// Double Schubert polynomials of permutations of S_7 take a fraction of a second each,
// so the run lasts long enough to be killed in the middle.
// (Chosen to take 0.2–1 s each here: about 5 s in all.)
const SLOW_PERMS = ['1536274', '3615274', '3542716', '3164725', '2461735', '3524716', '1462735', '2531746', '1364725', '2451763']
const SLOW_TEX = ['\\documentclass{article}', '\\begin{document}', ...SLOW_PERMS.map(p => `$\\mathfrak{S}_{${p}}(x;y) = (x_1 - y_1)(x_2 - y_1)$`), '\\end{document}', ''].join('\n')

/** A finished revision of SLOW_TEX plus a second run of it that is not on the queue. */
async function unqueuedSlowRun(): Promise<string> {
  const me = await newMember('killer')
  const { body: m } = await me.client.post('/api/manuscripts', { title: 'Slow draft' })
  const upload = await me.client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'slow.tex', content: SLOW_TEX }]))
  await waitForRun(upload.body.checkRunId, status => status === 'finished')
  // Only the worker started by the test takes it, until its lease runs out.
  const { id } = await db.insertInto('check_runs').values({ revision_id: upload.body.id, conventions: '{}', timings: '{}' }).returning('id').executeTakeFirstOrThrow()
  return id
}

/** Starts `scripts/worker.ts --run <id>`; resolves once its output matches `ready` (if given). */
function startWorker(runId: string, env: Record<string, string>, ready?: RegExp) {
  const worker = spawn(process.execPath, ['--import', 'tsx', 'scripts/worker.ts', '--run', runId], { env: { ...process.env, SCHOLIUM_LEASE_SECONDS: '3', ...env }, stdio: ['ignore', 'pipe', 'inherit'] })
  const exited = new Promise(resolve => worker.once('exit', resolve))
  const reached = new Promise<void>((resolve, reject) => {
    let out = ''
    worker.stdout!.on('data', (chunk) => {
      out += String(chunk)
      if (ready?.test(out)) resolve()
    })
    worker.once('exit', () => reject(new Error(`worker exited before ${ready}: ${out}`)))
  })
  // Killing a worker that was never waited on is expected, not an unhandled rejection.
  if (!ready) reached.catch(() => {})
  return { worker, exited, reached }
}

async function expectCompletedOnceByAnotherWorker(runId: string) {
  // The test profile's own worker sweeps expired leases and puts the run back on the queue.
  const run = await waitForRun(runId, status => status === 'finished', 90_000)
  expect(run.attempts).toBeGreaterThanOrEqual(2)
  const claims = await db.selectFrom('claims').select(['ordinal', 'line']).where('check_run_id', '=', runId).orderBy('ordinal').execute()
  expect(claims.map(c => c.ordinal)).toEqual(SLOW_PERMS.map((_, i) => i))
  expect(claims.map(c => c.line)).toEqual(SLOW_PERMS.map((_, i) => i + 3))
}

describe('a worker killed at each step of a run', () => {
  it('the slow manuscript has one claim per line', () => {
    expect(readManuscript({ files: { 'slow.tex': SLOW_TEX } }).claims.length).toBe(SLOW_PERMS.length)
  })

  it('killed right after taking the lease: another worker completes the run, nothing lost or duplicated', async () => {
    const runId = await unqueuedSlowRun()
    const { worker, exited, reached } = startWorker(runId, { SCHOLIUM_WORKER_HALT_AT: 'claimed' }, /halted at claimed/)
    await reached
    const held = await db.selectFrom('check_runs').select(['status', 'lease_owner']).where('id', '=', runId).executeTakeFirstOrThrow()
    expect(held.status).toBe('running')
    expect(held.lease_owner).not.toBeNull()
    worker.kill('SIGKILL')
    await exited
    await expectCompletedOnceByAnotherWorker(runId)
  })

  it('killed mid-evaluation: another worker completes the run, nothing lost or duplicated', async () => {
    const runId = await unqueuedSlowRun()
    const { worker, exited } = startWorker(runId, {})
    await waitForRun(runId, (status, done) => status === 'running' && done >= 2)
    worker.kill('SIGKILL')
    await exited
    expect((await db.selectFrom('check_runs').select('status').where('id', '=', runId).executeTakeFirstOrThrow()).status).toBe('running')
    await expectCompletedOnceByAnotherWorker(runId)
  })

  it('killed inside the final transaction, claims written but not committed: nothing half-written survives', async () => {
    const runId = await unqueuedSlowRun()
    const { worker, exited, reached } = startWorker(runId, { SCHOLIUM_WORKER_HALT_AT: 'committing' }, /halted at committing/)
    await reached
    // The claims are inserted in the open transaction: nobody else sees them yet.
    expect(await db.selectFrom('claims').select('id').where('check_run_id', '=', runId).execute()).toEqual([])
    worker.kill('SIGKILL')
    await exited
    await expectCompletedOnceByAnotherWorker(runId)
  })
})
