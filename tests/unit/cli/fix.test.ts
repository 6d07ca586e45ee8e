/**
 * `scholium check --fix <out.patch>`: the suggested corrections as a unified diff. Applied with
 * `git apply` to a copy of the corpus manuscript (tests/fixtures/corpus, whose wrong claims were
 * made wrong on purpose against python3-sympy and lrcalc values, see its manifest), the result
 * checks with no mismatch, and every claim that was right is untouched.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { execFileSync, spawnSync } from 'node:child_process'
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

const ROOT = join(import.meta.dirname, '../../..')
const CORPUS = join(ROOT, 'tests/fixtures/corpus/manuscript.tex')

function scholium(cwd: string, ...args: string[]) {
  const run = spawnSync(process.execPath, [join(ROOT, 'bin/scholium.mjs'), ...args], { cwd, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' }, timeout: 60_000 })
  return { code: run.status, stdout: run.stdout, stderr: run.stderr }
}

let dir: string
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scholium-fix-'))
  execFileSync('mkdir', ['-p', join(dir, 'paper')])
  copyFileSync(CORPUS, join(dir, 'paper/manuscript.tex'))
})
afterAll(() => rmSync(dir, { recursive: true, force: true }))

describe('scholium check --fix', () => {
  it('writes a patch that git apply takes and after which the corpus manuscript has no mismatch', () => {
    const before = scholium(dir, 'check', 'paper', '--json', '--fix', 'out.patch')
    expect(before.code).toBe(1)
    const report = JSON.parse(before.stdout)
    const mismatches = report.claims.filter((c: any) => c.verdict === 'mismatch')
    expect(mismatches.length).toBeGreaterThan(20)
    const fixed = mismatches.filter((c: any) => c.correction?.fixed)
    expect(before.stderr).toContain(`${fixed.length} corrections written`)
    const patch = readFileSync(join(dir, 'out.patch'), 'utf8')
    // Named relative to where the command ran, so `git apply` there finds the file.
    expect(patch).toMatch(/^diff --git a\/paper\/manuscript\.tex b\/paper\/manuscript\.tex$/m)
    // Each changed line once, as the corrected statement's line.
    const removed = patch.split('\n').filter(l => l.startsWith('-') && !l.startsWith('---'))
    expect(removed).toHaveLength(new Set(fixed.map((c: any) => c.line)).size)

    execFileSync('git', ['apply', '--check', 'out.patch'], { cwd: dir })
    execFileSync('git', ['apply', 'out.patch'], { cwd: dir })
    const after = scholium(dir, 'check', 'paper', '--json')
    const again = JSON.parse(after.stdout)
    expect(again.summary.mismatch).toBe(0)
    expect(after.code).toBe(0)
    expect(again.summary.claims).toBe(report.summary.claims)
    // The lines that held before still read the same.
    const original = readFileSync(CORPUS, 'utf8').split('\n')
    const patched = readFileSync(join(dir, 'paper/manuscript.tex'), 'utf8').split('\n')
    const changed = new Set(fixed.map((c: any) => c.line))
    original.forEach((line, i) => { if (!changed.has(i + 1)) expect(patched[i]).toBe(line) })
  })

  it('refuses --fix without a file, and a patch file it cannot write, with exit 2', () => {
    const bare = scholium(dir, 'check', 'paper', '--fix')
    expect(bare.code).toBe(2)
    expect(bare.stderr).toContain('--fix needs a file')
    const unwritable = scholium(dir, 'check', 'paper', '--fix', join(dir, 'no/such/folder/out.patch'))
    expect(unwritable.code).toBe(2)
    expect(unwritable.stderr).toContain('cannot be written')
    expect(existsSync(join(dir, 'no'))).toBe(false)
  })
})
