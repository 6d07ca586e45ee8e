// A small multi-file manuscript written for these tests (tests/fixtures/latex/workshop-notes):
// every expected value below was written by reading the fixture's LaTeX by hand.
import { describe, expect, it } from 'vitest'
import { readManuscript } from '../../../shared/latex/index'
import { int, loadBundle, oneLine, x, y } from './helpers'

const result = readManuscript({ files: loadBundle('workshop-notes') })
const byId = new Map(result.claims.map(c => [c.id, c]))

describe('workshop-notes manuscript', () => {
  it('finds the main file and follows \\input, \\include (with .tex) and a package of the bundle', () => {
    const roles = Object.fromEntries(result.files.map(f => [f.path, f.role]))
    expect(roles).toEqual({
      'main.tex': 'main',
      'notation.sty': 'included',
      'sections/intro.tex': 'included',
      'sections/nested/small.tex': 'included',
      'sections/examples.tex': 'included',
    })
    expect(result.warnings).toEqual([])
  })

  it('lists exactly the claims of the typeset text, in document order, each at its own file and line', () => {
    expect(result.claims.map(c => [c.id, c.status])).toEqual([
      ['sections/intro.tex:2:1', 'ready'],
      ['sections/intro.tex:2:2', 'ready'],
      ['sections/nested/small.tex:3:1', 'ready'],
      ['sections/examples.tex:4:1', 'ready'],
      ['sections/examples.tex:5:1', 'ready'],
      ['sections/examples.tex:8:1', 'ready'],
      ['sections/examples.tex:8:2', 'ready'],
      ['sections/examples.tex:9:1', 'ready'],
    ])
  })

  it('binds w from "Let $w = 25143$" for the claims after it', () => {
    const c = byId.get('sections/intro.tex:2:1')!
    expect(c.kind).toBe('length')
    expect(c.question).toEqual({ type: 'equality', lhs: { type: 'length', perm: oneLine(2, 5, 1, 4, 3) }, rhs: int(4) })
    expect(c.context).toEqual({ w: { kind: 'permutation', perm: oneLine(2, 5, 1, 4, 3) } })
    const bpd = byId.get('sections/intro.tex:2:2')!
    expect(bpd.kind).toBe('count')
    expect(bpd.source).toBe('\\#\\BPD(w) = 2')
    expect(bpd.expandedSource).toContain('\\operatorname')
    expect(bpd.question?.lhs).toEqual({ type: 'count', objects: 'bumplessPipeDreams', perm: oneLine(2, 5, 1, 4, 3) })
  })

  it('ends the binding at the next \\section, listing the unbound use as not read rather than as a verdict', () => {
    expect(byId.has('sections/examples.tex:2:1')).toBe(false)
    const entry = result.notRead.find(n => n.file === 'sections/examples.tex' && n.line === 2)!
    expect(entry.reason).toMatch(/w is not bound/)
  })

  it('expands a macro with an optional argument, keeping the use site and the label', () => {
    const single = byId.get('sections/nested/small.tex:3:1')!
    expect(single.source).toBe('\\Sc{132} = x_1 + x_2')
    expect(single.label).toBe('eq:small')
    expect(single.display).toBe(true)
    expect(single.question).toEqual({
      type: 'equality',
      lhs: { type: 'schubert', perm: oneLine(1, 3, 2), variant: 'single' },
      rhs: { type: 'add', terms: [x(1), x(2)] },
    })
    const double = byId.get('sections/examples.tex:4:1')!
    expect(double.question?.lhs).toEqual({ type: 'schubert', perm: oneLine(1, 3, 2), variant: 'double' })
    expect(double.label).toBe('eq:double')
  })

  it('checks the second step of an align chain against the first step\'s right-hand side', () => {
    const step = byId.get('sections/examples.tex:5:1')!
    expect(step.kind).toBe('polynomial')
    expect(step.question).toEqual({
      type: 'equality',
      lhs: { type: 'add', terms: [x(1), x(2), { type: 'negate', arg: y(1) }, { type: 'negate', arg: y(2) }] },
      rhs: {
        type: 'add',
        terms: [{ type: 'add', terms: [x(1), { type: 'negate', arg: y(1) }] }, { type: 'add', terms: [x(2), { type: 'negate', arg: y(2) }] }],
      },
    })
  })

  it('applies a one-claim convention tag to both claims of the display below it, and \\def and \\renewcommand macros', () => {
    const g = byId.get('sections/examples.tex:8:1')!
    expect(g.kind).toBe('grothendieck')
    expect(g.conventions).toEqual(['beta-plus'])
    const d = byId.get('sections/examples.tex:8:2')!
    expect(d.kind).toBe('dividedDifference')
    expect(d.conventions).toEqual(['beta-plus'])
    expect(d.question?.lhs).toEqual({ type: 'dividedDifference', index: 1, arg: { type: 'power', base: x(1), exponent: 2 } })
    expect(byId.get('sections/examples.tex:9:1')!.conventions).toEqual([])
  })

  it('reads w_0^{(3)} hidden in a package macro', () => {
    expect(byId.get('sections/examples.tex:9:1')!.question?.lhs).toEqual({
      type: 'count', objects: 'reducedWords', perm: { form: 'longest', n: 3 },
    })
  })
})
