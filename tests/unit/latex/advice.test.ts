// Every reason the reader or the check gives carries advice that fits the case: a permutation
// binding only for a permutation letter, a partition binding only for a partition letter,
// w_0^{(n)} only for w_0, variables for the very family written. Messages stay under 200
// characters and long lists are cut with the count of what was cut.
import { describe, expect, it } from 'vitest'
import { evaluateClaim } from '../../../shared/check/claim'
import { readSnippet } from './helpers'

const notReadReason = (tex: string) => {
  const r = readSnippet(tex)
  expect(r.claims).toEqual([])
  expect(r.notRead).toHaveLength(1)
  return r.notRead[0]!.reason
}
const unsupportedReason = (tex: string) => {
  const r = readSnippet(tex)
  expect(r.claims.map(c => c.status)).toEqual(['unsupported'])
  return r.claims[0]!.reason!
}
const checkMessage = (tex: string) => {
  const r = readSnippet(tex)
  expect(r.claims.map(c => c.status)).toEqual(['ready'])
  const e = evaluateClaim(r.claims[0]!)
  expect(e.status).toBe('unsupported')
  return (e as { message: string }).message
}

describe('unbound letters', () => {
  it('advises a permutation binding for a permutation letter', () => {
    expect(notReadReason('$\\mathfrak{S}_w = x_1$')).toBe('w is not bound here: a general statement, not an example (to check one, write "Let $w = 2143$" first)')
  })
  it('advises a partition binding for a partition letter', () => {
    expect(notReadReason('$s_\\mu = x_1$')).toBe('\\mu is not bound here: a general statement, not an example (to check one, write "Let $\\mu = (2,1)$" first)')
  })
  it('never advises a permutation binding for a partition letter, nor a partition binding for a permutation letter', () => {
    const perm = notReadReason('$\\mathfrak{S}_\\lambda = x_1$')
    expect(perm).not.toMatch(/Let|2143/)
    expect(perm).toMatch(/^\\lambda is not bound here/)
    const part = notReadReason('$s_w = x_1$')
    expect(part).not.toMatch(/Let|\(2,1\)/)
  })
  it('advises w_0^{(n)} only where the letter is w_0', () => {
    expect(notReadReason('$\\mathfrak{S}_{w_0} = x_1$')).toMatch(/n is not bound.*w_0\^\{\(n\)\}/)
    expect(notReadReason('$\\mathfrak{S}_{u_0} = x_1$')).not.toMatch(/w_0/)
    expect(notReadReason('$\\mathfrak{S}_{v} = x_1$')).not.toMatch(/w_0/)
    expect(notReadReason('$\\partial_i x_1 = 1$')).not.toMatch(/w_0|Let/)
  })
})

describe('letters bound to another kind of object', () => {
  it('says which kind the letter is, with the right article, and does not claim', () => {
    expect(notReadReason('Let $n = 3$. $\\mathfrak{S}_n = x_1$')).toBe('n is bound to an integer, not a permutation: another notation, not read')
    expect(notReadReason('Let $w = 21$. $s_w = x_1$')).toBe('w is bound to a permutation, not a partition: another notation, not read')
  })
})

describe('unsupported concrete claims', () => {
  it('advises commas for one-line notation of 10 or more digits only when every entry is one digit', () => {
    expect(unsupportedReason('$\\mathfrak{S}_{12345678910} = 1$')).toMatch(/is not a permutation of 1\.\.11; write entries of 10 or more with commas/)
    expect(unsupportedReason('$\\mathfrak{S}_{1223} = 1$')).toBe('1223 is not a permutation of 1..4')
  })
  it('cuts a long list of entries with the count of what was cut, under 200 characters', () => {
    const entries = Array.from({ length: 60 }, (_, i) => (i === 0 ? 2 : i + 1))
    const reason = unsupportedReason(`$\\mathfrak{S}_{[${entries.join(',')}]} = 1$`)
    expect(reason).toMatch(/^2,2,3,4,5,6,7,8,9,10,11,12,13,14,15,16… \(44 more\) is not a permutation of 1\.\.60$/)
    expect(reason.length).toBeLessThan(200)
  })
  it('cuts a long partition the same way', () => {
    const parts = Array.from({ length: 30 }, (_, i) => i + 1)
    expect(unsupportedReason(`$s_{(${parts.join(',')})} = 1$`)).toMatch(/^\(1,2,3,4,5,6,7,8,9,10,11,12,13,14,15,16… \(14 more\)\) is not a partition/)
  })
})

describe('advice from the check on variables', () => {
  it('names the family written: h, e, s, skew s', () => {
    expect(checkMessage('$h_2 + x_1 = x_1$')).toMatch(/; write h_\{2\}\(x_1,…,x_n\) to fix its variables$/)
    expect(checkMessage('$e_{3}e_1 = x_1$')).toMatch(/; write e_\{3\}\(x_1,…,x_n\)/)
    expect(checkMessage('$s_{21} = x_1x_2$')).toMatch(/; write s_\{21\}\(x_1,…,x_n\)/)
    expect(checkMessage('$x_1^2 = s_{(4,2)/(1)}$')).toMatch(/; write s_\{42\/1\}\(x_1,…,x_n\)/)
  })
  it('never advises s_λ(x_1,…,x_n) for a Stanley symmetric function', () => {
    const message = checkMessage('$F_{21} = x_1$')
    expect(message).not.toMatch(/\(x_1,…,x_n\)/)
    expect(message).toMatch(/F_w is read in infinitely many variables/)
    expect(message.length).toBeLessThan(200)
  })
})
