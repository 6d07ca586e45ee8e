/**
 * Cross-check against Debian's python3-sympy (/usr/bin/python3, sympy 1.11): a separate divided-
 * difference computation written below in Python, using sympy's sparse polynomial rings (sympy.polys.rings) and exact division, for S_w and
 * S_w(x; y) (factors x_i − y_j) for all of S_4 and a seeded sample of S_5. It walks from w0 to w
 * by a different route from the engine (first ascent each time, starting at w0's product formula).
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { Permutation, allPermutations, schubertPolynomial, doubleSchubertPolynomial, Polynomial } from '../../../shared/math'
import { seeded, randomPermutation } from '../../unit/math/helpers'

const PYTHON = '/usr/bin/python3'

const PROGRAM = String.raw`
import json, sys
from sympy.polys.rings import ring
from sympy.polys.domains import ZZ

def schubert(w, double):
    n = len(w)
    names = ['x%d' % i for i in range(1, n + 1)] + ['y%d' % i for i in range(1, n + 1)]
    R, *gens = ring(','.join(names), ZZ)
    x, y = gens[:n], gens[n:]
    f = R.one
    for i in range(1, n):
        for j in range(1, n - i + 1):
            f = f * ((x[i - 1] - y[j - 1]) if double else x[i - 1])
    # climb from w to w0 by ascents (first ascent each time); S_w = d_{a1} d_{a2} ... d_{ak} S_{w0}
    steps = []
    cur = list(w)
    while True:
        asc = [i for i in range(n - 1) if cur[i] < cur[i + 1]]
        if not asc:
            break
        i = asc[0]
        cur[i], cur[i + 1] = cur[i + 1], cur[i]
        steps.append(i + 1)
    for i in reversed(steps):
        swapped = R({m[:i - 1] + (m[i], m[i - 1]) + m[i + 1:]: c for m, c in f.items()})
        q, r = divmod(f - swapped, x[i - 1] - x[i])
        if r != 0:
            raise SystemExit('division by x_%d - x_%d was not exact' % (i, i + 1))
        f = q
    return [[list(m), int(c)] for m, c in f.items()]

data = json.loads(sys.stdin.read())
print(json.dumps([schubert(item['w'], item['double']) for item in data]))
`

function toTermMap(p: Polynomial, n: number): Map<string, number | bigint> {
  const m = new Map<string, number | bigint>()
  for (const t of p.termList()) {
    const ex = Array.from({ length: n }, (_, i) => t.x[i] ?? 0)
    const ey = Array.from({ length: n }, (_, i) => t.y[i] ?? 0)
    m.set([...ex, ...ey].join(','), t.coefficient)
  }
  return m
}

describe('Schubert polynomials against an independent sympy computation', () => {
  it('S_w and S_w(x; y) for all of S_4 and a seeded sample of S_5', () => {
    if (!existsSync(PYTHON)) throw new Error(`${PYTHON} is missing: install Debian's python3 and python3-sympy`)
    const rand = seeded(555)
    const perms: Permutation[] = [...allPermutations(4), ...Array.from({ length: 40 }, () => randomPermutation(rand, 5))]
    const items = perms.flatMap(w => [{ w: [...w.oneLine], double: false }, { w: [...w.oneLine], double: true }])
    const out = execFileSync(PYTHON, ['-c', PROGRAM], { input: JSON.stringify(items), encoding: 'utf8', maxBuffer: 64 << 20 })
    const results = JSON.parse(out) as [number[], number][][]
    expect(results.length).toBe(items.length)
    items.forEach((item, k) => {
      const w = Permutation.fromOneLine(item.w)
      const n = w.size
      const ours = item.double ? doubleSchubertPolynomial(w) : schubertPolynomial(w)
      const theirs = new Map(results[k]!.map(([m, c]) => [m.join(','), c] as [string, number]))
      expect([...toTermMap(ours, n)].sort(), `${item.double ? 'double ' : ''}S_${w}`).toEqual([...theirs].sort())
    })
  }, 120_000)
})
