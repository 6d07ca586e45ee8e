/**
 * Cohomology and quantum cohomology of the Grassmannian Gr(k, n) of k-planes in ℂ^n.
 *
 * Conventions:
 * - 1 ≤ k ≤ n − 1. Schubert classes σ_λ are indexed by partitions λ inside the k × (n − k) box
 *   (at most k rows, parts at most n − k); deg σ_λ = |λ| (complex codimension), σ_∅ = 1, and
 *   σ_{(n−k)^k} is the class of a point, so ∫_{Gr} σ_λ is the coefficient of the box class.
 * - H*(Gr(k,n)) = Λ / (s_λ : λ ⊄ box): a classical product is the Littlewood–Richardson product
 *   s_λ s_μ with every s_ν outside the box dropped. Classical results are SchurCombinations
 *   (symmetric.ts: partition key → nonzero coefficient).
 * - Pieri: σ_p · σ_λ = Σ σ_ν over horizontal p-strips ν/λ inside the box (computed here directly,
 *   independently of the LR product, so each checks the other). Giambelli: σ_λ = det(σ_{λ_i+j−i}),
 *   with σ_0 = 1 and σ_p = 0 for p < 0 or p > n − k; `giambelliDeterminant` evaluates that
 *   determinant in H*(Gr(k,n)) (it must return σ_λ).
 * - Quantum cohomology QH*(Gr(k,n)) over ℤ[q], deg q = n. Quantum products use the rim-hook
 *   algorithm of Bertram, Ciocan-Fontanine and Fulton ("Quantum multiplication of Schur
 *   polynomials", J. Algebra 219, 1999): multiply s_λ s_μ in k variables (ν with ≤ k rows), then
 *   remove n-rim hooks from ν until it lies in the box; each removal of a hook of height h gives
 *   a factor (−1)^{k−h} q, and ν is dropped when it cannot be brought into the box. We remove
 *   hooks on β-numbers: β_i = ν_i + k − i; removing an n-rim hook is β_i ↦ β_i − n, and sorting
 *   the β's back gives the sign. (Each step is a column operation on the alternant det(x_i^{β_j})
 *   under x_i^n = (−1)^{k−1} q, the same rule.)
 * - A QuantumCombination maps `quantumKey(d, λ)` = "d|λ-key" to the nonzero coefficient of q^d σ_λ.
 * - Coefficients are checked integers (coefficient.ts); the degree of Gr(k,n), which grows fast,
 *   is returned as a bigint.
 */
import { type Partition, type SchurCombination, partitionKey, partitionFromKey, toPartition, schurProduct } from './symmetric'
import { InvalidArgumentError } from './errors'
import { accumulate, mulChecked, negateCoefficient, type Coefficient } from './coefficient'
import { toMeter, type Budget, type BudgetMeter } from './budget'

export type QuantumCombination = Map<string, Coefficient>

/** One term c · q^d σ_λ of a quantum product. */
export interface QuantumTerm {
  qDegree: number
  partition: Partition
  coefficient: Coefficient
}

function checkGrassmannian(k: number, n: number): void {
  if (!Number.isInteger(k) || !Number.isInteger(n) || k < 1 || k > n - 1) {
    throw new InvalidArgumentError(`Gr(${k},${n}) needs integers 1 ≤ k ≤ n − 1`)
  }
}

/** True when λ fits in the k × (n − k) box; e.g. `inGrassmannianBox([2,1], 2, 4) === true`. */
export function inGrassmannianBox(lambda: readonly number[], k: number, n: number): boolean {
  const lam = lambda.filter(p => p > 0)
  return lam.length <= k && (lam[0] ?? 0) <= n - k
}

function boxPartition(lambda: readonly number[], k: number, n: number): Partition {
  checkGrassmannian(k, n)
  const lam = toPartition(lambda)
  if (!inGrassmannianBox(lam, k, n)) throw new InvalidArgumentError(`σ_{${lam.join(',')}} is not a class of Gr(${k},${n}): the partition leaves the ${k}×${n - k} box`)
  return lam
}

/** σ_λ · σ_μ in H*(Gr(k,n)); e.g. σ_1 · σ_1 = σ_2 + σ_{11} on Gr(2,4). */
export function grassmannianProduct(lambda: readonly number[], mu: readonly number[], k: number, n: number, budget?: Budget | BudgetMeter): SchurCombination {
  const lam = boxPartition(lambda, k, n)
  const m = boxPartition(mu, k, n)
  const out: SchurCombination = new Map()
  for (const [key, c] of schurProduct(lam, m, { maxRows: k, budget })) {
    if (inGrassmannianBox(partitionFromKey(key), k, n)) out.set(key, c)
  }
  return out
}

/** Product of two combinations of classes in H*(Gr(k,n)). */
export function grassmannianMultiply(a: SchurCombination, b: SchurCombination, k: number, n: number, budget?: Budget | BudgetMeter): SchurCombination {
  const meter = toMeter(budget)
  const out: SchurCombination = new Map()
  for (const [ka, ca] of a) for (const [kb, cb] of b) {
    for (const [key, c] of grassmannianProduct(partitionFromKey(ka), partitionFromKey(kb), k, n, meter)) accumulate(out, key, mulChecked(mulChecked(ca, cb), c))
    meter.terms(out.size, 'classes')
  }
  return out
}

/** Pieri: σ_p · σ_λ as the sum over horizontal p-strips inside the box; e.g. σ_1 σ_1 = σ_2 + σ_{11} on Gr(2,4). */
export function pieriProduct(p: number, lambda: readonly number[], k: number, n: number): SchurCombination {
  const lam = boxPartition(lambda, k, n)
  if (!Number.isInteger(p) || p < 0) throw new InvalidArgumentError('σ_p needs an integer p ≥ 0')
  const out: SchurCombination = new Map()
  if (p > n - k) return out
  const cur: number[] = []
  const rec = (r: number, left: number): void => {
    if (r === k) {
      if (left === 0) out.set(partitionKey(cur), 1)
      return
    }
    const old = lam[r] ?? 0
    const top = r === 0 ? n - k : (lam[r - 1] ?? 0)
    for (let a = 0; a <= Math.min(left, top - old); a++) {
      cur.push(old + a)
      rec(r + 1, left - a)
      cur.pop()
    }
  }
  rec(0, p)
  return out
}

/** Giambelli: det(σ_{λ_i + j − i}) evaluated in H*(Gr(k,n)) by the Leibniz sum; it equals σ_λ. */
export function giambelliDeterminant(lambda: readonly number[], k: number, n: number, budget?: Budget | BudgetMeter): SchurCombination {
  const meter = toMeter(budget)
  const lam = boxPartition(lambda, k, n)
  const l = lam.length
  const out: SchurCombination = new Map()
  const special = (p: number): SchurCombination => p === 0 ? new Map([['', 1]]) : (p < 0 || p > n - k ? new Map() : new Map([[String(p), 1]]))
  const used = new Array<boolean>(l).fill(false)
  const rec = (i: number, sign: number, acc: SchurCombination): void => {
    if (acc.size === 0) return
    if (i === l) { for (const [key, c] of acc) accumulate(out, key, sign > 0 ? c : negateCoefficient(c)); return }
    let inversions = 0
    for (let j = l - 1; j >= 0; j--) {
      if (used[j]) { inversions++; continue }
      used[j] = true
      // Choosing column j in row i passes `inversions` used columns to its right.
      rec(i + 1, inversions % 2 === 0 ? sign : -sign, grassmannianMultiply(acc, special(lam[i]! + j - i), k, n, meter))
      used[j] = false
    }
  }
  rec(0, 1, new Map([['', 1]]))
  return out
}

/** σ_λ^m in H*(Gr(k,n)); e.g. σ_1^4 = 2σ_{22} on Gr(2,4). */
export function grassmannianPower(lambda: readonly number[], m: number, k: number, n: number, budget?: Budget | BudgetMeter): SchurCombination {
  const meter = toMeter(budget)
  const lam = boxPartition(lambda, k, n)
  if (!Number.isInteger(m) || m < 0) throw new InvalidArgumentError('the exponent must be an integer ≥ 0')
  let acc: SchurCombination = new Map([['', 1]])
  const base: SchurCombination = new Map([[partitionKey(lam), 1]])
  for (let i = 0; i < m && acc.size > 0; i++) acc = grassmannianMultiply(acc, base, k, n, meter)
  return acc
}

/** ∫_{Gr(k,n)} of a class: the coefficient of the point class σ_{(n−k)^k}. */
export function grassmannianIntegral(c: SchurCombination, k: number, n: number): Coefficient {
  checkGrassmannian(k, n)
  return c.get(partitionKey(new Array<number>(k).fill(n - k))) ?? 0
}

/**
 * The degree ∫σ_1^{k(n−k)} of Gr(k,n) in its Plücker embedding, exact as a bigint, by counting
 * chains of boxes added one at a time (Pieri for σ_1); e.g. 2 for Gr(2,4).
 */
export function grassmannianDegree(k: number, n: number): bigint {
  checkGrassmannian(k, n)
  let layer = new Map<string, bigint>([['', 1n]])
  for (let step = 0; step < k * (n - k); step++) {
    const next = new Map<string, bigint>()
    for (const [key, c] of layer) {
      const lam = partitionFromKey(key)
      for (let r = 0; r < k; r++) {
        const old = lam[r] ?? 0
        const top = r === 0 ? n - k : (lam[r - 1] ?? 0)
        if (old + 1 > top) continue
        const nu = lam.slice()
        nu[r] = old + 1
        const nk = partitionKey(nu)
        next.set(nk, (next.get(nk) ?? 0n) + c)
      }
    }
    layer = next
  }
  return layer.get(partitionKey(new Array<number>(k).fill(n - k))) ?? 0n
}

/** Key of q^d σ_λ in a QuantumCombination; e.g. `quantumKey(1, [1]) === "1|1"`. */
export function quantumKey(d: number, lambda: readonly number[]): string {
  return `${d}|${partitionKey(lambda)}`
}

/** Terms of a QuantumCombination, highest q-degree last, partitions in decreasing lexicographic order. */
export function quantumEntries(c: QuantumCombination): QuantumTerm[] {
  const out = [...c].map(([key, coefficient]) => {
    const bar = key.indexOf('|')
    return { qDegree: Number(key.slice(0, bar)), partition: partitionFromKey(key.slice(bar + 1)), coefficient }
  })
  const lex = (a: number[], b: number[]) => {
    for (let i = 0; i < Math.max(a.length, b.length); i++) if ((a[i] ?? 0) !== (b[i] ?? 0)) return (b[i] ?? 0) - (a[i] ?? 0)
    return 0
  }
  return out.sort((s, t) => s.qDegree - t.qDegree || lex(s.partition, t.partition))
}

/**
 * Rim-hook reduction of s_ν (ℓ(ν) ≤ k) to ± q^d σ_ρ with ρ in the k × (n−k) box, or null when
 * s_ν vanishes in QH*(Gr(k,n)); e.g. ν = (3,1) on Gr(2,4) gives +q σ_∅.
 */
export function rimHookReduce(nu: readonly number[], k: number, n: number): { sign: 1 | -1, qDegree: number, partition: Partition } | null {
  checkGrassmannian(k, n)
  const v = toPartition(nu)
  if (v.length > k) return null
  const beta = Array.from({ length: k }, (_, i) => (v[i] ?? 0) + k - 1 - i)
  let sign = 1
  let d = 0
  const perRemoval = (k - 1) % 2 === 0 ? 1 : -1
  for (let i = 0; i < k; i++) {
    while (beta[i]! >= n) { beta[i]! -= n; d++; sign *= perRemoval }
  }
  // Sort decreasingly, tracking the sign of the permutation; equal β's mean the alternant vanishes.
  for (let i = 0; i < k; i++) for (let j = 0; j < k - 1 - i; j++) {
    if (beta[j] === beta[j + 1]) return null
    if (beta[j]! < beta[j + 1]!) { [beta[j], beta[j + 1]] = [beta[j + 1]!, beta[j]!]; sign = -sign }
  }
  for (let j = 0; j < k - 1; j++) if (beta[j] === beta[j + 1]) return null
  const rho = beta.map((b, i) => b - (k - 1 - i)).filter(p => p > 0)
  return { sign: sign as 1 | -1, qDegree: d, partition: rho }
}

/** σ_λ ⋆ σ_μ in QH*(Gr(k,n)); e.g. σ_1 ⋆ σ_{21} = σ_{22} + q on Gr(2,4). */
export function quantumProduct(lambda: readonly number[], mu: readonly number[], k: number, n: number, budget?: Budget | BudgetMeter): QuantumCombination {
  const lam = boxPartition(lambda, k, n)
  const m = boxPartition(mu, k, n)
  const out: QuantumCombination = new Map()
  for (const [key, c] of schurProduct(lam, m, { maxRows: k, budget })) {
    const r = rimHookReduce(partitionFromKey(key), k, n)
    if (r) accumulate(out, quantumKey(r.qDegree, r.partition), r.sign > 0 ? c : negateCoefficient(c))
  }
  return out
}

/** Product of two quantum combinations in QH*(Gr(k,n)). */
export function quantumMultiply(a: QuantumCombination, b: QuantumCombination, k: number, n: number, budget?: Budget | BudgetMeter): QuantumCombination {
  const meter = toMeter(budget)
  const out: QuantumCombination = new Map()
  for (const s of quantumEntries(a)) for (const t of quantumEntries(b)) {
    for (const u of quantumEntries(quantumProduct(s.partition, t.partition, k, n, meter))) {
      accumulate(out, quantumKey(s.qDegree + t.qDegree + u.qDegree, u.partition), mulChecked(mulChecked(s.coefficient, t.coefficient), u.coefficient))
    }
    meter.terms(out.size, 'classes')
  }
  return out
}

/** σ_λ^{⋆m} in QH*(Gr(k,n)); e.g. σ_1^{⋆4} = 2σ_{22} + … on Gr(2,4) has q-terms. */
export function quantumPower(lambda: readonly number[], m: number, k: number, n: number, budget?: Budget | BudgetMeter): QuantumCombination {
  const meter = toMeter(budget)
  const lam = boxPartition(lambda, k, n)
  if (!Number.isInteger(m) || m < 0) throw new InvalidArgumentError('the exponent must be an integer ≥ 0')
  let acc: QuantumCombination = new Map([[quantumKey(0, []), 1]])
  const base: QuantumCombination = new Map([[quantumKey(0, lam), 1]])
  for (let i = 0; i < m && acc.size > 0; i++) acc = quantumMultiply(acc, base, k, n, meter)
  return acc
}

/** The q = 0 part of a quantum combination, as a classical combination. */
export function quantumAtZero(c: QuantumCombination): SchurCombination {
  const out: SchurCombination = new Map()
  for (const t of quantumEntries(c)) if (t.qDegree === 0) out.set(partitionKey(t.partition), t.coefficient)
  return out
}
