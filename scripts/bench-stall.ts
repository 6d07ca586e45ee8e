// Upload-stall benchmark (issue 11): while one large upload is sent, other requests go on;
// prints the latency of those other requests (goal: none over 200 ms). Two uploads, one at a time:
// 55 MiB (over the 50 MiB unpacked limit, so received in full and then refused) and 45 MiB
// (accepted: a small main.tex and three 15 MiB figures, under the 20 MiB per-file limit, stored in S3 and recorded). Meanwhile 4 loops
// (in a worker thread of their own) each send GET /api/desk (session check + database) and GET /api/_auth/session one after the other.
// The quiet baseline's count over 200 ms is printed too: on a shared machine it is not zero either.
//
//   npx tsx scripts/bench-stall.ts [base URL]     # against a running app (npm start)
import { randomUUID } from 'node:crypto'
import { Worker } from 'node:worker_threads'

const base = process.argv.find(a => a.startsWith('http')) ?? 'http://127.0.0.1:3000'
const MiB = 1024 * 1024
let cookie = ''

async function call(method: string, path: string, body?: unknown) {
  const headers: Record<string, string> = { cookie }
  let payload: BodyInit | undefined
  if (body instanceof FormData) payload = body
  else if (body !== undefined) {
    headers['content-type'] = 'application/json'
    payload = JSON.stringify(body)
  }
  const response = await fetch(new URL(path, base), { method, headers, body: payload })
  const set = response.headers.getSetCookie()
  if (set.length) cookie = set.map(c => c.split(';')[0]).join('; ')
  return { status: response.status, text: await response.text() }
}

const email = `stall-${randomUUID().slice(0, 8)}@bench.scholium.example`
await call('POST', '/api/auth/sign-up', { email, displayName: 'Stall benchmark', password: 'stall benchmark password' })
if ((await call('POST', '/api/auth/sign-in', { email, password: 'stall benchmark password' })).status !== 200) throw new Error('sign-in failed')
const manuscript = JSON.parse((await call('POST', '/api/manuscripts', { title: `Stall benchmark ${new Date().toISOString()}` })).text)

function percentile(sorted: number[], p: number): number {
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil(p / 100 * sorted.length) - 1)]! : NaN
}

// The probe loops run in a worker thread of their own: sending a 55 MiB form body keeps this
// thread busy for several hundred ms at a time (undici reading the Blob), which, with the probes
// on the same thread, was counted as the app's stall.
const PROBE_LOOPS = `
const { parentPort, workerData } = require('node:worker_threads')
const latencies = []
let over = false
parentPort.once('message', () => { over = true })
const loop = async (path) => {
  while (!over) {
    const started = performance.now()
    const res = await fetch(new URL(path, workerData.base), { headers: { cookie: workerData.cookie } })
    await res.arrayBuffer()
    if (res.status !== 200) throw new Error('probe ' + path + ': ' + res.status)
    latencies.push(performance.now() - started)
  }
}
Promise.all(workerData.paths.map(loop)).then(() => parentPort.postMessage(latencies))
`

/** Runs the probe loops (in a worker thread) until `done` settles; returns every probe's latency in ms. */
async function probeWhile(done: Promise<unknown>): Promise<number[]> {
  // nuxt-auth-utils' session route; /api/auth/session is no route (a 404 through the renderer).
  const paths = ['/api/desk', '/api/_auth/session', '/api/desk', '/api/_auth/session']
  const worker = new Worker(PROBE_LOOPS, { eval: true, workerData: { base, cookie, paths } })
  const result = new Promise<number[]>((resolve, reject) => {
    worker.once('message', resolve)
    worker.once('error', reject)
  })
  void done.finally(() => worker.postMessage('stop'))
  const latencies = await result
  await worker.terminate()
  return latencies.sort((a, b) => a - b)
}

function filled(bytes: number, seed: string): Uint8Array<ArrayBuffer> {
  const out = new Uint8Array(new ArrayBuffer(bytes))
  const line = new TextEncoder().encode(`% ${seed} padding line of a very large source file, for the stall benchmark\n`)
  for (let i = 0; i < bytes; i += line.length) out.set(line.subarray(0, Math.min(line.length, bytes - i)), i)
  return out
}

const rows: string[] = []
for (const [label, build] of [
  ['55 MiB .tex (refused: over 50 MiB)', () => {
    const form = new FormData()
    form.append('files', new Blob([filled(55 * MiB, randomUUID())]), 'huge.tex')
    return form
  }],
  ['45 MiB: 3 figures + main.tex (accepted)', () => {
    const form = new FormData()
    form.append('files', new Blob(['\\documentclass{article}\n\\begin{document}\n$\\mathfrak{S}_{132} = x_1 + x_2$\n\\end{document}\n']), 'main.tex')
    for (const n of [1, 2, 3]) form.append('files', new Blob([filled(15 * MiB, randomUUID())]), `figure-${n}.png`)
    return form
  }],
] as const) {
  // A quiet baseline first, then the same probes during the upload.
  const baseline = await probeWhile(new Promise(resolve => setTimeout(resolve, 3000)))
  const started = performance.now()
  const upload = call('POST', `/api/manuscripts/${manuscript.id}/revisions`, build())
  const during = await probeWhile(upload)
  const { status } = await upload
  const uploadMs = Math.round(performance.now() - started)
  const over = during.filter(ms => ms > 200).length
  const quietOver = baseline.filter(ms => ms > 200).length
  rows.push(`| ${label} | ${status} | ${uploadMs} | ${during.length} | ${percentile(baseline, 50).toFixed(1)} / ${percentile(baseline, 99).toFixed(1)} / ${baseline.at(-1)!.toFixed(1)} | ${percentile(during, 50).toFixed(1)} / ${percentile(during, 99).toFixed(1)} / ${during.at(-1)!.toFixed(1)} | ${over} | ${quietOver} of ${baseline.length} |`)
}
console.log(`\nOther requests while one large upload runs (4 sequential loops on the same machine as the app), ms\n`)
console.log('| upload | status | upload ms | probes during | quiet p50 / p99 / max | during p50 / p99 / max | probes over 200 ms | quiet probes over 200 ms |')
console.log('|--------|-------:|----------:|--------------:|----------------------:|-----------------------:|-------------------:|-------------------------:|')
for (const row of rows) console.log(row)
