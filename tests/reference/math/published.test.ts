/**
 * Checks against published tables, OEIS sequences and classical identities. Each check names
 * its source; values recalled from memory are marked so.
 */
import { describe, it, expect } from 'vitest'
import {
  Permutation, Polynomial, parsePermutation, allPermutations, countReducedWords, isDominant, isVexillary,
  isGrassmannian, schubertPolynomial, schubertAtOnes, sumOverReducedWordsOfProducts, kostkaNumber, partitionsOf,
  countPipeDreams, pipeDreams, bumplessPipeDreams, countBumplessPipeDreams, standardTableauxCount, SchubertFamily,
} from '../../../shared/math'

describe('OEIS sequences', () => {
  it('A005118: number of reduced words of w0 in S_n is 1, 1, 2, 16, 768, 292864', () => {
    const counts = [1, 2, 3, 4, 5, 6].map(n => countReducedWords(Permutation.longest(n)))
    expect(counts).toEqual([1n, 1n, 2n, 16n, 768n, 292864n])
  })
  it('A000108 (Catalan): dominant (132-avoiding) permutations of S_n, n = 1..7: 1, 2, 5, 14, 42, 132, 429', () => {
    const counts = [1, 2, 3, 4, 5, 6, 7].map(n => allPermutations(n).filter(isDominant).length)
    expect(counts).toEqual([1, 2, 5, 14, 42, 132, 429])
  })
  it('A005802: vexillary (2143-avoiding) permutations of S_n, n = 1..7: 1, 2, 6, 23, 103, 513, 2761', () => {
    const counts = [1, 2, 3, 4, 5, 6, 7].map(n => allPermutations(n).filter(isVexillary).length)
    expect(counts).toEqual([1, 2, 6, 23, 103, 513, 2761])
  })
  it('A000325: Grassmannian permutations (at most one descent) of S_n number 2^n − n', () => {
    for (const n of [1, 2, 3, 4, 5, 6, 7]) expect(allPermutations(n).filter(isGrassmannian).length).toBe(2 ** n - n)
  })
  it('w0 has exactly one reduced pipe dream and one bumpless pipe dream (common practice)', () => {
    for (const n of [2, 3, 4, 5, 6]) {
      expect(pipeDreams(Permutation.longest(n)).length).toBe(1)
      expect(bumplessPipeDreams(Permutation.longest(n)).length).toBe(1)
      expect(countPipeDreams(Permutation.longest(n))).toBe(1n)
    }
  })
  it('A000142: there are n! permutations; the S_n family has n! Schubert polynomials', () => {
    expect(SchubertFamily.compute(6).count).toBe(720)
  })
})

describe('Schubert polynomials: published facts', () => {
  it('S_{w0} = x_1^{n−1} x_2^{n−2} ⋯ x_{n−1} (definition, common practice)', () => {
    for (const n of [2, 3, 4, 5, 6, 7]) {
      const e = Array.from({ length: n - 1 }, (_, i) => n - 1 - i)
      expect(schubertPolynomial(Permutation.longest(n)).equals(Polynomial.monomial(e))).toBe(true)
    }
  })
  it('the table of Schubert polynomials of S_4 (Macdonald, "Notes on Schubert Polynomials", 1991; recalled from memory)', () => {
    // exponent vectors of x_1, x_2, x_3, all coefficients 1
    const table: Record<string, number[][]> = {
      1234: [[]],
      2134: [[1]],
      1324: [[1], [0, 1]],
      1243: [[1], [0, 1], [0, 0, 1]],
      2314: [[1, 1]],
      3124: [[2]],
      2143: [[2], [1, 1], [1, 0, 1]],
      1342: [[1, 1], [1, 0, 1], [0, 1, 1]],
      1423: [[2], [1, 1], [0, 2]],
      3214: [[2, 1]],
      2341: [[1, 1, 1]],
      2413: [[2, 1], [1, 2]],
      3142: [[2, 1], [2, 0, 1]],
      4123: [[3]],
      1432: [[2, 1], [2, 0, 1], [1, 2], [1, 1, 1], [0, 2, 1]],
      3241: [[2, 1, 1]],
      2431: [[2, 1, 1], [1, 2, 1]],
      3412: [[2, 2]],
      4213: [[3, 1]],
      4132: [[3, 1], [3, 0, 1]],
      3421: [[2, 2, 1]],
      4231: [[3, 1, 1]],
      4312: [[3, 2]],
      4321: [[3, 2, 1]],
    }
    expect(Object.keys(table).length).toBe(24)
    for (const [w, monos] of Object.entries(table)) {
      const expected = Polynomial.fromTerms(monos.map(e => ({ x: e, y: [], coefficient: 1 })))
      expect(schubertPolynomial(parsePermutation(w)).toLatex(), `S_${w}`).toBe(expected.toLatex())
    }
  })
  it('Macdonald\'s identity S_w(1,…,1) = (1/ℓ!) Σ_{reduced words a} a_1⋯a_ℓ (Macdonald, ‘Notes on Schubert Polynomials’, 1991; recalled from memory)', () => {
    for (const n of [3, 4, 5]) {
      for (const w of allPermutations(n)) {
        let fact = 1n
        for (let k = 2; k <= w.length(); k++) fact *= BigInt(k)
        const lhs = schubertAtOnes(w)
        expect(sumOverReducedWordsOfProducts(w)).toBe(lhs * fact)
        // and the same number from the expanded polynomial
        expect(schubertPolynomial(w).evaluate(new Array(n).fill(1))).toBe(lhs)
      }
    }
    // a larger case: w0 of S_6 has S_w(1) = 1
    expect(sumOverReducedWordsOfProducts(Permutation.longest(6))).toBe(15n * 14n * 13n * 12n * 11n * 10n * 9n * 8n * 7n * 6n * 5n * 4n * 3n * 2n)
  })
  it('counts of pipe dreams and BPDs equal S_w(1,…,1) for 1^3 × 1432 (Fomin–Kirillov; Lam–Lee–Shimozono)', () => {
    const w = parsePermutation('1432').shift(3)
    const n = schubertAtOnes(w)
    expect(BigInt(pipeDreams(w).length)).toBe(n)
    expect(countBumplessPipeDreams(w, { method: 'walk' })).toBe(n)
  })
})

describe('Kostka numbers (Macdonald, "Symmetric Functions and Hall Polynomials", Ch. I §6 table; recalled from memory)', () => {
  it('n = 3', () => {
    // rows λ = 3, 21, 111; columns μ = 3, 21, 111
    const table = [[1, 1, 1], [0, 1, 2], [0, 0, 1]]
    const parts = partitionsOf(3)
    parts.forEach((lam, i) => parts.forEach((mu, j) => expect(kostkaNumber(lam, mu)).toBe(table[i]![j])))
  })
  it('n = 4', () => {
    // rows λ = 4, 31, 22, 211, 1111; columns μ in the same order
    const table = [
      [1, 1, 1, 1, 1],
      [0, 1, 1, 2, 3],
      [0, 0, 1, 1, 2],
      [0, 0, 0, 1, 3],
      [0, 0, 0, 0, 1],
    ]
    const parts = partitionsOf(4)
    expect(parts).toEqual([[4], [3, 1], [2, 2], [2, 1, 1], [1, 1, 1, 1]])
    parts.forEach((lam, i) => parts.forEach((mu, j) => expect(kostkaNumber(lam, mu), `K_{${lam},${mu}}`).toBe(table[i]![j])))
  })
  it('K_{λ,1^n} = f^λ, the hook length formula (common practice), n = 6', () => {
    for (const lam of partitionsOf(6)) expect(BigInt(kostkaNumber(lam, [1, 1, 1, 1, 1, 1]))).toBe(standardTableauxCount(lam))
    // f^{321} = 16 (common practice)
    expect(standardTableauxCount([3, 2, 1])).toBe(16n)
  })
})
