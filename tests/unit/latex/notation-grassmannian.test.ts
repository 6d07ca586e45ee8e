// Schubert classes σ_λ of Grassmannians, the setting Gr(k,n) taken from the text or a tag, quantum
// products with q, Giambelli determinants, degrees, and coproducts Δ(s_λ) written with ⊗.
// Expected products come from Debian's lrcalc (the command is named beside each check); the
// degree ∫σ_1^4 = 2 on Gr(2,4) is the classical count of lines meeting four general lines
// (common practice).
import { describe, expect, it } from 'vitest'
import { readSnippet, ready } from './helpers'
import { verdictsOf } from './verdict-helpers'
import { parseTag } from '../../../shared/latex/tags'
import { checkManuscript } from '../../../shared/check/index'

const cls = (...partition: number[]) => ({ type: 'schubertClass', partition })

describe('the Grassmannian setting', () => {
  it.each([
    ['In $H^*(\\mathrm{Gr}(2,4))$ we have $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 2, n: 4 }],
    ['Let $X=\\mathrm{Gr}(3,7)$. Then $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 3, n: 7, name: 'X' }],
    ['$X = G(2,5)$ and $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 2, n: 5, name: 'X' }],
    ['On the Grassmannian $G(2,5)$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 2, n: 5 }],
    ['The Grassmannian $\\mathrm{Gr}_2(\\mathbb{C}^4)$ has $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 2, n: 4 }],
    ['In $\\operatorname{Gr}(2,\\mathbb{C}^4)$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 2, n: 4 }],
    ['In $QH^*(\\mathrm{Gr}(2,5))$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'quantum', k: 2, n: 5 }],
    ['In $QH^{*}(\\mathrm{Gr}(2,5))$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'quantum', k: 2, n: 5 }],
    ['% scholium: in Gr(2,4)\n$\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'cohomology', k: 2, n: 4 }],
    ['% scholium: in QH Gr(2,5)\n$\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.', { ring: 'quantum', k: 2, n: 5 }],
  ])('reads the setting of %s', (tex, setting) => {
    const claims = ready(readSnippet(tex))
    expect(claims.map(c => c.question?.setting)).toEqual([setting])
    expect(claims[0]!.kind).toBe(setting.ring === 'quantum' ? 'quantumGrassmannian' : 'grassmannian')
  })

  it.each([
    ['We have $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$ in $H^*(\\mathrm{Gr}(2,4))$.', { ring: 'cohomology', k: 2, n: 4 }],
    ['We have $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$ in $QH^{*}(\\mathrm{Gr}(2,5))$.', { ring: 'quantum', k: 2, n: 5 }],
    ['We have $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$ on $\\mathrm{Gr}(3,6)$.', { ring: 'cohomology', k: 3, n: 6 }],
  ])('reads a setting named right after the claim: %s', (tex, setting) => {
    expect(ready(readSnippet(tex)).map(c => c.question?.setting)).toEqual([setting])
  })

  it('a Grassmannian later in the sentence, after other words, is not the claim\'s setting', () => {
    expect(readSnippet('We have $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$, which fails in $H^*(\\mathrm{Gr}(2,4))$.').claims).toEqual([])
  })

  it('does not read σ_λ without a setting, and lists it as not read', () => {
    const r = readSnippet('We have $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.source)).toEqual(['\\sigma_1^2 = \\sigma_2+\\sigma_{11}'])
  })

  it('ends the setting with its environment and with its section', () => {
    const tex = [
      '\\begin{example} In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$. \\end{example}',
      'After it: $\\sigma_1^2 = \\sigma_2$.',
      'In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_2\\sigma_2 = \\sigma_{22}$.',
      '\\section{Next}',
      'Here $\\sigma_1\\sigma_1 = \\sigma_2$.',
    ].join('\n')
    const r = readSnippet(tex)
    expect(ready(r).map(c => c.line)).toEqual([1, 3])
    expect(r.notRead.map(n => n.line)).toEqual([2, 5])
  })

  it('a later setting replaces an earlier one', () => {
    const r = readSnippet('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$. In $H^*(\\mathrm{Gr}(3,6))$, $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.')
    expect(ready(r).map(c => [c.question?.setting?.k, c.question?.setting?.n])).toEqual([[2, 4], [3, 6]])
  })

  it('math naming two Grassmannians ends the setting, even one set by a tag: the reader does not guess', () => {
    const tex = '% scholium: in Gr(2,5)\nThe inclusion $\\mathrm{Gr}(2,4) \\to \\mathrm{Gr}(2,5)$ pulls back $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.'
    const r = readSnippet(tex)
    expect(r.claims).toEqual([])
    expect(r.notRead).toHaveLength(1)
    // H* and QH* of one Grassmannian in one piece of math is just as unclear.
    expect(readSnippet('Recall $QH^*(\\mathrm{Gr}(2,4)) \\supset H^*(\\mathrm{Gr}(2,4))$, and $\\sigma_1\\sigma_{21} = \\sigma_{22}$.').claims).toEqual([])
  })

  it('a tag setting lasts until the next tag; "in Sym" ends it', () => {
    const tex = [
      '% scholium: in Gr(2,4)',
      '\\section{A}',
      '$\\sigma_1^2 = \\sigma_2+\\sigma_{11}$',
      '% scholium: in Sym',
      '$\\sigma_1^2 = \\sigma_2+\\sigma_{11}$',
    ].join('\n')
    const r = readSnippet(tex)
    expect(ready(r).map(c => c.line)).toEqual([3])
    expect(r.notRead.map(n => n.line)).toEqual([5])
  })

  it('parses the tag forms and rejects a meaningless Grassmannian', () => {
    expect(parseTag(' scholium: in Gr(2,4)').directives).toEqual([{ type: 'grassmannian', setting: { ring: 'cohomology', k: 2, n: 4 } }])
    expect(parseTag(' scholium: in QH Gr(3, 7); skip').directives).toEqual([{ type: 'grassmannian', setting: { ring: 'quantum', k: 3, n: 7 } }, { type: 'skip' }])
    expect(parseTag(' scholium: in Sym').directives).toEqual([{ type: 'grassmannian', setting: null }])
    expect(parseTag(' scholium: in Gr(4,4)').errors).toEqual(['Gr(4,4) needs 1 ≤ k ≤ n − 1'])
    expect(parseTag(' scholium: in P^3').errors[0]).toMatch(/write "in Gr\(k,n\)"/)
  })

  it('a bare G(k,n) is not a Grassmannian without a hint', () => {
    const r = readSnippet('The group $G(2,5)$ acts, and $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.')
    expect(r.claims).toEqual([])
  })

  it('the name X = Gr(3,7) is a setting, not a claim', () => {
    const r = readSnippet('$X = \\mathrm{Gr}(3,7)$')
    expect(r.claims).toEqual([])
    expect(r.notRead).toEqual([])
  })
})

describe('Schubert classes σ_λ', () => {
  const inGr24 = (math: string) => `In $H^*(\\mathrm{Gr}(2,4))$, ${math}`
  it.each([
    ['$\\sigma_{21} = \\sigma_{21}$', cls(2, 1)],
    ['$\\sigma_{(2,1)} = \\sigma_{21}$', cls(2, 1)],
    ['$\\sigma_{2,1} = \\sigma_{21}$', cls(2, 1)],
    ['$\\sigma_{1^2} = \\sigma_{11}$', cls(1, 1)],
  ])('reads %s', (math, lhs) => {
    expect(ready(readSnippet(inGr24(math))).map(c => c.question?.lhs)).toEqual([lhs])
  })

  it('reads σ_λ with λ bound, powers, ⋆ and q', () => {
    const r = readSnippet('In $QH^*(\\mathrm{Gr}(2,4))$ let $\\lambda = (2,1)$. Then $\\sigma_1 \\star \\sigma_\\lambda = \\sigma_{22} + q$.')
    expect(ready(r).map(c => c.question)).toEqual([{
      type: 'equality',
      lhs: { type: 'multiply', factors: [cls(1), cls(2, 1)] },
      rhs: { type: 'add', terms: [cls(2, 2), { type: 'quantumParameter' }] },
      setting: { ring: 'quantum', k: 2, n: 4 },
    }])
  })

  it('σ_λ with λ unbound is a general statement: not read', () => {
    const r = readSnippet('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_\\lambda \\sigma_\\mu = \\sum_\\nu c^\\nu_{\\lambda\\mu}\\sigma_\\nu$.')
    expect(r.claims).toEqual([])
  })

  it('σ_λ next to x_i (a presentation of the ring) and σ_i applied to an argument are not claims', () => {
    const r = readSnippet('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1 = x_1 + x_2$ and $\\sigma_1(x_1) = x_2$.')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.source)).toEqual(['\\sigma_1 = x_1 + x_2'])
    // A parenthesis of classes is a product.
    expect(verdictsOf('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1(\\sigma_1+\\sigma_2) = \\sigma_2 + \\sigma_{11} + \\sigma_{21}$.')).toEqual(['verified'])
  })

  it('σ bound to a permutation stays a permutation', () => {
    const r = readSnippet('In $H^*(\\mathrm{Gr}(2,4))$ let $\\sigma = 2143$. Then $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$.')
    expect(r.claims).toEqual([])
  })

  it('prose about Grassmannians stays silent', () => {
    for (const tex of [
      'We have $\\dim \\mathrm{Gr}(2,4)=4$ and $\\sigma_\\lambda$ is the class of the Schubert variety.',
      'In $QH^*(\\mathrm{Gr}(2,4))$ put $q=0$ to recover $H^*(\\mathrm{Gr}(2,4))$.',
      'In $QH^*(\\mathrm{Gr}(2,4))$ we set $q = 1$.',
      'In $H^*(\\mathrm{Gr}(2,4))$ the transpositions satisfy $\\sigma_1\\sigma_2\\sigma_1 = \\sigma_2\\sigma_1\\sigma_2$ and $\\sigma_1^2 = 1$.',
    ]) {
      const r = readSnippet(tex)
      expect(r.claims, tex).toEqual([])
    }
  })
})

describe('verdicts in H*(Gr(2,4)) and QH*(Gr(2,4))', () => {
  it('products against lrcalc mult -r 2 with parts ≤ 2: σ_1^2 = σ_2 + σ_11, σ_1σ_21 = σ_22, σ_2σ_2 = σ_22', () => {
    const tex = 'In $H^*(\\mathrm{Gr}(2,4))$: $\\sigma_1^2 = \\sigma_2+\\sigma_{11}$, $\\sigma_1\\sigma_{21} = \\sigma_{22}$, $\\sigma_2\\,\\sigma_2 = \\sigma_{22}$, $\\sigma_1\\sigma_1 = \\sigma_2$.'
    expect(verdictsOf(tex)).toEqual(['verified', 'verified', 'verified', 'mismatch'])
  })

  it('a Schur identity in a Gr(2,4) section is checked there (truncated); outside, in Λ', () => {
    // lrcalc mult 2 - 2: s_4 + s_31 + s_22; only s_22 fits the 2 × 2 box.
    expect(verdictsOf('In $H^*(\\mathrm{Gr}(2,4))$ we have $s_2 s_2 = s_{22}$.')).toEqual(['verified'])
    expect(verdictsOf('We have $s_2 s_2 = s_{22}$.')).toEqual(['mismatch'])
    expect(verdictsOf('In $H^*(\\mathrm{Gr}(2,4))$ we have $s_2 s_2 = s_4 + s_{31} + s_{22}$.')).toEqual(['verified'])
  })

  it('a class that vanishes in the box, written as a class, is a mismatch that names it', () => {
    const report = checkOne('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_2\\sigma_{11} = \\sigma_{31}$.')
    expect(report.verdict).toBe('mismatch')
    expect(report.message).toContain('σ_{31} is 0 in H^*(Gr(2,4)): (3,1) does not fit in the 2×2 box')
    expect(report.diff).toMatchObject({ basis: 'class', extra: [{ term: '\\sigma_{31}', coefficient: '1' }] })
    // Pieri in Λ (lrcalc mult 1 - 2: s_3 + s_21) with σ_3, which is 0 in Gr(2,4).
    expect(checkOne('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1\\sigma_2 = \\sigma_3 + \\sigma_{21}$.').message).toContain('σ_{3} is 0 in H^*(Gr(2,4))')
    // Saying that it vanishes is right.
    expect(verdictsOf('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_3 = 0$ and $\\sigma_2\\sigma_{11} = 0$.')).toEqual(['verified', 'verified'])
  })

  it('degrees: ∫_{Gr(2,4)} σ_1^4 = 2 (lines meeting four lines, common practice), deg Gr(2,5) = 5 (OEIS A000108), ∫_X', () => {
    expect(verdictsOf('$\\int_{\\mathrm{Gr}(2,4)} \\sigma_1^4 = 2$ and $\\int_{\\mathrm{Gr}(2,4)} \\sigma_1^4 = 1$')).toEqual(['verified', 'mismatch'])
    expect(verdictsOf('$\\deg \\mathrm{Gr}(2,5) = 5$, $\\deg(\\mathrm{Gr}(2,6)) = 14$, $\\deg \\mathrm{Gr}(2,6) = 13$')).toEqual(['verified', 'verified', 'mismatch'])
    // deg Gr(3,7) = 462, SYT of the 3 × 4 rectangle (hook length formula: 12!/(6·5·4·3 · 5·4·3·2 · 4·3·2·1) = 462)
    expect(verdictsOf('Let $X = \\mathrm{Gr}(3,7)$. Then $\\int_X \\sigma_1^{12} = 462$.')).toEqual(['verified'])
    expect(checkOne('$\\int_{\\mathrm{Gr}(2,4)} \\sigma_1^4 = 1$').message).toBe('The manuscript has 1; the computation gives 2.')
  })

  it('Giambelli determinants, σ_0 = 1', () => {
    const det = (a: string) => `In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_{21} = \\det\\begin{pmatrix}${a}\\end{pmatrix}$.`
    expect(verdictsOf(det('\\sigma_2&\\sigma_3\\\\ \\sigma_0&\\sigma_1'))).toEqual(['verified'])
    // σ_2σ_1 − σ_3σ_0 = σ_21 in Λ; swapping the rows flips the sign.
    expect(verdictsOf(det('\\sigma_0&\\sigma_1\\\\ \\sigma_2&\\sigma_3'))).toEqual(['mismatch'])
  })

  it('quantum products against lrcalc mult -q 2,2: σ_1 ⋆ σ_21 = σ_22 + q, σ_21 ⋆ σ_21 = qσ_2 + qσ_11', () => {
    const tex = 'In $QH^*(\\mathrm{Gr}(2,4))$: $\\sigma_1 * \\sigma_{21} = \\sigma_{22} + q$, $\\sigma_{21}\\star\\sigma_{21} = q\\sigma_2 + q\\sigma_{11}$, $\\sigma_1 \\star \\sigma_{21} = \\sigma_{22}$.'
    expect(verdictsOf(tex)).toEqual(['verified', 'verified', 'mismatch'])
    const report = checkOne('In $QH^*(\\mathrm{Gr}(2,4))$, $\\sigma_{21}\\star\\sigma_{21} = q\\sigma_2 + 2q\\sigma_{11}$.')
    expect(report.diff).toEqual({ basis: 'class', missing: [], extra: [], wrongCoefficient: [{ term: 'q\\sigma_{11}', claimed: '2', computed: '1' }] })
  })

  it('q in a classical setting is not checked: no verdict, listed as not read', () => {
    const report = checkManuscript({ files: { 'snippet.tex': 'In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1\\sigma_{21} = \\sigma_{22} + q$.' } })
    expect(report.claims).toEqual([])
    expect(readSnippet('In $H^*(\\mathrm{Gr}(2,4))$, $\\sigma_1\\sigma_{21} = \\sigma_{22} + q$.').notRead).toHaveLength(1)
  })
})

describe('coproducts', () => {
  it('reads Δ(s_21) with ⊗ and checks it against lrcalc coprod -a 2 1', () => {
    const right = 's_{21}\\otimes 1 + s_2\\otimes s_1 + s_{11}\\otimes s_1 + s_1\\otimes s_2 + s_1\\otimes s_{11} + 1\\otimes s_{21}'
    const r = readSnippet(`$\\Delta(s_{21}) = ${right}$`)
    expect(ready(r).map(c => c.kind)).toEqual(['coproduct'])
    expect(verdictsOf(`$\\Delta(s_{21}) = ${right}$`)).toEqual(['verified'])
    const report = checkOne(`$\\Delta(s_{21}) = ${right.replace(' + 1\\otimes s_{21}', '')}$`)
    expect(report.verdict).toBe('mismatch')
    expect(report.diff).toEqual({ basis: 'tensor', missing: [{ term: '1\\otimes s_{21}', coefficient: '1' }], extra: [], wrongCoefficient: [] })
  })

  it('integer multiples: Δ(s_1^2) = s_1^2 ⊗ 1 + 2 s_1 ⊗ s_1 + 1 ⊗ s_1^2 (Δ is a ring map, common practice)', () => {
    expect(verdictsOf('$\\Delta(s_1 s_1) = s_2\\otimes 1 + s_{11}\\otimes 1 + 2 s_1 \\otimes s_1 + 1\\otimes s_2 + 1 \\otimes s_{11}$')).toEqual(['verified'])
  })

  it('skew coefficients c^{λ}_{μν} of s_{λ/μ}: c^{321}_{21,21} = 2 (lrcalc lrcoef 3 2 1 - 2 1 - 2 1)', () => {
    expect(verdictsOf('$c^{321}_{21,21} = 2$ and $s_{321/21} = s_3 + 2s_{21} + s_{111}$')).toEqual(['verified', 'verified'])
  })

  it('Δ of something that is not a symmetric function is not read', () => {
    expect(readSnippet('$\\Delta(x_1) = x_1 \\otimes 1$').claims.filter(c => c.status === 'ready')).toEqual([])
  })
})

function checkOne(tex: string) {
  const claims = checkManuscript({ files: { 'snippet.tex': tex } }).claims
  if (claims.length !== 1) throw new Error(`expected one claim, got ${claims.length}`)
  return claims[0]!
}

// Regression: q next to classes of plain H*(Gr(k,n)) gave "unsupported" (unknown symbol q); it is
// the paper's shorthand for QH* at best, so it is listed as not read and gets no verdict.
describe('q in plain H^*', () => {
  it('is not read, and gets no verdict', () => {
    const r = readSnippet('In $H^*(\\mathrm{Gr}(2,4))$ we have $\\sigma_1 \\sigma_3 = q$.')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.reason)).toEqual([expect.stringMatching(/q in H\^\*\(Gr\(k,n\)\), not QH\^\*/)])
  })
  it('is still read in QH^*', () => {
    expect(readSnippet('In $QH^*(\\mathrm{Gr}(2,4))$ we have $\\sigma_1 \\sigma_{22} = q\\sigma_1$.').claims.map(c => c.status)).toEqual(['ready'])
  })
})

describe('classes of Schubert varieties [X_λ]', () => {
  // Whether X_λ has codimension |λ| (class σ_λ) or dimension |λ| (class σ of the complement) differs
  // between papers; under the other reading [X_1]^2 = [X_2] + [X_{11}] in Gr(2,4) would be a red mark.
  it('are not read, with a reason that names the two indexings', () => {
    const read = readSnippet('In $H^*(\\mathrm{Gr}(2,4))$ we have $[X_{1}]^2 = [X_{2}] + [X_{11}]$ and $[\\Omega_{1}]^2 = [\\Omega_{2}] + [\\Omega_{11}]$.')
    expect(read.claims).toEqual([])
    expect(read.notRead.map(n => n.reason)).toEqual([expect.stringMatching(/codimension .* dimension/), expect.stringMatching(/codimension .* dimension/)])
  })
})
