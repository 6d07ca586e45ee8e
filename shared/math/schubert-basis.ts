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

export type SchubertCombination = Map<string, Coefficient>

/** Sorted list form of a combination: longest permutations first, then by one-line. */
export function combinationEntries(c: SchubertCombination): { permutation: Permutation; coefficient: Coefficient }[] {
  return [...c]
    .map(([k, coefficient]) => ({ permutation: Permutation.fromOneLine(k === '' ? [] : k.split(',').map(Number)), coefficient }))
    .sort((a, b) => b.permutation.length() - a.permutation.length() || a.permutation.key.localeCompare(b.permutation.key))
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
export function schubertExpansion(f: Polynomial, options: { within?: number; budget?: Budget | BudgetMeter } = {}): SchubertCombination {
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
export function doubleSchubertExpansion(f: Polynomial, options: { within?: number; budget?: Budget | BudgetMeter } = {}): DoubleSchubertCombination {
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

interface Mono { e: number[]; c: number }

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

/** S_u · S_v by the transition recursion on u (memoised), multiplying by x_r with the Monk-derived rule. */
export function schubertProductByTransition(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter): SchubertCombination {
  const meter = toMeter(budget)
  const ctx = numericContext(u, v)
  if (ctx) return productByTransitionNumeric(u, v, ctx, meter)
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

// ---- numeric-key fast path ------------------------------------------------------------
//
// Every permutation met while multiplying S_u · S_v by the transition recursion has all its
// descents at positions ≤ D = max(last descent of u, of v), because every combination is the
// (unique) expansion of a polynomial in x_1..x_D. Such a permutation is fixed by its first D
// values (the rest increase), so it is keyed by the number Σ_{i≤D} w(i) B^{i−1}, exact
// whenever B^D ≤ 2^53 with B bounding the values (B = D + ℓ(u) + ℓ(v) + 2 suffices, as
// w(i) ≤ i + c_i(w) ≤ D + ℓ(w)).

interface NumericContext {
  D: number
  B: number
  /** P[i] = B^{i−1}, i = 1..D */
  P: number[]
  vals: Int32Array
  present: Uint8Array
}

function numericContext(u: Permutation, v: Permutation): NumericContext | undefined {
  const last = (w: Permutation): number => { const d = w.descents(); return d.length ? d[d.length - 1]! : 0 }
  const D = Math.max(last(u), last(v), 1)
  const B = D + u.length() + v.length() + 2
  if (Math.pow(B, D) > Number.MAX_SAFE_INTEGER) return undefined
  const P = [0]
  for (let i = 1; i <= D; i++) P.push(Math.pow(B, i - 1))
  return { D, B, P, vals: new Int32Array(D + 1), present: new Uint8Array(B + 2) }
}

function numericKey(w: Permutation, ctx: NumericContext): number {
  let k = 0
  for (let i = 1; i <= ctx.D; i++) k += w.at(i) * ctx.P[i]!
  return k
}

function numericToPermutationKey(key: number, ctx: NumericContext): string {
  const prefix: number[] = []
  let rest = key
  for (let i = 1; i <= ctx.D; i++) { prefix.push(rest % ctx.B); rest = Math.floor(rest / ctx.B) }
  const used = new Set(prefix)
  const line = prefix.slice()
  const max = Math.max(...prefix, ctx.D)
  for (let v = 1; v <= max; v++) if (!used.has(v)) line.push(v)
  return Permutation.unchecked(line).key
}

// `accumulate` for the numeric product's hot loop: plain number addition, with addChecked only
// called (to throw) past 2^53, where accumulate would switch to BigInt the product cannot hold.
function addNum(m: Map<number, number>, k: number, c: number): void {
  const old = m.get(k)
  if (old === undefined) m.set(k, c)
  else {
    const v = old + c
    if (v === 0) m.delete(k)
    else {
      if (v > Number.MAX_SAFE_INTEGER || v < -Number.MAX_SAFE_INTEGER) addChecked(old, c)
      m.set(k, v)
    }
  }
}

function multiplyByVariableNumeric(r: number, comb: Map<number, number>, ctx: NumericContext, meter: BudgetMeter): Map<number, number> {
  const out = new Map<number, number>()
  const { D, B, P, vals, present } = ctx
  for (const [key, c] of comb) {
    let rest = key
    for (let i = 1; i <= D; i++) {
      const a = rest % B
      vals[i] = a
      present[a] = 1
      rest = (rest - a) / B
    }
    const wr = vals[r]!
    // up-moves within the prefix
    let m = Infinity
    for (let k = r + 1; k <= D; k++) {
      const wk = vals[k]!
      if (wk > wr && wk < m) {
        m = wk
        addNum(out, key + (wk - wr) * (P[r]! - P[k]!), c)
      }
    }
    // up-move into the increasing tail: its smallest value above w(r)
    let t = wr + 1
    while (present[t]) t++
    if (t < m) {
      if (t >= B) throw new Error('internal: value bound exceeded in numeric product')
      addNum(out, key + (t - wr) * P[r]!, c)
    }
    // down-moves
    let M = -Infinity
    for (let q = r - 1; q >= 1; q--) {
      const wq = vals[q]!
      if (wq < wr && wq > M) {
        M = wq
        addNum(out, key + (wr - wq) * (P[q]! - P[r]!), -c)
      }
    }
    for (let i = 1; i <= D; i++) present[vals[i]!] = 0
  }
  meter.step(comb.size * D)
  meter.terms(out.size, 'Schubert classes')
  return out
}

function productByTransitionNumeric(u: Permutation, v: Permutation, ctx: NumericContext, meter: BudgetMeter): SchubertCombination {
  // First pass: how many times each node of the transition recursion is used, so that an
  // intermediate combination is dropped as soon as its last user has read it (keeps memory low).
  const uses = new Map<string, number>()
  const keyOf = (line: readonly number[]): { key: string; trimmed: readonly number[] } => {
    const trimmed = trimFixedPoints(line)
    return { key: trimmed.join(','), trimmed }
  }
  const visit = (line: readonly number[]): void => {
    const { key, trimmed } = keyOf(line)
    const seen = uses.get(key)
    uses.set(key, (seen ?? 0) + 1)
    if (seen !== undefined) return
    const step = transitionStep(trimmed)
    if (step) { visit(step.v); for (const o of step.others) visit(o) }
  }
  visit(u.oneLine)
  const memo = new Map<string, Map<number, number>>()
  const base = new Map<number, number>([[numericKey(v, ctx), 1]])
  const release = (key: string): void => {
    const left = uses.get(key)! - 1
    uses.set(key, left)
    if (left === 0) memo.delete(key)
  }
  const go = (line: readonly number[]): Map<number, number> => {
    const { key, trimmed } = keyOf(line)
    const hit = memo.get(key)
    if (hit) return hit
    const step = transitionStep(trimmed)
    let result: Map<number, number>
    if (!step) result = base
    else {
      result = multiplyByVariableNumeric(step.r, go(step.v), ctx, meter)
      release(keyOf(step.v).key)
      for (const o of step.others) {
        for (const [k, c] of go(o)) addNum(result, k, c)
        release(keyOf(o).key)
      }
      meter.terms(result.size, 'Schubert classes')
    }
    memo.set(key, result)
    return result
  }
  const out: SchubertCombination = new Map()
  for (const [k, c] of go(u.oneLine)) out.set(numericToPermutationKey(k, ctx), c)
  return out
}
