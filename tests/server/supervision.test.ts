// Issue 11: a dead worker never stops checking. scripts/test.sh runs the check worker under
// npm start's supervisor (scripts/supervise.ts); these tests kill it and freeze it.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { Client, db, demoClient, eventually, filesForm, newMember, SMALL_TEX, waitForRun } from './helpers'
import { LIVE_WITHIN_SECONDS } from '../../server/repositories/workers'

// Double Schubert polynomials of permutations of S_7: a few seconds in all, long enough to kill mid-run.
const PERMS = ['2637154', '4617253', '3716254', '2547163', '4263715', '3627154', '2743165', '5362714', '2571634', '4372615']
const SLOW_TEX = ['\\documentclass{article}', '\\begin{document}', ...PERMS.map(p => `$\\mathfrak{S}_{${p}}(x;y) = (x_1 - y_1)(x_2 - y_1)$`), '\\end{document}', ''].join('\n')

async function liveWorkers() {
  return db.selectFrom('worker_heartbeats').select(['worker_id', 'pid'])
    .where('seen_at', '>', new Date(Date.now() - LIVE_WITHIN_SECONDS * 1000)).execute()
}

async function upload(client: Client, content: string) {
  const { body: m } = await client.post('/api/manuscripts', { title: 'Supervised draft' })
  const res = await client.post(`/api/manuscripts/${m.id}/revisions`, filesForm([{ name: 'main.tex', content }]))
  expect(res.status).toBe(201)
  return { revisionId: res.body.id as string, checkRunId: res.body.checkRunId as string }
}

/** The pid of the worker holding the run's lease, once it holds it. */
async function leaseHolderPid(checkRunId: string): Promise<number> {
  const owner = await eventually('the run is taken', async () => {
    const run = await db.selectFrom('check_runs').select(['status', 'lease_owner']).where('id', '=', checkRunId).executeTakeFirstOrThrow()
    return run.status === 'running' && run.lease_owner ? run.lease_owner : undefined
  }, 60_000, 50)
  // scripts/worker.ts names itself host:pid:random.
  return Number(owner.split(':').at(-2))
}

describe('the supervised check worker', () => {
  it('killed in the middle of a run: the supervisor starts another, which finishes the run once, nothing duplicated', async () => {
    const me = await newMember('supervised')
    const before = await liveWorkers()
    expect(before.length).toBeGreaterThanOrEqual(1)
    const { checkRunId } = await upload(me.client, SLOW_TEX)
    const pid = await leaseHolderPid(checkRunId)
    expect(before.map(w => w.pid)).toContain(pid)
    process.kill(pid, 'SIGKILL')

    // A new worker process says it is alive.
    const replacement = await eventually('a restarted worker', async () => (await liveWorkers()).find(w => w.pid !== pid && !before.some(b => b.pid === w.pid)), 30_000, 200)
    expect(replacement.pid).not.toBe(pid)
    const run = await waitForRun(checkRunId, status => status === 'finished', 90_000)
    expect(run.attempts).toBeGreaterThanOrEqual(2)
    const claims = await db.selectFrom('claims').select(['ordinal', 'line', 'verdict']).where('check_run_id', '=', checkRunId).orderBy('ordinal').execute()
    expect(claims.map(c => c.ordinal)).toEqual(PERMS.map((_, i) => i))
    expect(claims.map(c => c.line)).toEqual(PERMS.map((_, i) => i + 3))
    expect(claims.every(c => c.verdict !== null)).toBe(true)
    // The supervisor logged the death and the restart.
    const log = readFileSync(join(process.env.SCHOLIUM_TEST_RESULTS!, 'worker.log'), 'utf8')
    expect(log).toMatch(new RegExp(`worker-1 \\(pid ${pid}\\) died with SIGKILL after [\\d.]+ s; restarting in [\\d.]+ s`))
    expect(log).toContain(`worker-1 started (pid ${replacement.pid})`)
  })

  it('frozen mid-run: the run shows "waiting for a worker" (queued, not running) and health says no worker; it finishes once the worker is back', async () => {
    const me = await newMember('frozen')
    const { checkRunId } = await upload(me.client, SLOW_TEX)
    const pid = await leaseHolderPid(checkRunId)
    process.kill(pid, 'SIGSTOP')
    try {
      const view = await eventually('the run waits for a worker', async () => {
        const res = await me.client.get(`/api/check-runs/${checkRunId}`)
        return res.body.waitingForWorker ? res.body : undefined
      }, 30_000, 250)
      expect(view.status).toBe('queued')
      // The stored row still says running: only the view knows its lease ran out with nobody alive.
      expect((await db.selectFrom('check_runs').select('status').where('id', '=', checkRunId).executeTakeFirstOrThrow()).status).toBe('running')
      const health = await new Client().get('/api/health')
      expect(health.status).toBe(200)
      expect(health.body).toMatchObject({ ok: false, database: { ok: true }, storage: { ok: true }, mail: { ok: true }, workers: { live: 0 } })
      expect(health.body.queue.leaseExpired).toBeGreaterThanOrEqual(1)
      // A new upload says the same while no worker is alive.
      const fresh = await upload(me.client, SMALL_TEX)
      expect((await me.client.get(`/api/check-runs/${fresh.checkRunId}`)).body).toMatchObject({ status: 'queued', waitingForWorker: true })
    }
    finally {
      process.kill(pid, 'SIGCONT')
    }
    await waitForRun(checkRunId, status => status === 'finished', 90_000)
    expect((await me.client.get(`/api/check-runs/${checkRunId}`)).body).toMatchObject({ status: 'finished', waitingForWorker: false })
    const claims = await db.selectFrom('claims').select('ordinal').where('check_run_id', '=', checkRunId).orderBy('ordinal').execute()
    expect(claims.map(c => c.ordinal)).toEqual(PERMS.map((_, i) => i))
  })
})

describe('/api/health', () => {
  it('reports database, S3, mail, queue depth and live workers; worker hosts and pids only to the site admin', async () => {
    await eventually('exactly one live worker', async () => (await liveWorkers()).length === 1 ? true : undefined, 30_000, 200)
    const anonymous = await new Client().get('/api/health')
    expect(anonymous.status).toBe(200)
    expect(anonymous.body).toMatchObject({ ok: true, database: { ok: true }, storage: { ok: true }, mail: { ok: true }, workers: { live: 1 } })
    expect(anonymous.body.queue).toEqual({ waiting: expect.any(Number), running: expect.any(Number), leaseExpired: expect.any(Number) })
    expect(anonymous.body.workers.list).toBeUndefined()
    const admin = await (await demoClient('admin')).get('/api/health')
    expect(admin.body.workers.list).toEqual([expect.objectContaining({ pid: expect.any(Number), host: expect.any(String), threads: expect.any(Number) })])
  })
})
