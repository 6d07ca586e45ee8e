// Grassmannian and coproduct claims from LaTeX to verdict: an invented manuscript end to end, an
// invented multiplication table of Gr(2,4) as row · column = cell statements, and seeded
// properties of the check path (what the report prints as "computed" reads back as a claim that
// verifies, in any order of the factors; the quantum value at q = 0 is the classical one).
// Expected products are from Debian's lrcalc, named beside each check.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { checkManuscript } from '../../../shared/check/index'
import { partitionsOf, type Partition } from '../../../shared/math'

const report = (tex: string) => checkManuscript({ files: { 'paper.tex': tex } })
const verdicts = (tex: string) => report(tex).claims.map(c => [c.kind, c.verdict])

describe('an invented manuscript, end to end', () => {
  const tex = String.raw`\documentclass{article}
\newtheorem{example}{Example}
\begin{document}
\section{Lines in space}
The Grassmannian $\mathrm{Gr}(2,4)$ of lines in $\mathbb{P}^3$ has $\dim \mathrm{Gr}(2,4)=4$, and
$\sigma_\lambda$ is the class of the Schubert variety $\Omega_\lambda$.
\begin{example}
In $H^*(\mathrm{Gr}(2,4))$ the special classes multiply as
\begin{align*}
  \sigma_1 \cdot \sigma_1 &= \sigma_2 + \sigma_{11}, \\
  \sigma_2 \cdot \sigma_{11} &= \sigma_{31}.
\end{align*}
\end{example}
\begin{example}
In $QH^*(\mathrm{Gr}(2,4))$ we get $\sigma_1 \star \sigma_{21} = \sigma_{22} + q$; put $q = 0$ to recover the classical product.
\end{example}
\section{Coproducts}
\[ \Delta(s_{21}) = s_{21}\otimes 1 + s_2\otimes s_1 + s_{11}\otimes s_1 + s_1\otimes s_2 + s_1\otimes s_{11} + 1\otimes s_{21}. \]
\end{document}
`
  it('verifies the true product, the quantum product and the coproduct, flags the vanishing class, and stays silent on the prose', () => {
    // lrcalc mult -r 2 1 - 1: s_2 + s_11; lrcalc mult -r 2 2 - 1 1: s_31 only, outside the 2 × 2 box;
    // lrcalc mult -q 2,2 1 - 2 1: σ_22 + q; lrcalc coprod -a 2 1: the six terms.
    const r = report(tex)
    expect(r.claims.map(c => [c.line, c.kind, c.verdict])).toEqual([
      [10, 'grassmannian', 'verified'],
      [11, 'grassmannian', 'mismatch'],
      [15, 'quantumGrassmannian', 'verified'],
      [18, 'coproduct', 'verified'],
    ])
    expect(r.claims[1]!.message).toBe('1 extra class. σ_{31} is 0 in H^*(Gr(2,4)): (3,1) does not fit in the 2×2 box.')
    expect(r.notRead).toEqual([])
  })
})

describe('an invented multiplication table of H*(Gr(2,4)), one statement per cell', () => {
  // Row · column = cell, as a table of products is read. Values: lrcalc mult -r 2, keeping parts ≤ 2.
  const heads = ['1', '2', '11', '21', '22']
  const table: Record<string, string> = {
    '1·1': '\\sigma_2 + \\sigma_{11}', '1·2': '\\sigma_{21}', '1·11': '\\sigma_{21}', '1·21': '\\sigma_{22}', '1·22': '0',
    '2·2': '\\sigma_{22}', '2·11': '0', '2·21': '0', '2·22': '0',
    '11·11': '\\sigma_{22}', '11·21': '0', '11·22': '0',
    '21·21': '0', '21·22': '0', '22·22': '0',
  }
  const statements = (cells: Record<string, string>) => {
    const rows: string[] = []
    heads.forEach((a, i) => heads.slice(i).forEach(b => rows.push(`\\sigma_{${a}} \\cdot \\sigma_{${b}} &= ${cells[`${a}·${b}`]}`)))
    return `In $H^*(\\mathrm{Gr}(2,4))$:\n\\begin{align*}\n${rows.join(' \\\\\n')}\n\\end{align*}\n`
  }

  it('every cell of the true table verifies', () => {
    const r = report(statements(table))
    expect(r.claims).toHaveLength(15)
    expect(r.claims.filter(c => c.verdict !== 'verified').map(c => c.source)).toEqual([])
  })

  it('a cell that vanishes in the box but is written as a class is the one mismatch, named', () => {
    const r = report(statements({ ...table, '2·11': '\\sigma_{31}' }))
    const wrong = r.claims.filter(c => c.verdict !== 'verified')
    expect(wrong.map(c => c.source)).toEqual(['\\sigma_{2} \\cdot \\sigma_{11} = \\sigma_{31}'])
    expect(wrong[0]!.message).toContain('σ_{31} is 0 in H^*(Gr(2,4))')
  })

  it('a cell with a wrong class is a mismatch with the term-by-term difference in σ notation', () => {
    const r = report(statements({ ...table, '1·1': '\\sigma_2' }))
    const wrong = r.claims.filter(c => c.verdict !== 'verified')
    expect(wrong.map(c => c.diff)).toEqual([{ basis: 'class', missing: [{ term: '\\sigma_{11}', coefficient: '1' }], extra: [], wrongCoefficient: [] }])
  })
})

/** Partitions in the k × (n − k) box, ∅ excluded. */
function box(k: number, n: number): Partition[] {
  const out: Partition[] = []
  for (let s = 1; s <= k * (n - k); s++) for (const p of partitionsOf(s)) if (p.length <= k && (p[0] ?? 0) <= n - k) out.push(p)
  return out
}

const sigma = (p: Partition) => `\\sigma_{${p.some(x => x > 9) ? p.join(',') : p.join('')}}`

/** Gr(k,n) with 3 ≤ n ≤ 7 and three classes in its box. */
const classesOfGrassmannian = fc.integer({ min: 3, max: 7 }).chain(n => fc.integer({ min: 1, max: n - 1 }).chain((k) => {
  const classes = box(k, n)
  const pick = fc.integer({ min: 0, max: classes.length - 1 }).map(i => classes[i]!)
  return fc.tuple(fc.constant(k), fc.constant(n), pick, pick, pick)
}))

/** The computed value the report prints for `product` in the given ring. */
function computedOf(ring: 'H' | 'QH', k: number, n: number, product: string): string {
  const claims = report(`In $${ring}^*(\\mathrm{Gr}(${k},${n}))$: $${product} = 0$.`).claims
  if (claims.length !== 1 || claims[0]!.computed === null) throw new Error(`no computed value for ${product} on Gr(${k},${n}): ${JSON.stringify(claims.map(c => c.message))}`)
  return claims[0]!.computed
}

describe('properties of the check path (fast-check, seeded)', () => {
  for (const ring of ['H', 'QH'] as const) {
    it(`in ${ring}*(Gr(k,n)): (σ_a σ_b) σ_c read back against σ_c (σ_b σ_a) verifies, so the product is commutative and associative`, () => {
      fc.assert(fc.property(classesOfGrassmannian, ([k, n, a, b, c]) => {
        const op = ring === 'QH' ? ' \\star ' : ' \\cdot '
        const value = computedOf(ring, k, n, `(${sigma(a)}${op}${sigma(b)})${op}${sigma(c)}`)
        const back = report(`In $${ring}^*(\\mathrm{Gr}(${k},${n}))$: $${sigma(c)}${op}(${sigma(b)}${op}${sigma(a)}) = ${value}$.`).claims
        expect(back.map(cl => cl.verdict), `${value} on Gr(${k},${n})`).toEqual(['verified'])
      }), { seed: 20261202 + (ring === 'QH' ? 1 : 0), numRuns: 60 })
    })
  }

  it('the quantum product at q = 0 is the classical product', () => {
    fc.assert(fc.property(classesOfGrassmannian, ([k, n, a, b]) => {
      const quantum = computedOf('QH', k, n, `${sigma(a)} \\star ${sigma(b)}`)
      const classical = computedOf('H', k, n, `${sigma(a)} \\cdot ${sigma(b)}`)
      // Drop the terms with q from the printed quantum value (every coefficient is positive: no signs).
      const atZero = quantum === '0' ? [] : quantum.split(' + ').filter(t => !t.includes('q'))
      expect(atZero.join(' + ') || '0', `${sigma(a)} ⋆ ${sigma(b)} on Gr(${k},${n})`).toBe(classical)
    }), { seed: 20261204, numRuns: 80 })
  })
})

describe('kinds', () => {
  it('names the kinds of Grassmannian, quantum and coproduct claims', () => {
    expect(verdicts('In $QH^*(\\mathrm{Gr}(2,4))$, $\\sigma_1^2 = \\sigma_2 + \\sigma_{11}$. $\\Delta(s_1) = s_1\\otimes 1 + 1\\otimes s_1$')).toEqual([
      ['quantumGrassmannian', 'verified'],
      ['coproduct', 'verified'],
    ])
  })
})
