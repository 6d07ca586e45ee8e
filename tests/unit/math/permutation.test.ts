import { describe, it, expect } from 'vitest'
import {
  Permutation, parsePermutation, rotheDiagram, essentialSet, rankConditions, containsPattern,
  isDominant, isVexillary, isGrassmannian, vexillaryShape, reducedWords, countReducedWords,
  allPermutations, toLehmerCode, fromLehmerCode, ParseError, InvalidArgumentError, BudgetExceededError,
} from '../../../shared/math'
import { seeded, randomPermutation } from './helpers'

const P = (s: string) => parsePermutation(s)

describe('parsing', () => {
  it('reads one-line notation with digits run together', () => {
    expect(P('2143').oneLine).toEqual([2, 1, 4, 3])
  })
  it('reads bracketed lists for n > 9', () => {
    expect(P('[2,1,10,3,4,5,6,7,8,9]').oneLine).toEqual([2, 1, 10, 3, 4, 5, 6, 7, 8, 9])
    expect(P('[2, 1, 3]').oneLine).toEqual([2, 1, 3])
  })
  it('reads cycle notation (a b c) meaning a→b→c→a', () => {
    expect(P('(1 2)(3 4)').oneLine).toEqual([2, 1, 4, 3])
    expect(P('(1,2,3)').oneLine).toEqual([2, 3, 1])
    expect(parsePermutation('(1 2)', 4).oneLine).toEqual([2, 1, 3, 4])
  })
  it('reads words in simple transpositions as products left to right', () => {
    // s_1 s_2: apply s_2 first as maps; one-line = swap positions 1,2 then 2,3 of 123 = 231
    expect(P('s_1 s_2').oneLine).toEqual([2, 3, 1])
    expect(P('s_{1}s_{2}s_{1}').oneLine).toEqual([3, 2, 1])
    expect(P('s_2s_1').oneLine).toEqual([3, 1, 2])
  })
  it('reads w0 with a size', () => {
    expect(parsePermutation('w_0', 4).oneLine).toEqual([4, 3, 2, 1])
    expect(() => parsePermutation('w_0')).toThrow(ParseError)
  })
  it('builds from specs without strings', () => {
    expect(Permutation.fromSpec({ oneLine: [3, 1, 2] }).toString()).toBe('312')
    expect(Permutation.fromSpec({ cycles: [[1, 3]] }).toString()).toBe('321')
    expect(Permutation.fromSpec({ word: [2, 1] }).toString()).toBe('312')
    expect(Permutation.fromSpec({ longest: 3 }).toString()).toBe('321')
  })
  it('refuses malformed input with clear typed errors', () => {
    expect(() => P('2243')).toThrow(ParseError)
    expect(() => P('21x3')).toThrow(/not a permutation/)
    expect(() => P('[1,2,,3]')).toThrow(ParseError)
    expect(() => P('(1 2)(2 3)')).toThrow(/not disjoint/)
    expect(() => Permutation.fromOneLine([1, 1])).toThrow(InvalidArgumentError)
  })
  it('prints one-line notation, bracketed beyond 9', () => {
    expect(P('2143').toString()).toBe('2143')
    expect(Permutation.longest(10).toString()).toBe('[10,9,8,7,6,5,4,3,2,1]')
  })
})

describe('operations', () => {
  it('composes right to left and inverts', () => {
    const u = P('231')
    const v = P('213')
    expect(u.compose(v).oneLine).toEqual([3, 2, 1]) // u(v(1)) = u(2) = 3
    expect(u.inverse().oneLine).toEqual([3, 1, 2])
    expect(u.compose(u.inverse()).key).toBe('')
  })
  it('w s_i swaps positions, s_i w swaps values', () => {
    const w = P('2413')
    expect(w.rightMultiplySimple(1).toString()).toBe('4213')
    expect(w.leftMultiplySimple(1).toString()).toBe('1423')
    expect(w.compose(Permutation.simple(2)).equals(w.rightMultiplySimple(2))).toBe(true)
  })
  it('length, descents, Lehmer code both ways', () => {
    const w = P('2143')
    expect(w.length()).toBe(2)
    expect(w.descents()).toEqual([1, 3])
    expect(toLehmerCode(w)).toEqual([1, 0, 1, 0])
    expect(fromLehmerCode([1, 0, 1]).toString()).toBe('2143')
    for (const x of allPermutations(5)) expect(fromLehmerCode(toLehmerCode(x)).equals(x)).toBe(true)
  })
  it('Rothe diagram has ℓ(w) cells; essential set and ranks', () => {
    expect(rotheDiagram(P('2143'))).toEqual([[1, 1], [3, 3]])
    const rand = seeded(7)
    for (let t = 0; t < 30; t++) {
      const w = randomPermutation(rand, 6)
      expect(rotheDiagram(w).length).toBe(w.length())
    }
    // 2143: essential cells (1,1) rank 0 and (3,3) rank 2 (common practice, Fulton's conditions)
    expect(essentialSet(P('2143'))).toEqual([[1, 1], [3, 3]])
    expect(rankConditions(P('2143'))).toEqual([{ row: 1, column: 1, rank: 0 }, { row: 3, column: 3, rank: 2 }])
    // 1432: D = {(2,2),(2,3),(3,2)}; essential cells (2,3) and (3,2), both rank 1
    expect(essentialSet(P('1432'))).toEqual([[2, 3], [3, 2]])
  })
  it('patterns and classes', () => {
    expect(containsPattern(P('2143'), P('21'))).toBe(true)
    expect(containsPattern(P('1234'), P('21'))).toBe(false)
    expect(isVexillary(P('2143'))).toBe(false)
    expect(isVexillary(P('21543'))).toBe(false) // 2,1,5,4 is a 2143 pattern
    expect(isVexillary(P('4231'))).toBe(true)
    expect(isDominant(P('321'))).toBe(true)
    expect(isDominant(P('132'))).toBe(false)
    expect(isGrassmannian(P('1423'))).toBe(true)
    expect(isGrassmannian(P('2143'))).toBe(false)
    expect(vexillaryShape(P('1432'))).toEqual([2, 1])
    expect(() => vexillaryShape(P('2143'))).toThrow(InvalidArgumentError)
    // dominant ⇔ Lehmer code weakly decreasing
    for (const w of allPermutations(5)) {
      const c = w.lehmerCode()
      expect(isDominant(w)).toBe(c.every((v, i) => i === 0 || v <= c[i - 1]!))
    }
  })
  it('reduced words: enumerated ones are reduced words of w and their number matches the count', () => {
    const w = P('3412')
    const words = reducedWords(w)
    expect(words.map(a => a.join('')).sort()).toEqual(['2132', '2312'])
    const rand = seeded(11)
    for (let t = 0; t < 20; t++) {
      const x = randomPermutation(rand, 5)
      const ws = reducedWords(x)
      expect(BigInt(ws.length)).toBe(countReducedWords(x))
      for (const a of ws) {
        expect(a.length).toBe(x.length())
        expect(Permutation.fromWord(a).equals(x)).toBe(true)
      }
    }
  })
  it('embedding and the shift 1^m × w', () => {
    const w = P('21')
    expect(w.embed(4).toString()).toBe('2134')
    expect(w.embed(4).key).toBe(w.key)
    expect(w.shift(2).toString()).toBe('1243')
    expect(() => P('321').embed(2)).toThrow(InvalidArgumentError)
  })
  it('reduced-word enumeration respects its budget', () => {
    expect(() => reducedWords(Permutation.longest(6), { maxTerms: 1000 })).toThrow(BudgetExceededError)
  })
})
