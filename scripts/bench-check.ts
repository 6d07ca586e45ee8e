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
import {
  combinationEntries, countPipeDreams, countReducedWords, doubleSchubertPolynomial, littlewoodRichardson, Permutation,
  schubertPolynomial, schubertProduct, schurProduct,
} from '../shared/math'
import type { Report } from '../shared/types/report'

const GOAL_MS = 5000
const CLAIMS = 1000
const SECTIONS = 10

// mulberry32, so that every run checks the same manuscript
let seed = 1789
function rand(): number {
  seed = (seed + 0x6d2b79f5) >>> 0
  let t = seed
  t = Math.imul(t ^ (t >>> 15), t | 1)
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296
}
const randomInt = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1))
function randomPermutation(n: number, maxLength: number): Permutation {
  for (;;) {
    const line = Array.from({ length: n }, (_, i) => i + 1)
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(rand() * (i + 1))
      ;[line[i], line[j]] = [line[j]!, line[i]!]
    }
    const w = Permutation.fromOneLine(line)
    if (w.length() > 0 && w.length() <= maxLength) return w
  }
}
const written = (w: Permutation) => w.trimmed().oneLine.join('')
const PARTITIONS = [[1], [2], [1, 1], [3], [2, 1], [1, 1, 1], [4], [3, 1], [2, 2], [2, 1, 1]]
const part = (l: readonly number[]) => l.join('')
const wrongNow = () => rand() < 0.1

/** One claim of the given kind, as LaTeX (inline or display). */
function claim(kind: number): string {
  switch (kind) {
    case 0: case 1: case 2: { // Schubert polynomial in S_4–S_6
      const w = randomPermutation(randomInt(4, 6), 8)
      const p = schubertPolynomial(w)
      return `\\[ \\Sch{${written(w)}} = ${wrongNow() ? p.toLatex().replace(/ \+ [^+]*$/, '') || '0' : p.toLatex()} \\]`
    }
    case 3: case 4: { // a product in the Schubert basis
      const u = randomPermutation(randomInt(3, 5), 3)
      const v = randomPermutation(randomInt(3, 5), 3)
      const terms = combinationEntries(schubertProduct(u, v))
      if (terms.some(t => t.permutation.size > 9)) return claim(kind)
      const drop = wrongNow() && terms.length > 1
      const rhs = (drop ? terms.slice(1) : terms).map(t => `${t.coefficient === 1 ? '' : `${t.coefficient}\\,`}\\Sch{${written(t.permutation)}}`).join(' + ')
      return `\\[ \\Sch{${written(u)}}\\,\\Sch{${written(v)}} = ${rhs} \\]`
    }
    case 5: { // a double Schubert polynomial
      const w = randomPermutation(randomInt(3, 4), 4)
      return `\\[ \\mathfrak{S}_{${written(w)}}(x;y) = ${doubleSchubertPolynomial(w).toLatex()} \\]`
    }
    case 6: { // a product of Schur functions
      const a = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const b = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const terms = [...schurProduct(a, b)].map(([key, c]) => `${c === 1 ? '' : `${c}\\,`}s_{${key.split(',').join('')}}`)
      return `\\[ s_{${part(a)}}\\, s_{${part(b)}} = ${terms.join(' + ')} \\]`
    }
    case 7: { // a Littlewood–Richardson coefficient
      const a = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const b = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const nu = [...schurProduct(a, b).keys()][0]!.split(',').map(Number)
      return `$c^{${part(nu)}}_{${part(a)},${part(b)}} = ${littlewoodRichardson(nu, a, b) + (wrongNow() ? 1 : 0)}$`
    }
    case 8: { // a length
      const w = randomPermutation(randomInt(4, 6), 10)
      return `$\\ell(${written(w)}) = ${w.length()}$`
    }
    default: { // a count
      const w = randomPermutation(randomInt(4, 6), 8)
      return rand() < 0.5 ? `$\\#\\PD(${written(w)}) = ${countPipeDreams(w)}$` : `$\\#\\Red(${written(w)}) = ${countReducedWords(w)}$`
    }
  }
}

const PROSE = 'We compare the expansions term by term and note where each monomial comes from in the staircase.'
function buildManuscript(): Record<string, string> {
  const files: Record<string, string> = {}
  let made = 0
  for (let s = 1; s <= SECTIONS; s++) {
    const lines = [`\\section{Part ${s}}`]
    const wanted = Math.round((CLAIMS * s) / SECTIONS) - made
    for (let k = 0; k < wanted; k++) lines.push(PROSE, claim((made + k) % 10), '')
    made += wanted
    files[`sections/part${s}.tex`] = lines.join('\n')
  }
  files['main.tex'] = [
    '\\documentclass{amsart}',
    '\\newcommand{\\Sch}[1]{\\mathfrak{S}_{#1}}',
    '\\DeclareMathOperator{\\PD}{PD}',
    '\\DeclareMathOperator{\\Red}{Red}',
    '\\begin{document}',
    ...Array.from({ length: SECTIONS }, (_, i) => `\\input{sections/part${i + 1}}`),
    '\\end{document}',
  ].join('\n')
  return files
}

const files = buildManuscript()
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
  if (inProcess.summary.claims !== CLAIMS) console.log(`WARNING: ${inProcess.summary.claims} claims found, ${CLAIMS} written.`)
  if (!same || inProcessMs >= GOAL_MS || coldMs >= GOAL_MS || cliMs >= GOAL_MS) process.exitCode = 1
}
finally {
  rmSync(dir, { recursive: true, force: true })
}
