/**
 * Grothendieck polynomials with β a formal parameter (parameter-ring.ts, parameter name `beta`).
 *
 * Conventions (as in grothendieck.ts and double-grothendieck.ts, indices from 1):
 * - π^β_i f = ∂_i((1 + β x_{i+1}) f); G^β_{w s_i} = π^β_i G^β_w when ℓ(w s_i) < ℓ(w).
 * - Grading: with deg x_i = deg y_j = 1 and deg β = −1, G^β_w (single), G_w(x; y) in the ⊕ form
 *   (top class ∏ (x_i ⊕ y_j), x ⊕ y = x + y + βxy) and the numerator of the ⊖ form (top class
 *   ∏ (x_i ⊖ y_j), x ⊖ y = (x − y)/(1 + βy)) are homogeneous of degree ℓ(w). So the coefficient of
 *   β^k is the part of x,y-degree ℓ(w) + k of the value at β = 1 (betaCoefficients), and the formal
 *   value is exact, never a numerical substitution.
 * - The Grothendieck basis over ℤ[β]: {G^β_w} is a basis of ℤ[β][x_1, x_2, …] and G^β_w = S_w +
 *   (terms of higher x-degree, each with a positive power of β). grothendieckExpansionFormal peels the
 *   lowest x-degree part: write each of its β-coefficients in the Schubert basis, subtract, repeat.
 *   Then G^β_u G^β_v = Σ_w c^w_{uv} β^{ℓ(w)−ℓ(u)−ℓ(v)} G^β_w with integers c^w_{uv}, the K-theoretic
 *   structure constants (checked against sympy by expanding both sides, tests/reference/math).
 */
import type { Permutation } from './permutation'
import { Polynomial } from './polynomial'
import { ParametricPolynomial, parameterExponents } from './parameter-ring'
import { grothendieckPolynomial } from './grothendieck'
import { betaCoefficients, doubleGrothendieckPolynomial, doubleGrothendieckOminus, permutationFromKey } from './double-grothendieck'
import { schubertExpansion } from './schubert-basis'
import { NotInSpanError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** The parameter name of β in parametric values. */
export const BETA = 'beta'

/** G^β_w with β formal; e.g. G_{132} = x_1 + x_2 + β x_1x_2. */
export function grothendieckFormal(w: Permutation, budget?: Budget | BudgetMeter): ParametricPolynomial {
  return ParametricPolynomial.series(BETA, betaCoefficients(grothendieckPolynomial(w, 1, budget), w.length()))
}

/** G_w(x; y) in the ⊕ form with β formal; e.g. G_{21}(x; y) = x_1 + y_1 + β x_1y_1. */
export function doubleGrothendieckFormal(w: Permutation, budget?: Budget | BudgetMeter): ParametricPolynomial {
  return ParametricPolynomial.series(BETA, betaCoefficients(doubleGrothendieckPolynomial(w, 1, budget), w.length()))
}

/** G^⊖_w(x; y) with β formal, as numerator / ∏_j (1 + βy_j)^{denominator[j−1]}; e.g. G^⊖_{21} = (x_1 − y_1)/(1 + βy_1). */
export function doubleGrothendieckOminusFormal(w: Permutation, budget?: Budget | BudgetMeter): { numerator: ParametricPolynomial, denominator: number[] } {
  // Cancelling (1 + y_j) at β = 1 is the same as cancelling (1 + βy_j) formally (homogenisation is multiplicative).
  const atOne = doubleGrothendieckOminus(w, 1, budget)
  return { numerator: ParametricPolynomial.series(BETA, betaCoefficients(atOne.numerator, w.length())), denominator: atOne.denominator }
}

/** Σ_w c_w(β) G^β_w with c_w(β) ∈ ℤ[β] (constants in x), keyed by the permutation's key. */
export type FormalGrothendieckCombination = Map<string, ParametricPolynomial>

/**
 * f ∈ ℤ[β][x] in the Grothendieck basis with β formal; e.g. G_{132}^2 ↦ G_{1423} + G_{231} + β G_{2413}.
 * Throws NotInSpanError when f involves y or another parameter, or the peeling passes `maxDegree`.
 */
export function grothendieckExpansionFormal(f: ParametricPolynomial, options: { maxDegree?: number, budget?: Budget | BudgetMeter } = {}): FormalGrothendieckCombination {
  const meter = toMeter(options.budget)
  const cap = options.maxDegree ?? 32
  for (const name of f.parameterNames()) if (name !== BETA) throw new NotInSpanError(`the polynomial involves the parameter ${name}; the Grothendieck basis here is over ℤ[β]`)
  let rest = f
  const out: FormalGrothendieckCombination = new Map()
  const cache = new Map<string, ParametricPolynomial>()
  while (!rest.isZero()) {
    let low = Infinity
    for (const p of rest.parts.values()) {
      if (p.maxIndex('y') > 0) throw new NotInSpanError('the polynomial involves y-variables; the Grothendieck basis spans ℤ[β][x] only')
      low = Math.min(low, p.lowestDegreePart().degree())
    }
    if (low > cap) throw new NotInSpanError(`the Grothendieck expansion does not end below degree ${cap}`)
    let subtract = ParametricPolynomial.zero()
    for (const [key, p] of rest.parts) {
      const part = p.homogeneousComponent(low)
      if (part.isZero()) continue
      const betaPower = parameterExponents(key)[BETA] ?? 0
      for (const [wKey, c] of schubertExpansion(part, { budget: meter })) {
        const coefficient = ParametricPolynomial.parameter(BETA, betaPower).mul(ParametricPolynomial.constant(c))
        const total = (out.get(wKey) ?? ParametricPolynomial.zero()).add(coefficient)
        if (total.isZero()) out.delete(wKey)
        else out.set(wKey, total)
        let g = cache.get(wKey)
        if (!g) cache.set(wKey, (g = grothendieckFormal(permutationFromKey(wKey), meter)))
        subtract = subtract.add(g.mul(coefficient, meter))
      }
    }
    meter.step(rest.parts.size)
    rest = rest.sub(subtract)
  }
  return out
}

/** G^β_u G^β_v in the Grothendieck basis with β formal (K-theoretic structure constants). */
export function grothendieckProductFormalBasis(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter): FormalGrothendieckCombination {
  const meter = toMeter(budget)
  return grothendieckExpansionFormal(grothendieckFormal(u, meter).mul(grothendieckFormal(v, meter), meter), { budget: meter })
}

/** Σ c_w(β) G^β_w as a parametric polynomial. */
export function formalGrothendieckCombinationToPolynomial(c: FormalGrothendieckCombination, budget?: Budget | BudgetMeter): ParametricPolynomial {
  let total = ParametricPolynomial.zero()
  for (const [key, coefficient] of c) total = total.add(grothendieckFormal(permutationFromKey(key), budget).mul(coefficient, budget))
  return total
}

/** (1 + βy_j) for the ⊖ denominators; e.g. `onePlusBetaY(1)`. */
export function onePlusBetaY(j: number): ParametricPolynomial {
  return ParametricPolynomial.constant(1).add(ParametricPolynomial.parameter(BETA).mul(ParametricPolynomial.from(Polynomial.y(j))))
}
