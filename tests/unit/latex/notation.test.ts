// Notation recognised without tags. Each expected question was written by hand from the
// snippet's meaning (common practice of the field), not copied from the reader's output.
import { describe, expect, it } from 'vitest'
import { int, onlyQuestion, oneLine, readSnippet, ready, x, y } from './helpers'

const S = (entries: number[], variant: 'single' | 'double' = 'single') => ({ type: 'schubert', perm: { form: 'oneLine', entries }, variant })
const schur = (...index: number[]) => ({ type: 'symmetric', family: 'schur', index })

describe('Schubert-type objects', () => {
  it.each([
    ['$\\mathfrak{S}_{2143} = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3])],
    ['$\\mathfrak S_{2143} = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3])],
    ['$\\mathfrak{S}_{2143}(x) = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3])],
    ['$\\mathfrak{S}_{2143}(x;y) = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3], 'double')],
    ['$\\mathfrak{S}_{2143}(x,y) = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3], 'double')],
    ['$\\mathfrak{S}_{2143}(\\mathbf x;\\mathbf y) = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3], 'double')],
    ['$\\mathfrak{S}_{{2\\,1\\,4\\,3}} = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3])],
    ['$\\mathfrak{S}_{[2,1,4,3]} = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3])],
    ['$\\mathfrak{S}_{(2,1,4,3)} = x_1^2 + x_1 x_2 + x_1 x_3$', S([2, 1, 4, 3])],
  ])('%s', (tex, lhs) => {
    expect(onlyQuestion(tex).lhs).toEqual(lhs)
  })

  it('reads one-line permutations with entries of 10 or more in brackets', () => {
    const q = onlyQuestion('$\\mathfrak S_{[1,2,3,4,5,6,7,8,9,11,10]} = x_1 + x_2 + x_3 + x_4 + x_5 + x_6 + x_7 + x_8 + x_9 + x_{10}$')
    expect(q.lhs).toEqual(S([1, 2, 3, 4, 5, 6, 7, 8, 9, 11, 10]))
    expect((q.rhs as { terms: unknown[] }).terms[9]).toEqual(x(10))
  })

  it('reads (1,3) and (1\\,2)(3\\,4) as cycles, (1,3,2) as one-line', () => {
    expect(onlyQuestion('$\\mathfrak S_{(1,3)} = x_1^2 + x_1 x_2 + x_2^2$').lhs).toMatchObject({ perm: { form: 'cycles', cycles: [[1, 3]] } })
    expect(onlyQuestion('$\\mathfrak S_{(1\\,2)(3\\,4)} = x_1 x_3 + x_1 x_2$').lhs).toMatchObject({ perm: { form: 'cycles', cycles: [[1, 2], [3, 4]] } })
    expect(onlyQuestion('$\\mathfrak S_{(1,3,2)} = x_1 + x_2$').lhs).toMatchObject({ perm: oneLine(1, 3, 2) })
    expect(onlyQuestion('$\\mathfrak S_{(2,3,4)} = x_1 x_2 x_3$').lhs).toMatchObject({ perm: { form: 'cycles', cycles: [[2, 3, 4]] } })
  })

  it('reads words in simple transpositions and w_0', () => {
    expect(onlyQuestion('$\\mathfrak S_{s_1 s_2 s_1} = x_1^2 x_2$').lhs).toMatchObject({ perm: { form: 'word', letters: [1, 2, 1] } })
    expect(onlyQuestion('$\\mathfrak S_{s_1s_2} = x_1^2$').lhs).toMatchObject({ perm: { form: 'word', letters: [1, 2] } })
    expect(onlyQuestion('$\\mathfrak S_{w_0^{(3)}} = x_1^2 x_2$').lhs).toMatchObject({ perm: { form: 'longest', n: 3 } })
    const r = readSnippet('Let $n = 4$. Then $\\ell(w_0) = 6$.')
    expect(ready(r).map(c => c.question?.lhs)).toEqual([{ type: 'length', perm: { form: 'longest', n: 4 } }])
  })

  it('reads Grothendieck and Stanley objects', () => {
    expect(onlyQuestion('$\\mathfrak{G}_{21} = x_1$').lhs).toEqual({ type: 'grothendieck', perm: oneLine(2, 1), variant: 'single' })
    expect(onlyQuestion('$\\mathfrak{G}_{21}(x;y) = x_1 + y_1 - x_1 y_1$').lhs).toEqual({ type: 'grothendieck', perm: oneLine(2, 1), variant: 'double' })
    expect(onlyQuestion('$F_{321} = s_{21} + s_{111}$').lhs).toEqual({ type: 'stanley', perm: oneLine(3, 2, 1) })
  })

  it('reports a non-permutation subscript as unsupported with the reason', () => {
    const r = readSnippet('$\\mathfrak S_{2243} = x_1$')
    expect(r.claims).toHaveLength(1)
    expect(r.claims[0]).toMatchObject({ status: 'unsupported', reason: '2243 is not a permutation of 1..4' })
  })
})

describe('symmetric functions', () => {
  it.each([
    ['$s_{21} = m_{21} + 2 m_{111}$', schur(2, 1)],
    ['$s_{2,1} = m_{21} + 2 m_{111}$', schur(2, 1)],
    ['$s_{(2,1)} = m_{21} + 2 m_{111}$', schur(2, 1)],
  ])('%s', (tex, lhs) => {
    const q = onlyQuestion(tex)
    expect(q.lhs).toEqual(lhs)
    expect(q.rhs).toEqual({
      type: 'add',
      terms: [
        { type: 'symmetric', family: 'monomial', index: [2, 1] },
        { type: 'multiply', factors: [int(2), { type: 'symmetric', family: 'monomial', index: [1, 1, 1] }] },
      ],
    })
  })

  it('reads variables, e_k, h_k, p_k and products of Schur functions', () => {
    expect(onlyQuestion('$s_{11}(x_1,x_2,x_3) = e_2(x_1,x_2,x_3)$')).toEqual({
      type: 'equality',
      lhs: { type: 'symmetric', family: 'schur', index: [1, 1], variableCount: 3 },
      rhs: { type: 'symmetric', family: 'elementary', index: [2], variableCount: 3 },
    })
    expect(onlyQuestion('$s_{1}(x_1,\\dots,x_4) = p_1(x_1,\\ldots,x_4)$').lhs).toMatchObject({ variableCount: 4 })
    expect(onlyQuestion('$h_2 = s_2$').lhs).toEqual({ type: 'symmetric', family: 'complete', index: [2] })
    expect(onlyQuestion('$s_{21} s_{1} = s_{31} + s_{22} + s_{211}$').lhs).toEqual({ type: 'multiply', factors: [schur(2, 1), schur(1)] })
  })

  it('reads products of Schubert polynomials expanded in the Schubert basis', () => {
    const q = onlyQuestion('$\\mathfrak S_{213}\\,\\mathfrak S_{213} = \\mathfrak S_{312} + \\mathfrak S_{231}$')
    expect(q.lhs).toEqual({ type: 'multiply', factors: [S([2, 1, 3]), S([2, 1, 3])] })
    expect(q.rhs).toEqual({ type: 'add', terms: [S([3, 1, 2]), S([2, 3, 1])] })
  })
})

describe('polynomials', () => {
  it('reads products of factors, \\cdot, \\left( \\right), powers and coefficients', () => {
    const q = onlyQuestion('$(x_1-y_1)(x_2-y_1) = x_1 x_2 - x_1 y_1 - x_2 y_1 + y_1^2$')
    expect(q.lhs).toEqual({
      type: 'multiply',
      factors: [{ type: 'add', terms: [x(1), { type: 'negate', arg: y(1) }] }, { type: 'add', terms: [x(2), { type: 'negate', arg: y(1) }] }],
    })
    const r = onlyQuestion('$3\\cdot x_{10}^{2} = \\left( x_1 + x_2 \\right)\\, x_3$')
    expect(r.lhs).toEqual({ type: 'multiply', factors: [int(3), { type: 'power', base: x(10), exponent: 2 }] })
    expect(r.rhs).toEqual({ type: 'multiply', factors: [{ type: 'add', terms: [x(1), x(2)] }, x(3)] })
  })
})

describe('numbers', () => {
  it.each([
    ['$\\ell(2143) = 2$', { type: 'length', perm: oneLine(2, 1, 4, 3) }],
    ['$\\#\\mathrm{BPD}(2143) = 1$', { type: 'count', objects: 'bumplessPipeDreams', perm: oneLine(2, 1, 4, 3) }],
    ['$|\\mathrm{PD}(2143)| = 1$', { type: 'count', objects: 'pipeDreams', perm: oneLine(2, 1, 4, 3) }],
    ['$\\#\\operatorname{Red}(321) = 2$', { type: 'count', objects: 'reducedWords', perm: oneLine(3, 2, 1) }],
    ['$\\left|\\operatorname{Red}(321)\\right| = 2$', { type: 'count', objects: 'reducedWords', perm: oneLine(3, 2, 1) }],
    ['$c^{321}_{21,21} = 2$', { type: 'littlewoodRichardson', lambda: [2, 1], mu: [2, 1], nu: [3, 2, 1] }],
    ['$c_{213,213}^{312} = 1$', { type: 'structureConstant', u: oneLine(2, 1, 3), v: oneLine(2, 1, 3), w: oneLine(3, 1, 2) }],
    ['$K_{(3,1),(2,1,1)} = 2$', { type: 'kostka', shape: [3, 1], content: [2, 1, 1] }],
    ['$K_{31,211} = 2$', { type: 'kostka', shape: [3, 1], content: [2, 1, 1] }],
    ['$\\mathfrak S_{321}(1,1,1) = 1$', { type: 'evaluateAtOnes', arg: S([3, 2, 1]), variableCount: 3 }],
    ['$\\mathfrak S_{1432}(1,\\dots,1) = 5$', { type: 'evaluateAtOnes', arg: S([1, 4, 3, 2]) }],
  ])('%s', (tex, lhs) => {
    expect(onlyQuestion(tex).lhs).toEqual(lhs)
  })

  it('reads partitions and permutations bound by "Let"', () => {
    const r = readSnippet('Let $\\lambda = (2,1)$ and $\\mu = 21$. Then $K_{\\lambda\\mu} = 1$.')
    expect(ready(r).map(c => c.question?.lhs)).toEqual([{ type: 'kostka', shape: [2, 1], content: [2, 1] }])
    const s = readSnippet('Let $u = 213$, $v = 213$ and $w = 312$; then $c_{u,v}^{w} = 1$.')
    expect(ready(s).map(c => c.question?.lhs)).toEqual([{ type: 'structureConstant', u: oneLine(2, 1, 3), v: oneLine(2, 1, 3), w: oneLine(3, 1, 2) }])
  })
})

describe('divided differences and determinants', () => {
  it('applies \\partial_i to the rest of the product', () => {
    expect(onlyQuestion('$\\partial_1 \\mathfrak S_{231} = \\mathfrak S_{213}$').lhs).toEqual({ type: 'dividedDifference', index: 1, arg: S([2, 3, 1]) })
    expect(onlyQuestion('$\\partial_2 (x_1^2 x_2) = x_1^2$').lhs).toEqual({
      type: 'dividedDifference', index: 2, arg: { type: 'multiply', factors: [{ type: 'power', base: x(1), exponent: 2 }, x(2)] },
    })
  })

  it('reads \\det of pmatrix, bmatrix, matrix and a bare vmatrix', () => {
    const expected = { type: 'determinant', rows: [[{ type: 'symmetric', family: 'complete', index: [1] }, { type: 'symmetric', family: 'complete', index: [2] }], [int(1), { type: 'symmetric', family: 'complete', index: [1] }]] }
    for (const env of ['pmatrix', 'bmatrix']) {
      expect(onlyQuestion(`$\\det\\begin{${env}} h_1 & h_2 \\\\ 1 & h_1 \\end{${env}} = s_{11}$`).lhs).toEqual(expected)
    }
    expect(onlyQuestion('$\\det\\left(\\begin{matrix} h_1 & h_2 \\\\ 1 & h_1 \\end{matrix}\\right) = s_{11}$').lhs).toEqual(expected)
    expect(onlyQuestion('$\\begin{vmatrix} h_1 & h_2 \\\\ 1 & h_1 \\end{vmatrix} = s_{11}$').lhs).toEqual(expected)
  })
})

describe('what is and is not a claim', () => {
  it('does not report plain math', () => {
    const r = readSnippet('For $n \\geq 3$ and each $x_i$, let $k = 2$; the polynomial $\\mathfrak S_w$ and $a + b = c$ are fine.')
    expect(r.claims).toEqual([])
  })

  it('reports an equation with unknown notation next to a recognised object as unsupported', () => {
    const r = readSnippet('Here $\\mathfrak{T}_w = x_1 + x_2$ and $\\deg \\mathfrak S_{132} = 1$.')
    // \mathfrak{T} is nothing Scholium knows: the reader lists it as not read, never as a verdict.
    expect(r.claims.map(c => [c.status, c.reason])).toEqual([
      ['unsupported', 'unknown symbol \\deg'],
    ])
    expect(r.notRead.map(n => [n.line, n.source])).toEqual([[1, '\\mathfrak{T}_w = x_1 + x_2']])
  })

  it('splits claims separated by \\qquad, commas and "and"', () => {
    const r = readSnippet('\\[ \\ell(21) = 1, \\quad \\ell(321) = 3 \\qquad \\ell(312) = 2 \\text{ and } \\ell(1) = 0. \\]')
    expect(r.claims.map(c => [c.id, c.question?.rhs])).toEqual([
      ['snippet.tex:1:1', int(1)], ['snippet.tex:1:2', int(3)], ['snippet.tex:1:3', int(2)], ['snippet.tex:1:4', int(0)],
    ])
  })

  it('gives each step of a chain its own line, and joins a right-hand side continued with +', () => {
    const tex = [
      '\\begin{align*}',
      '\\mathfrak S_{1432} &= x_1^2 x_2 + x_1^2 x_3 + x_1 x_2^2 \\\\',
      '  &\\quad + x_1 x_2 x_3 + x_2^2 x_3 \\\\',
      '  &= x_1 x_2 (x_1 + x_2) + x_3 (x_1^2 + x_1 x_2 + x_2^2)',
      '\\end{align*}',
    ].join('\n')
    const r = readSnippet(tex)
    expect(r.claims.map(c => [c.line, c.endLine, c.kind])).toEqual([[2, 3, 'schubert'], [4, 4, 'polynomial']])
    expect((r.claims[0]!.question!.rhs as { terms: unknown[] }).terms).toHaveLength(5)
    expect((r.claims[1]!.question!.lhs as { terms: unknown[] }).terms).toHaveLength(5)
  })

  it('reads inline \\( \\), display $$ $$, gather and multline', () => {
    const tex = '\\(\\ell(21) = 1\\) $$\\ell(21) = 1$$\n\\begin{gather}\\ell(21) = 1\\end{gather}\n\\begin{multline*}\\ell(21)\n = 1\\end{multline*}'
    const r = readSnippet(tex)
    expect(r.claims.map(c => [c.line, c.display, c.status])).toEqual([[1, false, 'ready'], [1, true, 'ready'], [2, true, 'ready'], [3, true, 'ready']])
  })
})
