/**
 * Claims about Schubert classes of a Grassmannian and about coproducts of symmetric functions:
 * evaluation and term-by-term comparison.
 *
 * Conventions:
 * - A claim with a `setting` is evaluated in H*(Gr(k,n)) or QH*(Gr(k,n)) (shared/math/grassmannian.ts):
 *   σ_λ and s_λ are the class σ_λ (0 when λ leaves the k × (n − k) box), e_p = σ_{1^p}, h_p = σ_p,
 *   s_{λ/μ} = Σ c^λ_{μν} σ_ν, integers are multiples of σ_∅ = 1, q is the quantum parameter, and
 *   products are the ring's (truncated, or quantum by rim hooks). Values are QuantumCombinations
 *   ("d|λ" → coefficient of q^d σ_λ); classical values only have d = 0.
 * - ∫ is the coefficient of the point class σ_{(n−k)^k}; ∫_{Gr(k,n)} evaluates its integrand in
 *   H*(Gr(k,n)) whatever the claim's setting. deg Gr(k,n) = ∫σ_1^{k(n−k)}.
 * - A claim with Δ or ⊗ is evaluated in Λ ⊗ Λ: Δ(s_λ) = Σ c^λ_{μν} s_μ ⊗ s_ν (shared/math/skew.ts),
 *   a ⊗ b of two symmetric functions (integers are multiples of 1 = s_∅), sums and integer
 *   multiples. Keys are "μ-key⊗ν-key".
 * - Convention axes do not act on classes: σ_λ is taken as written.
 * - Every σ_λ written outside the box gives a note for the mismatch message, so that a table entry
 *   that vanishes in Gr(k,n) but is written as a class is named.
 */
import type { Expr, GrassmannianSetting } from '../types/claims'
import type { ClaimDiff, DiffTerm, DiffWrongCoefficient } from '../types/report'
import { DIFF_LIMIT } from '../types/report'
import {
  accumulate, addCombinations, grassmannianDegree, grassmannianMultiply, inGrassmannianBox, mulChecked, negateCoefficient, partitionFromKey, partitionKey,
  quantumEntries, quantumKey, quantumMultiply, schurCoproduct, skewSchurExpansion, toCoefficient, toPartition, absCoefficient,
  type Coefficient, type QuantumCombination, type SchurCombination,
} from '../math'
import { evaluate, type EvaluationEnv } from './evaluate'
import type { Comparison } from './compare'
import { UnsupportedClaimError } from './values'

/** True when a claim is compared here rather than in compare.ts. */
export function isRingClaim(lhs: Expr, rhs: Expr, setting: GrassmannianSetting | undefined): boolean {
  return !!setting || hasType(lhs, rhs, t => t === 'tensor' || t === 'coproduct' || t === 'grassmannianDegree' || t === 'integral' || t === 'schubertClass' || t === 'quantumParameter')
}

function hasType(lhs: Expr, rhs: Expr, test: (t: Expr['type']) => boolean): boolean {
  let found = false
  const visit = (e: Expr): void => {
    if (found) return
    if (test(e.type)) { found = true; return }
    switch (e.type) {
      case 'add': e.terms.forEach(visit); break
      case 'multiply': e.factors.forEach(visit); break
      case 'negate': case 'evaluateAtOnes': case 'dividedDifference': case 'integral': case 'coproduct': visit(e.arg); break
      case 'power': visit(e.base); break
      case 'determinant': e.rows.forEach(r => r.forEach(visit)); break
      case 'tensor': visit(e.left); visit(e.right); break
      default: break
    }
  }
  visit(lhs)
  visit(rhs)
  return found
}

/** Compares the two sides of a Grassmannian or coproduct claim; the left side is the reference. */
export function compareInRing(lhs: Expr, rhs: Expr, env: EvaluationEnv, setting: GrassmannianSetting | undefined): Comparison {
  if (hasType(lhs, rhs, t => t === 'tensor' || t === 'coproduct')) {
    const computed = tensorValue(lhs, env)
    const claimed = tensorValue(rhs, env)
    return termComparison(computed, claimed, 'tensor', tensorTermLatex, [])
  }
  const ring = setting ?? impliedSetting(lhs, rhs)
  if (!ring) throw new UnsupportedClaimError('σ_λ needs a Grassmannian: name it in the text (in $H^*(\\mathrm{Gr}(k,n))$) or with a tag (scholium: in Gr(k,n))')
  const notes: string[] = []
  const computed = classValue(lhs, ring, env, notes)
  const claimed = classValue(rhs, ring, env, notes)
  // σ_λ written as a term of the claimed side when λ leaves the box: that class is 0, so the
  // entry is wrong even when the product is 0 too (σ_2 σ_{11} = σ_{31} in Gr(2,4)).
  const vanishing = writtenOutsideBox(rhs, ring).filter(t => !writtenOutsideBox(lhs, ring).some(u => u.key === t.key))
  if (vanishing.length) {
    const comparison = termComparison(computed, claimed, 'class', classTermLatex, notes)
    const diff = comparison.diff && comparison.diff.basis === 'class' ? comparison.diff : { basis: 'class' as const, missing: [], extra: [], wrongCoefficient: [], notes }
    diff.extra = [...diff.extra, ...vanishing.map(t => ({ term: t.latex, coefficient: String(t.coefficient) }))]
    return { holds: false, computed: comparison.computed, diff }
  }
  const constantOnly = (c: QuantumCombination) => [...c.keys()].every(key => key === quantumKey(0, []))
  if (constantOnly(computed) && constantOnly(claimed) && (rhs.type === 'integer' || lhs.type === 'integer')) {
    const a = String(computed.get(quantumKey(0, [])) ?? 0)
    const b = String(claimed.get(quantumKey(0, [])) ?? 0)
    return { holds: a === b, computed: a, diff: a === b ? null : { basis: 'number', claimed: b, computed: a } }
  }
  return termComparison(computed, claimed, 'class', classTermLatex, notes)
}

/**
 * Terms c σ_λ (c an integer, possibly times a power of q) of a side written as a sum of classes,
 * with λ outside the box; e.g. `σ_{22} + σ_{31}` in Gr(2,4) gives σ_{31}.
 */
function writtenOutsideBox(side: Expr, s: GrassmannianSetting): { key: string, latex: string, coefficient: Coefficient }[] {
  const out: { key: string, latex: string, coefficient: Coefficient }[] = []
  const term = (e: Expr, sign: Coefficient): void => {
    if (e.type === 'negate') return term(e.arg, negateCoefficient(sign))
    let coefficient = sign
    let cls: Expr | undefined
    let q = 0
    for (const f of e.type === 'multiply' ? e.factors : [e]) {
      if (f.type === 'integer') coefficient = mulChecked(coefficient, toCoefficient(BigInt(f.value)))
      else if (f.type === 'quantumParameter') q++
      else if (f.type === 'power' && f.base.type === 'quantumParameter') q += f.exponent
      else if (f.type === 'schubertClass' && !cls) cls = f
      else return
    }
    if (cls?.type !== 'schubertClass' || inGrassmannianBox(cls.partition, s.k, s.n)) return
    const lambda = toPartition(cls.partition)
    out.push({ key: quantumKey(q, lambda), latex: classTermLatex(quantumKey(q, lambda)), coefficient })
  }
  for (const t of side.type === 'add' ? side.terms : [side]) term(t, 1)
  return out
}

/** ∫_{Gr(2,4)} … or deg Gr(2,4) = … name their own space; such a claim needs no setting. */
function impliedSetting(lhs: Expr, rhs: Expr): GrassmannianSetting | undefined {
  let found: GrassmannianSetting | undefined
  const visit = (e: Expr): void => {
    if (found) return
    if (e.type === 'integral' && e.space) found = { ring: 'cohomology', ...e.space }
    else if (e.type === 'grassmannianDegree') found = { ring: 'cohomology', ...e.space }
    else if (e.type === 'add') e.terms.forEach(visit)
    else if (e.type === 'multiply') e.factors.forEach(visit)
    else if (e.type === 'negate') visit(e.arg)
  }
  visit(lhs)
  visit(rhs)
  return found
}

const ONE = (): QuantumCombination => new Map([[quantumKey(0, []), 1]])

function constant(c: Coefficient): QuantumCombination {
  return c === 0 ? new Map() : new Map([[quantumKey(0, []), c]])
}

function ringName(s: GrassmannianSetting): string {
  return `${s.ring === 'quantum' ? 'QH' : 'H'}^*(Gr(${s.k},${s.n}))`
}

function indexLatex(parts: readonly number[]): string {
  if (parts.length === 0) return '\\emptyset'
  return parts.some(p => p > 9) ? parts.join(',') : parts.join('')
}

/** The class σ_λ, or 0 with a note when λ leaves the box. */
function classOf(parts: readonly number[], s: GrassmannianSetting, notes: string[]): QuantumCombination {
  const lambda = toPartition(parts)
  if (inGrassmannianBox(lambda, s.k, s.n)) return new Map([[quantumKey(0, lambda), 1]])
  const note = `σ_{${indexLatex(lambda)}} is 0 in ${ringName(s)}: (${lambda.join(',')}) does not fit in the ${s.k}×${s.n - s.k} box`
  if (!notes.includes(note)) notes.push(note)
  return new Map()
}

function schurCombinationIn(schur: SchurCombination, s: GrassmannianSetting): QuantumCombination {
  const out: QuantumCombination = new Map()
  for (const [key, c] of schur) {
    const lambda = partitionFromKey(key)
    if (inGrassmannianBox(lambda, s.k, s.n)) out.set(quantumKey(0, lambda), c)
  }
  return out
}

function multiply(a: QuantumCombination, b: QuantumCombination, s: GrassmannianSetting, env: EvaluationEnv): QuantumCombination {
  if (a.size === 0 || b.size === 0) return new Map()
  if (s.ring === 'quantum') return quantumMultiply(a, b, s.k, s.n, env.meter)
  const classical = (c: QuantumCombination): SchurCombination => {
    const out: SchurCombination = new Map()
    for (const t of quantumEntries(c)) {
      if (t.qDegree !== 0) throw new UnsupportedClaimError(`q appears in a claim about ${ringName(s)}; write QH^* for quantum products`)
      out.set(partitionKey(t.partition), t.coefficient)
    }
    return out
  }
  return schurCombinationIn(grassmannianMultiply(classical(a), classical(b), s.k, s.n, env.meter), s)
}

/** The value of one side in the ring of `s`. */
function classValue(expr: Expr, s: GrassmannianSetting, env: EvaluationEnv, notes: string[]): QuantumCombination {
  env.meter.step()
  switch (expr.type) {
    case 'integer': return constant(toCoefficient(BigInt(expr.value)))
    case 'add': return expr.terms.reduce<QuantumCombination>((acc, t) => addCombinations(acc, classValue(t, s, env, notes)), new Map())
    case 'negate': return addCombinations(new Map(), classValue(expr.arg, s, env, notes), -1)
    case 'multiply': return expr.factors.reduce<QuantumCombination>((acc, f) => multiply(acc, classValue(f, s, env, notes), s, env), ONE())
    case 'power': {
      if (expr.exponent < 0) throw new UnsupportedClaimError('negative powers of classes are not read')
      const base = classValue(expr.base, s, env, notes)
      let acc = ONE()
      for (let i = 0; i < expr.exponent && acc.size > 0; i++) acc = multiply(acc, base, s, env)
      return acc
    }
    case 'schubertClass': return classOf(expr.partition, s, notes)
    case 'quantumParameter':
      if (s.ring !== 'quantum') throw new UnsupportedClaimError(`q appears in a claim about ${ringName(s)}; write QH^* for quantum products`)
      return new Map([[quantumKey(1, []), 1]])
    case 'symmetric': {
      if (expr.variableCount !== undefined) throw new UnsupportedClaimError('a polynomial in x_1, …, x_n is not a class of a Grassmannian')
      if (expr.skew) return schurCombinationIn(skewSchurExpansion(expr.index, expr.skew, { budget: env.meter }), s)
      const p = expr.index[0] ?? 0
      switch (expr.family) {
        case 'schur': return classOf(expr.index, s, notes)
        case 'complete': return classOf(p > 0 ? [p] : [], s, [])
        case 'elementary': return classOf(new Array<number>(p).fill(1), s, [])
        default: throw new UnsupportedClaimError('only s_λ, e_p and h_p are read as classes of a Grassmannian')
      }
    }
    case 'integral': {
      const space: GrassmannianSetting = expr.space ? { ring: 'cohomology', ...expr.space } : { ...s, ring: 'cohomology' }
      const value = classValue(expr.arg, space, env, notes)
      const point = quantumKey(0, new Array<number>(space.k).fill(space.n - space.k))
      return constant(value.get(point) ?? 0)
    }
    case 'grassmannianDegree': return constant(toCoefficient(grassmannianDegree(expr.space.k, expr.space.n)))
    case 'determinant': return determinantIn(expr.rows.map(row => row.map(entry => classValue(entry, s, env, notes))), s, env)
    default: throw new UnsupportedClaimError(`${expr.type} is not a class of a Grassmannian`)
  }
}

/** Leibniz sum over permutations (Giambelli determinants are small: one row per part of λ). */
function determinantIn(m: QuantumCombination[][], s: GrassmannianSetting, env: EvaluationEnv): QuantumCombination {
  const size = m.length
  if (m.some(row => row.length !== size)) throw new UnsupportedClaimError('the determinant of a matrix that is not square')
  if (size > 8) throw new UnsupportedClaimError('determinants of classes larger than 8 × 8 are not expanded')
  let out: QuantumCombination = new Map()
  const used = new Array<boolean>(size).fill(false)
  const rec = (row: number, sign: 1 | -1, acc: QuantumCombination): void => {
    if (acc.size === 0) return
    if (row === size) { out = addCombinations(out, acc, sign); return }
    let passed = 0
    for (let col = size - 1; col >= 0; col--) {
      if (used[col]) { passed++; continue }
      used[col] = true
      rec(row + 1, passed % 2 === 0 ? sign : (-sign as 1 | -1), multiply(acc, m[row]![col]!, s, env))
      used[col] = false
    }
  }
  rec(0, 1, ONE())
  return out
}

const tensorKey = (left: readonly number[], right: readonly number[]) => `${partitionKey(left)}⊗${partitionKey(right)}`

function symmetricValue(expr: Expr, env: EvaluationEnv): SchurCombination {
  const v = evaluate(expr, env)
  if (v.kind === 'symmetric') return v.schur
  if (v.kind === 'number') return v.value === 0n ? new Map() : new Map([['', toCoefficient(v.value)]])
  throw new UnsupportedClaimError('⊗ and Δ are read of symmetric functions written without variables')
}

/** The value of one side in Λ ⊗ Λ. */
function tensorValue(expr: Expr, env: EvaluationEnv): Map<string, Coefficient> {
  env.meter.step()
  switch (expr.type) {
    case 'integer': {
      const c = toCoefficient(BigInt(expr.value))
      return c === 0 ? new Map() : new Map([[tensorKey([], []), c]])
    }
    case 'add': {
      const out = new Map<string, Coefficient>()
      for (const t of expr.terms) for (const [key, c] of tensorValue(t, env)) accumulate(out, key, c)
      return out
    }
    case 'negate': {
      const out = new Map<string, Coefficient>()
      for (const [key, c] of tensorValue(expr.arg, env)) out.set(key, negateCoefficient(c))
      return out
    }
    case 'multiply': {
      // Integer multiples only: a product of two tensors is not read.
      let scalar: Coefficient = 1
      let tensor: Map<string, Coefficient> | undefined
      for (const f of expr.factors) {
        if (f.type === 'integer') scalar = mulChecked(scalar, toCoefficient(BigInt(f.value)))
        else if (!tensor) tensor = tensorValue(f, env)
        else throw new UnsupportedClaimError('products in Λ ⊗ Λ are not read; write the terms s_μ ⊗ s_ν')
      }
      const out = new Map<string, Coefficient>()
      for (const [key, c] of tensor ?? new Map([[tensorKey([], []), 1]])) accumulate(out, key, mulChecked(scalar, c))
      return out
    }
    case 'tensor': {
      if (hasType(expr.left, expr.right, t => t === 'tensor' || t === 'coproduct')) throw new UnsupportedClaimError('triple tensors are not read')
      const out = new Map<string, Coefficient>()
      const left = symmetricValue(expr.left, env)
      const right = symmetricValue(expr.right, env)
      for (const [a, ca] of left) for (const [b, cb] of right) accumulate(out, `${a}⊗${b}`, mulChecked(ca, cb))
      return out
    }
    case 'coproduct': {
      const out = new Map<string, Coefficient>()
      for (const [key, c] of symmetricValue(expr.arg, env)) {
        for (const t of schurCoproduct(partitionFromKey(key), { budget: env.meter })) accumulate(out, tensorKey(t.left, t.right), mulChecked(c, t.coefficient))
      }
      return out
    }
    default: throw new UnsupportedClaimError('a claim with ⊗ or Δ must be written in s_μ ⊗ s_ν terms')
  }
}

function classTermLatex(key: string): string {
  const bar = key.indexOf('|')
  const d = Number(key.slice(0, bar))
  const lambda = partitionFromKey(key.slice(bar + 1))
  const q = d === 0 ? '' : d === 1 ? 'q' : `q^{${d}}`
  if (lambda.length === 0) return q || '1'
  return `${q}\\sigma_{${indexLatex(lambda)}}`
}

function schurLatex(key: string): string {
  const parts = partitionFromKey(key)
  return parts.length === 0 ? '1' : `s_{${indexLatex(parts)}}`
}

function tensorTermLatex(key: string): string {
  const [a, b] = key.split('⊗') as [string, string]
  return `${schurLatex(a)}\\otimes ${schurLatex(b)}`
}

/** Terms ordered for display: q-degree, then size, then partition (largest first). */
function orderedKeys(c: Map<string, Coefficient>): string[] {
  const weight = (key: string): number[] => {
    const bar = key.indexOf('|')
    const parts = key.slice(bar + 1).split(/[⊗,]/).filter(Boolean).map(Number)
    return [bar >= 0 ? Number(key.slice(0, bar)) : 0, -parts.reduce((x, y) => x + y, 0), ...parts.map(p => -p)]
  }
  return [...c.keys()].sort((a, b) => {
    const wa = weight(a)
    const wb = weight(b)
    for (let i = 0; i < Math.max(wa.length, wb.length); i++) if ((wa[i] ?? 0) !== (wb[i] ?? 0)) return (wa[i] ?? 0) - (wb[i] ?? 0)
    return a.localeCompare(b)
  })
}

function combinationLatex(c: Map<string, Coefficient>, latex: (key: string) => string): string {
  if (c.size === 0) return '0'
  return orderedKeys(c).map((key, i) => {
    const v = c.get(key)!
    const sign = v < 0 ? (i === 0 ? '-' : ' - ') : i === 0 ? '' : ' + '
    const term = latex(key)
    const magnitude = absCoefficient(v) === 1 ? (term === '1' ? '1' : '') : `${absCoefficient(v)}${term === '1' ? '' : '\\,'}`
    return `${sign}${magnitude}${term === '1' ? '' : term}`
  }).join('')
}

function termComparison(computed: Map<string, Coefficient>, claimed: Map<string, Coefficient>, basis: 'class' | 'tensor', latex: (key: string) => string, notes: string[]): Comparison {
  const missing: DiffTerm[] = []
  const extra: DiffTerm[] = []
  const wrong: DiffWrongCoefficient[] = []
  for (const key of orderedKeys(computed)) {
    const c = computed.get(key)!
    const written = claimed.get(key)
    if (written === undefined) missing.push({ term: latex(key), coefficient: String(c) })
    else if (written !== c) wrong.push({ term: latex(key), claimed: String(written), computed: String(c) })
  }
  for (const key of orderedKeys(claimed)) if (!computed.has(key)) extra.push({ term: latex(key), coefficient: String(claimed.get(key)!) })
  const holds = missing.length === 0 && extra.length === 0 && wrong.length === 0
  if (holds) return { holds, computed: combinationLatex(computed, latex), diff: null }
  const cut = missing.length > DIFF_LIMIT || extra.length > DIFF_LIMIT || wrong.length > DIFF_LIMIT
  const diff: ClaimDiff = {
    basis,
    missing: missing.slice(0, DIFF_LIMIT),
    extra: extra.slice(0, DIFF_LIMIT),
    wrongCoefficient: wrong.slice(0, DIFF_LIMIT),
    ...(cut ? { truncated: { missing: missing.length, extra: extra.length, wrongCoefficient: wrong.length } } : {}),
    ...(notes.length ? { notes } : {}),
  }
  return { holds, computed: combinationLatex(computed, latex), diff }
}
