// K-theory (β formal, ⊕ and ⊖, G_w(x;y), β = 0), key polynomials and atoms, and tag-declared parameters.
// Values are worked by hand from the definitions (noted beside each check); the Grothendieck product is
// the one tests/reference/math/sympy-grothendieck-formal.test.ts confirms with sympy.
import { describe, expect, it } from 'vitest'
import { checkManuscript } from '../../../shared/check/index'
import { onlyQuestion, readSnippet } from './helpers'
import { verdictsOf } from './verdict-helpers'

const claimsOf = (tex: string) => checkManuscript({ files: { 'snippet.tex': tex } }).claims

describe('β as a formal parameter in K-theory claims', () => {
  it('reads \\beta as the parameter beta next to \\mathfrak{G}', () => {
    const q = onlyQuestion('$$\\mathfrak{G}_{132} = x_1 + x_2 + \\beta x_1 x_2$$')
    expect(JSON.stringify(q.rhs)).toContain('{"type":"parameter","name":"beta"}')
  })

  it('verifies G_{132} = x_1 + x_2 + βx_1x_2 (by hand: π^β_1 of G_{312} = x_1^2) and flags the wrong sign of β', () => {
    expect(verdictsOf('$$\\mathfrak{G}_{132} = x_1 + x_2 + \\beta x_1 x_2$$')).toEqual(['verified'])
    expect(verdictsOf('$$\\mathfrak{G}_{132} = x_1 + x_2 - \\beta x_1 x_2$$')).toEqual(['mismatch'])
  })

  it('without β written, G is numeric under the beta conventions (β = −1 by default, β = +1 by tag)', () => {
    expect(verdictsOf('$$\\mathfrak{G}_{132} = x_1 + x_2 - x_1 x_2$$')).toEqual(['verified'])
    expect(verdictsOf('% scholium: use beta-plus\n$$\\mathfrak{G}_{132} = x_1 + x_2 + x_1 x_2$$')).toEqual(['verified'])
  })

  it('K-theoretic structure constants with β formal: G_{132}^2 = G_{231} + G_{1423} + βG_{2413}', () => {
    expect(verdictsOf('$$\\mathfrak{G}_{132}\\mathfrak{G}_{132} = \\mathfrak{G}_{231} + \\mathfrak{G}_{1423} + \\beta\\mathfrak{G}_{2413}$$')).toEqual(['verified'])
    expect(verdictsOf('$$\\mathfrak{G}_{132}\\mathfrak{G}_{132} = \\mathfrak{G}_{231} + \\mathfrak{G}_{1423}$$')).toEqual(['mismatch'])
  })

  it('a mismatch diff names the β-terms', () => {
    const [c] = claimsOf('$$\\mathfrak{G}_{132} = x_1 + x_2$$ % scholium: use beta-minus\n')
    expect(c!.verdict).toBe('mismatch')
    const [d] = claimsOf('$$\\mathfrak{G}_{132} = x_1 + x_2 + 2\\beta x_1x_2$$')
    expect(d!.diff).toMatchObject({ basis: 'monomial', wrongCoefficient: [{ term: '\\beta x_{1}x_{2}', claimed: '2', computed: '1' }] })
  })
})

describe('⊕ and ⊖ in claims, G_w(x;y) in both normalisations', () => {
  it('reads x_1 \\oplus y_1 as a formal-group sum', () => {
    expect(onlyQuestion('$$\\mathfrak{G}_{21}(x;y) = x_1 \\oplus y_1$$').rhs).toEqual({
      type: 'formalGroup', op: 'oplus', left: { type: 'variable', name: 'x', index: 1 }, right: { type: 'variable', name: 'y', index: 1 },
    })
  })

  it('verifies the top class of S_2 in each normalisation, and each fails in the other', () => {
    expect(verdictsOf('$$\\mathfrak{G}_{21}(x;y) = x_1 \\oplus y_1$$')).toEqual(['verified'])
    expect(verdictsOf('$$\\mathfrak{G}_{21}(x;y) = x_1 + y_1 + \\beta x_1 y_1$$')).toEqual(['verified'])
    expect(verdictsOf('% scholium: use k-ominus\n$$\\mathfrak{G}_{21}(x;y) = x_1 \\ominus y_1$$')).toEqual(['verified'])
    const [c] = claimsOf('% scholium: use k-oplus\n$$\\mathfrak{G}_{21}(x;y) = x_1 \\ominus y_1$$')
    expect(c!.verdict).toBe('mismatch')
    expect(c!.holdsUnder).toEqual(['k-ominus'])
  })

  it('products of ⊕ factors: the top class of S_3 is (x_1 ⊕ y_1)(x_1 ⊕ y_2)(x_2 ⊕ y_1)', () => {
    expect(verdictsOf('$$\\mathfrak{G}_{321}(x;y) = (x_1 \\oplus y_1)(x_1 \\oplus y_2)(x_2 \\oplus y_1)$$')).toEqual(['verified'])
    expect(verdictsOf('$$\\mathfrak{G}_{321}(x;y) = (x_1 \\oplus y_1)(x_1 \\oplus y_2)(x_2 \\oplus y_2)$$')).toEqual(['mismatch'])
  })

  it('divided differences act on β-polynomials: ∂_1(x_1 ⊕ y_1) = 1 + βy_1 (by hand)', () => {
    expect(verdictsOf('$$\\partial_1 (x_1 \\oplus y_1) = 1 + \\beta y_1$$')).toEqual(['verified'])
    expect(verdictsOf('$$\\partial_1 (x_1 \\oplus y_1) = 1 - \\beta y_1$$')).toEqual(['mismatch'])
  })

  it('does not read ⊕ mixed with + at one level', () => {
    const r = readSnippet('$$\\mathfrak{G}_{21}(x;y) = x_1 \\oplus y_1 + 0$$')
    expect(r.claims.filter(c => c.status === 'ready')).toEqual([])
  })

  it('stays silent on direct sums that are not K-theory', () => {
    const r = readSnippet('Here $V \\oplus W = U$ and $\\mathbb{Z} \\oplus \\mathbb{Z} = \\mathbb{Z}^2$.')
    expect(r.claims).toEqual([])
  })
})

describe('the specialisation β = 0', () => {
  it('reads |_{\\beta=0}, \\big|_{\\beta=0} and \\left. … \\right|_{\\beta=0}', () => {
    for (const tex of [
      '$$\\mathfrak{G}_{21}(x;y)|_{\\beta=0} = x_1 + y_1$$',
      '$$\\mathfrak{G}_{21}(x;y)\\big|_{\\beta=0} = x_1 + y_1$$',
      '$$\\left.\\mathfrak{G}_{21}(x;y)\\right|_{\\beta = 0} = x_1 + y_1$$',
    ]) {
      expect(onlyQuestion(tex).lhs, tex).toMatchObject({ type: 'specialise', parameter: 'beta', value: '0' })
      expect(verdictsOf(tex), tex).toEqual(['verified'])
    }
  })

  it('names the sign slip under a tag as well', () => {
    const [c] = claimsOf('% scholium: use k-oplus\n$$\\mathfrak{G}_{21}(x;y)|_{\\beta=0} = x_1 - y_1$$')
    expect(c!.verdict).toBe('mismatch')
    expect(c!.message).toMatch(/True only with y_j ↦ −y_j: the paper's G_w\(x; y\) uses x_i ⊕ y_j/)
  })

  it('names the sign slip: S_w(x; y) stated where the ⊕ normalisation gives S_w(x; −y)', () => {
    // The paper's other claim fixes the normalisation to ⊕; a lone claim would set it by itself.
    const [ok, c] = claimsOf('$$\\mathfrak{G}_{21}(x;y) = x_1 \\oplus y_1$$\n$$\\mathfrak{G}_{21}(x;y)|_{\\beta=0} = x_1 - y_1$$')
    expect(ok!.verdict).toBe('verified')
    expect(c!.verdict).toBe('mismatch')
    expect(c!.holdsUnder).toEqual(['k-ominus'])
    expect(c!.message).toMatch(/y_j ↦ −y_j/)
    expect(c!.message).toMatch(/x_i ⊕ y_j/)
  })

  it('under the ⊖ normalisation, β = 0 gives S_w(x; y) (factors x_i − y_j)', () => {
    expect(verdictsOf('% scholium: use k-ominus\n$$\\mathfrak{G}_{132}(x;y)|_{\\beta=0} = x_1 + x_2 - y_1 - y_2$$')).toEqual(['verified'])
    expect(verdictsOf('% scholium: use k-ominus\n$$\\mathfrak{G}_{132}(x;y)|_{\\beta=0} = \\mathfrak{S}_{132}(x;y)$$')).toEqual(['verified'])
  })

  it('stays silent on prose: a parameter, a general specialisation, a setting', () => {
    const r = readSnippet([
      'where $\\beta$ is a parameter.',
      '$G_w$ specialises to $\\mathfrak{S}_w$ at $\\beta=0$.',
      'We take $\\beta = -1$ throughout, and at $\\beta=0$ nothing changes.',
      '$$\\mathfrak{G}_w|_{\\beta=0} = \\mathfrak{S}_w$$',
    ].join('\n'))
    expect(r.claims).toEqual([])
  })
})

describe('key polynomials and Demazure atoms', () => {
  const key = (composition: number[]) => ({ type: 'keyPolynomial', family: 'key', composition })

  it.each([['$\\kappa_{(0,2,1)} = 0$'], ['$\\kappa_{021} = 0$'], ['$\\kappa_{0,2,1} = 0$']])('reads %s as κ_(0,2,1)', (tex) => {
    expect(onlyQuestion(tex).lhs).toEqual(key([0, 2, 1]))
  })

  it('verifies κ_{01} = x_1 + x_2 and κ_{021} by hand (π_1 π_2 of x_1^2x_2), flags a missing term', () => {
    expect(verdictsOf('$\\kappa_{01} = x_1 + x_2$')).toEqual(['verified'])
    const full = 'x_1^2x_2 + x_1x_2^2 + x_1^2x_3 + x_1x_2x_3 + x_2^2x_3'
    expect(verdictsOf(`$$\\kappa_{(0,2,1)} = ${full}$$`)).toEqual(['verified'])
    expect(verdictsOf(`$$\\kappa_{(0,2,1)} = ${full.replace(' + x_1x_2x_3', '')}$$`)).toEqual(['mismatch'])
  })

  it('a key in atoms: κ_{021} = A_{021} + A_{201} + A_{210} + A_{120} (by hand, π̄_i = x_{i+1}∂_i)', () => {
    expect(verdictsOf('$$\\kappa_{021} = \\mathcal{A}_{021} + \\mathcal{A}_{201} + \\mathcal{A}_{210} + \\mathcal{A}_{120}$$')).toEqual(['verified'])
    expect(verdictsOf('$$\\kappa_{021} = \\mathcal{A}_{021} + \\mathcal{A}_{201} + \\mathcal{A}_{210}$$')).toEqual(['mismatch'])
  })

  it('S_w in keys: S_{132} = κ_{(0,1)} (x_1 + x_2) and S_{1432} = κ_{021} + … is read as a polynomial identity', () => {
    expect(verdictsOf('$\\mathfrak{S}_{132} = \\kappa_{(0,1)}$')).toEqual(['verified'])
    expect(verdictsOf('$\\mathfrak{S}_{132} = \\kappa_{(1)}$')).toEqual(['mismatch'])
  })

  it('published facts through the reader: S_w = κ_{code(w)} for vexillary w, κ_α = s_λ(x_1..x_n) for α increasing (common practice)', () => {
    // 1432 is vexillary (it avoids 2143) with Lehmer code (0,2,1); (0,1,2) is the increasing rearrangement of (2,1).
    expect(verdictsOf('$\\mathfrak{S}_{1432} = \\kappa_{(0,2,1)}$')).toEqual(['verified'])
    expect(verdictsOf('$\\kappa_{(0,1,2)} = s_{21}(x_1,x_2,x_3)$')).toEqual(['verified'])
    expect(verdictsOf('$\\kappa_{(0,2,1)} = s_{21}(x_1,x_2,x_3)$')).toEqual(['mismatch'])
  })

  it('reads \\mathcal{A}_\\alpha with α bound: A_{102} = x_1x_2x_3 + x_1x_3^2 (by hand)', () => {
    const tex = 'Let $\\alpha = (1,0,2)$. Then $\\mathcal{A}_\\alpha = x_1x_2x_3 + x_1x_3^2$.'
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf(tex.replace('x_1x_2x_3 + ', ''))).toEqual(['mismatch'])
  })

  it('stays silent on κ_α with α unbound, on parts κ_1 = 2, and on an algebra \\mathcal{A}', () => {
    const r = readSnippet([
      '$\\kappa_\\alpha$ for $\\alpha\\in\\mathbb{Z}_{\\ge0}^n$, and $\\kappa_\\alpha = \\sum_\\beta \\mathcal{A}_\\beta$.',
      'The parts are $\\kappa_1 = 2$ and $\\kappa_2 = 1$.',
      'Let $\\mathcal{A} = \\mathbb{Z}[x_1]$ and $\\mathcal{A}_2 = 0$.',
      'The entry $\\mathcal{A}_{12} = x_1 - x_2$ of the matrix.',
    ].join('\n'))
    expect(r.claims).toEqual([])
  })
})

describe('parameters declared by a tag', () => {
  it('checks identities in a declared q exactly, and leaves an undeclared q unread', () => {
    expect(verdictsOf('% scholium: parameters q\n$$(x_1 + q)^2 = x_1^2 + 2qx_1 + q^2$$')).toEqual(['verified'])
    expect(verdictsOf('% scholium: parameters q\n$$(x_1 + q)^2 = x_1^2 + qx_1 + q^2$$')).toEqual(['mismatch'])
    expect(readSnippet('$$(x_1 + q)^2 = x_1^2 + 2qx_1 + q^2$$').claims.filter(c => c.status === 'ready')).toEqual([])
  })

  it('declares Greek parameters and keeps "put q = 0" silent', () => {
    expect(verdictsOf('% scholium: parameters \\gamma, t\n$$(x_1 + \\gamma)(x_1 - t) = x_1^2 + \\gamma x_1 - t x_1 - \\gamma t$$')).toEqual(['verified'])
    expect(readSnippet('% scholium: parameters q\nPut $q=0$ and $t = 1$.').claims).toEqual([])
  })

  it('refuses to declare a letter the reader already reads', () => {
    const r = readSnippet('% scholium: parameters x\n$x_1 = x_1$')
    expect(r.warnings.map(w => w.message).join(' ')).toMatch(/cannot be a parameter/)
  })
})
