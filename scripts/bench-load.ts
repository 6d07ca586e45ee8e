// Load benchmark of the report (issue 11): signs in, then reads the report JSON and the report
// page with 50 concurrent clients for 20 s each, alone and during 5 re-checks, and prints
// p50/p95/p99 of every response's latency (goal: report JSON p95 under 200 ms on this 2-core
// machine, with the load tool on the same machine). The report read is a 50-claim synthetic
// manuscript; the 5 re-checks are of a 1,000-claim one, so the worker's threads compete for the CPU.
//
//   npx tsx scripts/bench-load.ts [base URL]           # against a running app (npm start)
//   npx tsx scripts/bench-load.ts --compare <output>   # side by side: two app processes from a build
//                                                      # (e.g. .cache/demo-output), report cache on / off
//   npx tsx scripts/bench-load.ts --compare <old output> --against <new output>   # two builds side by side
// --compare starts `node <output>/server/index.mjs` twice on ports 3190 and 3191 (--port moves them),
// with the NUXT_* variables of this shell (npm start's local defaults when unset; NUXT_SESSION_PASSWORD
// falls back to storage/demo/session-password), one with SCHOLIUM_REPORT_CACHE_ENTRIES=0 (or, with
// --against, the other build), and measures one at a time, alternating between the two phase by
// phase, so that other load on the machine falls on both alike. A running worker is needed for the
// re-checks either way.
// Options: --seconds N (default 20), --connections N (default 50), --port N (default 3190).
import { randomUUID } from 'node:crypto'
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import autocannon from 'autocannon'
import { buildManuscript } from './lib/synthetic-manuscript'

const args = process.argv.slice(2)
const option = (name: string) => {
  const at = args.indexOf(name)
  return at === -1 ? undefined : args[at + 1]
}
const seconds = Number(option('--seconds') ?? 20)
const connections = Number(option('--connections') ?? 50)
const compareOutput = option('--compare')
const againstOutput = option('--against')
const firstPort = Number(option('--port') ?? 3190)
const base = compareOutput ? undefined : (args.find(a => a.startsWith('http')) ?? 'http://127.0.0.1:3000')

class Session {
  cookie = ''
  constructor(readonly base: string) {}
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- JSON bodies of several routes; the script reads a few fields
  async call(method: string, path: string, body?: unknown): Promise<any> {
    const headers: Record<string, string> = { cookie: this.cookie }
    let payload: BodyInit | undefined
    if (body instanceof FormData) payload = body
    else if (body !== undefined) {
      headers['content-type'] = 'application/json'
      payload = JSON.stringify(body)
    }
    const response = await fetch(new URL(path, this.base), { method, headers, body: payload })
    const set = response.headers.getSetCookie()
    if (set.length) this.cookie = set.map(c => c.split(';')[0]).join('; ')
    if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${await response.text()}`)
    return response.json()
  }
}

async function signIn(session: Session, email: string, password: string) {
  await session.call('POST', '/api/auth/sign-up', { email, displayName: 'Load benchmark', password }).catch(() => {})
  await session.call('POST', '/api/auth/sign-in', { email, password })
}

async function uploadChecked(session: Session, title: string, files: Record<string, string>): Promise<string> {
  const { id } = await session.call('POST', '/api/manuscripts', { title })
  const form = new FormData()
  for (const [path, content] of Object.entries(files)) form.append('files', new Blob([content]), path)
  const revision = await session.call('POST', `/api/manuscripts/${id}/revisions`, form)
  await waitFinished(session, revision.id)
  return revision.id
}

async function waitFinished(session: Session, revisionId: string, timeoutMs = 180_000): Promise<void> {
  const started = Date.now()
  for (;;) {
    const view = await session.call('GET', `/api/revisions/${revisionId}/report`)
    if (view.run?.status === 'finished' && view.report) return
    if (view.run?.status === 'failed') throw new Error(`run failed: ${view.run.error}`)
    if (Date.now() - started > timeoutMs) throw new Error('no finished report in time')
    await new Promise(resolve => setTimeout(resolve, 200))
  }
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN
  return sorted[Math.min(sorted.length - 1, Math.ceil(p / 100 * sorted.length) - 1)]!
}

interface Row { what: string, requests: number, rps: number, p50: number, p95: number, p99: number, max: number, failures: number, toolCpu: number, appCpu: number, machineCpu: number }

/** CPU seconds a process has used so far (Linux /proc), or NaN when unknown. */
function processCpuSeconds(pid: number | undefined): number {
  if (!pid) return NaN
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ')
    return (Number(fields[11]) + Number(fields[12])) / 100 // utime + stime, in clock ticks of 1/100 s
  }
  catch {
    return NaN
  }
}

/** Busy and total CPU ticks of the whole machine (all cores). */
function machineTicks(): { busy: number, total: number } {
  const [, ...ticks] = readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/).map(Number)
  const total = ticks.reduce((a, b) => a + b, 0)
  return { busy: total - ticks[3]! - ticks[4]!, total }
}

/** The pid serving a base URL, when this script started it (--compare). */
const appPids = new Map<string, number>()

async function load(what: string, url: string, cookie: string): Promise<Row> {
  const latencies: number[] = []
  const appPid = appPids.get(new URL(url).origin)
  const [tool0, app0, machine0] = [process.cpuUsage(), processCpuSeconds(appPid), machineTicks()]
  const instance = autocannon({ url, connections, duration: seconds, headers: { cookie } })
  instance.on('response', (_client, _status, _bytes, ms) => latencies.push(ms))
  const result = await instance
  const tool = process.cpuUsage(tool0)
  const machine1 = machineTicks()
  latencies.sort((a, b) => a - b)
  return {
    // CPU shares in % of one core over the window (the machine's: of all its cores together).
    toolCpu: Math.round((tool.user + tool.system) / 1e6 / seconds * 100),
    appCpu: Math.round((processCpuSeconds(appPid) - app0) / seconds * 100),
    machineCpu: Math.round((machine1.busy - machine0.busy) / (machine1.total - machine0.total) * 100),
    what,
    requests: result.requests.total,
    rps: Math.round(result.requests.total / seconds),
    p50: percentile(latencies, 50),
    p95: percentile(latencies, 95),
    p99: percentile(latencies, 99),
    max: result.latency.max,
    failures: result.errors + result.timeouts + result.non2xx,
  }
}

/** Asks for 5 re-checks of the big revision; resolves with how many finished, once all have. */
async function recheck(session: Session, revisionId: string): Promise<() => Promise<number>> {
  const ids: string[] = []
  for (let i = 0; i < 5; i++) {
    const { checkRunId } = await session.call('POST', `/api/revisions/${revisionId}/checks`, { conventions: {} })
    ids.push(checkRunId)
  }
  return async () => {
    let finished = 0
    for (const id of ids) {
      const run = await session.call('GET', `/api/check-runs/${id}`)
      if (run.status === 'finished') finished++
    }
    return finished
  }
}

interface Target { label: string, session: Session, json: string, page: string, big: string }

async function prepare(label: string, appBase: string): Promise<Target> {
  const session = new Session(appBase)
  await signIn(session, `load-${randomUUID().slice(0, 8)}@bench.scholium.example`, 'load benchmark password')
  const small = await uploadChecked(session, `Load benchmark 50 claims ${new Date().toISOString()}`, buildManuscript(50, 2, 4292))
  const big = await uploadChecked(session, `Load benchmark 1,000 claims ${new Date().toISOString()}`, buildManuscript(1000, 10, 5242))
  return { label, session, json: `${appBase}/api/revisions/${small}/report`, page: `${appBase}/revisions/${small}`, big }
}

/** The four phases, each measured on every target in turn before the next phase. */
async function measure(targets: Target[]): Promise<Row[]> {
  const rows: Row[] = []
  for (const what of ['json', 'page'] as const) {
    for (const t of targets) rows.push(await load(`${t.label} report ${what === 'json' ? 'JSON' : 'page'}, alone`, t[what], t.session.cookie))
  }
  for (const what of ['json', 'page'] as const) {
    for (const t of targets) {
      const finishedCount = await recheck(t.session, t.big)
      const row = await load(`${t.label} report ${what === 'json' ? 'JSON' : 'page'}, during 5 re-checks`, t[what], t.session.cookie)
      row.what += ` (${await finishedCount()}/5 finished in the window)`
      rows.push(row)
      await waitFinished(t.session, t.big, 300_000)
    }
  }
  return rows
}

function startApp(output: string, port: number, env: Record<string, string>): Promise<ChildProcess> {
  const password = process.env.NUXT_SESSION_PASSWORD ?? (existsSync('storage/demo/session-password') ? readFileSync('storage/demo/session-password', 'utf8').trim() : undefined)
  if (!password) throw new Error('set NUXT_SESSION_PASSWORD (or run npm start once, which writes storage/demo/session-password)')
  const child = spawn(process.execPath, [join(output, 'server/index.mjs')], {
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), NUXT_SESSION_PASSWORD: password, NUXT_PUBLIC_BASE_URL: `http://127.0.0.1:${port}`, ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  return new Promise((resolve, reject) => {
    const started = Date.now()
    const poll = async () => {
      if (child.exitCode !== null) return reject(new Error(`the app on port ${port} exited`))
      const ok = await fetch(`http://127.0.0.1:${port}/api/health`).then(r => r.status === 200).catch(() => false)
      if (ok) return resolve(child)
      if (Date.now() - started > 60_000) return reject(new Error(`the app on port ${port} did not answer`))
      setTimeout(poll, 200)
    }
    void poll()
  })
}

const rows: Row[] = []
if (compareOutput) {
  const apps: ChildProcess[] = []
  try {
    const sides = againstOutput
      ? [[`old (${compareOutput}):`, compareOutput, '200'], [`new (${againstOutput}):`, againstOutput, '200']] as const
      : [['cache on: ', compareOutput, '200'], ['cache off:', compareOutput, '0']] as const
    const targets: Target[] = []
    for (const [i, [label, output, entries]] of sides.entries()) {
      const app = await startApp(output, firstPort + i, { SCHOLIUM_REPORT_CACHE_ENTRIES: entries })
      apps.push(app)
      appPids.set(`http://127.0.0.1:${firstPort + i}`, app.pid!)
      targets.push(await prepare(label, `http://127.0.0.1:${firstPort + i}`))
    }
    rows.push(...await measure(targets))
  }
  finally {
    for (const app of apps) app.kill('SIGTERM')
  }
}
else {
  rows.push(...await measure([await prepare('', base!)]))
}

console.log(`\n${connections} concurrent clients, ${seconds} s each; latency of every response in ms (autocannon 9.0.0 on the same machine)\n`)
console.log('CPU: % of one core used by this process (autocannon) and by the app during the window; machine: % of all cores busy (everything on it)\n')
console.log('| what | requests | req/s | p50 | p95 | p99 | max | failures | tool CPU | app CPU | machine |')
console.log('|------|---------:|------:|----:|----:|----:|----:|---------:|---------:|--------:|--------:|')
const ms = (n: number) => Math.round(n)
for (const r of rows) console.log(`| ${r.what} | ${r.requests} | ${r.rps} | ${ms(r.p50)} | ${ms(r.p95)} | ${ms(r.p99)} | ${r.max} | ${r.failures} | ${r.toolCpu}% | ${Number.isNaN(r.appCpu) ? '–' : `${r.appCpu}%`} | ${r.machineCpu}% |`)
const jsonAlone = rows.filter(r => r.what.includes('report JSON'))
for (const r of jsonAlone) console.log(`${r.what}: p95 ${ms(r.p95)} ms — goal (p95 < 200 ms) ${r.p95 < 200 ? 'met' : 'NOT met'}`)
