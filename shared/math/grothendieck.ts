/**
 * Grothendieck polynomials with parameter β (β = −1 by default).
 *
 * Conventions:
 * - G_{w0} = x_1^{n−1} x_2^{n−2} ⋯ x_{n−1} for w0 ∈ S_n;
 * - G_{w s_i} = π^β_i G_w when ℓ(w s_i) < ℓ(w), with π^β_i f = ∂_i((1 + β x_{i+1}) f)
 *   (see divided-difference.ts). For β = −1: π_i f = ∂_i((1 − x_{i+1}) f).
 * - For a dominant u with code λ, G_u = x^λ; we start there (as for Schubert
 *   polynomials) and apply π^β back down.
 * - The lowest-degree part of G_w is S_w; the coefficient of a term of degree
 *   ℓ(w) + k carries β^k.
 */
import { Permutation } from './permutation'
import { Polynomial } from './polynomial'
import { grothendieckOperator } from './divided-difference'
import { climbToDominant } from './schubert'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** The Grothendieck polynomial G^β_w; e.g. G_{132} = x_1 + x_2 − x_1x_2 for β = −1. */
export function grothendieckPolynomial(w: Permutation, beta = -1, budget?: Budget | BudgetMeter): Polynomial {
  const meter = toMeter(budget)
  const { steps, shape } = climbToDominant(w.trimmed())
  let f = Polynomial.monomial(shape)
  for (let k = steps.length - 1; k >= 0; k--) f = grothendieckOperator(f, steps[k]!, beta, meter)
  return f
}
