/**
 * Schubert and double Schubert polynomials.
 *
 * Conventions:
 * - S_w(x) for w ∈ S_n: S_{w0} = x_1^{n−1} x_2^{n−2} ⋯ x_{n−1}, and
 *   S_{w s_i} = ∂_i S_w whenever ℓ(w s_i) < ℓ(w) (∂_i acts on x, see divided-difference.ts).
 *   S_w is stable under S_n ⊂ S_{n+1}, so it depends only on w ∈ S_∞.
 * - Double: S_w(x; y) with S_{w0} = ∏_{i+j ≤ n} (x_i − y_j), ∂_i acting on x.
 *   Then S_w(x; 0) = S_w(x) and S_{w⁻¹}(x; y) = S_w(−y; −x).
 * - Algorithm A ("dominant descent"): bubble the Lehmer code of w upward into a
 *   partition λ (each step w ↦ w s_i with c_i < c_{i+1}, a length-increasing step) to
 *   reach a dominant u; S_u = x^λ and S_u(x; y) = ∏_{(i,j) ∈ λ} (x_i − y_j); then apply
 *   the divided differences back down.
 * - Algorithm B ("transition"): Lascoux–Schützenberger transition
 *   S_w = x_r S_v + Σ_{q<r, ℓ(v t_{qr}) = ℓ(w)} S_{v t_{qr}}, with r the last descent of w,
 *   s the largest j > r with w(j) < w(r), v = w t_{rs}.
 *   It also gives S_w(1, …, 1) (= number of reduced pipe dreams) without expansion.
 * - Pipe-dream and bumpless formulas live in pipe-dream.ts and bumpless.ts.
 */
import { Permutation, trimFixedPoints } from './permutation'
import { Polynomial, productOf } from './polynomial'
import { dividedDifference } from './divided-difference'
import { PACKED_MAX_N, PackedContext, type PackedPolynomial } from './packed'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** Ascents i_1, i_2, … climbing from w to a dominant permutation (u = w s_{i_1} s_{i_2} ⋯), and the partition λ = code(u). */
export function climbToDominant(w: Permutation): { steps: number[], shape: number[] } {
  const code = w.trimmed().lehmerCode()
  const steps: number[] = []
  let moved = true
  while (moved) {
    moved = false
    for (let i = 0; i + 1 < code.length; i++) {
      if (code[i]! < code[i + 1]!) {
        const a = code[i]!
        code[i] = code[i + 1]! + 1
        code[i + 1] = a
        steps.push(i + 1)
        moved = true
      }
    }
  }
  return { steps, shape: code }
}

const contexts = new Map<number, PackedContext>()
function packedContext(n: number): PackedContext {
  let c = contexts.get(n)
  if (!c) {
    c = new PackedContext(n)
    contexts.set(n, c)
  }
  return c
}

/** S_w in packed form (w trimmed, n = its size, n ≤ 12); internal fast path. */
export function packedSchubert(w: Permutation, meter?: BudgetMeter): { context: PackedContext, poly: PackedPolynomial } {
  const t = w.trimmed()
  const n = Math.max(t.size, 1)
  const ctx = packedContext(n)
  const { steps, shape } = climbToDominant(t)
  let f = ctx.monomial(shape)
  for (let k = steps.length - 1; k >= 0; k--) f = ctx.dividedDifference(f, steps[k]!, meter)
  return { context: ctx, poly: f }
}

/** The Schubert polynomial S_w(x); e.g. `schubertPolynomial(Permutation.parse('132'))` is x_1 + x_2. */
export function schubertPolynomial(w: Permutation, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  const t = w.trimmed()
  if (t.size <= PACKED_MAX_N) {
    const { context, poly } = packedSchubert(t, meter)
    return context.toPolynomial(poly)
  }
  const { steps, shape } = climbToDominant(t)
  let f = Polynomial.monomial(shape)
  for (let k = steps.length - 1; k >= 0; k--) f = dividedDifference(f, steps[k]!, 'x', meter)
  return f
}

/** The double Schubert polynomial S_w(x; y) (factors x_i − y_j); e.g. S_{21} = x_1 − y_1. */
export function doubleSchubertPolynomial(w: Permutation, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  const { steps, shape } = climbToDominant(w.trimmed())
  const factors: Polynomial[] = []
  shape.forEach((len, r) => {
    for (let j = 1; j <= len; j++) factors.push(Polynomial.x(r + 1).sub(Polynomial.y(j)))
  })
  let f = productOf(factors, meter)
  for (let k = steps.length - 1; k >= 0; k--) f = dividedDifference(f, steps[k]!, 'x', meter)
  return f
}

/** Every S_w for w ∈ S_n, computed top-down from w0 with one divided difference each (n ≤ 12). */
export class SchubertFamily {
  readonly n: number
  private readonly context: PackedContext
  private readonly packed = new Map<string, PackedPolynomial>()

  private constructor(n: number, context: PackedContext) {
    this.n = n
    this.context = context
  }

  /** Compute the whole family; e.g. `SchubertFamily.compute(5).get(w)`. */
  static compute(n: number, budget?: Budget | BudgetMeter): SchubertFamily {
    const meter = toMeter(budget)
    const ctx = packedContext(Math.max(n, 1))
    const fam = new SchubertFamily(n, ctx)
    const w0 = Permutation.longest(n).oneLine.slice()
    let level: { line: number[], poly: PackedPolynomial }[] = [
      { line: w0, poly: ctx.monomial(w0.map(v => v - 1)) },
    ]
    fam.packed.set(w0.join(','), level[0]!.poly)
    // Walk down the weak order level by level. A child c ≠ w0 is produced from exactly one
    // parent, c s_a with a the first ascent of c, so each S_c is computed once: S_c = ∂_a S_{c s_a}.
    while (level.length > 0) {
      const next: { line: number[], poly: PackedPolynomial }[] = []
      for (const { line, poly } of level) {
        for (let i = 1; i < n; i++) {
          if (line[i - 1]! < line[i]!) continue
          // child c = parent s_i has an ascent at i; emit only if i is c's first ascent.
          const child = line.slice()
          child[i - 1] = line[i]!
          child[i] = line[i - 1]!
          let first = 0
          for (let k = 1; k < n; k++) if (child[k - 1]! < child[k]!) { first = k; break }
          if (first !== i) continue
          const p = ctx.dividedDifference(poly, i, meter)
          fam.packed.set(child.join(','), p)
          next.push({ line: child, poly: p })
        }
      }
      level = next
      meter.terms(fam.packed.size, 'permutations')
    }
    return fam
  }

  /** Number of permutations computed (n!). */
  get count(): number {
    return this.packed.size
  }

  /** Total number of terms over the family. */
  totalTerms(): number {
    let t = 0
    for (const p of this.packed.values()) t += p.codes.length
    return t
  }

  /** Number of terms of S_w. */
  termCount(w: Permutation): number {
    return this.packedOf(w).codes.length
  }

  /** S_w in the general sparse form. */
  get(w: Permutation): Polynomial {
    return this.context.toPolynomial(this.packedOf(w))
  }

  private packedOf(w: Permutation): PackedPolynomial {
    const p = this.packed.get(w.embed(this.n).oneLine.join(','))
    if (!p) throw new Error(`internal: ${w.toString()} missing from the S_${this.n} family`)
    return p
  }
}

/** S_w(1, …, 1), the number of reduced pipe dreams of w, by the transition recursion (no expansion). */
export function schubertAtOnes(w: Permutation, budget?: Budget | BudgetMeter): bigint {
  const meter = toMeter(budget)
  const memo = new Map<string, bigint>()
  const go = (line: number[]): bigint => {
    const key = trimFixedPoints(line).join(',')
    const hit = memo.get(key)
    if (hit !== undefined) return hit
    meter.step()
    const step = transitionStep(line)
    let result = 1n
    if (step) {
      result = go(step.v)
      for (const u of step.others) result += go(u)
    }
    memo.set(key, result)
    meter.terms(memo.size, 'memoised permutations')
    return result
  }
  return go(w.oneLine.slice())
}

/** Cheap invariants of S_w, available without expanding it. */
export function schubertInvariants(w: Permutation, budget?: Budget | BudgetMeter): {
  degree: number
  valueAtOnes: bigint
  lastVariable: number
} {
  const d = w.descents()
  return { degree: w.length(), valueAtOnes: schubertAtOnes(w, budget), lastVariable: d.length ? d[d.length - 1]! : 0 }
}

/** One step of the transition recursion, or undefined for the identity. */
export function transitionStep(line0: readonly number[]): { r: number, v: number[], others: number[][] } | undefined {
  const line = line0.slice()
  let r = 0
  for (let i = line.length - 1; i >= 1; i--) if (line[i - 1]! > line[i]!) { r = i; break }
  if (r === 0) return undefined
  let s = r + 1
  for (let j = r + 1; j <= line.length; j++) if (line[j - 1]! < line[r - 1]!) s = j
  const v = line.slice()
  v[r - 1] = line[s - 1]!
  v[s - 1] = line[r - 1]!
  const others: number[][] = []
  const vr = v[r - 1]!
  for (let q = r - 1; q >= 1; q--) {
    const vq = v[q - 1]!
    if (vq > vr) continue
    let covered = true
    for (let k = q + 1; k < r; k++) {
      const vk = v[k - 1]!
      if (vk > vq && vk < vr) { covered = false; break }
    }
    if (!covered) continue
    const u = v.slice()
    u[q - 1] = vr
    u[r - 1] = vq
    others.push(u)
  }
  return { r, v, others }
}
