// General identities in unbound letters are not claims: no verdict and no "unsupported"; they go
// to the not-read list. Claims about concrete objects the reader cannot check stay "unsupported"
// with a correct reason. All sources are invented; each case is one the styles corpus recorded.
import { describe, expect, it } from 'vitest'
import { readSnippet } from './helpers'

describe('identities in unbound letters are not read, never unsupported', () => {
  it.each([
    ['a divided difference ∂_i', '$\\partial_i f = (f - s_i f)/(x_i - x_{i+1})$', 'i'],
    ['∂_i inside a product', '$\\pi_i f = \\partial_i((1 - x_{i+1})f)$', 'i'],
    ['the top Schubert polynomial with n unbound', '$\\mathfrak{S}_{w_0} = x_1^{n-1}x_2^{n-2}\\cdots x_{n-1}$', 'n'],
    ['the double top polynomial with n unbound', '$\\mathfrak{S}_{w_0}(x;y) = \\prod_{i+j\\leq n}(x_i - y_j)$', 'n'],
    ['the length of w_0 with n unbound', '$\\ell(w_0) = \\binom{n}{2}$', 'n'],
    ['a recursion in ws_i', '$\\mathfrak{S}_{ws_i} = \\partial_i \\mathfrak{S}_w$', 'w'],
    ['Monk\'s rule with s_r', '$\\mathfrak{S}_{s_r}\\mathfrak{S}_w = \\sum \\mathfrak{S}_{wt_{ab}}$', 'r'],
    ['a structure-constant expansion', '$\\mathfrak{S}_u\\mathfrak{S}_v = \\sum_w c_{u,v}^w \\mathfrak{S}_w$', 'u'],
    ['a Grothendieck top class', '$\\mathfrak{G}_{w_0} = x_1^{n-1}\\cdots x_{n-1}$', 'n'],
  ])('%s', (_name, tex, letter) => {
    const r = readSnippet(`Recall ${tex} in general.`)
    expect(r.claims).toEqual([])
    expect(r.notRead).toHaveLength(1)
    expect(r.notRead[0]!.reason).toMatch(new RegExp(`^${letter.replace(/\\/g, '\\\\')} is not bound here: a general statement`))
  })

  it('lists a flag 0 = F_0 ⊂ F_1 (an index 0 is no permutation) as not read', () => {
    const r = readSnippet('The flag $0 = F_0 \\subset F_1 \\subset \\dots \\subset F_n$ is fixed.')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.reason)).toEqual([expect.stringMatching(/index 0 is not a permutation/)])
  })

  it('lists a letter bound to another kind of object (ℓ(λ) for a partition) as not read', () => {
    const r = readSnippet('Let $\\lambda = (2,1)$. Then $\\ell(\\lambda) = 2$ parts and $\\mathfrak{S}_\\lambda = x_1$.')
    expect(r.claims).toEqual([])
    expect(r.notRead.map(n => n.reason)).toEqual([
      '\\lambda is bound to a partition, not a permutation: another notation, not read',
      '\\lambda is bound to a partition, not a permutation: another notation, not read',
    ])
  })
})

describe('the same identities become claims once the letters are bound', () => {
  it('reads w_0 once n is bound, and ∂_1 with a number', () => {
    // S_{321} = x_1^2 x_2 and ∂_1 S_{312} = S_{132} = x_1 + x_2: common practice (∂_i S_w = S_{ws_i} at a descent i).
    const r = readSnippet('Let $n = 3$. Then $\\mathfrak{S}_{w_0} = x_1^2x_2$ and $\\partial_1 \\mathfrak{S}_{312} = x_1 + x_2$.')
    expect(r.claims.map(c => [c.status, c.kind])).toEqual([['ready', 'schubert'], ['ready', 'dividedDifference']])
    expect(r.claims[0]!.question!.lhs).toMatchObject({ perm: { form: 'longest', n: 3 } })
    expect(r.notRead).toEqual([])
  })
})

describe('concrete claims the reader cannot check stay unsupported, with a correct reason', () => {
  it.each([
    ['an unread superscript', '$\\mathfrak{S}_{132}^{(2)} = x_1$', /superscript on \\mathfrak\{S\} is not supported/],
    ['a subscript that is no permutation', '$\\mathfrak{S}_{1223} = x_1$', /1223 is not a permutation of 1\.\.4/],
    ['∂_0', '$\\partial_0 x_1 = 1$', /\\partial needs a positive integer index/],
    ['w_0 with an unread superscript', '$\\mathfrak{S}_{w_0^{-1}} = x_1$', /only w_0\^\{\(n\)\}, the longest permutation of S_n, is read/],
  ])('%s', (_name, tex, reason) => {
    const r = readSnippet(tex)
    expect(r.claims.map(c => c.status)).toEqual(['unsupported'])
    expect(r.claims[0]!.reason).toMatch(reason)
    expect(r.notRead).toEqual([])
  })
})
