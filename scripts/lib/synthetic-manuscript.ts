// A synthetic manuscript for benchmarks: claims of mixed kinds (Schubert polynomials in S_4–S_6,
// products in the Schubert basis, double Schubert polynomials, Schur products, Littlewood–Richardson
// coefficients, lengths and counts), about one in ten written wrong, over a main file and section files.
// The right-hand sides are written with the engine itself: this is for measuring speed, not correctness
// (tests/reference/check/corpus.test.ts checks correctness against lrcalc and sympy).
import {
  combinationEntries, countPipeDreams, countReducedWords, doubleSchubertPolynomial, littlewoodRichardson, Permutation,
  schubertPolynomial, schubertProduct, schurProduct,
} from '../../shared/math'
import { seeded } from '../../tests/helpers/seeded-random'

// Seeded, so that every run checks the same manuscript (buildManuscript resets it).
let rand = seeded(1789)
const randomInt = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1))
function randomPermutation(n: number, maxLength: number): Permutation {
  for (;;) {
    const line = Array.from({ length: n }, (_, i) => i + 1)
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(rand() * (i + 1))
      ;[line[i], line[j]] = [line[j]!, line[i]!]
    }
    const w = Permutation.fromOneLine(line)
    if (w.length() > 0 && w.length() <= maxLength) return w
  }
}
const written = (w: Permutation) => w.trimmed().oneLine.join('')
const PARTITIONS = [[1], [2], [1, 1], [3], [2, 1], [1, 1, 1], [4], [3, 1], [2, 2], [2, 1, 1]]
const part = (l: readonly number[]) => l.join('')
const wrongNow = () => rand() < 0.1

/** One claim of the given kind, as LaTeX (inline or display). */
function claim(kind: number): string {
  switch (kind) {
    case 0: case 1: case 2: { // Schubert polynomial in S_4–S_6
      const w = randomPermutation(randomInt(4, 6), 8)
      const p = schubertPolynomial(w)
      return `\\[ \\Sch{${written(w)}} = ${wrongNow() ? p.toLatex().replace(/ \+ [^+]*$/, '') || '0' : p.toLatex()} \\]`
    }
    case 3: case 4: { // a product in the Schubert basis
      const u = randomPermutation(randomInt(3, 5), 3)
      const v = randomPermutation(randomInt(3, 5), 3)
      const terms = combinationEntries(schubertProduct(u, v))
      if (terms.some(t => t.permutation.size > 9)) return claim(kind)
      const drop = wrongNow() && terms.length > 1
      const rhs = (drop ? terms.slice(1) : terms).map(t => `${t.coefficient === 1 ? '' : `${t.coefficient}\\,`}\\Sch{${written(t.permutation)}}`).join(' + ')
      return `\\[ \\Sch{${written(u)}}\\,\\Sch{${written(v)}} = ${rhs} \\]`
    }
    case 5: { // a double Schubert polynomial
      const w = randomPermutation(randomInt(3, 4), 4)
      return `\\[ \\mathfrak{S}_{${written(w)}}(x;y) = ${doubleSchubertPolynomial(w).toLatex()} \\]`
    }
    case 6: { // a product of Schur functions
      const a = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const b = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const terms = [...schurProduct(a, b)].map(([key, c]) => `${c === 1 ? '' : `${c}\\,`}s_{${key.split(',').join('')}}`)
      return `\\[ s_{${part(a)}}\\, s_{${part(b)}} = ${terms.join(' + ')} \\]`
    }
    case 7: { // a Littlewood–Richardson coefficient
      const a = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const b = PARTITIONS[randomInt(0, PARTITIONS.length - 1)]!
      const nu = [...schurProduct(a, b).keys()][0]!.split(',').map(Number)
      return `$c^{${part(nu)}}_{${part(a)},${part(b)}} = ${BigInt(littlewoodRichardson(nu, a, b)) + (wrongNow() ? 1n : 0n)}$`
    }
    case 8: { // a length
      const w = randomPermutation(randomInt(4, 6), 10)
      return `$\\ell(${written(w)}) = ${w.length()}$`
    }
    default: { // a count
      const w = randomPermutation(randomInt(4, 6), 8)
      return rand() < 0.5 ? `$\\#\\PD(${written(w)}) = ${countPipeDreams(w)}$` : `$\\#\\Red(${written(w)}) = ${countReducedWords(w)}$`
    }
  }
}

const PROSE = 'We compare the expansions term by term and note where each monomial comes from in the staircase.'
/** A manuscript of `claims` claims over `sections` section files plus main.tex; the same on every call with the same seed. */
export function buildManuscript(claims = 1000, sections = 10, seedValue = 1789): Record<string, string> {
  rand = seeded(seedValue)
  const files: Record<string, string> = {}
  let made = 0
  for (let s = 1; s <= sections; s++) {
    const lines = [`\\section{Part ${s}}`]
    const wanted = Math.round((claims * s) / sections) - made
    for (let k = 0; k < wanted; k++) lines.push(PROSE, claim((made + k) % 10), '')
    made += wanted
    files[`sections/part${s}.tex`] = lines.join('\n')
  }
  files['main.tex'] = [
    '\\documentclass{amsart}',
    '\\newcommand{\\Sch}[1]{\\mathfrak{S}_{#1}}',
    '\\DeclareMathOperator{\\PD}{PD}',
    '\\DeclareMathOperator{\\Red}{Red}',
    '\\begin{document}',
    ...Array.from({ length: sections }, (_, i) => `\\input{sections/part${i + 1}}`),
    '\\end{document}',
  ].join('\n')
  return files
}
