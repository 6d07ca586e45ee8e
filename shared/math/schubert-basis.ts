/**
 * The Schubert basis of ℤ[x_1, x_2, …]: expansion, structure constants, Monk's rule.
 *
 * Conventions:
 * - A SchubertCombination maps `Permutation.key` (trimmed one-line, e.g. "2,1,4,3") to a
 *   nonzero integer coefficient; it stands for Σ c_w S_w.
 * - Expansion uses the leading-term property: the largest monomial of S_w in the order
 *   that compares exponents of x_k, x_{k−1}, …, x_1 (last variable first) is x^{code(w)}
 *   with coefficient 1. Peeling leading terms gives exact coefficients.
 * - Structure constants: S_u S_v = Σ_w c_{u,v}^w S_w. The product is computed without
 *   expanding it: write the factor with fewer terms as a polynomial, evaluate it in
 *   Horner form over x_1, x_2, …, and multiply Schubert combinations by a variable with
 *   x_r S_w = Σ_{k>r, ℓ(w t_{rk}) = ℓ(w)+1} S_{w t_{rk}} − Σ_{q<r, ℓ(w t_{qr}) = ℓ(w)+1} S_{w t_{qr}}
 *   (a consequence of Monk's rule, as x_r = S_{s_r} − S_{s_{r−1}}).
 * - Monk's rule: S_{s_r} S_w = Σ_{j ≤ r < k, ℓ(w t_{jk}) = ℓ(w)+1} S_{w t_{jk}}.
 */
import { Permutation, trimFixedPoints } from './permutation'
import { Polynomial, decodeMonomial, encodeMonomial } from './polynomial'
import { doubleSchubertPolynomial, packedSchubert, schubertPolynomial, transitionStep } from './schubert'
import { NotInSpanError } from './errors'
import { accumulate, addChecked, mulChecked, negateCoefficient, type Coefficient } from './coefficient'
import { toMeter, type Budget, type BudgetMeter } from './budget'
import { PackedRangeExceeded, packedKeys, packedTransitionProduct } from './packed-product'

export type SchubertCombination = Map<string, Coefficient>

// Made on first use: creating a collator loads ICU data, a few ms at the start of every process.
let keyOrder: Intl.Collator | undefined

/** Sorted list form of a combination: longest permutations first, then by one-line. */
export function combinationEntries(c: SchubertCombination): { permutation: Permutation, coefficient: Coefficient }[] {
  // Length and key once per entry, not once per comparison: a product of thousands of terms is
  // sorted for every report (the collator orders as localeCompare does, at a fraction of its cost).
  return [...c]
    .map(([k, coefficient]) => {
      const permutation = Permutation.fromOneLine(k === '' ? [] : k.split(',').map(Number))
      return { permutation, coefficient, length: permutation.length(), key: permutation.key }
    })
    .sort((a, b) => b.length - a.length || (keyOrder ??= new Intl.Collator()).compare(a.key, b.key))
    .map(({ permutation, coefficient }) => ({ permutation, coefficient }))
}

/** Compare two combinations for equality. */
export function combinationsEqual(a: SchubertCombination, b: SchubertCombination): boolean {
  if (a.size !== b.size) return false
  for (const [k, c] of a) if (b.get(k) !== c) return false
  return true
}

/** Σ c_w S_w as a polynomial. */
export function combinationToPolynomial(c: SchubertCombination, budget?: Budget | BudgetMeter): Polynomial {
  let p = Polynomial.zero()
  for (const { permutation, coefficient } of combinationEntries(c)) p = p.add(schubertPolynomial(permutation, budget).scale(coefficient))
  return p
}

function compareLeading(a: readonly number[], b: readonly number[]): number {
  for (let i = Math.max(a.length, b.length) - 1; i >= 0; i--) {
    const d = (a[i] ?? 0) - (b[i] ?? 0)
    if (d !== 0) return d
  }
  return 0
}

/**
 * Expand a polynomial in x in the Schubert basis; e.g. x_1 ↦ {"2,1": 1}.
 * With `within: n` only S_w for w ∈ S_n are allowed; a polynomial outside that span (or one
 * involving y) is refused with NotInSpanError.
 */
export function schubertExpansion(f: Polynomial, options: { within?: number, budget?: Budget | BudgetMeter } = {}): SchubertCombination {
  const meter = toMeter(options.budget)
  for (const k of f.terms.keys()) {
    if (decodeMonomial(k).y.length > 0) throw new NotInSpanError('the polynomial involves y-variables; the Schubert basis spans ℤ[x] only')
  }
  const rest = new Map(f.terms)
  const out: SchubertCombination = new Map()
  while (rest.size > 0) {
    meter.step(rest.size)
    let bestKey = ''
    let best: number[] | undefined
    for (const k of rest.keys()) {
      const e = decodeMonomial(k).x
      if (best === undefined || compareLeading(e, best) > 0) { best = e; bestKey = k }
    }
    const c = rest.get(bestKey)!
    const w = Permutation.fromLehmerCode(best!)
    if (options.within !== undefined && w.trimmed().size > options.within) {
      throw new NotInSpanError(`not in the span of {S_w : w ∈ S_${options.within}}: the expansion needs S_${w.toString()} (leading monomial with exponents [${best!.join(',')}])`)
    }
    out.set(w.key, c)
    const s = schubertPolynomial(w, meter)
    for (const [k, v] of s.terms) accumulate(rest, k, -mulChecked(c, v))
    meter.terms(rest.size)
  }
  return out
}

/** A combination Σ c_w(y) S_w(x; y) with coefficients polynomials in y (keys as in SchubertCombination). */
export type DoubleSchubertCombination = Map<string, Polynomial>

/**
 * Expand a polynomial in x and y in the double Schubert basis over ℤ[y]; e.g. x_1 ↦ S_{21}(x;y) + y_1.
 * S_w(x; y) = S_w(x) + (terms of lower x-degree), so peeling the x-leading term (largest
 * x-degree, then last variable first) gives the coefficients c_w(y) exactly.
 */
export function doubleSchubertExpansion(f: Polynomial, options: { within?: number, budget?: Budget | BudgetMeter } = {}): DoubleSchubertCombination {
  const meter = toMeter(options.budget)
  const rest = new Map(f.terms)
  const out: DoubleSchubertCombination = new Map()
  const xDegree = (e: readonly number[]): number => e.reduce((a, b) => a + b, 0)
  while (rest.size > 0) {
    meter.step(rest.size)
    let best: number[] | undefined
    for (const k of rest.keys()) {
      const e = decodeMonomial(k).x
      if (best === undefined || xDegree(e) > xDegree(best) || (xDegree(e) === xDegree(best) && compareLeading(e, best) > 0)) best = e
    }
    const bestX = encodeMonomial(best!)
    // c(y): all terms whose x-part is exactly x^best
    const coeff = new Map<string, Coefficient>()
    for (const [k, c] of rest) {
      const e = decodeMonomial(k)
      if (encodeMonomial(e.x) === bestX) coeff.set(encodeMonomial([], e.y), c)
    }
    const c = new Polynomial(coeff)
    const w = Permutation.fromLehmerCode(best!)
    if (options.within !== undefined && w.trimmed().size > options.within) {
      throw new NotInSpanError(`not in the span of {S_w(x;y) : w ∈ S_${options.within}} over ℤ[y]: the expansion needs S_${w.toString()}`)
    }
    out.set(w.key, c)
    for (const [k, v] of c.mul(doubleSchubertPolynomial(w, meter), meter).terms) accumulate(rest, k, -v)
    meter.terms(rest.size)
  }
  return out
}

/** S_u(x;y) · S_v(x;y) in the double Schubert basis (equivariant structure constants, polynomials in y). */
export function doubleSchubertProduct(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter): DoubleSchubertCombination {
  const meter = toMeter(budget)
  return doubleSchubertExpansion(doubleSchubertPolynomial(u, meter).mul(doubleSchubertPolynomial(v, meter), meter), { budget: meter })
}

// ---- products -------------------------------------------------------------------------

/** Internal keys: one UTF-16 code unit per one-line value, trailing fixed points dropped. */
function toInternal(w: Permutation): string {
  return String.fromCharCode(...w.trimmed().oneLine)
}

function fromInternal(k: string): string {
  const vals: number[] = []
  for (let i = 0; i < k.length; i++) vals.push(k.charCodeAt(i))
  return vals.join(',')
}

/** x_r · Σ c_w S_w, as a combination (internal keys). */
function multiplyByVariable(r: number, comb: Map<string, Coefficient>, meter: BudgetMeter): Map<string, Coefficient> {
  const out = new Map<string, Coefficient>()
  for (const [key, c] of comb) {
    const n = key.length
    const at = (j: number): number => (j <= n ? key.charCodeAt(j - 1) : j)
    const wr = at(r)
    // Up-moves t_{rk}, k > r: w(r) < w(k) with no value of positions between in (w(r), w(k)).
    let m = Infinity
    const top = Math.max(n, r) + 1
    for (let k = r + 1; k <= top; k++) {
      const wk = at(k)
      if (wk > wr && wk < m) {
        m = wk
        accumulate(out, swapKey(key, r, k), c)
      }
    }
    // Down-moves t_{qr}, q < r: w(q) < w(r) with no value between in (w(q), w(r)).
    let M = -Infinity
    for (let q = r - 1; q >= 1; q--) {
      const wq = at(q)
      if (wq < wr && wq > M) {
        M = wq
        accumulate(out, swapKey(key, q, r), negateCoefficient(c))
      }
    }
    meter.step(top)
  }
  meter.terms(out.size, 'Schubert classes')
  return out
}

function swapKey(key: string, a: number, b: number): string {
  // a < b; extend with fixed points when b is past the end.
  let k = key
  while (k.length < b) k += String.fromCharCode(k.length + 1)
  return k.slice(0, a - 1) + k[b - 1] + k.slice(a, b - 1) + k[a - 1] + k.slice(b)
}

/**
 * S_u · S_v in the Schubert basis; e.g. S_{21}·S_{21} = S_{312} + S_{231}.
 * Default method 'transition' (transition recursion on the factor with the smaller recursion,
 * see schubertProductByTransition); 'horner' expands one factor into monomials instead.
 */
export function schubertProduct(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter, method: 'transition' | 'horner' = 'transition'): SchubertCombination {
  if (method === 'transition') {
    return transitionDagSize(u) <= transitionDagSize(v) ? schubertProductByTransition(u, v, budget) : schubertProductByTransition(v, u, budget)
  }
  return schubertProductByHorner(u, v, budget)
}

/** S_u · S_v by expanding the factor with fewer terms and evaluating it in Horner form on Schubert combinations. */
export function schubertProductByHorner(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter): SchubertCombination {
  const meter = toMeter(budget)
  const [monos, other] = pickPolynomialSide(u, v, meter)
  const start = new Map<string, Coefficient>([[toInternal(other), 1]])
  const order: number[] = []
  const maxVar = monos.reduce((m, t) => Math.max(m, t.e.length), 0)
  for (let i = 1; i <= maxVar; i++) order.push(i)
  const result = horner(monos, order, 0, start, meter)
  const out: SchubertCombination = new Map()
  for (const [k, c] of result) out.set(fromInternal(k), c)
  return out
}

interface Mono { e: number[], c: number }

function pickPolynomialSide(u: Permutation, v: Permutation, meter: BudgetMeter): [Mono[], Permutation] {
  const pu = packedSchubert(u, meter)
  const pv = packedSchubert(v, meter)
  const [side, other] = pu.poly.codes.length <= pv.poly.codes.length ? [pu, v] : [pv, u]
  const monos: Mono[] = []
  for (let t = 0; t < side.poly.codes.length; t++) monos.push({ e: side.context.exponents(side.poly.codes[t]!), c: side.poly.coefficients[t]! })
  return [monos, other]
}

/** Σ_m c_m x^{e_m} restricted to variables ≥ i, times the combination `base`, in Horner form over x_i. */
function horner(monos: Mono[], order: readonly number[], depth: number, base: Map<string, Coefficient>, meter: BudgetMeter): Map<string, Coefficient> {
  if (depth === order.length) {
    let total: Coefficient = 0
    for (const m of monos) total = addChecked(total, m.c)
    const out = new Map<string, Coefficient>()
    if (total !== 0) for (const [k, c] of base) out.set(k, mulChecked(c, total))
    return out
  }
  const i = order[depth]!
  // Group by the exponent of x_i.
  const groups = new Map<number, Mono[]>()
  let top = 0
  for (const m of monos) {
    const a = m.e[i - 1] ?? 0
    top = Math.max(top, a)
    let g = groups.get(a)
    if (!g) { g = []; groups.set(a, g) }
    g.push(m)
  }
  let acc = new Map<string, Coefficient>()
  for (let a = top; a >= 0; a--) {
    if (a < top) acc = multiplyByVariable(i, acc, meter)
    const g = groups.get(a)
    if (g) {
      const part = horner(g, order, depth + 1, base, meter)
      for (const [k, c] of part) accumulate(acc, k, c)
    }
  }
  return acc
}

/** Monk's rule: S_{s_r} · S_w; e.g. `monkProduct(1, Permutation.parse('21'))`. */
export function monkProduct(r: number, w: Permutation): SchubertCombination {
  const n = Math.max(w.size, r) + 1
  const line = w.embed(n)
  const len = line.length()
  const out: SchubertCombination = new Map()
  for (let j = 1; j <= r; j++) for (let k = r + 1; k <= n; k++) {
    const t = Permutation.fromCycles([[j, k]], n)
    const x = line.compose(t)
    if (x.length() === len + 1) out.set(x.key, addChecked(out.get(x.key) ?? 0, 1))
  }
  return out
}

/** A single structure constant c_{u,v}^w. */
export function structureConstant(u: Permutation, v: Permutation, w: Permutation, budget?: Budget | BudgetMeter): Coefficient {
  if (u.length() + v.length() !== w.length()) return 0
  return schubertProduct(u, v, budget).get(w.key) ?? 0
}

/**
 * S_u · S_v by the transition recursion on u (memoised), multiplying by x_r with the Monk-derived rule.
 * Route 'packed' (the default when the keys fit, see packed-product.ts) holds combinations in
 * typed arrays and falls back to 'exact' if a coefficient passes 2^53 − 1; 'exact' keeps Maps
 * of exact coefficients throughout (kept callable so that tests compare the two).
 */
export function schubertProductByTransition(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter, route: 'packed' | 'exact' = 'packed'): SchubertCombination {
  const meter = toMeter(budget)
  const keys = route === 'packed' ? packedKeys(u, v) : undefined
  if (keys) {
    try {
      return packedTransitionProduct(u, v, keys, meter)
    }
    catch (error) {
      if (!(error instanceof PackedRangeExceeded)) throw error
    }
  }
  const memo = new Map<string, Map<string, Coefficient>>()
  const base = new Map<string, Coefficient>([[toInternal(v), 1]])
  const go = (line: number[]): Map<string, Coefficient> => {
    const trimmed = trimFixedPoints(line)
    const key = trimmed.join(',')
    const hit = memo.get(key)
    if (hit) return hit
    const step = transitionStep(trimmed)
    let result: Map<string, Coefficient>
    if (!step) result = base
    else {
      result = multiplyByVariable(step.r, go(step.v), meter)
      for (const o of step.others) for (const [k, c] of go(o)) accumulate(result, k, c)
    }
    meter.step()
    memo.set(key, result)
    return result
  }
  const out: SchubertCombination = new Map()
  for (const [k, c] of go(u.oneLine.slice())) out.set(fromInternal(k), c)
  return out
}

/** Number of distinct nodes of the transition recursion from w (a cheap cost estimate). */
export function transitionDagSize(w: Permutation, limit = 1e6): number {
  const seen = new Set<string>()
  const stack = [w.oneLine.slice()]
  while (stack.length > 0 && seen.size < limit) {
    const trimmed = trimFixedPoints(stack.pop()!)
    const key = trimmed.join(',')
    if (seen.has(key)) continue
    seen.add(key)
    const step = transitionStep(trimmed)
    if (step) { stack.push(step.v); for (const o of step.others) stack.push(o) }
  }
  return seen.size
}
