/**
 * Scholium math engine: exact Schubert calculus in pure TypeScript.
 *
 * Module conventions are written at the top of each module; the main ones:
 * indices start at 1; u.compose(v) = u∘v (v first); ∂_i acts on x unless asked for y;
 * S_{w0}(x; y) = ∏_{i+j≤n} (x_i − y_j); G^β_{w0} = x^δ with π^β_i f = ∂_i((1 + β x_{i+1}) f), β = −1
 * by default; the zero polynomial has degree −Infinity; coefficients are exact (checked).
 */
export const ENGINE_VERSION = '0.1.0'

export * from './errors'
export * from './budget'
export * from './coefficient'
export * from './permutation'
export * from './polynomial'
export * from './divided-difference'
export {
  climbToDominant,
  schubertPolynomial,
  doubleSchubertPolynomial,
  SchubertFamily,
  schubertAtOnes,
  schubertInvariants,
} from './schubert'
export * from './grothendieck'
export * from './pipe-dream'
export * from './bumpless'
export {
  type SchubertCombination,
  combinationEntries,
  combinationsEqual,
  combinationToPolynomial,
  schubertExpansion,
  schubertProduct,
  schubertProductByHorner,
  schubertProductByTransition,
  transitionDagSize,
  monkProduct,
  structureConstant,
  type DoubleSchubertCombination,
  doubleSchubertExpansion,
  doubleSchubertProduct,
} from './schubert-basis'
export * from './symmetric'
export * from './skew'
export * from './grassmannian'
export * from './stanley'
export * from './back-stable'
export * from './key'
export * from './double-grothendieck'
export * from './parameter-ring'
export * from './grothendieck-formal'
export * from './triangular'
export * from './supersymmetric'
export * from './determinant'
