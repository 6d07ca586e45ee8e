/**
 * Back-stable Schubert polynomials, single and double, against truncations computed by Debian's
 * python3-sympy (/usr/bin/python3): S_{1^m × w}(x) and S_{1^m × w}(x; y) (factors x_i − y_j) from the
 * top class of S_{m+n} by divided differences in sympy's sparse rings (first ascent each time). The
 * engine's side is the formula of shared/math/back-stable.ts truncated to m non-positive variables of
 * each set and renamed (x_{≤0} ↦ x_1..x_m, x_i ↦ x_{m+i}, the same for y).
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import {
  Permutation, Polynomial, allPermutations, parsePermutation, backStableSchubert, backStableTruncation,
  doubleBackStableSchubert, doubleBackStableTruncation,
} from '../../../shared/math'

const PYTHON = '/usr/bin/python3'

const PROGRAM = String.raw`
import json, sys
from sympy.polys.rings import ring
from sympy.polys.domains import ZZ

def schubert(w, double):
    n = len(w)
    R, *gens = ring(','.join(['x%d' % i for i in range(1, n + 1)] + ['y%d' % i for i in range(1, n + 1)]), ZZ)
    x, y = gens[:n], gens[n:]
    f = R.one
    for i in range(1, n):
        for j in range(1, n - i + 1):
            f = f * ((x[i - 1] - y[j - 1]) if double else x[i - 1])
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
        swapped = R({m[:i] + (m[i + 1], m[i]) + m[i + 2:]: c for m, c in f.items()})
        q, r = divmod(f - swapped, x[i] - x[i + 1])
        if r != 0:
            raise SystemExit('inexact division')
        f = q
    return [[list(m), int(c)] for m, c in f.items()]

data = json.loads(sys.stdin.read())
print(json.dumps([schubert(d['w'], d['double']) for d in data]))
`

describe('back-stable Schubert polynomials against sympy truncations S_{1^m × w}', () => {
  it('single: all w in S_4 with m = 1, 2; double: all w in S_3 with m = 1, 2 and four of S_4 with m = 1', () => {
    if (!existsSync(PYTHON)) throw new Error(`${PYTHON} is missing: install Debian's python3 and python3-sympy`)
    const cases: { w: Permutation; m: number; double: boolean }[] = [
      ...allPermutations(4).flatMap(w => [1, 2].map(m => ({ w, m, double: false }))),
      ...allPermutations(3).flatMap(w => [1, 2].map(m => ({ w, m, double: true }))),
      ...['2143', '1342', '3142', '2413'].map(s => ({ w: parsePermutation(s), m: 1, double: true })),
    ]
    const items = cases.map(c => ({ w: [...c.w.shift(c.m).oneLine], double: c.double }))
    const out = JSON.parse(execFileSync(PYTHON, ['-c', PROGRAM], { input: JSON.stringify(items), encoding: 'utf8', maxBuffer: 64 << 20 })) as [number[], number][][]
    expect(out.length).toBe(cases.length)
    cases.forEach((c, k) => {
      const n = items[k]!.w.length
      const theirs = Polynomial.fromTerms(out[k]!.map(([e, coefficient]) => ({ x: e.slice(0, n), y: e.slice(n), coefficient })))
      const ours = c.double
        ? doubleBackStableTruncation(doubleBackStableSchubert(c.w), c.m)
        : backStableTruncation(backStableSchubert(c.w), c.m)
      expect(ours.equals(theirs), `${c.double ? 'double ' : ''}w=${c.w}, m=${c.m}`).toBe(true)
    })
  }, 120_000)
})
