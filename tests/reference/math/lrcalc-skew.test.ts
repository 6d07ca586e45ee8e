/**
 * Skew Schur functions and coproducts against Debian's lrcalc (`lrcalc skew`, `lrcalc coprod -a`),
 * an independent C implementation. If the binary is missing these tests FAIL; they never skip.
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { skewSchurExpansion, schurCoproduct, partitionsInside, partitionsOf, partitionKey } from '../../../shared/math'
import { seeded, randomInt } from '../../unit/math/helpers'

const LRCALC = '/usr/bin/lrcalc'

function lrcalc(args: string[]): string {
  if (!existsSync(LRCALC)) throw new Error(`${LRCALC} is missing: install Debian's lrcalc package (apt-get install lrcalc)`)
  return execFileSync(LRCALC, args, { encoding: 'utf8' })
}

const parts = (s: string) => s.split(',').map(t => t.trim()).filter(t => t !== '').map(Number)

/** "2  (2, 1)" lines into partition key → coefficient. */
function parseSkew(out: string): [string, number][] {
  const m = new Map<string, number>()
  for (const line of out.split('\n')) {
    const t = line.trim()
    if (t === '') continue
    const match = /^(-?\d+)\s+\(([\d,\s]*)\)$/.exec(t)
    if (!match) throw new Error(`unexpected lrcalc skew line: "${line}"`)
    m.set(partitionKey(parts(match[2]!)), Number(match[1]))
  }
  return [...m].sort((a, b) => a[0].localeCompare(b[0]))
}

/** "1  (2)  (1)" lines into "μ|ν" → coefficient. */
function parseCoprod(out: string): [string, number][] {
  const m = new Map<string, number>()
  for (const line of out.split('\n')) {
    const t = line.trim()
    if (t === '') continue
    const match = /^(-?\d+)\s+\(([\d,\s]*)\)\s+\(([\d,\s]*)\)$/.exec(t)
    if (!match) throw new Error(`unexpected lrcalc coprod line: "${line}"`)
    m.set(`${partitionKey(parts(match[2]!))}|${partitionKey(parts(match[3]!))}`, Number(match[1]))
  }
  return [...m].sort((a, b) => a[0].localeCompare(b[0]))
}

const sorted = (m: Map<string, number>) => [...m].sort((a, b) => a[0].localeCompare(b[0]))

describe('skew Schur functions s_{λ/μ} against lrcalc skew', () => {
  it('every μ ⊆ λ for every λ of size 6 (source: lrcalc skew)', () => {
    for (const lam of partitionsOf(6)) for (const mu of partitionsInside(lam)) {
      if (mu.length === 0) continue
      const out = lrcalc(['skew', ...lam.map(String), '-', ...mu.map(String)])
      expect(sorted(skewSchurExpansion(lam, mu)), `s_{${lam}/${mu}}`).toEqual(parseSkew(out))
    }
  })
  it('a seeded sample of sizes 8 to 11 (source: lrcalc skew)', () => {
    const rand = seeded(912)
    for (let t = 0; t < 25; t++) {
      const all = partitionsOf(randomInt(rand, 8, 11))
      const lam = all[randomInt(rand, 0, all.length - 1)]!
      const inside = partitionsInside(lam).filter(m => m.length > 0)
      const mu = inside[randomInt(rand, 0, inside.length - 1)]!
      const out = lrcalc(['skew', ...lam.map(String), '-', ...mu.map(String)])
      expect(sorted(skewSchurExpansion(lam, mu)), `s_{${lam}/${mu}}`).toEqual(parseSkew(out))
    }
  })
  it('with at most r rows (source: lrcalc skew -r)', () => {
    for (const [lam, mu, r] of [[[4, 3, 2, 1], [2, 1], 2], [[5, 3, 3], [2], 3], [[5, 4, 2], [3, 1], 2]] as const) {
      const out = lrcalc(['skew', '-r', String(r), ...lam.map(String), '-', ...mu.map(String)])
      expect(sorted(skewSchurExpansion(lam, mu, { maxRows: r })), `s_{${lam}/${mu}}, ${r} rows`).toEqual(parseSkew(out))
    }
  })
})

describe('coproducts Δ(s_λ) against lrcalc coprod', () => {
  it('every λ of size ≤ 6 and a few larger (source: lrcalc coprod -a)', () => {
    const shapes = [1, 2, 3, 4, 5, 6].flatMap(n => partitionsOf(n)).concat([[4, 3, 1], [3, 3, 2, 1]])
    for (const lam of shapes) {
      const out = lrcalc(['coprod', '-a', ...lam.map(String)])
      const ours = new Map(schurCoproduct(lam).map(t => [`${partitionKey(t.left)}|${partitionKey(t.right)}`, t.coefficient]))
      expect(sorted(ours), `Δ(s_{${lam}})`).toEqual(parseCoprod(out))
    }
  })
})
