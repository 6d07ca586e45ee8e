/**
 * K-theoretic structure constants with β formal, against Debian's python3-sympy (/usr/bin/python3).
 * The program below builds G^β_w in ZZ[x_1..x_n, β] from the top class x_1^{n−1}⋯x_{n−1} of S_n by
 * π^β_i f = ∂_i((1 + β x_{i+1}) f) (first ascent each time, exact division), then expands both sides
 * of G_u G_v = Σ_w c_w(β) G_w, with the c_w(β) the engine gives, and reports whether they agree and
 * the left side's terms. All pairs from S_3, and pairs of S_4 with one factor of length ≤ 2.
 */
import { describe, it, expect } from 'vitest'
import {
  Permutation, allPermutations, grothendieckFormal, grothendieckProductFormalBasis, BETA, permutationFromKey,
} from '../../../shared/math'
import { runSympy } from '../../helpers/sympy'

const PROGRAM = String.raw`
N = 8
R, *g = ring(','.join(['x%d' % i for i in range(1, N + 1)] + ['b']), ZZ)
x, b = g[:N], g[N]

def groth(w):
    n = len(w)
    f = R.one
    for i in range(1, n):
        f = f * x[i - 1] ** (n - i)
    for i in reversed(ascents_to_top(w)):
        h = f * (1 + b * x[i + 1])
        f = divide_exact(h - swap(R, h, i), x[i] - x[i + 1])
    return f

out = []
for d in data:
    left = groth(d['u']) * groth(d['v'])
    right = R.zero
    for w, c, k in d['expansion']:
        right = right + c * b ** k * groth(w)
    out.append({'agree': left == right, 'left': terms(left)})
print(json.dumps(out))
`

describe('Grothendieck products with β formal against sympy', () => {
  it('G_u G_v = Σ c_w(β) G_w, both sides expanded in sympy; the left side matches the engine', () => {
    const s3 = allPermutations(3)
    const pairs: [Permutation, Permutation][] = [
      ...s3.flatMap(u => s3.map(v => [u, v] as [Permutation, Permutation])),
      ...allPermutations(4).filter(u => u.length() <= 2).flatMap(u => allPermutations(4).filter(v => v.length() >= 2 && v.length() <= 3).map(v => [u, v] as [Permutation, Permutation])),
    ]
    const items = pairs.map(([u, v]) => {
      const expansion = [...grothendieckProductFormalBasis(u, v)].flatMap(([key, c]) => c.termList().map((t) => {
        const w = permutationFromKey(key)
        return [[...w.oneLine], Number(t.coefficient), t.parameters[BETA] ?? 0]
      }))
      return { u: [...u.oneLine], v: [...v.oneLine], expansion }
    })
    // A control the program must reject: the last expansion with its last term dropped.
    const control = { ...items[items.length - 1]!, expansion: items[items.length - 1]!.expansion.slice(0, -1) }
    const out = runSympy<{ agree: boolean, left: [number[], number][] }[]>(PROGRAM, [...items, control])
    expect(out.length).toBe(items.length + 1)
    expect(out.pop()!.agree, 'a wrong expansion is rejected').toBe(false)
    pairs.forEach(([u, v], k) => {
      expect(out[k]!.agree, `G_${u} G_${v}`).toBe(true)
      const ours = grothendieckFormal(u).mul(grothendieckFormal(v))
      const theirs = new Map<string, number>()
      for (const [e, c] of out[k]!.left) theirs.set(`${e.slice(0, 8).join(',')}|${e[8]}`, c)
      const mine = new Map<string, number>()
      for (const t of ours.termList()) mine.set(`${Array.from({ length: 8 }, (_, i) => t.x[i] ?? 0).join(',')}|${t.parameters[BETA] ?? 0}`, Number(t.coefficient))
      expect([...mine].sort(), `G_${u} G_${v} expanded`).toEqual([...theirs].sort())
    })
  }, 120_000)
})
