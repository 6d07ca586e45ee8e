// Littlewood–Richardson coefficients written with a capital C, or with indices told apart only
// by spacing. Expected values from Debian's lrcalc (`lrcalc lrcoef`), named beside each check.
import { describe, expect, it } from 'vitest'
import { onlyQuestion, readSnippet, ready } from './helpers'
import { verdictsOf } from './verdict-helpers'

const lr = (nu: number[], lambda: number[], mu: number[]) => ({ type: 'littlewoodRichardson', lambda, mu, nu })

describe('LR coefficients with a capital C', () => {
  it('reads C^{(4,2)}_{(2,1),(2,1)} as c^{42}_{21,21}', () => {
    expect(onlyQuestion('$C^{(4,2)}_{(2,1),(2,1)} = 1$').lhs).toEqual(lr([4, 2], [2, 1], [2, 1]))
  })

  it('verifies C^{42}_{21,21} = 1 (lrcalc lrcoef 4 2 - 2 1 - 2 1) and flags 2', () => {
    expect(verdictsOf('$C^{(4,2)}_{(2,1),(2,1)} = 1$')).toEqual(['verified'])
    expect(verdictsOf('$C^{42}_{21,21} = 2$')).toEqual(['mismatch'])
  })

  it('leaves a capital C that is not an LR coefficient silent (constants, sizes that do not fit)', () => {
    for (const tex of ['$C_1 = 3$', '$C^{2}_{1} = 3$', '$C^{321}_{21,1} = 0$', '$C^{\\nu}_{\\lambda\\mu} = 1$']) {
      const verdicts = verdictsOf(tex)
      expect(verdicts, tex).not.toContain('mismatch')
      expect(verdicts, tex).not.toContain('verified')
    }
  })
})

describe('LR indices without commas', () => {
  it.each([
    ['$c^{42}_{21\\,21} = 1$'],
    ['$c^{42}_{21\\ 21} = 1$'],
    ['$c^{42}_{21\\;21} = 1$'],
  ])('splits %s at the spacing', (tex) => {
    expect(onlyQuestion(tex).lhs).toEqual(lr([4, 2], [2, 1], [2, 1]))
  })

  it('verifies c^{321}_{21\\,21} = 2 (lrcalc lrcoef 3 2 1 - 2 1 - 2 1) and flags 1', () => {
    expect(verdictsOf('$c^{321}_{21\\,21} = 2$')).toEqual(['verified'])
    expect(verdictsOf('$c^{321}_{21\\,21} = 1$')).toEqual(['mismatch'])
  })

  it('does not split digits written together (c^{42}_{2121} is ambiguous)', () => {
    const verdicts = verdictsOf('$c^{42}_{2121} = 1$')
    expect(verdicts).not.toContain('verified')
    expect(verdicts).not.toContain('mismatch')
  })

  it('reads indices split only by spacing as partitions, never as permutations when sizes do not fit', () => {
    // 21·1 as Schubert classes would give a structure constant 0; as partitions the sizes do not fit.
    const verdicts = verdictsOf('$c^{321}_{21\\,1} = 2$')
    expect(verdicts).not.toContain('mismatch')
    expect(verdicts).not.toContain('verified')
  })

  it('reads c_{\\lambda\\mu}^{\\nu} with bound partitions (lrcalc lrcoef 3 2 1 - 2 1 - 2 1 = 2)', () => {
    const tex = 'Let $\\lambda=(2,1)$, $\\mu=(2,1)$, $\\nu=(3,2,1)$. Then $c_{\\lambda\\mu}^{\\nu} = 2$.'
    expect(ready(readSnippet(tex)).map(c => c.question?.lhs)).toEqual([lr([3, 2, 1], [2, 1], [2, 1])])
    expect(verdictsOf(tex)).toEqual(['verified'])
    expect(verdictsOf(tex.replace('= 2$.', '= 3$.'))).toEqual(['mismatch'])
  })
})
