// Issue 11: what a reader sees of a run whose worker died (server/services/check-runs.ts).
import { describe, expect, it } from 'vitest'
import { checkRunView, runStatus } from '../../../server/services/check-runs'
import type { CheckRunHead } from '../../../server/database/schema'

const now = new Date('2026-12-02T10:00:00Z')
const row = (status: CheckRunHead['status'], leaseUntil: Date | null): CheckRunHead => ({
  id: 'r', revision_id: 'v', status, engine_version: null, conventions: {}, claims_total: 10, claims_done: 3, timings: {}, summary: {},
  error: null, attempts: 1, requested_by: null, queued_at: now, started_at: now, finished_at: null, lease_owner: 'w', lease_until: leaseUntil, what_if: false,
})

describe('a run\'s status as the UI shows it', () => {
  it('a running run whose lease ran out is queued (nobody is checking it), one still leased is running', () => {
    expect(runStatus(row('running', new Date(now.getTime() - 1)), now)).toBe('queued')
    expect(runStatus(row('running', new Date(now.getTime() + 1000)), now)).toBe('running')
    expect(runStatus(row('finished', null), now)).toBe('finished')
  })
  it('waits for a worker only when it waits and no worker is alive', () => {
    const expired = row('running', new Date(Date.now() - 1000))
    expect(checkRunView(expired, false)).toMatchObject({ status: 'queued', waitingForWorker: true })
    expect(checkRunView(expired, true)).toMatchObject({ status: 'queued', waitingForWorker: false })
    expect(checkRunView(row('queued', null), false).waitingForWorker).toBe(true)
    expect(checkRunView(row('running', new Date(Date.now() + 60_000)), false)).toMatchObject({ status: 'running', waitingForWorker: false })
    expect(checkRunView({ ...row('finished', null), lease_owner: null }, false).waitingForWorker).toBe(false)
  })
})
