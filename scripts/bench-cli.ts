/**
 * Benchmark of the `scholium` command as a user runs it (not a test): whole process against
 * whole process, in one run, so that the ratios hold on a noisy machine.
 *   npx tsx scripts/bench-cli.ts [--reps N] [--against <an earlier build's scholium.mjs>]
 * Compared side by side: bare `node -e 0`, the development launcher (bin/scholium.mjs, which
 * compiles TypeScript through tsx at start) and the bundled command (dist/cli/scholium.mjs,
 * built by scripts/build-cli.mjs), on a one-claim file and on the synthetic 1,000-claim
 * manuscript of the check benchmark. Goal: a one-claim file in under 150 ms, and paper-size
 * inputs no slower than the development launcher. `--against` races an earlier build of the
 * command too (e.g. one built from main in another checkout), for before/after in one run.
 */
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import { performance } from 'node:perf_hooks'
import { fileURLToPath } from 'node:url'
import { buildManuscript } from './lib/synthetic-manuscript'

const root = join(dirname(fileURLToPath(import.meta.url)), '..')
const repsFlag = process.argv.indexOf('--reps')
const reps = repsFlag > 0 ? Number(process.argv[repsFlag + 1]) : 15
const againstFlag = process.argv.indexOf('--against')
const against = againstFlag > 0 ? process.argv[againstFlag + 1] : undefined

execFileSync(process.execPath, [join(root, 'scripts/build-cli.mjs')], { stdio: 'inherit' })
const scratch = mkdtempSync(join(tmpdir(), 'scholium-bench-cli-'))
const oneClaim = join(scratch, 'one-claim.tex')
writeFileSync(oneClaim, '\\documentclass{article}\n\\begin{document}\n$\\mathfrak{S}_{132} = x_1 + x_2$\n\\end{document}\n')
const paper = join(scratch, 'paper')
for (const [path, text] of Object.entries(buildManuscript(1000, 10))) {
  mkdirSync(dirname(join(paper, path)), { recursive: true })
  writeFileSync(join(paper, path), text)
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.floor(sorted.length / 2)]!
}

/** Median wall time of a whole process, alternating the commands so that noise hits all alike. */
function race(commands: Record<string, string[]>): Record<string, number> {
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(commands).map(k => [k, []]))
  for (let i = 0; i < reps; i++) {
    for (const [name, args] of Object.entries(commands)) {
      const start = performance.now()
      const run = spawnSync(process.execPath, args, { encoding: 'utf8', maxBuffer: 1 << 28, env: { ...process.env, NO_COLOR: '1' } })
      times[name]!.push(performance.now() - start)
      if (run.status !== 0 && run.status !== 1) throw new Error(`${name} failed: ${run.stderr}`)
    }
  }
  return Object.fromEntries(Object.entries(times).map(([k, v]) => [k, median(v)]))
}

const launcher = join(root, 'bin/scholium.mjs')
const bundle = join(root, 'dist/cli/scholium.mjs')
const earlier = (args: string[]): Record<string, string[]> => against ? { earlier: [against, ...args] } : {}
const small = race({ 'bare node': ['-e', '0'], 'tsx launcher': [launcher, 'check', oneClaim], 'bundled': [bundle, 'check', oneClaim], ...earlier(['check', oneClaim]) })
const large = race({ 'tsx launcher': [launcher, 'check', paper], 'bundled': [bundle, 'check', paper], ...earlier(['check', paper]) })
rmSync(scratch, { recursive: true, force: true })

const ms = (t: number) => `${t.toFixed(0)} ms`
console.log(`whole-process medians over ${reps} alternating runs`)
console.log(`one-claim file:   bare node ${ms(small['bare node']!)}, tsx launcher ${ms(small['tsx launcher']!)}, bundled ${ms(small.bundled!)}  (bundled / launcher = ${(small.bundled! / small['tsx launcher']!).toFixed(2)}, bundled / bare node = ${(small.bundled! / small['bare node']!).toFixed(2)})`)
console.log(`1,000-claim paper: tsx launcher ${ms(large['tsx launcher']!)}, bundled ${ms(large.bundled!)}  (bundled / launcher = ${(large.bundled! / large['tsx launcher']!).toFixed(2)})`)
if (against) {
  console.log(`earlier build (${against}): one-claim file ${ms(small.earlier!)}, 1,000-claim paper ${ms(large.earlier!)}  (bundled / earlier = ${(small.bundled! / small.earlier!).toFixed(2)} and ${(large.bundled! / large.earlier!).toFixed(2)})`)
}
