/**
 * The corpus: tests/fixtures/corpus/manuscript.tex, an invented manuscript of 126 claims whose values
 * come from outside Scholium, about a third of them deliberately wrong. The manifest beside it says,
 * for every claim, its line, whether it was written right or wrong, how it was corrupted, and the
 * source of the right value:
 * - Debian's lrcalc: `/usr/bin/schubmult` (products S_u S_v and structure constants c_{u,v}^w),
 *   `/usr/bin/lrcalc mult` (products of Schur functions) and `lrcalc lrcoef` (c^ν_{λ,μ});
 * - Debian's python3-sympy (/usr/bin/python3) running reference.py: Schubert and double Schubert
 *   polynomials by divided differences, Schur polynomials as ratios of alternants, inversions
 *   (sympy.combinatorics), reduced words by recursion over descents;
 * - #PD(w) and #BPD(w) as S_w(1,…,1) of the sympy polynomial (Bergeron–Billey 1993; Lam–Lee–Shimozono 2021).
 * The checker (the command line, as a user runs it) must mark exactly the wrong claims as mismatches
 * and verify every right one, line by line; convention slips must hold under the named convention.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { ManifestClaim } from '../../fixtures/corpus/generate'

const ROOT = join(import.meta.dirname, '../../..')
const CORPUS = join(ROOT, 'tests/fixtures/corpus')
const manifest = JSON.parse(readFileSync(join(CORPUS, 'manifest.json'), 'utf8')) as { claims: ManifestClaim[] }

let report: any
let exitCode: number | null
let scratch: string
beforeAll(() => {
  scratch = mkdtempSync(join(tmpdir(), 'scholium-corpus-'))
  const run = spawnSync(process.execPath, [join(ROOT, 'bin/scholium.mjs'), 'check', join(CORPUS, 'manuscript.tex'), '--json'], { cwd: ROOT, encoding: 'utf8', maxBuffer: 64 << 20, timeout: 120_000 })
  if (run.stderr) throw new Error(`scholium wrote to stderr: ${run.stderr}`)
  exitCode = run.status
  report = JSON.parse(run.stdout)
}, 120_000)
afterAll(() => { rmSync(scratch, { recursive: true, force: true }) })

describe('the corpus manuscript', () => {
  it('is big and mixed enough: 100+ claims of every kind, right and wrong, every kind of slip', () => {
    const claims = manifest.claims
    expect(claims.length).toBeGreaterThanOrEqual(100)
    const kinds = new Set(claims.map(c => c.kind))
    for (const kind of ['schubert', 'structureConstant', 'symmetricFunction', 'littlewoodRichardson', 'length', 'count', 'specialization']) expect(kinds).toContain(kind)
    const slips = new Set(claims.map(c => c.corruption).filter(Boolean))
    for (const slip of ['dropped term', 'changed coefficient', 'w written for its inverse', 'other sign convention', 'transposed partition', 'transposed result partitions', 'off by one']) expect(slips).toContain(slip)
    expect(claims.filter(c => c.written === 'wrong').length).toBeGreaterThanOrEqual(30)
  })

  it('is still what lrcalc and sympy give (regenerated from the outside sources and compared)', () => {
    for (const binary of ['/usr/bin/schubmult', '/usr/bin/lrcalc', '/usr/bin/python3']) {
      if (!existsSync(binary)) throw new Error(`${binary} is missing: install Debian's lrcalc and python3-sympy`)
    }
    const run = spawnSync(process.execPath, ['--import', 'tsx', join(CORPUS, 'generate.ts')], { cwd: ROOT, encoding: 'utf8', env: { ...process.env, CORPUS_OUT: scratch }, timeout: 120_000 })
    expect(run.status, run.stderr).toBe(0)
    expect(readFileSync(join(scratch, 'manuscript.tex'), 'utf8')).toBe(readFileSync(join(CORPUS, 'manuscript.tex'), 'utf8'))
    expect(readFileSync(join(scratch, 'manifest.json'), 'utf8')).toBe(readFileSync(join(CORPUS, 'manifest.json'), 'utf8'))
  }, 120_000)
})

describe('the checker on the corpus', () => {
  it('finds exactly the manifest\'s claims, at their lines, as written', () => {
    const found = report.claims.map((c: any) => `${c.line}:${c.source}`)
    const listed = manifest.claims.map(c => `${c.line}:${c.latex}`)
    expect(found).toEqual(listed)
    expect(report.warnings).toEqual([])
  })

  it('verifies every claim written right and marks every claim written wrong as a mismatch, line by line', () => {
    const byLine = new Map<number, any[]>()
    for (const c of report.claims) byLine.set(c.line, [...(byLine.get(c.line) ?? []), c])
    const problems: string[] = []
    for (const expected of manifest.claims) {
      const claim = byLine.get(expected.line)?.[expected.order]
      const want = expected.written === 'right' ? 'verified' : 'mismatch'
      if (!claim) problems.push(`line ${expected.line}: no claim (${expected.latex})`)
      else if (claim.verdict !== want) problems.push(`line ${expected.line}: ${claim.verdict}, expected ${want} (${expected.corruption ?? 'written right'}; source: ${expected.source}): ${claim.message}`)
    }
    expect(problems).toEqual([])
    expect(report.summary).toMatchObject({
      claims: manifest.claims.length,
      verified: manifest.claims.filter(c => c.written === 'right').length,
      mismatch: manifest.claims.filter(c => c.written === 'wrong').length,
      unsupported: 0,
      error: 0,
    })
    expect(exitCode).toBe(1)
  })

  it('says that the convention slips hold under the other convention, and only those', () => {
    const byLine = new Map<number, any[]>()
    for (const c of report.claims) byLine.set(c.line, [...(byLine.get(c.line) ?? []), c])
    for (const expected of manifest.claims) {
      const claim = byLine.get(expected.line)![expected.order]
      expect(claim.holdsUnder, `line ${expected.line} (${expected.corruption ?? 'right'})`).toEqual(expected.holdsUnder ?? [])
      if (expected.holdsUnder) expect(claim.breaksPaperConvention, `line ${expected.line}`).toBeDefined()
    }
    expect(report.summary.otherConvention).toBe(manifest.claims.filter(c => c.holdsUnder).length)
  })

  it('infers the paper\'s own conventions: x_i − y_j, w as written, partitions by rows', () => {
    expect(report.conventions.inferred).toEqual({ doubleSign: 'xy-minus', indexing: 'perm-w', partition: 'shape-rows' })
  })

  it('gives term-level differences for wrong polynomials and products', () => {
    for (const expected of manifest.claims.filter(c => c.corruption === 'dropped term')) {
      const claim = report.claims.find((c: any) => c.line === expected.line)
      expect(claim.diff.basis, `line ${expected.line}`).toMatch(/^(monomial|schubert|schur)$/)
      expect(claim.diff.missing.length, `line ${expected.line}: one term dropped`).toBe(1)
      expect(claim.diff.extra).toEqual([])
    }
    for (const expected of manifest.claims.filter(c => c.corruption === 'off by one')) {
      const claim = report.claims.find((c: any) => c.line === expected.line && c.source === expected.latex)
      expect(claim.diff.basis).toBe('number')
      expect(Number(claim.diff.claimed) - Number(claim.diff.computed), `line ${expected.line}`).toBe(1)
    }
  })
})
