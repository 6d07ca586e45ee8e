/**
 * Back-stable claims read from LaTeX, against truncations computed by Debian's python3-sympy
 * (/usr/bin/python3, through tests/helpers/sympy.ts). For each written claim ←S_w = RHS, sympy
 * computes S_{1^m × w} (m = 4, or m = 2 for the double polynomial with factors x_i − y_j, whose top
 * class grows fast) by divided differences
 * from the top class of S_{m+n}, and the right-hand side with its non-positive variables
 * relabelled x_0, x_{−1}, … ↦ x_1..x_m (Schur functions by Jacobi–Trudi in h) and x_i ↦ x_{m+i};
 * the two agree exactly when the claim holds, since m is at least the degree of every claim.
 * The reader's verdict must be what sympy says, and sympy must say what each case expects.
 */
import { describe, it, expect } from 'vitest'
import { checkManuscript } from '../../../shared/check/index'
import { runSympy } from '../../helpers/sympy'

const PROGRAM = String.raw`
from itertools import permutations

def run(case):
    w = case['w']
    M = case['m']
    n = len(w)
    N = M + n
    R, x, y = xy_ring(N)
    big = list(range(1, M + 1)) + [M + v for v in w]
    f = R.one
    for i in range(1, N):
        for j in range(1, N - i + 1):
            f = f * ((x[i - 1] - y[j - 1]) if case['double'] else x[i - 1])
    for i in reversed(ascents_to_top(big)):
        f = divide_exact(f - swap(R, f, i), x[i] - x[i + 1])

    def h(k, vs):
        if k < 0: return R.zero
        if k == 0: return R.one
        total = R.zero
        def rec(start, left, acc):
            nonlocal total
            if left == 0:
                total += acc
                return
            for t in range(start, len(vs)):
                rec(t, left - 1, acc * vs[t])
        rec(0, k, R.one)
        return total

    def schur(lam, letter='x'):
        vs = (x if letter == 'x' else y)[:M]
        l = len(lam)
        total = R.zero
        for p in permutations(range(l)):
            sign = 1
            for a in range(l):
                for b in range(a + 1, l):
                    if p[a] > p[b]: sign = -sign
            term = R.one
            for i in range(l):
                term = term * h(lam[i] - i + p[i], vs)
            total += sign * term
        return total

    def e(k, letter='x'):
        return schur([1] * k, letter)

    def hh(k, letter='x'):
        return schur([k], letter)

    X = lambda i: x[M + i - 1]
    Y = lambda j: y[M + j - 1]
    rhs = eval(case['rhs'], {'schur': schur, 'e': e, 'h': hh, 'X': X, 'Y': Y})
    return f == rhs

print(json.dumps([run(c) for c in data]))
`

interface Case {
  tex: string
  w: number[]
  double: boolean
  /** The right-hand side in sympy, written separately from the LaTeX. */
  rhs: string
  holds: boolean
}

const CASES: Case[] = [
  { tex: '\\overleftarrow{\\mathfrak{S}}_{213} = s_1[x_-] + x_1', w: [2, 1, 3], double: false, rhs: 'schur([1]) + X(1)', holds: true },
  { tex: '\\overleftarrow{\\mathfrak{S}}_{213} = x_1', w: [2, 1, 3], double: false, rhs: 'X(1)', holds: false },
  { tex: '\\overleftarrow{\\mathfrak{S}}_{231} = s_{11}[x_-] + s_1[x_-](x_1 + x_2) + x_1x_2', w: [2, 3, 1], double: false, rhs: 'schur([1,1]) + schur([1])*(X(1) + X(2)) + X(1)*X(2)', holds: true },
  { tex: '\\overleftarrow{\\mathfrak{S}}_{312} = h_2(x_{\\le 0}) + h_1(x_{\\le 0})x_1 + x_1^2', w: [3, 1, 2], double: false, rhs: 'h(2) + h(1)*X(1) + X(1)**2', holds: true },
  { tex: '\\overleftarrow{\\mathfrak{S}}_{312} = e_2(x_{\\le 0}) + e_1(x_{\\le 0})x_1 + x_1^2', w: [3, 1, 2], double: false, rhs: 'e(2) + e(1)*X(1) + X(1)**2', holds: false },
  {
    tex: '\\overleftarrow{\\mathfrak{S}}_{2143} = s_2[x_-] + s_{11}[x_-] + (2x_1 + x_2 + x_3)s_1[x_-] + x_1^2 + x_1x_2 + x_1x_3',
    w: [2, 1, 4, 3], double: false, rhs: 'schur([2]) + schur([1,1]) + (2*X(1) + X(2) + X(3))*schur([1]) + X(1)**2 + X(1)*X(2) + X(1)*X(3)', holds: true,
  },
  {
    tex: '\\overleftarrow{\\mathfrak{S}}_{1432} = s_{21}[x_-] + s_2[x_-](x_1 + x_2) + s_{11}[x_-](x_1 + x_2) + s_1[x_-](x_1^2 + 2x_1x_2 + x_2^2) + x_1^2x_2 + x_1x_2^2',
    w: [1, 4, 3, 2], double: false, rhs: 'schur([2,1]) + (schur([2]) + schur([1,1]))*(X(1) + X(2)) + schur([1])*(X(1)**2 + 2*X(1)*X(2) + X(2)**2) + X(1)**2*X(2) + X(1)*X(2)**2', holds: false,
  },
  { tex: '\\overleftarrow{\\mathfrak{S}}_{213}(x;y) = s_1[x_-] - s_1[y_-] + x_1 - y_1', w: [2, 1, 3], double: true, rhs: 'schur([1]) - schur([1], "y") + X(1) - Y(1)', holds: true },
  { tex: '\\overleftarrow{\\mathfrak{S}}_{213}(x;y) = s_1[x_-] + s_1[y_-] + x_1 - y_1', w: [2, 1, 3], double: true, rhs: 'schur([1]) + schur([1], "y") + X(1) - Y(1)', holds: false },
  {
    tex: '\\overleftarrow{\\mathfrak{S}}_{132}(x;y) = s_1[x_-] - s_1[y_-] + x_1 + x_2 - y_1 - y_2',
    w: [1, 3, 2], double: true, rhs: 'schur([1]) - schur([1], "y") + X(1) + X(2) - Y(1) - Y(2)', holds: true,
  },
]

describe('back-stable claims through the reader against sympy truncations S_{1^m × w}', () => {
  it('the verdict is verified exactly when sympy finds the truncations equal', () => {
    const sympy = runSympy<boolean[]>(PROGRAM, CASES.map(({ w, double, rhs }) => ({ w, double, rhs, m: double ? 2 : 4 })))
    expect(sympy).toEqual(CASES.map(c => c.holds))
    const verdicts = CASES.map(c => checkManuscript({ files: { 'main.tex': `\\[ ${c.tex} \\]` } }).claims.map(claim => claim.verdict))
    expect(verdicts).toEqual(CASES.map(c => [c.holds ? 'verified' : 'mismatch']))
  }, 120_000)
})
