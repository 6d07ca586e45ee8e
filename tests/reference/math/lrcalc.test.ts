/**
 * Cross-checks against Debian's lrcalc package (binaries /usr/bin/schubmult and /usr/bin/lrcalc),
 * an independent C implementation. If the binaries are missing these tests FAIL (the test script
 * installs the package); they never skip.
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import {
  Permutation, allPermutations, parsePermutation, schubertProduct, schurProduct, littlewoodRichardson, partitionsOf, partitionKey,
} from '../../../shared/math'
import { seeded, randomPermutation, randomInt } from '../../unit/math/helpers'

const SCHUBMULT = '/usr/bin/schubmult'
const LRCALC = '/usr/bin/lrcalc'

function requireBinary(path: string): void {
  if (!existsSync(path)) {
    throw new Error(`${path} is missing: install Debian's lrcalc package (apt-get install lrcalc) — this reference test cannot run without it`)
  }
}

/** Parse lines such as "2  (4, 1, 2, 3)" into key → coefficient (keys in Permutation.key / partition form). */
function parseLines(out: string, kind: 'perm' | 'partition'): Map<string, number> {
  const m = new Map<string, number>()
  for (const line of out.split('\n')) {
    const t = line.trim()
    if (t === '') continue
    const match = /^(-?\d+)\s+\(([\d,\s]*)\)$/.exec(t)
    if (!match) throw new Error(`unexpected lrcalc output line: "${line}"`)
    const values = match[2]!.split(',').map(s => s.trim()).filter(s => s !== '').map(Number)
    const key = kind === 'perm' ? Permutation.fromOneLine(values).key : partitionKey(values)
    m.set(key, (m.get(key) ?? 0) + Number(match[1]))
  }
  return m
}

function schubmult(u: Permutation, v: Permutation): Map<string, number> {
  const out = execFileSync(SCHUBMULT, [...u.oneLine.map(String), '-', ...v.oneLine.map(String)], { encoding: 'utf8' })
  return parseLines(out, 'perm')
}

function sorted(m: ReadonlyMap<string, number | bigint>): [string, number | bigint][] {
  return [...m].sort((a, b) => a[0].localeCompare(b[0]))
}

describe('Schubert structure constants against lrcalc schubmult', () => {
  it('the binaries are installed', () => {
    requireBinary(SCHUBMULT)
    requireBinary(LRCALC)
  })
  it('all 576 pairs in S_4', () => {
    requireBinary(SCHUBMULT)
    const S4 = allPermutations(4)
    for (const u of S4) for (const v of S4) {
      expect(sorted(schubertProduct(u, v)), `${u} * ${v}`).toEqual(sorted(schubmult(u, v)))
    }
  })
  it('a seeded random sample of pairs in S_5, S_6, S_7', () => {
    requireBinary(SCHUBMULT)
    const rand = seeded(2024)
    for (let t = 0; t < 60; t++) {
      const n = randomInt(rand, 5, 7)
      const u = randomPermutation(rand, n)
      const v = randomPermutation(rand, n)
      if (u.length() + v.length() > 16) continue
      expect(sorted(schubertProduct(u, v)), `${u} * ${v}`).toEqual(sorted(schubmult(u, v)))
    }
  })
  it('products of hundreds to thousands of terms in S_9 and S_10 (the typed-array route of packed-product.ts)', () => {
    requireBinary(SCHUBMULT)
    for (const [a, b] of [
      ['826594731', '324918576'],
      ['715364928', '482913675'],
      ['[2,10,5,4,1,8,3,9,6,7]', '[9,6,3,7,1,8,2,10,4,5]'],
      ['[9,2,3,10,6,7,1,8,4,5]', '[7,10,6,5,8,2,3,1,4,9]'],
    ] as const) {
      const u = parsePermutation(a)
      const v = parsePermutation(b)
      expect(sorted(schubertProduct(u, v)), `${u} * ${v}`).toEqual(sorted(schubmult(u, v)))
    }
  })
})

describe('Littlewood–Richardson coefficients against lrcalc', () => {
  const rand = seeded(77)
  const parts = [1, 2, 3, 4].flatMap(k => partitionsOf(k))
  it('products s_λ s_μ (lrcalc mult) for a seeded sample with |λ| + |μ| ≤ 8', () => {
    requireBinary(LRCALC)
    for (let t = 0; t < 40; t++) {
      const a = parts[randomInt(rand, 0, parts.length - 1)]!
      const b = parts[randomInt(rand, 0, parts.length - 1)]!
      const out = execFileSync(LRCALC, ['mult', ...a.map(String), '-', ...b.map(String)], { encoding: 'utf8' })
      expect(sorted(schurProduct(a, b)), `${a} * ${b}`).toEqual(sorted(parseLines(out, 'partition')))
    }
  })
  it('single coefficients c^ν_{λμ} (lrcalc lrcoef), including zeros', () => {
    requireBinary(LRCALC)
    for (let t = 0; t < 40; t++) {
      const a = parts[randomInt(rand, 0, parts.length - 1)]!
      const b = parts[randomInt(rand, 0, parts.length - 1)]!
      const size = a.reduce((s, p) => s + p, 0) + b.reduce((s, p) => s + p, 0)
      const all = partitionsOf(size)
      const nu = all[randomInt(rand, 0, all.length - 1)]!
      const out = execFileSync(LRCALC, ['lrcoef', ...nu.map(String), '-', ...a.map(String), '-', ...b.map(String)], { encoding: 'utf8' })
      expect(littlewoodRichardson(nu, a, b), `c^{${nu}}_{${a},${b}}`).toBe(Number(out.trim()))
    }
  })
  it('the documented example: c^{321}_{21,21} = 2', () => {
    requireBinary(LRCALC)
    const out = execFileSync(LRCALC, ['lrcoef', '3', '2', '1', '-', '2', '1', '-', '2', '1'], { encoding: 'utf8' })
    expect(Number(out.trim())).toBe(2)
    expect(littlewoodRichardson([3, 2, 1], [2, 1], [2, 1])).toBe(2)
  })
})
