// Precision rules for prose math of real manuscripts: each rule sends what it matches to the
// not-read list (no verdict, no "unsupported"), and a true claim of the same shape about bound or
// known objects is still read. Every case is invented; NOTATION.md lists the patterns.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { readManuscript } from '../../../shared/latex/index'
import { readSnippet } from './helpers'

/** The claims' statuses, and the not-read reasons, of a snippet. */
const outcome = (tex: string) => {
  const r = readSnippet(tex)
  return { claims: r.claims.map(c => [c.status, c.source]), notRead: r.notRead.map(n => n.reason) }
}
const notReadOnly = (tex: string, reason: RegExp) => {
  const o = outcome(tex)
  expect(o.claims).toEqual([])
  expect(o.notRead).toEqual([expect.stringMatching(reason)])
  for (const why of o.notRead) expect(why.length).toBeLessThanOrEqual(200)
}
const statuses = (tex: string) => readSnippet(tex).claims.map(c => c.status)

describe('a condition inside a set {… : …}', () => {
  it('is not read', () => {
    notReadOnly('The set $\\{ w \\in S_4 : \\ell(w) = 2 \\}$ has five elements.', /inside a set/)
    notReadOnly('the conjugate has $\\lambda\'_j = \\#\\{ i : \\lambda_i \\geq j \\}$', /inside a set/)
  })
  it('leaves a claim beside balanced set braces read', () => {
    expect(statuses('For $i \\in \\{1,3\\}$ we have $\\ell(2143) = 2$.')).toEqual(['ready'])
  })
})

describe('a tuple (…, …)', () => {
  it('is a sequence of values, not read', () => {
    notReadOnly('Let $w = 2143$. Its code $c(w) = (c_1, c_2, \\dots, c_n)$ is weak.', /tuple/)
  })
  it('leaves parenthesised one-line notation and argument lists read', () => {
    expect(statuses('$\\mathfrak{S}_{(1,3,2)} = x_1 + x_2$ and $s_{2}(x_1,x_2) = x_1^2 + x_1x_2 + x_2^2$')).toEqual(['ready', 'ready'])
  })
})

describe('letters the sentence makes general: w ↦ …, for every w', () => {
  it('does not use the binding of w inside "the map w ↦ w^{-1}" or "for every w"', () => {
    notReadOnly('Let $w = 2143$. The map $w \\mapsto w^{-1}$ preserves length, $\\ell(w) = \\ell(w)$.', /stands for any w/)
    notReadOnly('Let $w = 2143$. For every $w$ in $S_4$ one has $\\ell(w) = 2$.', /stands for any w/)
  })
  it('still uses the binding when the sentence makes another letter general, or in the next sentence', () => {
    expect(statuses('Let $w = 2143$. For every $i$ we have $\\ell(w) = 2$.')).toEqual(['ready'])
    expect(statuses('Let $w = 2143$. The map $u \\mapsto u^{-1}$ is a bijection. Then $\\ell(w) = 2$.')).toEqual(['ready'])
  })
})

describe('words in simple transpositions', () => {
  it('reads a power of a bracketed word, or a word equal to e or id, as a product in the group', () => {
    notReadOnly('In the group $S_3$ we have $(s_1s_2)^3 = 1$.', /product in the group/)
    notReadOnly('Here $s_1^2 = e$.', /product in the group/)
    notReadOnly('and $(s_2 s_1)^3 = \\mathrm{id}$.', /product in the group/)
  })
  it('reads the same shapes as Schur functions where the paragraph plainly speaks of Schur functions', () => {
    expect(statuses('Schur functions commute: $s_1 s_2 = s_2 s_1$.')).toEqual(['ready'])
    expect(statuses('In the group $S_3$ the product $s_1 s_1 = s_2 + s_{11}$ is not meant.')).toEqual(['ready'])
    expect(statuses('$(s_1 + s_2)^2 = s_1^2 + 2s_1s_2 + s_2^2$')).toEqual(['ready'])
  })
})

describe('a letter Scholium does not know, named or defined', () => {
  it('is not read, even when the other side mentions ℓ(w)', () => {
    notReadOnly('Let $N = 10$ and $M = N - \\ell(2143)$ in what follows.', /named or defined/)
  })
  it('leaves a concrete object with an unreadable index unsupported', () => {
    expect(statuses('$\\mathfrak{S}_{1223} = x_1$')).toEqual(['unsupported'])
  })
})

describe('letters that only look like objects', () => {
  it('a lone \\ell, or \\ell in an index, is a letter, not the length function', () => {
    notReadOnly('We have $|\\lambda| = \\lambda_1 + \\lambda_2 + \\dots + \\lambda_\\ell$.', /size or an absolute value|not bound/)
    expect(statuses('so $\\ell(2143) = 2$')).toEqual(['ready'])
  })
  it('c_1 without a superscript is a letter, c^ν_{λμ} an LR coefficient', () => {
    notReadOnly('and $c_1 + c_2 = \\ell(2143)$', /unknown symbol c/)
    expect(statuses('$c^{3}_{2,1} = 1$')).toEqual(['ready'])
  })
  it('F_5 with no permutation as index names a flag member; F_{321} is a Stanley function', () => {
    const o = outcome('The flag $0 = F_0 \\subset F_1 \\subset \\dots \\subset F_5 = \\mathbb{C}^5$ is fixed.')
    expect(o.claims).toEqual([])
    expect(statuses('$F_{321} = s_{111} + 2s_{21} + s_3$')).toEqual(['ready'])
  })
  it('\\# counts only a set Scholium knows', () => {
    notReadOnly('so $\\#S = \\ell(2143)$ here', /unknown set S/)
    expect(statuses('$\\#\\mathrm{Red}(321) = 2$')).toEqual(['ready'])
  })
  it('an index with a free letter (s_{i_1}) is a general statement, with no binding advice', () => {
    notReadOnly('The product $w = s_{i_1} s_{i_2} \\cdots s_{i_\\ell}$ is reduced.', /^i is not bound here: a general statement, not an example$/)
    expect(statuses('$s_{(2,1)} s_1 = s_{31} + s_{22} + s_{211}$')).toEqual(['ready'])
  })
})

describe('coefficient extraction [x^a]F', () => {
  it('is not read', () => {
    notReadOnly('so that $[x_1^2]\\mathfrak{S}_{312} = 1$ in words', /coefficient extraction/)
    notReadOnly('and $[x^a]\\mathfrak{S}_{312} = 1$', /coefficient extraction/)
  })
  it('leaves brackets in a subscript (one-line notation) read', () => {
    expect(statuses('$\\mathfrak{S}_{[1,3,2]} = x_1 + x_2$')).toEqual(['ready'])
  })
})

describe('the symmetric group written \\mathfrak{S}_n', () => {
  it('reads \\mathfrak{S}_4 (a number that is no permutation) as the group, never as a Schubert polynomial', () => {
    expect(outcome('The group $\\mathfrak{S}_4$ has order $|\\mathfrak{S}_4| = 24$.')).toEqual({ claims: [], notRead: [] })
    notReadOnly('and $\\mathfrak{S}_3 = \\langle s_1, s_2 \\rangle$ acts', /⟨…⟩/)
  })
  it('keeps \\mathfrak{S}_{21} a Schubert polynomial, and a long non-permutation unsupported', () => {
    expect(statuses('$\\mathfrak{S}_{21} = x_1$ and $\\mathfrak{S}_{1223} = x_1$')).toEqual(['ready', 'unsupported'])
  })
})

describe('products in the group with a cycle or a bound permutation', () => {
  it('reads a side in cycle notation, (1\\,3), as a permutation, not the number 13', () => {
    notReadOnly('In $S_3$ the product $s_1s_2s_1 = (1\\,3)$ is a transposition.', /symmetric group/)
  })
  it('reads ws_1 with w bound to a permutation as a product in the group', () => {
    notReadOnly('Let $w = 2143$; then $ws_1 = 1243$ in the group.', /w is a permutation here: a product in the symmetric group/)
  })
  it('still reads an object with parentheses around a sum, and w(1) stays silent', () => {
    expect(statuses('$(x_1 + x_2) = \\mathfrak{S}_{132}$')).toEqual(['ready'])
    expect(outcome('Let $w = 2143$. Then $w(1) = 2$.')).toEqual({ claims: [], notRead: [] })
  })
})

describe('a substitution stated earlier in the sentence', () => {
  it('leaves a claim evaluated at x_i = … unread', () => {
    notReadOnly('Using $x_1 = 1$ and $x_2 = 2$ we get $\\mathfrak{S}_{132} = 3$.', /substitution/)
  })
  it('reads the claim when the substitution is in an earlier sentence or names no variable', () => {
    expect(statuses('Put $x_1 = 1$. Then $\\mathfrak{S}_{132} = x_1 + x_2$.')).toEqual(['ready'])
    expect(statuses('For $n = 3$ we get $\\mathfrak{S}_{132} = x_1 + x_2$.')).toEqual(['ready'])
  })
  // Regression (long-paper/paper.tex:3720): "Setting $x_3 = 0$ …, and then $e_3(x_1,x_2) = 0$" was
  // left unread although the claim lists its variables and x_3 is not one of them.
  it('reads a claim whose argument list names none of the substituted variables', () => {
    expect(statuses('Setting $x_3 = 0$ gives two variables, and then $e_3(x_1,x_2) = 0$.')).toEqual(['ready'])
    notReadOnly('Setting $x_2 = 0$ gives one variable, and then $e_2(x_1,x_2) = 0$.', /substitution/)
  })
})

describe('the held-back trap of the styles corpus', () => {
  it('course-notes/notes.tex:186: the group product (s_1s_2)^3 = 1 and s_1s_3 = s_3s_1 give no claim', () => {
    const dir = join(__dirname, '../../fixtures/styles/course-notes')
    const r = readManuscript({ files: { 'notes.tex': readFileSync(join(dir, 'notes.tex'), 'utf8') }, main: 'notes.tex' })
    const line = readFileSync(join(dir, 'notes.tex'), 'utf8').split('\n')[185]!
    expect(line).toContain('$(s_1s_2)^3 = 1$')
    expect(r.claims.filter(c => c.line === 186)).toEqual([])
    expect(r.notRead.filter(n => n.line === 186).map(n => n.source)).toEqual(['s_1s_3 = s_3s_1', '(s_1s_2)^3 = 1'])
  })
})
