import { describe, it, expect } from 'vitest'
import {
  skewSchurExpansion, schurCoproduct, skewCoefficient, schurProduct, partitionsOf, partitionsInside,
  schurCombinationToPolynomial, schurPolynomial, containsPartition, partitionKey,
} from '../../../shared/math'

describe('skew Schur functions', () => {
  it('s_{λ/∅} = s_λ and s_{λ/λ} = 1', () => {
    for (const lam of partitionsOf(5)) {
      expect([...skewSchurExpansion(lam, [])]).toEqual([[partitionKey(lam), 1]])
      expect([...skewSchurExpansion(lam, lam)]).toEqual([['', 1]])
    }
  })
  it('is zero when μ is not inside λ', () => {
    expect(skewSchurExpansion([2, 1], [3]).size).toBe(0)
    expect(skewSchurExpansion([2, 1], [1, 1, 1]).size).toBe(0)
    expect(containsPartition([2, 1], [2, 2])).toBe(false)
  })
  it('with at most 2 rows, s_{4422/11} is zero: column 2 of the skew shape has 4 boxes (by hand; lrcalc skew -r crashes here)', () => {
    expect(skewSchurExpansion([4, 4, 2, 2], [1, 1], { maxRows: 2 }).size).toBe(0)
    expect(skewSchurExpansion([4, 4, 2, 2], [1, 1], { maxRows: 4 }).size).toBeGreaterThan(0)
  })
  it('c^λ_{μν} from the skew function equals c^λ_{μν} from the product s_μ s_ν (two LR routes)', () => {
    for (const lam of partitionsOf(7)) for (const mu of partitionsInside(lam)) {
      const skew = skewSchurExpansion(lam, mu)
      for (const [nu, c] of skew) {
        expect(schurProduct(mu, nu === '' ? [] : nu.split(',').map(Number)).get(partitionKey(lam)), `${lam}/${mu} ${nu}`).toBe(c)
      }
    }
  })
  it('s_{(2,1)/(1)}(x_1,x_2,x_3) is x_1^2+… by tableaux: the polynomial of s_2 + s_{11}', () => {
    const p = schurCombinationToPolynomial(skewSchurExpansion([2, 1], [1]), 3)
    expect(p.equals(schurPolynomial([2], 3).add(schurPolynomial([1, 1], 3)))).toBe(true)
    expect(skewCoefficient([3, 2, 1], [2, 1], [2, 1])).toBe(2)
  })
  it('coproduct: the counit terms and the total dimension count', () => {
    const terms = schurCoproduct([3, 1])
    expect(terms[0]).toEqual({ left: [3, 1], right: [], coefficient: 1 })
    expect(terms[terms.length - 1]).toEqual({ left: [], right: [3, 1], coefficient: 1 })
    // Σ over Δ(s_λ) of c · (1 ⊗ 1) pairs is symmetric under swapping the factors
    const key = (l: number[], r: number[]) => `${partitionKey(l)}|${partitionKey(r)}`
    const m = new Map(terms.map(t => [key(t.left, t.right), t.coefficient]))
    for (const t of terms) expect(m.get(key(t.right, t.left))).toBe(t.coefficient)
  })
})
