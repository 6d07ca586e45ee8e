import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  grassmannianProduct, grassmannianMultiply, pieriProduct, giambelliDeterminant, grassmannianPower, grassmannianIntegral,
  quantumProduct, quantumMultiply, quantumAtZero, quantumKey, rimHookReduce, quantumPower, partitionKey, partitionsOf,
  schurCombinationsEqual, InvalidArgumentError, type Partition, type SchurCombination,
} from '../../../shared/math'

function box(k: number, n: number): Partition[] {
  const out: Partition[] = []
  for (let s = 0; s <= k * (n - k); s++) for (const p of partitionsOf(s)) if (p.length <= k && (p[0] ?? 0) <= n - k) out.push(p)
  return out
}

const single = (p: Partition): SchurCombination => new Map([[partitionKey(p), 1]])
const sorted = (m: ReadonlyMap<string, number | bigint>) => [...m].sort((a, b) => a[0].localeCompare(b[0]))

/** A Grassmannian with 2 ≤ n ≤ 8 and three classes in its box. */
const grassmannianAndClasses = fc.integer({ min: 2, max: 8 }).chain(n => fc.integer({ min: 1, max: n - 1 }).chain((k) => {
  const classes = box(k, n)
  const pick = fc.integer({ min: 0, max: classes.length - 1 }).map(i => classes[i]!)
  return fc.tuple(fc.constant(k), fc.constant(n), pick, pick, pick)
}))

describe('H*(Gr(k,n))', () => {
  it('σ_1^2 = σ_2 + σ_{11} and σ_2 σ_2 = σ_{22} on Gr(2,4) (by hand: the box is 2 × 2)', () => {
    expect(sorted(grassmannianProduct([1], [1], 2, 4))).toEqual([['1,1', 1], ['2', 1]])
    expect(sorted(grassmannianProduct([2], [2], 2, 4))).toEqual([['2,2', 1]])
    expect(grassmannianProduct([2], [1, 1], 2, 4).size).toBe(0)
  })
  it('refuses a class outside the box and a meaningless Grassmannian', () => {
    expect(() => grassmannianProduct([3], [1], 2, 4)).toThrow(InvalidArgumentError)
    expect(() => grassmannianProduct([1], [1], 4, 4)).toThrow(InvalidArgumentError)
    expect(() => quantumProduct([1, 1, 1], [1], 2, 5)).toThrow(InvalidArgumentError)
  })
  it('property: the product is commutative and associative', () => {
    fc.assert(fc.property(grassmannianAndClasses, ([k, n, a, b, c]) => {
      expect(sorted(grassmannianProduct(a, b, k, n))).toEqual(sorted(grassmannianProduct(b, a, k, n)))
      const left = grassmannianMultiply(grassmannianProduct(a, b, k, n), single(c), k, n)
      const right = grassmannianMultiply(single(a), grassmannianProduct(b, c, k, n), k, n)
      expect(sorted(left)).toEqual(sorted(right))
    }), { seed: 901, numRuns: 150 })
  })
  it('property: Pieri by horizontal strips equals the LR product with σ_p', () => {
    fc.assert(fc.property(grassmannianAndClasses, fc.integer({ min: 0, max: 7 }), ([k, n, a], p) => {
      const q = Math.min(p, n - k)
      expect(sorted(pieriProduct(q, a, k, n))).toEqual(sorted(grassmannianProduct([q], a, k, n)))
    }), { seed: 902, numRuns: 150 })
  })
  it('Giambelli: det(σ_{λ_i+j−i}) is σ_λ for every class of Gr(3,7) and Gr(4,8)', () => {
    for (const [k, n] of [[3, 7], [4, 8]] as const) for (const lam of box(k, n)) {
      expect(sorted(giambelliDeterminant(lam, k, n)), `${lam}`).toEqual([[partitionKey(lam), 1]])
    }
  })
  it('σ_1^5 on Gr(2,5) is 5σ_{32} + … of degree 5 (count of SYT of 32 is 5, hook length formula)', () => {
    const p = grassmannianPower([1], 5, 2, 5)
    expect(p.get('3,2')).toBe(5)
    expect(grassmannianIntegral(grassmannianPower([1], 6, 2, 5), 2, 5)).toBe(5)
  })
})

describe('QH*(Gr(k,n))', () => {
  it('rim hooks (by hand): s_{31} on Gr(2,4) is q, s_3 vanishes there, s_6 on Gr(1,5) is qσ_1, s_{33} on Gr(2,4) is qσ_2', () => {
    expect(rimHookReduce([3, 1], 2, 4)).toEqual({ sign: 1, qDegree: 1, partition: [] })
    expect(rimHookReduce([3], 2, 4)).toBeNull()
    // P^4 = Gr(1,5): σ_1^5 = q, so s_5 ↦ q and s_6 ↦ q σ_1
    expect(rimHookReduce([6], 1, 5)).toEqual({ sign: 1, qDegree: 1, partition: [1] })
    // Gr(2,4): the 4-rim hook of (3,3) through (1,3), (2,3), (2,2), (2,1) has height 2, sign (−1)^{2−2}, and leaves (2)
    expect(rimHookReduce([3, 3], 2, 4)).toEqual({ sign: 1, qDegree: 1, partition: [2] })
    // Gr(2,5): s_{42} — the 5-rim hook from (1,4) down to (2,1) has height 2 and leaves (1)
    expect(rimHookReduce([4, 2], 2, 5)).toEqual({ sign: 1, qDegree: 1, partition: [1] })
    // Gr(3,6): s_{4,1,1} — the 6-rim hook of the whole hook shape has height 3: sign (−1)^{3−3}
    expect(rimHookReduce([4, 1, 1], 3, 6)).toEqual({ sign: 1, qDegree: 1, partition: [] })
    // Gr(2,5): s_{4,1}: the 5-rim hook is the whole shape, height 2 → +q
    expect(rimHookReduce([4, 1], 2, 5)).toEqual({ sign: 1, qDegree: 1, partition: [] })
  })
  it('σ_1^{⋆4} on Gr(2,4) is 2σ_{22} + 2q (quantum Pieri by hand: σ_1 ⋆ σ_{21} = σ_{22} + q, σ_1 ⋆ σ_{2} = σ_{21})', () => {
    expect(sorted(quantumPower([1], 4, 2, 4))).toEqual([['0|2,2', 2], ['1|', 2]])
  })
  it('property: the quantum product is commutative and associative', () => {
    fc.assert(fc.property(grassmannianAndClasses, ([k, n, a, b, c]) => {
      expect(sorted(quantumProduct(a, b, k, n))).toEqual(sorted(quantumProduct(b, a, k, n)))
      const one = (p: Partition) => new Map([[quantumKey(0, p), 1]])
      const left = quantumMultiply(quantumProduct(a, b, k, n), one(c), k, n)
      const right = quantumMultiply(one(a), quantumProduct(b, c, k, n), k, n)
      expect(sorted(left)).toEqual(sorted(right))
    }), { seed: 903, numRuns: 150 })
  })
  it('property: the quantum product at q = 0 is the classical product', () => {
    fc.assert(fc.property(grassmannianAndClasses, ([k, n, a, b]) => {
      expect(schurCombinationsEqual(quantumAtZero(quantumProduct(a, b, k, n)), grassmannianProduct(a, b, k, n))).toBe(true)
    }), { seed: 904, numRuns: 200 })
  })
})
