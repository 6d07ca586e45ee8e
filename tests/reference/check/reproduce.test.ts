/**
 * The reproduction scripts (shared/check/reproduce.ts) run in Debian's python3-sympy, an algebra
 * system independent of our engine, and must agree with our verdicts: "matches" on every verified
 * claim and a difference on every mismatch. The claims are those of the test corpus
 * (tests/fixtures/corpus/manuscript.tex, whose values come from lrcalc and sympy) and of the CLI
 * fixtures, a sample of every kind the scripts restate.
 */
import { describe, it, expect } from 'vitest'
import { spawnSync } from 'node:child_process'
import { readFileSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { checkManuscript } from '../../../shared/check'
import { reproduceScript } from '../../../shared/check/reproduce'
import type { ReportClaim } from '../../../shared/types/report'

const ROOT = join(import.meta.dirname, '../../..')

/** The claims with their runnable scripts, joined from the report's library as the UI and the CLI do. */
type ClaimWithScript = ReportClaim & { script?: string }

function claimsOf(path: string): ClaimWithScript[] {
  const report = checkManuscript({ files: { 'main.tex': readFileSync(path, 'utf8') } })
  return report.claims.map(c => ({ ...c, script: reproduceScript(report.reproduceLibrary, c) ?? undefined }))
}

/** Runs many scripts in one python3 process (each in its own namespace) and returns what each printed. */
function runScripts(scripts: string[]): string[] {
  const driver = `
import sys, json, io, contextlib
outputs = []
for script in json.load(sys.stdin):
    buffer = io.StringIO()
    with contextlib.redirect_stdout(buffer):
        exec(script, {})
    outputs.append(buffer.getvalue().strip())
print(json.dumps(outputs))
`
  const run = spawnSync('/usr/bin/python3', ['-c', driver], { input: JSON.stringify(scripts), encoding: 'utf8', maxBuffer: 1 << 26, timeout: 240_000 })
  if (run.status !== 0) throw new Error(`python3 failed: ${run.stderr.slice(-2000)}`)
  return JSON.parse(run.stdout)
}

describe('reproduction scripts agree with the verdicts when SymPy runs them', () => {
  const sample: ClaimWithScript[] = [
    ...claimsOf(join(ROOT, 'tests/fixtures/corpus/manuscript.tex')),
    ...readdirSync(join(ROOT, 'tests/fixtures/cli')).filter(f => f.endsWith('.tex')).flatMap(f => claimsOf(join(ROOT, 'tests/fixtures/cli', f))),
  ].filter(c => c.script !== undefined)

  it('the sample covers verified and mismatched claims of several kinds', () => {
    expect(sample.filter(c => c.verdict === 'verified').length).toBeGreaterThan(10)
    expect(sample.filter(c => c.verdict === 'mismatch').length).toBeGreaterThan(3)
    expect(new Set(sample.map(c => c.kind)).size).toBeGreaterThan(4)
  })

  it('every script prints "matches" exactly when the claim is verified', () => {
    const outputs = runScripts(sample.map(c => c.script!))
    const disagreements = sample
      .map((claim, i) => ({ claim, output: outputs[i]! }))
      .filter(({ claim, output }) => (output === 'matches') !== (claim.verdict === 'verified') || !/^(matches|differs by )/.test(output))
      .map(({ claim, output }) => `${claim.file}:${claim.line} ${claim.verdict} ${claim.source} → ${output}`)
    expect(disagreements).toEqual([])
  }, 300_000)
})
