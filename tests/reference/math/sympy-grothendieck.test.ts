/**
 * Double Grothendieck polynomials against Debian's python3-sympy (/usr/bin/python3): the program
 * below starts from the top class of S_n, ∏_{i+j≤n} (x_i + y_j + β x_i y_j) (⊕ form) or
 * ∏_{i+j≤n} (x_i − y_j) over ∏_j (1 + β y_j)^{n−j} (⊖ form), and walks down to w by isobaric divided
 * differences π^β_i f = ∂_i((1 + β x_{i+1}) f) with sympy's sparse rings and exact division
 * (first ascent each time; the engine starts at a dominant permutation instead).
 * All of S_4 and a seeded sample of S_5, β = −1 and β = +1.
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import {
  Permutation, Polynomial, allPermutations, doubleGrothendieckPolynomial, doubleGrothendieckOminus, rationalsEqual,
} from '../../../shared/math'
import { seeded, randomPermutation } from '../../unit/math/helpers'

const PYTHON = '/usr/bin/python3'

const PROGRAM = String.raw`
import json, sys
from sympy.polys.rings import ring
from sympy.polys.domains import ZZ

def grothendieck(w, beta, form):
    n = len(w)
    R, *gens = ring(','.join(['x%d' % i for i in range(1, n + 1)] + ['y%d' % i for i in range(1, n + 1)]), ZZ)
    x, y = gens[:n], gens[n:]
    f = R.one
    for i in range(1, n):
        for j in range(1, n - i + 1):
            a, b = x[i - 1], y[j - 1]
            f = f * ((a + b + beta * a * b) if form == 'oplus' else (a - b))
    steps = []
    cur = list(w)
    while True:
        asc = [i for i in range(n - 1) if cur[i] < cur[i + 1]]
        if not asc:
            break
        i = asc[0]
        cur[i], cur[i + 1] = cur[i + 1], cur[i]
        steps.append(i)
    for i in reversed(steps):
        g = f * (1 + beta * x[i + 1])
        swapped = R({m[:i] + (m[i + 1], m[i]) + m[i + 2:]: c for m, c in g.items()})
        q, r = divmod(g - swapped, x[i] - x[i + 1])
        if r != 0:
            raise SystemExit('inexact division')
        f = q
    return [[list(m), int(c)] for m, c in f.items()]

data = json.loads(sys.stdin.read())
print(json.dumps([grothendieck(d['w'], d['beta'], d['form']) for d in data]))
`

function fromSympy(terms: [number[], number][], n: number): Polynomial {
  return Polynomial.fromTerms(terms.map(([m, c]) => ({ x: m.slice(0, n), y: m.slice(n), coefficient: c })))
}

describe('double Grothendieck polynomials against an independent sympy computation', () => {
  it('⊕ and ⊖ forms, β = ±1, all of S_4 and a seeded sample of S_5', () => {
    if (!existsSync(PYTHON)) throw new Error(`${PYTHON} is missing: install Debian's python3 and python3-sympy`)
    const rand = seeded(909)
    const perms: Permutation[] = [...allPermutations(4), ...Array.from({ length: 6 }, () => randomPermutation(rand, 5))]
    const items = perms.flatMap(w => [-1, 1].flatMap(beta => (['oplus', 'ominus'] as const).map(form => ({ w: [...w.oneLine], beta, form }))))
    const out = JSON.parse(execFileSync(PYTHON, ['-c', PROGRAM], { input: JSON.stringify(items), encoding: 'utf8', maxBuffer: 64 << 20 })) as [number[], number][][]
    expect(out.length).toBe(items.length)
    items.forEach((item, k) => {
      const w = Permutation.fromOneLine(item.w)
      const n = item.w.length
      const theirs = fromSympy(out[k]!, n)
      if (item.form === 'oplus') {
        expect(doubleGrothendieckPolynomial(w, item.beta).equals(theirs), `G_${w}, β=${item.beta}`).toBe(true)
      } else {
        const denominator = Array.from({ length: n - 1 }, (_, j) => n - 1 - j)
        expect(rationalsEqual(doubleGrothendieckOminus(w, item.beta), { numerator: theirs, beta: item.beta, denominator }), `G^⊖_${w}, β=${item.beta}`).toBe(true)
      }
    })
  }, 120_000)
})
