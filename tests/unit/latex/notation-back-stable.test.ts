// Back-stable Schubert polynomials in the reader (shared/latex/notation/back-stable.ts): the object,
// the non-positive alphabets, Chern-class letters declared by a tag, and what must stay silent.
// Values used: ←S_{s_1} = s_1(x_{≤0}) + x_1 (the limit of S_{s_{m+1}} = x_1 + … + x_{m+1}, common
// practice), ←S_{312} = h_2(x_{≤0}) + h_1(x_{≤0}) x_1 + x_1^2 (the limit of S_{1^m × 312} = h_2(x_1..x_{m+1}),
// whose part without x_{m+1} is h_2 of the first m variables, common practice).
import { describe, expect, it } from 'vitest'
import { checkManuscript } from '../../../shared/check/index'
import { parseTag } from '../../../shared/latex/tags'
import { nonPositiveAlphabetAt } from '../../../shared/latex/notation/back-stable'
import { buildMathTree } from '../../../shared/latex/math-tree'
import { Tokenizer } from '../../../shared/latex/tokens'
import { onlyQuestion, readSnippet } from './helpers'
import { verdictsOf } from './verdict-helpers'

function nodes(tex: string) {
  const tokens = []
  const t = new Tokenizer(tex)
  for (let token = t.next(); token; token = t.next()) tokens.push(token)
  return buildMathTree(tokens)
}

describe('the non-positive alphabet after a symmetric function', () => {
  it.each([
    ['[x_-]', 'x'], ['(x_-)', 'x'], ['[x_{-}]', 'x'], ['(x^-)', 'x'], ['(x_{\\le 0})', 'x'], ['(x_{\\leq 0})', 'x'],
    ['(x_0, x_{-1}, \\dots)', 'x'], ['(x_0,x_{-1},x_{-2},\\ldots)', 'x'], ['[y_-]', 'y'], ['(y_{\\le 0})', 'y'],
  ])('reads %s as the letter %s', (tex, letter) => {
    expect(nonPositiveAlphabetAt(nodes(tex), 0)?.set).toBe(letter)
  })
  it.each(['(x_1, x_2)', '(x)', '[x_+]', '(x_0, x_1, \\dots)', '(x_0, x_{-2}, \\dots)', '(x_{\\le 1})', '(z_-)'])('does not read %s', (tex) => {
    expect(nonPositiveAlphabetAt(nodes(tex), 0)).toBeUndefined()
  })
})

describe('back-stable claims', () => {
  it('reads \\overleftarrow{\\mathfrak{S}}_w with its symmetric part in the non-positive variables', () => {
    const q = onlyQuestion('\\[ \\overleftarrow{\\mathfrak{S}}_{213} = s_1[x_-] + x_1 \\]')
    expect(q.lhs).toEqual({ type: 'backStable', perm: { form: 'oneLine', entries: [2, 1, 3] }, variant: 'single' })
    expect(q.rhs).toMatchObject({ type: 'add', terms: [{ type: 'nonPositive', set: 'x', arg: { type: 'symmetric', family: 'schur', index: [1] } }, { type: 'variable' }] })
    expect(readSnippet('\\[ \\overleftarrow{\\mathfrak{S}}_{213} = s_1[x_-] + x_1 \\]').claims[0]!.kind).toBe('backStable')
  })
  it('verifies a true claim and flags one that drops a term, in each way of writing the variables', () => {
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{213} = s_1[x_-] + x_1 \\]')).toEqual(['verified'])
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{213} = s_1(x_0,x_{-1},\\dots) + x_1 \\]')).toEqual(['verified'])
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{213} = x_1 \\]')).toEqual(['mismatch'])
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{312} = h_2(x_{\\le 0}) + h_1(x_{\\le 0})x_1 + x_1^2 \\]')).toEqual(['verified'])
    // e_2 is not h_2: the symmetric part is compared exactly, in the Schur basis.
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{312} = e_2(x_{\\le 0}) + e_1(x_{\\le 0})x_1 + x_1^2 \\]')).toEqual(['mismatch'])
  })
  it('takes a symmetric function written without variables in a back-stable claim in x_0, x_{-1}, …', () => {
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{213} = s_1 + x_1 \\]')).toEqual(['verified'])
  })
  it('reads the double polynomial with symmetric functions in both non-positive alphabets (factors x − y)', () => {
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{213}(x;y) = s_1[x_-] - s_1[y_-] + x_1 - y_1 \\]')).toEqual(['verified'])
    expect(verdictsOf('\\[ \\overleftarrow{\\mathfrak{S}}_{213}(x;y) = s_1[x_-] + s_1[y_-] + x_1 - y_1 \\]')).toEqual(['mismatch'])
  })
  it('names the missing basis element in the difference', () => {
    const report = checkOne('\\[ \\overleftarrow{\\mathfrak{S}}_{2143} = s_2[x_-] + (2x_1 + x_2 + x_3)s_1[x_-] + x_1^2 + x_1x_2 + x_1x_3 \\]')
    expect(report.verdict).toBe('mismatch')
    expect(report.diff).toMatchObject({ basis: 'monomial', missing: [{ term: 's_{11}(x_{\\le 0})', coefficient: '1' }], extra: [] })
  })
  it('keeps prose about back-stable polynomials silent', () => {
    const r = readSnippet('The polynomial $\\overleftarrow{\\mathfrak{S}}_w$ is the limit of $\\mathfrak{S}_{1^m \\times w}$, and $\\overleftarrow{\\mathfrak{S}}_w$ is symmetric in $x_0, x_{-1}, \\dots$.')
    expect(r.claims).toEqual([])
  })
})

describe('Chern-class letters declared by a tag', () => {
  it('parses "chern c h" and "chern c e" and refuses letters already read', () => {
    expect(parseTag(' scholium: chern c h').directives).toEqual([{ type: 'chern', letter: 'c', family: 'complete' }])
    expect(parseTag(' scholium: chern c e').directives).toEqual([{ type: 'chern', letter: 'c', family: 'elementary' }])
    expect(parseTag(' scholium: chern s h').errors[0]).toMatch(/cannot be a Chern-class letter/)
    expect(parseTag(' scholium: chern c p').errors[0]).toMatch(/needs h or e/)
    expect(parseTag(' scholium: chern c').errors[0]).toMatch(/expects a letter and h or e/)
  })
  it('checks c_k as h_k or e_k, whichever the tag declares', () => {
    expect(verdictsOf('% scholium: chern c h\n\\[ \\overleftarrow{\\mathfrak{S}}_{312} = c_2 + c_1 x_1 + x_1^2 \\]')).toEqual(['verified'])
    expect(verdictsOf('% scholium: chern c e\n\\[ \\overleftarrow{\\mathfrak{S}}_{312} = c_2 + c_1 x_1 + x_1^2 \\]')).toEqual(['mismatch'])
    // ←S_{231} = e_2(x_{≤0}) + e_1(x_{≤0})(x_1 + x_2) + x_1x_2: its symmetric part is elementary.
    expect(verdictsOf('% scholium: chern c e\n\\[ \\overleftarrow{\\mathfrak{S}}_{231} = c_2 + c_1(x_1 + x_2) + x_1x_2 \\]')).toEqual(['verified'])
  })
  it('does not read c_k outside back-stable claims, nor without the tag', () => {
    expect(readSnippet('% scholium: chern c h\nThe Chern classes are $c(w) = (c_1, c_2)$ and $c_1 = 2$.').claims.every(c => c.status !== 'ready')).toBe(true)
    // Without the tag c_2 is a letter the paper has not declared: the math is not read (no verdict, no "unsupported").
    const untagged = readSnippet('\\[ \\overleftarrow{\\mathfrak{S}}_{312} = c_2 + c_1 x_1 + x_1^2 \\]')
    expect(untagged.claims).toEqual([])
    expect(untagged.notRead).toHaveLength(1)
  })
})

/** One claim, end to end; the report claim carries the difference. */
function checkOne(tex: string) {
  const claims = checkManuscript({ files: { 'snippet.tex': tex } }).claims
  if (claims.length !== 1) throw new Error(`expected one claim, got ${claims.length}`)
  return claims[0]!
}
