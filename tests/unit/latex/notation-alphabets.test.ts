// The alphabets of double polynomials: (x|y), (\mathbf{x};\mathbf{y}) and (x;-y), which means
// every y_j replaced by −y_j. Expected values: S_21(x;y) = x_1 − y_1 and S_132(x;y) =
// x_1 + x_2 − y_1 − y_2 (Fulton, Young Tableaux, §10, double Schubert polynomials; from memory),
// with the reference sign convention Π(x_i − y_j).
import { describe, expect, it } from 'vitest'
import { onlyQuestion } from './helpers'
import { verdictsOf } from './verdict-helpers'

const S = (entries: number[], extra: Record<string, unknown> = {}) => ({ type: 'schubert', perm: { form: 'oneLine', entries }, variant: 'double', ...extra })

describe('second alphabets of double Schubert polynomials', () => {
  it.each([
    ['$\\mathfrak{S}_{21}(x|y) = x_1 - y_1$'],
    ['$\\mathfrak{S}_{21}(x\\mid y) = x_1 - y_1$'],
    ['$\\mathfrak{S}_{21}(\\mathbf{x};\\mathbf{y}) = x_1 - y_1$'],
  ])('reads %s as a double Schubert polynomial', tex => {
    expect(onlyQuestion(tex).lhs).toEqual(S([2, 1]))
  })

  it('reads (x;-y) as the double polynomial with y replaced by −y', () => {
    expect(onlyQuestion('$\\mathfrak{S}_{132}(x;-y) = x_1+x_2+y_1+y_2$').lhs).toEqual(S([1, 3, 2], { negatedY: true }))
    expect(onlyQuestion('$\\mathfrak{S}_{132}(\\mathbf{x};-\\mathbf{y}) = x_1+x_2+y_1+y_2$').lhs).toEqual(S([1, 3, 2], { negatedY: true }))
  })

  it('verifies S_w(x;-y) next to S_w(x;y) in the same paper and flags the sign left unchanged', () => {
    const fixed = '$\\mathfrak{S}_{21}(x;y) = x_1 - y_1$, so '
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x;-y) = x_1+x_2+y_1+y_2$.`)).toEqual(['verified', 'verified'])
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x;-y) = x_1+x_2-y_1-y_2$.`)).toEqual(['verified', 'mismatch'])
  })

  it('verifies (x|y) like (x;y) and flags a wrong sign', () => {
    const fixed = '$\\mathfrak{S}_{21}(x;y) = x_1 - y_1$, so '
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x|y) = x_1+x_2-y_1-y_2$.`)).toEqual(['verified', 'verified'])
    expect(verdictsOf(`${fixed}$\\mathfrak{S}_{132}(x|y) = x_1+x_2+y_1-y_2$.`)).toEqual(['verified', 'mismatch'])
  })

  it('does not read (x;-y) on a double Grothendieck polynomial or with a non-variable after the minus', () => {
    for (const tex of ['$\\mathfrak{G}_{21}(x;-y) = x_1 + y_1$', '$\\mathfrak{S}_{21}(x;-1) = x_1 + 1$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts, tex).not.toContain('verified')
      expect(verdicts, tex).not.toContain('mismatch')
    }
  })
})
