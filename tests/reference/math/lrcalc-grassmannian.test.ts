/**
 * Classical and quantum products on Grassmannians against Debian's lrcalc (`lrcalc mult -q rows,cols`
 * and `lrcalc mult -r rows`), plus published facts. If lrcalc is missing these tests FAIL; they never skip.
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import {
  grassmannianProduct, quantumProduct, quantumEntries, grassmannianPower, grassmannianIntegral, grassmannianDegree,
  partitionsOf, partitionKey, quantumKey, type Partition,
} from '../../../shared/math'
import { seeded, randomInt } from '../../unit/math/helpers'

const LRCALC = '/usr/bin/lrcalc'

function lrcalc(args: string[]): string {
  if (!existsSync(LRCALC)) throw new Error(`${LRCALC} is missing: install Debian's lrcalc package (apt-get install lrcalc)`)
  return execFileSync(LRCALC, args, { encoding: 'utf8' })
}

function parse(out: string): { c: number, nu: Partition }[] {
  return out.split('\n').map(l => l.trim()).filter(l => l !== '').map((l) => {
    const m = /^(-?\d+)\s+\(([\d,\s]*)\)$/.exec(l)
    if (!m) throw new Error(`unexpected lrcalc line: "${l}"`)
    return { c: Number(m[1]), nu: m[2]!.split(',').map(s => s.trim()).filter(s => s !== '').map(Number) }
  })
}

const size = (p: readonly number[]) => p.reduce((s, a) => s + a, 0)
const sorted = (m: ReadonlyMap<string, number | bigint>) => [...m].sort((a, b) => a[0].localeCompare(b[0]))

/** Partitions in the k × (n−k) box. */
function box(k: number, n: number): Partition[] {
  const out: Partition[] = []
  for (let s = 0; s <= k * (n - k); s++) for (const p of partitionsOf(s)) if (p.length <= k && (p[0] ?? 0) <= n - k) out.push(p)
  return out
}

/** lrcalc mult -q k,n−k prints ν only; the q-degree is (|λ|+|μ|−|ν|)/n. */
function lrcalcQuantum(lam: Partition, mu: Partition, k: number, n: number): Map<string, number> {
  const out = new Map<string, number>()
  for (const { c, nu } of parse(lrcalc(['mult', '-q', `${k},${n - k}`, ...lam.map(String), '-', ...mu.map(String)]))) {
    const d = (size(lam) + size(mu) - size(nu)) / n
    out.set(quantumKey(d, nu), c)
  }
  return out
}

describe('quantum products in QH*(Gr(k,n)) against lrcalc mult -q', () => {
  for (const [k, n] of [[2, 4], [2, 5], [3, 6]] as const) {
    it(`every pair of classes on Gr(${k},${n}) (source: lrcalc mult -q ${k},${n - k})`, () => {
      const classes = box(k, n).filter(p => p.length > 0)
      for (const a of classes) for (const b of classes) {
        expect(sorted(quantumProduct(a, b, k, n)), `σ_{${a}} ⋆ σ_{${b}} on Gr(${k},${n})`).toEqual(sorted(lrcalcQuantum(a, b, k, n)))
      }
    })
  }
  it('a seeded sample on Gr(3,7), Gr(4,8) and Gr(4,9) (source: lrcalc mult -q)', () => {
    const rand = seeded(4909)
    for (const [k, n] of [[3, 7], [4, 8], [4, 9]] as const) {
      const classes = box(k, n).filter(p => p.length > 0)
      for (let t = 0; t < 25; t++) {
        const a = classes[randomInt(rand, 0, classes.length - 1)]!
        const b = classes[randomInt(rand, 0, classes.length - 1)]!
        expect(sorted(quantumProduct(a, b, k, n)), `σ_{${a}} ⋆ σ_{${b}} on Gr(${k},${n})`).toEqual(sorted(lrcalcQuantum(a, b, k, n)))
      }
    }
  })
  it('σ_1 ⋆ σ_{21} = σ_{22} + q on Gr(2,4): the q-term (source: lrcalc mult -q 2,2)', () => {
    expect(quantumEntries(quantumProduct([1], [2, 1], 2, 4))).toEqual([
      { qDegree: 0, partition: [2, 2], coefficient: 1 },
      { qDegree: 1, partition: [], coefficient: 1 },
    ])
    expect(sorted(lrcalcQuantum([1], [2, 1], 2, 4))).toEqual([['0|2,2', 1], ['1|', 1]])
  })
})

describe('classical products in H*(Gr(k,n)) against lrcalc mult -r', () => {
  it('seeded pairs on Gr(3,7) and Gr(4,9): lrcalc mult -r k, keeping ν with ν_1 ≤ n − k (source: lrcalc mult -r)', () => {
    const rand = seeded(377)
    for (const [k, n] of [[3, 7], [4, 9]] as const) {
      const classes = box(k, n).filter(p => p.length > 0)
      for (let t = 0; t < 25; t++) {
        const a = classes[randomInt(rand, 0, classes.length - 1)]!
        const b = classes[randomInt(rand, 0, classes.length - 1)]!
        const expected = new Map<string, number>()
        for (const { c, nu } of parse(lrcalc(['mult', '-r', String(k), ...a.map(String), '-', ...b.map(String)]))) {
          if ((nu[0] ?? 0) <= n - k) expected.set(partitionKey(nu), c)
        }
        expect(sorted(grassmannianProduct(a, b, k, n)), `σ_{${a}} σ_{${b}} on Gr(${k},${n})`).toEqual(sorted(expected))
      }
    }
  })
})

describe('published facts about Grassmannians', () => {
  it('∫σ_1^4 = 2 on Gr(2,4): two lines meet four general lines in P^3 (common practice)', () => {
    expect(grassmannianIntegral(grassmannianPower([1], 4, 2, 4), 2, 4)).toBe(2)
    expect(grassmannianDegree(2, 4)).toBe(2n)
  })
  it('deg Gr(2,n) is the Catalan number C_{n−2} (OEIS A000108)', () => {
    const catalan = [1n, 1n, 2n, 5n, 14n, 42n, 132n, 429n, 1430n, 4862n, 16796n]
    for (let n = 3; n <= 12; n++) expect(grassmannianDegree(2, n), `Gr(2,${n})`).toBe(catalan[n - 2])
    for (let n = 3; n <= 9; n++) expect(BigInt(grassmannianIntegral(grassmannianPower([1], 2 * (n - 2), 2, n), 2, n))).toBe(catalan[n - 2])
  })
  it('deg Gr(3,3+m) is the number of SYT of the 3 × m rectangle, 3-dimensional Catalan numbers (OEIS A005789, from memory)', () => {
    const a005789 = [1n, 1n, 5n, 42n, 462n, 6006n, 87516n]
    for (let m = 1; m <= 6; m++) expect(grassmannianDegree(3, 3 + m), `Gr(3,${3 + m})`).toBe(a005789[m])
  })
})
