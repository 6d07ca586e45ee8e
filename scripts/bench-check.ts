// Benchmark of the whole check: a synthetic manuscript of 1,000 claims of mixed kinds (Schubert
// polynomials in S_4–S_6, products in the Schubert basis, double Schubert polynomials, Schur
// products, Littlewood–Richardson coefficients, lengths and counts), about one in ten written
// wrong, spread over a main file and ten section files. It is checked twice: in this process
// (checkManuscript, with a warm engine and in a fresh process) and through the command line as a user runs it (node bin/scholium.mjs check
// <folder> --json, process start-up included). Goal: under 5 s each.
// Run: npx tsx scripts/bench-check.ts
//
// The right-hand sides are written with the engine itself: this measures speed, not correctness
// (the corpus test, tests/reference/check/corpus.test.ts, checks correctness against lrcalc and sympy).
import { spawnSync } from 'node:child_process'
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { checkManuscript } from '../shared/check'
import { reproduceScript } from '../shared/check/reproduce-script'
import type { Report } from '../shared/types/report'
import { buildManuscript } from './lib/synthetic-manuscript'

const GOAL_MS = 5000
const CLAIMS = 1000
const SECTIONS = 10

const files = buildManuscript(CLAIMS, SECTIONS)
const dir = mkdtempSync(join(tmpdir(), 'scholium-bench-'))
try {
  mkdirSync(join(dir, 'sections'))
  for (const [path, content] of Object.entries(files)) writeFileSync(join(dir, path), content)

  let started = performance.now()
  const inProcess = checkManuscript({ files })
  const inProcessMs = performance.now() - started

  // The run above follows the generation, which warmed the engine; a fresh process shows the cold cost.
  const probe = join(dir, 'probe.ts')
  writeFileSync(probe, [
    `import { readFileSync } from 'node:fs'`,
    `import { checkManuscript } from ${JSON.stringify(join(import.meta.dirname, '../shared/check/index.ts'))}`,
    `const files = JSON.parse(readFileSync(${JSON.stringify(join(dir, 'files.json'))}, 'utf8'))`,
    `const t = performance.now()`,
    `const r = checkManuscript({ files })`,
    `console.log(JSON.stringify({ ms: performance.now() - t, report: r }))`,
  ].join('\n'))
  writeFileSync(join(dir, 'files.json'), JSON.stringify(files))
  const cold = spawnSync(process.execPath, ['--import', 'tsx', probe], { encoding: 'utf8', maxBuffer: 256 << 20, cwd: join(import.meta.dirname, '..') })
  if (cold.status !== 0) throw new Error(`the cold in-process run failed: ${cold.stderr}`)
  const { ms: coldMs, report: coldReport } = JSON.parse(cold.stdout) as { ms: number, report: Report }

  started = performance.now()
  const run = spawnSync(process.execPath, [join(import.meta.dirname, '../bin/scholium.mjs'), 'check', dir, '--json'], { encoding: 'utf8', maxBuffer: 256 << 20 })
  const cliMs = performance.now() - started
  if (run.status !== 0 && run.status !== 1) throw new Error(`scholium check exited ${run.status}: ${run.stderr}`)
  const viaCli = JSON.parse(run.stdout) as Report

  const row = (name: string, ms: number, r: Report) =>
    `| ${name.padEnd(30)} | ${String(Math.round(ms)).padStart(7)} | ${String(r.summary.durationMs).padStart(8)} | ${String(r.summary.claims).padStart(6)} | ${String(r.summary.verified).padStart(8)} | ${String(r.summary.mismatch).padStart(8)} | ${String(r.summary.unsupported + r.summary.error).padStart(7)} | ${ms < GOAL_MS ? 'yes' : 'NO '}  |`
  console.log(`Synthetic manuscript: ${Object.keys(files).length} files, ${Object.values(files).reduce((n, f) => n + f.length, 0).toLocaleString('en')} characters`)
  console.log('| path                           | wall ms | check ms | claims | verified | mismatch | other   | <5 s |')
  console.log('|--------------------------------|---------|----------|--------|----------|----------|---------|------|')
  console.log(row('in process, warm engine', inProcessMs, inProcess))
  console.log(row('in process, fresh process', coldMs, coldReport))
  console.log(row('command line (spawn, --json)', cliMs, viaCli))
  const verdicts = (r: Report) => JSON.stringify(r.claims.map(c => [c.file, c.line, c.verdict]))
  const same = verdicts(inProcess) === verdicts(viaCli) && verdicts(coldReport) === verdicts(viaCli)
  console.log(same ? 'Both paths give the same verdicts.' : 'WARNING: the two paths disagree.')
  // What the stored document weighs, against the same report with a whole script in every claim (version 1's form).
  const library = inProcess.reproduceLibrary
  const whole = { ...inProcess, reproduceLibrary: undefined, claims: inProcess.claims.map(c => c.reproduce ? { ...c, reproduce: reproduceScript(library, c) } : c) }
  const kib = (value: unknown) => `${Math.round(Buffer.byteLength(JSON.stringify(value)) / 1024).toLocaleString('en')} KiB`
  console.log(`Report JSON: ${kib(inProcess)} stored (definitions once, ${inProcess.claims.filter(c => c.reproduce).length} snippets); ${kib(whole)} with a whole script in every claim.`)
  if (inProcess.summary.claims !== CLAIMS) console.log(`WARNING: ${inProcess.summary.claims} claims found, ${CLAIMS} written.`)
  if (!same || inProcessMs >= GOAL_MS || coldMs >= GOAL_MS || cliMs >= GOAL_MS) process.exitCode = 1
}
finally {
  rmSync(dir, { recursive: true, force: true })
}
