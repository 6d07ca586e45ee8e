// The alphabet declarations of shared/latex/notation/alphabet.ts, on token trees built by hand
// through the reader's own tokenizer.
import { describe, expect, it } from 'vitest'
import { declaredAlphabet } from '../../../shared/latex/notation/alphabet'
import { buildMathTree } from '../../../shared/latex/math-tree'
import { tokenize } from '../../../shared/latex/tokens'

const nodes = (tex: string) => buildMathTree(tokenize(tex))

describe('declaredAlphabet', () => {
  it('finds letters after a subscript', () => {
    expect(declaredAlphabet(nodes('s_{21}(a,b,c)'), nodes('a^2b'))).toEqual({ kind: 'letters', letters: ['a', 'b', 'c'] })
  })
  it('finds variables from x_0 and a second alphabet z', () => {
    expect(declaredAlphabet(nodes('m_2(x_0,x_1,x_2)'), nodes('x_0^2'))).toEqual({ kind: 'fromZero' })
    expect(declaredAlphabet(nodes('\\mathfrak{S}_{21}(x;z)'), nodes('x_1-z_1'))).toEqual({ kind: 'secondZ' })
    expect(declaredAlphabet(nodes('\\mathfrak{S}_{21}(x|z)'), nodes('x_1-z_1'))).toEqual({ kind: 'secondZ' })
  })
  it('declares nothing for disagreeing lists, repeated letters, reserved letters or lists not after a subscript', () => {
    expect(declaredAlphabet(nodes('s_{1}(a,b)'), nodes('s_{1}(b,a)'))).toBeUndefined()
    expect(declaredAlphabet(nodes('s_{1}(a,a)'), nodes('2a'))).toBeUndefined()
    expect(declaredAlphabet(nodes('s_{1}(x,y)'), nodes('x+y'))).toBeUndefined()
    expect(declaredAlphabet(nodes('f(a,b)'), nodes('a+b'))).toBeUndefined()
    expect(declaredAlphabet(nodes('s_{1}(a,b)'), nodes('a+x_1'))).toBeUndefined()
    expect(declaredAlphabet(nodes('m_2(x_1,x_2)'), nodes('x_1^2'))).toBeUndefined()
  })
})
