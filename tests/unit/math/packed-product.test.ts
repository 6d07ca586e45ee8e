// The typed-array route of the transition product (shared/math/packed-product.ts) against the
// exact Map route it replaced as the default, and its guards. The exact route is itself checked
// against the expansion of the product polynomial (basis-symmetric.test.ts) and against lrcalc
// (tests/reference/math/lrcalc.test.ts).
import { describe, expect, it } from 'vitest'
import { combinationsEqual, parsePermutation, schubertProduct, schubertProductByTransition } from '../../../shared/math'
import { PackedRangeExceeded, TermTable } from '../../../shared/math/packed-product'
import { randomInt, randomPermutation, seeded } from './helpers'

describe('packed transition product', () => {
  it('equals the exact route on seeded random pairs in S_5 to S_9, both factor orders', () => {
    const rand = seeded(613)
    let compared = 0
    for (let t = 0; t < 120; t++) {
      const n = randomInt(rand, 5, 9)
      const u = randomPermutation(rand, n)
      const v = randomPermutation(rand, n)
      if (u.length() + v.length() > 30) continue
      const exact = schubertProductByTransition(u, v, undefined, 'exact')
      expect(combinationsEqual(schubertProductByTransition(u, v), exact), `${u} · ${v}`).toBe(true)
      expect(combinationsEqual(schubertProductByTransition(v, u), exact), `${v} · ${u}`).toBe(true)
      compared++
    }
    expect(compared).toBeGreaterThan(60)
  })

  it('equals the exact route on products of a few thousand terms (table growth, cancellations)', () => {
    for (const [a, b] of [['826594731', '324918576'], ['715364928', '482913675']] as const) {
      const u = parsePermutation(a)
      const v = parsePermutation(b)
      const packed = schubertProduct(u, v)
      expect(packed.size).toBeGreaterThan(2000)
      expect(combinationsEqual(packed, schubertProductByTransition(u, v, undefined, 'exact'))).toBe(true)
    }
  })

  it('the term table adds, cancels and grows past its first capacity', () => {
    const table = new TermTable(2, 4)
    const values = Uint16Array.of(3, 1)
    for (let k = 0; k < 5000; k++) table.add(k * 1e9 + 7, 1, values, 0, 0, k % 60000, -1, 0)
    table.add(7, -1, values, 0, -1, 0, -1, 0)
    table.add(1e9 + 7, 2, values, 0, -1, 0, -1, 0)
    const out = table.take()
    expect(out.size).toBe(4999)
    const at = out.keys.indexOf(1e9 + 7)
    expect(out.coefficients[at]).toBe(3)
    expect([...out.values.subarray(2 * at, 2 * at + 2)]).toEqual([1, 1])
    table.clear()
    expect(table.take().size).toBe(0)
  })

  it('stops instead of rounding when a coefficient passes 2^53 − 1 (regression guard: the Map route rounded silently)', () => {
    const table = new TermTable(1)
    const values = Uint16Array.of(2)
    table.add(5, Number.MAX_SAFE_INTEGER, values, 0, -1, 0, -1, 0)
    expect(() => table.add(5, 1, values, 0, -1, 0, -1, 0)).toThrow(PackedRangeExceeded)
  })
})
