/**
 * Benchmark of Grassmannian and skew computations (not a test). Run: npx tsx scripts/bench-grassmannian.ts [--quick]
 *
 * (e) Quantum products σ_λ ⋆ σ_μ in QH*(Gr(4,9)) side by side with Debian's `lrcalc mult -q 4,5`.
 * (f) Skew Schur functions s_{λ/μ} with |λ/μ| = 12 side by side with `lrcalc skew`.
 * For each input, results are compared term by term, and reported are: our in-process time (cold first
 * call and warm median), our whole-process time (a fresh node process running a bundled copy of the
 * engine and printing every term, as lrcalc does), lrcalc's whole-process time, lrcalc's time net of
 * its own start-up (its whole-process time minus that of a trivial product, `1 - 1`; an estimate of
 * its in-process time, since lrcalc has no in-process interface we can call), and the ratios.
 * `--quick` runs fewer inputs with one repetition each.
 */
import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { fmt, median, table, time } from './lib/bench-table'
import { ENGINE_VERSION, partitionKey, quantumKey, quantumProduct, skewSchurExpansion, type Partition } from '../shared/math'

const here = dirname(fileURLToPath(import.meta.url))
const quick = process.argv.includes('--quick')
const LRCALC = '/usr/bin/lrcalc'

/** Pairs of classes of Gr(4,9) (the box is 4 × 5), from small to large products. */
const QUANTUM_PAIRS: [Partition, Partition][] = [
  [[1], [5, 4, 3, 2]],
  [[3, 1], [4, 3, 2]],
  [[2, 2, 1], [5, 3, 3, 1]],
  [[3, 2, 1], [4, 4, 2, 1]],
  [[4, 2, 2, 1], [5, 3, 2, 2]],
  [[5, 3, 2, 1], [4, 4, 3, 2]],
  [[5, 4, 2, 1], [5, 3, 3, 2]],
  [[5, 5, 3, 2], [4, 4, 3, 3]],
  [[5, 4, 4, 3], [5, 5, 3, 2]],
]

/** Skew shapes λ/μ with 12 boxes. */
const SKEW_SHAPES: [Partition, Partition][] = [
  [[7, 6], [1]],
  [[5, 4, 4], [1]],
  [[8, 6, 5, 3], [4, 3, 2, 1]],
  [[7, 6, 4, 3, 1], [5, 3, 1]],
  [[6, 5, 4, 3, 2, 1], [3, 2, 2, 1, 1]],
  [[7, 5, 4, 3, 2, 1], [4, 3, 2, 1]],
  [[5, 5, 4, 4, 3, 3], [4, 3, 2, 2, 1]],
  [[6, 6, 5, 5, 4, 4], [5, 4, 4, 3, 2, 1]],
]

/** A bundled entry so that a fresh `node` runs the engine without a TypeScript loader: `quantum k n λ - μ` or `skew λ - μ`. */
async function bundleWorker(dir: string): Promise<string> {
  const entry = join(dir, 'worker.ts')
  writeFileSync(entry, `
import { quantumProduct, quantumEntries, skewSchurExpansion } from ${JSON.stringify(resolve(here, '../shared/math/index.ts'))}
const [mode, ...rest] = process.argv.slice(2)
let out = ''
if (mode === 'quantum') {
  const [k, n, ...parts] = rest
  const sep = parts.indexOf('-')
  const product = quantumProduct(parts.slice(0, sep).map(Number), parts.slice(sep + 1).map(Number), Number(k), Number(n))
  for (const t of quantumEntries(product)) out += t.coefficient + '  (' + t.partition.join(', ') + ')\\n'
} else {
  const sep = rest.indexOf('-')
  for (const [key, c] of skewSchurExpansion(rest.slice(0, sep).map(Number), rest.slice(sep + 1).map(Number))) out += c + '  (' + key + ')\\n'
}
process.stdout.write(out)
`)
  const esbuild = await import('esbuild')
  const outfile = join(dir, 'worker.mjs')
  await esbuild.build({ entryPoints: [entry], bundle: true, platform: 'node', format: 'esm', outfile, logLevel: 'silent' })
  return outfile
}

function lrcalcTerms(out: string): { c: number, nu: Partition }[] {
  return out.split('\n').map(l => l.trim()).filter(Boolean).map((l) => {
    const m = /^(-?\d+)\s+\(([\d,\s]*)\)$/.exec(l)
    if (!m) throw new Error(`unexpected lrcalc line "${l}"`)
    return { c: Number(m[1]), nu: m[2]!.split(',').map(s => s.trim()).filter(Boolean).map(Number) }
  })
}

const size = (p: readonly number[]) => p.reduce((s, a) => s + a, 0)

interface Measured { cold: number, warm: number, whole: number, theirs: number, same: boolean, terms: number }

function measure<T extends Map<string, unknown>>(ours: () => T, workerArgs: string[], lrcalcArgs: string[], expected: (lrcalcOut: string) => Map<string, number>, worker: string, reps: number): Measured {
  const [first, cold] = time(ours)
  const warm = median(Array.from({ length: reps }, () => time(ours)[1]))
  const whole = median(Array.from({ length: reps }, () => time(() => execFileSync(process.execPath, [worker, ...workerArgs], { encoding: 'utf8', maxBuffer: 1 << 28 }))[1]))
  let theirOut = ''
  const theirs = median(Array.from({ length: reps }, () => {
    const [o, t] = time(() => execFileSync(LRCALC, lrcalcArgs, { encoding: 'utf8', maxBuffer: 1 << 28 }))
    theirOut = o
    return t
  }))
  const want = expected(theirOut)
  const same = want.size === first.size && [...want].every(([key, c]) => first.get(key) === c)
  return { cold, warm, whole, theirs, same, terms: first.size }
}

async function main(): Promise<void> {
  console.log(`Scholium math engine ${ENGINE_VERSION} — node ${process.version}, ${quick ? 'quick run' : 'full run'}\n`)
  if (!existsSync(LRCALC)) throw new Error(`${LRCALC} is missing: install Debian's lrcalc package`)
  const dir = mkdtempSync(join(tmpdir(), 'scholium-bench-gr-'))
  const worker = await bundleWorker(dir)
  const reps = quick ? 1 : 5
  const [, bareNode] = time(() => execFileSync(process.execPath, ['-e', '0']))
  const lrcalcStart = median(Array.from({ length: 7 }, () => time(() => execFileSync(LRCALC, ['mult', '-q', '4,5', '1', '-', '1']))[1]))

  const k = 4
  const n = 9
  const report = (title: string, rows: string[][], totals: { warm: number, whole: number, theirs: number, net: number }) => {
    console.log(title)
    table(['product', 'terms', 'agree', 'ours cold', 'ours warm', 'ours process', 'lrcalc', 'lrcalc net', 'warm/lrcalc', 'warm/net', 'process/lrcalc'], rows)
    console.log(`total: ours warm ${fmt(totals.warm)} ms, ours process ${fmt(totals.whole)} ms, lrcalc ${fmt(totals.theirs)} ms (net of start-up ${fmt(totals.net)} ms)`)
    console.log(`ratios: in-process/lrcalc ${(totals.warm / totals.theirs).toFixed(2)}, in-process/lrcalc net ${(totals.warm / Math.max(totals.net, 1e-3)).toFixed(2)}, process/process ${(totals.whole / totals.theirs).toFixed(2)}\n`)
  }
  const row = (label: string, m: Measured): string[] => {
    const net = Math.max(m.theirs - lrcalcStart, 0.01)
    return [label, String(m.terms), m.same ? 'yes' : 'NO', fmt(m.cold), fmt(m.warm), fmt(m.whole), fmt(m.theirs), fmt(net), (m.warm / m.theirs).toFixed(2), (m.warm / net).toFixed(2), (m.whole / m.theirs).toFixed(2)]
  }

  // (e) quantum products on Gr(4,9)
  const rowsE: string[][] = []
  const totalE = { warm: 0, whole: 0, theirs: 0, net: 0 }
  for (const [a, b] of quick ? QUANTUM_PAIRS.slice(0, 4) : QUANTUM_PAIRS) {
    const args = [...a.map(String), '-', ...b.map(String)]
    const m = measure(() => quantumProduct(a, b, k, n), ['quantum', String(k), String(n), ...args], ['mult', '-q', `${k},${n - k}`, ...args], (out) => {
      const want = new Map<string, number>()
      for (const { c, nu } of lrcalcTerms(out)) want.set(quantumKey((size(a) + size(b) - size(nu)) / n, nu), c)
      return want
    }, worker, reps)
    totalE.warm += m.warm
    totalE.whole += m.whole
    totalE.theirs += m.theirs
    totalE.net += Math.max(m.theirs - lrcalcStart, 0)
    rowsE.push(row(`σ_${partitionKey(a)} ⋆ σ_${partitionKey(b)}`, m))
  }
  report(`(e) quantum products in QH*(Gr(4,9)) vs lrcalc mult -q 4,5 (ms; lrcalc = whole process; its start-up ≈ ${fmt(lrcalcStart)} ms)`, rowsE, totalE)

  // (f) skew Schur functions of size 12
  const rowsF: string[][] = []
  const totalF = { warm: 0, whole: 0, theirs: 0, net: 0 }
  for (const [lam, mu] of quick ? SKEW_SHAPES.slice(0, 4) : SKEW_SHAPES) {
    const m = measure(() => skewSchurExpansion(lam, mu), ['skew', ...lam.map(String), '-', ...mu.map(String)], ['skew', ...lam.map(String), '/', ...mu.map(String)], (out) => {
      const want = new Map<string, number>()
      for (const { c, nu } of lrcalcTerms(out)) want.set(partitionKey(nu), c)
      return want
    }, worker, reps)
    totalF.warm += m.warm
    totalF.whole += m.whole
    totalF.theirs += m.theirs
    totalF.net += Math.max(m.theirs - lrcalcStart, 0)
    rowsF.push(row(`s_${partitionKey(lam)}/${partitionKey(mu)}`, m))
  }
  report('(f) skew Schur functions s_{λ/μ}, |λ/μ| = 12, vs lrcalc skew (ms; lrcalc = whole process)', rowsF, totalF)

  rmSync(dir, { recursive: true, force: true })
  console.log(`(a bare \`node -e 0\` takes ${fmt(bareNode)} ms here, which bounds the process ratio on small inputs)`)
  console.log(`peak memory (max RSS of this process): ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`)
}

main().catch((e) => {
  console.error(e)
  process.exit(1)
})
