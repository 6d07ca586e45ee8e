// Benchmark of the uploaded path: how long after an upload finishes its report is ready,
// for a 50-claim paper (goal: 2 s) and a 1,000-claim manuscript (goal: 5 s), side by side
// with the same manuscripts checked in this process.
// Needs a running Scholium with its worker: start `npm start`, then, in another shell:
//   npx tsx scripts/bench-upload.ts [http://127.0.0.1:3000]
import { randomUUID } from 'node:crypto'
import { checkManuscript } from '../shared/check'
import { buildManuscript } from './lib/synthetic-manuscript'

const base = process.argv[2] ?? 'http://127.0.0.1:3000'
let cookie = ''

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- JSON bodies of several routes; the script reads a few fields
async function call(method: string, path: string, body?: unknown): Promise<any> {
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
  if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${await response.text()}`)
  return response.json()
}

async function uploadAndWait(title: string, files: Record<string, string>) {
  const { id } = await call('POST', '/api/manuscripts', { title })
  const form = new FormData()
  for (const [path, content] of Object.entries(files)) form.append('files', new Blob([content]), path)
  const uploadStarted = performance.now()
  const revision = await call('POST', `/api/manuscripts/${id}/revisions`, form)
  const uploaded = performance.now()
  for (;;) {
    const view = await call('GET', `/api/revisions/${revision.id}/report`)
    if (view.run?.status === 'finished' && view.report) return { uploadMs: uploaded - uploadStarted, readyMs: performance.now() - uploaded, claims: view.report.summary.claims }
    if (view.run?.status === 'failed') throw new Error(`run failed: ${view.run.error}`)
    if (performance.now() - uploaded > 120_000) throw new Error('no report after 120 s')
    await new Promise(resolve => setTimeout(resolve, 25))
  }
}

await call('POST', '/api/auth/sign-up', { email: `bench-${randomUUID().slice(0, 8)}@bench.scholium.example`, displayName: 'Benchmark', password: 'benchmark-password' })
console.log(`Scholium at ${base}`)
console.log('| manuscript  | claims | upload ms | report ready ms after upload | in-process check ms | goal     |')
console.log('|-------------|--------|-----------|------------------------------|---------------------|----------|')
for (const [label, claims, sections, goalMs] of [['50 claims', 50, 2, 2000], ['1,000 claims', 1000, 10, 5000]] as const) {
  const files = buildManuscript(claims, sections, 4242 + claims)
  const started = performance.now()
  checkManuscript({ files })
  const inProcessMs = performance.now() - started
  const result = await uploadAndWait(`Benchmark ${label} ${new Date().toISOString()}`, files)
  console.log(`| ${label.padEnd(11)} | ${String(result.claims).padStart(6)} | ${String(Math.round(result.uploadMs)).padStart(9)} | ${String(Math.round(result.readyMs)).padStart(28)} | ${String(Math.round(inProcessMs)).padStart(19)} | ${result.readyMs < goalMs ? 'met' : 'NOT met'} (${goalMs / 1000} s) |`)
}
