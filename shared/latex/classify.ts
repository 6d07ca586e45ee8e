/**
 * Naming a claim's kind from the objects in its expressions.
 *
 * Convention: the most specific object decides, in the order of `KIND_PRIORITY`
 * (a determinant of Schubert polynomials is a `determinant` claim).
 */
import type { ClaimKind, Expr } from '../types/claims'

const KIND_PRIORITY: [Expr['type'] | 'schur-like', ClaimKind][] = [
  ['coproduct', 'coproduct'],
  ['tensor', 'coproduct'],
  ['quantumParameter', 'quantumGrassmannian'],
  ['integral', 'grassmannian'],
  ['grassmannianDegree', 'grassmannian'],
  ['schubertClass', 'grassmannian'],
  ['determinant', 'determinant'],
  ['dividedDifference', 'dividedDifference'],
  ['kostka', 'kostka'],
  ['littlewoodRichardson', 'littlewoodRichardson'],
  ['structureConstant', 'structureConstant'],
  ['count', 'count'],
  ['length', 'length'],
  ['evaluateAtOnes', 'specialization'],
  ['specialise', 'specialization'],
  ['grothendieck', 'grothendieck'],
  ['keyPolynomial', 'key'],
  ['stanley', 'stanley'],
  ['schubert', 'schubert'],
  ['symmetric', 'symmetricFunction'],
]

/** Every node type occurring in an expression. */
export function exprTypes(e: Expr, into = new Set<Expr['type']>()): Set<Expr['type']> {
  into.add(e.type)
  switch (e.type) {
    case 'add':
      e.terms.forEach(t => exprTypes(t, into))
      break
    case 'multiply':
      e.factors.forEach(t => exprTypes(t, into))
      break
    case 'negate':
    case 'evaluateAtOnes':
    case 'dividedDifference':
    case 'specialise':
      exprTypes(e.arg, into)
      break
    case 'formalGroup':
      exprTypes(e.left, into)
      exprTypes(e.right, into)
      break
    case 'power':
      exprTypes(e.base, into)
      break
    case 'determinant':
      e.rows.forEach(r => r.forEach(t => exprTypes(t, into)))
      break
    case 'integral':
    case 'coproduct':
      exprTypes(e.arg, into)
      break
    case 'tensor':
      exprTypes(e.left, into)
      exprTypes(e.right, into)
      break
    default:
      break
  }
  return into
}

const POLYNOMIAL_TYPES = new Set<Expr['type']>(['integer', 'variable', 'add', 'negate', 'multiply', 'power', 'parameter', 'formalGroup'])

/** True if the expression holds more than integers and variables: `containsObject({type:'length',…}) === true`. */
export function containsObject(e: Expr): boolean {
  for (const t of exprTypes(e)) if (!POLYNOMIAL_TYPES.has(t)) return true
  return false
}

/** Kind of the claim `lhs = rhs`: `classifyClaim(S, poly) === 'schubert'`. */
export function classifyClaim(lhs: Expr, rhs: Expr): ClaimKind {
  const types = exprTypes(rhs, exprTypes(lhs))
  for (const [t, kind] of KIND_PRIORITY) if (types.has(t as Expr['type'])) return kind
  return 'polynomial'
}
