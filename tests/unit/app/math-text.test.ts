import { describe, it, expect } from 'vitest'
import { mathTextSegments } from '../../../utils/math-text'
import { ALL_CONVENTION_IDS, CONVENTION_CHOICE_TEX } from '../../../shared/types/conventions'
import katex from 'katex'

describe('the interface\'s own prose with $…$ math', () => {
  it('splits text and math at unescaped dollars, keeping an unpaired one as text', () => {
    expect(mathTextSegments('factors $x_i - y_j$ here')).toEqual([
      { kind: 'text', text: 'factors ' }, { kind: 'math', tex: 'x_i - y_j' }, { kind: 'text', text: ' here' },
    ])
    expect(mathTextSegments('costs \\$5 and $a$')).toEqual([{ kind: 'text', text: 'costs \\$5 and ' }, { kind: 'math', tex: 'a' }])
    expect(mathTextSegments('one $ alone')).toEqual([{ kind: 'text', text: 'one $ alone' }])
  })
  it('every convention choice has a typeset form, and KaTeX reads all of its math (no raw LaTeX shown)', () => {
    for (const id of ALL_CONVENTION_IDS) {
      const text = CONVENTION_CHOICE_TEX[id]
      expect(text, id).toBeDefined()
      const math = mathTextSegments(text!).filter(s => s.kind === 'math')
      expect(math.length, id).toBeGreaterThan(0)
      for (const segment of math) expect(() => katex.renderToString((segment as { tex: string }).tex, { throwOnError: true }), `${id}: ${(segment as { tex: string }).tex}`).not.toThrow()
    }
  })
})
