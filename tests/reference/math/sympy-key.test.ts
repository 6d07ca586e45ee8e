/**
 * Key polynomials and Demazure atoms against Debian's python3-sympy (/usr/bin/python3): the program
 * below applies Demazure operators π_i f = ∂_i(x_i f) and π̄_i f = π_i f − f with sympy's sparse
 * polynomial rings and exact division, sorting α towards its decreasing rearrangement by the LAST
 * ascent each time (the engine takes the first), for every weak composition of size ≤ 4 with 4 parts.
 */
import { describe, it, expect } from 'vitest'
import { keyPolynomial, demazureAtom, polynomialDifference } from '../../../shared/math'
import { polynomialFromSympy, runSympy } from '../../helpers/sympy'

// The ring has y-variables too (the shared prelude's ring); the programs never use them.
const PROGRAM = String.raw`
def demazure(alpha, atom):
    n = len(alpha)
    R, x, y = xy_ring(n)
    steps = ascents_to_top(alpha, last=True)
    cur = list(alpha)
    for i in steps:
        cur[i], cur[i + 1] = cur[i + 1], cur[i]
    f = R.one
    for i, e in enumerate(cur):
        f = f * x[i] ** e
    for i in reversed(steps):
        g = f * x[i]
        q = divide_exact(g - swap(R, g, i), x[i] - x[i + 1])
        f = q - f if atom else q
    return terms(f)

print(json.dumps([demazure(d['alpha'], d['atom']) for d in data]))
`

function compositions(d: number, n: number): number[][] {
  if (n === 0) return d === 0 ? [[]] : []
  const out: number[][] = []
  for (let a = 0; a <= d; a++) for (const rest of compositions(d - a, n - 1)) out.push([a, ...rest])
  return out
}

describe('key polynomials and atoms against an independent sympy computation', () => {
  it('κ_α and A_α for every weak composition of size ≤ 4 with 4 parts', () => {
    const alphas = [0, 1, 2, 3, 4].flatMap(d => compositions(d, 4))
    const items = alphas.flatMap(alpha => [{ alpha, atom: false }, { alpha, atom: true }])
    const out = runSympy<[number[], number][][]>(PROGRAM, items)
    expect(out.length).toBe(items.length)
    items.forEach((item, k) => {
      const ours = item.atom ? demazureAtom(item.alpha) : keyPolynomial(item.alpha)
      expect(polynomialDifference(ours, polynomialFromSympy(out[k]!, 4)).equal, `${item.atom ? 'A' : 'κ'}_(${item.alpha})`).toBe(true)
    })
  }, 60_000)
})
