/**
 * One driver for the reference tests that recompute engine values with Debian's python3-sympy
 * (/usr/bin/python3, never the pyenv python3 on PATH). A test passes a Python body that may use the
 * prelude below; the body reads its JSON input from `data` and prints one JSON answer.
 *
 * Prelude (Python, sympy's sparse rings over ZZ, exact division only):
 * - `xy_ring(n)`: the ring ZZ[x1..xn, y1..yn], returned as (R, x, y);
 * - `ascents_to_top(w, last=False)`: the positions i (0-based) at which w climbs to w0 by swapping
 *   an ascent, the first ascent each time (or the last with `last=True`), in climbing order;
 * - `swap(R, f, i)`: f with x_{i+1} and x_{i+2} exchanged (0-based i);
 * - `divide_exact(f, g)`: f / g, raising when the division leaves a remainder;
 * - `terms(f)`: [[exponents], coefficient] pairs for JSON.
 */
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { Polynomial } from '../../shared/math'

export const SYMPY_PYTHON = '/usr/bin/python3'

const PRELUDE = String.raw`
import json, sys
from sympy.polys.rings import ring
from sympy.polys.domains import ZZ

def xy_ring(n):
    R, *gens = ring(','.join(['x%d' % i for i in range(1, n + 1)] + ['y%d' % i for i in range(1, n + 1)]), ZZ)
    return R, gens[:n], gens[n:]

def ascents_to_top(w, last=False):
    steps = []
    cur = list(w)
    while True:
        asc = [i for i in range(len(cur) - 1) if cur[i] < cur[i + 1]]
        if not asc:
            return steps
        i = asc[-1] if last else asc[0]
        cur[i], cur[i + 1] = cur[i + 1], cur[i]
        steps.append(i)

def swap(R, f, i):
    return R({m[:i] + (m[i + 1], m[i]) + m[i + 2:]: c for m, c in f.items()})

def divide_exact(f, g):
    q, r = divmod(f, g)
    if r != 0:
        raise SystemExit('inexact division')
    return q

def terms(f):
    return [[list(m), int(c)] for m, c in f.items()]

data = json.loads(sys.stdin.read())
`

/** Run `body` (Python, after the prelude) on `input` and parse what it prints; e.g. `runSympy('print(json.dumps(data))', [1])`. */
export function runSympy<T>(body: string, input: unknown): T {
  if (!existsSync(SYMPY_PYTHON)) throw new Error(`${SYMPY_PYTHON} is missing: install Debian's python3 and python3-sympy`)
  const out = execFileSync(SYMPY_PYTHON, ['-c', PRELUDE + body], { input: JSON.stringify(input), encoding: 'utf8', maxBuffer: 64 << 20 })
  return JSON.parse(out) as T
}

/** Exponent/coefficient pairs over ZZ[x1..xn, y1..yn] (from `terms(f)` of `xy_ring(n)`) as a Polynomial. */
export function polynomialFromSympy(list: [number[], number][], n: number): Polynomial {
  return Polynomial.fromTerms(list.map(([e, coefficient]) => ({ x: e.slice(0, n), y: e.slice(n), coefficient })))
}
