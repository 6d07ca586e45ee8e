/**
 * Key polynomials and Demazure atoms against Debian's python3-sympy (/usr/bin/python3): the program
 * below applies Demazure operators π_i f = ∂_i(x_i f) and π̄_i f = π_i f − f with sympy's sparse
 * polynomial rings and exact division, sorting α towards its decreasing rearrangement by the LAST
 * ascent each time (the engine takes the first), for every weak composition of size ≤ 4 with 4 parts.
 */
import { describe, it, expect } from 'vitest'
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { keyPolynomial, demazureAtom, type Polynomial } from '../../../shared/math'

const PYTHON = '/usr/bin/python3'

const PROGRAM = String.raw`
import json, sys
from sympy.polys.rings import ring
from sympy.polys.domains import ZZ

def demazure(alpha, atom):
    n = len(alpha)
    R, *x = ring(','.join('x%d' % i for i in range(1, n + 1)), ZZ)
    cur = list(alpha)
    steps = []
    while True:
        asc = [i for i in range(n - 1) if cur[i] < cur[i + 1]]
        if not asc:
            break
        i = asc[-1]
        cur[i], cur[i + 1] = cur[i + 1], cur[i]
        steps.append(i)
    f = R.one
    for i, e in enumerate(cur):
        f = f * x[i] ** e
    for i in reversed(steps):
        g = f * x[i]
        swapped = R({m[:i] + (m[i + 1], m[i]) + m[i + 2:]: c for m, c in g.items()})
        q, r = divmod(g - swapped, x[i] - x[i + 1])
        if r != 0:
            raise SystemExit('inexact division')
        f = q - f if atom else q
    return [[list(m), int(c)] for m, c in f.items()]

data = json.loads(sys.stdin.read())
print(json.dumps([demazure(d['alpha'], d['atom']) for d in data]))
`

function compositions(d: number, n: number): number[][] {
  if (n === 0) return d === 0 ? [[]] : []
  const out: number[][] = []
  for (let a = 0; a <= d; a++) for (const rest of compositions(d - a, n - 1)) out.push([a, ...rest])
  return out
}

function termMap(p: Polynomial, n: number): [string, number][] {
  return p.termList().map(t => [Array.from({ length: n }, (_, i) => t.x[i] ?? 0).join(','), t.coefficient] as [string, number]).sort()
}

describe('key polynomials and atoms against an independent sympy computation', () => {
  it('κ_α and A_α for every weak composition of size ≤ 4 with 4 parts', () => {
    if (!existsSync(PYTHON)) throw new Error(`${PYTHON} is missing: install Debian's python3 and python3-sympy`)
    const alphas = [0, 1, 2, 3, 4].flatMap(d => compositions(d, 4))
    const items = alphas.flatMap(alpha => [{ alpha, atom: false }, { alpha, atom: true }])
    const out = JSON.parse(execFileSync(PYTHON, ['-c', PROGRAM], { input: JSON.stringify(items), encoding: 'utf8' })) as [number[], number][][]
    expect(out.length).toBe(items.length)
    items.forEach((item, k) => {
      const ours = item.atom ? demazureAtom(item.alpha) : keyPolynomial(item.alpha)
      const theirs = out[k]!.map(([m, c]) => [m.join(','), c] as [string, number]).sort()
      expect(termMap(ours, 4), `${item.atom ? 'A' : 'κ'}_(${item.alpha})`).toEqual(theirs)
    })
  }, 60_000)
})
