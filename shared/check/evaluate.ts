/**
 * Evaluates the expressions of a claim with the engine, under one set of conventions.
 *
 * Conventions are applied where the manuscript's notation meets the engine:
 * - doubleSign 'xy-plus': a double Schubert polynomial as written is the engine's
 *   S_w(x; −y), i.e. y_j ↦ −y_j on the engine's value;
 * - indexing 'perm-inverse': every permutation written stands for its inverse;
 * - partition 'shape-columns': every partition labelling a Schur function (and the
 *   shape of a Kostka number, and the partitions of a Littlewood–Richardson
 *   coefficient) is read transposed;
 * - beta: the β of Grothendieck polynomials (−1 or +1) when the claim does not write β; a claim
 *   that writes β (or ⊕, ⊖) keeps it formal (`formalBeta`), and the axis does not apply;
 * - kFactor: a double Grothendieck polynomial G_w(x; y) in the ⊕ form ('k-oplus') or the ⊖ form
 *   ('k-ominus', a rational function of y with denominators ∏ (1 + βy_j)).
 * Everything the manuscript writes explicitly (x_i, y_j, integers) is taken as written.
 */
import type { Expr, GrassmannianSetting, PermutationSpec } from '../types/claims'
import type { ConventionSet } from '../types/conventions'
import {
  BudgetMeter, completeSymmetric, conjugate, countBumplessPipeDreams, countPipeDreams, countReducedWords, determinant,
  dividedDifference, doubleSchubertPolynomial, elementarySymmetric, grothendieckPolynomial, kostkaNumber, littlewoodRichardson,
  monomialSymmetric, partitionKey, Permutation, Polynomial, powerSum, schubertPolynomial, schurCombinationToPolynomial, skewSchurExpansion,
  schurExpansion, schurPolynomial, stanleySymmetricFunction, structureConstant, toPartition, type SchurCombination,
  ParametricPolynomial, grothendieckFormal, doubleGrothendieckFormal, doubleGrothendieckOminusFormal, doubleGrothendieckByHecke,
  doubleGrothendieckOminus, doubleGrothendieckPolynomial, keyPolynomial, demazureAtom,
} from '../math'
import {
  addValues, formalDifference, formalSum, multiplyValues, negateValue, numberValue, powerValue, specialiseValue, toPolynomial,
  UnsupportedClaimError, type Value,
} from './values'
import { backStableTerms, liftSymmetric } from './back-stable'

/** Engine results shared by every claim of a run (keys include everything the value depends on). */
export type EngineMemo = Map<string, unknown>

export interface EvaluationEnv {
  conventions: ConventionSet
  meter: BudgetMeter
  memo: EngineMemo
  /** The claim's Grassmannian (its question's `setting`): classes are compared in check/grassmannian.ts. */
  grassmannian?: GrassmannianSetting
  /** The claim writes β (or ⊕, ⊖): Grothendieck polynomials keep β as a formal parameter. */
  formalBeta?: boolean
  /** The claim writes ←S_w: values live in Λ(x_{≤0}) ⊗ ℤ[x, y], symmetric functions in x_0, x_{−1}, … (check/back-stable.ts). */
  backStable?: boolean
}

/** The number β stands for, or null when it is formal. */
function betaOf(env: EvaluationEnv): number | null {
  return env.formalBeta ? null : env.conventions.beta === 'beta-plus' ? 1 : -1
}

function remember<T>(env: EvaluationEnv, key: string, compute: () => T): T {
  if (env.memo.has(key)) return env.memo.get(key) as T
  const value = compute()
  env.memo.set(key, value)
  return value
}

/** The engine permutation a written spec denotes, before conventions. e.g. `{form:'oneLine',entries:[2,1]}` is s_1. */
export function permutationOf(spec: PermutationSpec): Permutation {
  switch (spec.form) {
    case 'oneLine': return Permutation.fromOneLine(spec.entries)
    case 'cycles': return Permutation.fromCycles(spec.cycles)
    case 'word': return Permutation.fromWord(spec.letters)
    case 'longest': return Permutation.longest(spec.n)
  }
}

/**
 * The permutation a written one stands for under the paper's indexing: its inverse under
 * 'perm-inverse'. An involution, so the same map takes the engine's permutation back to the
 * paper's. The one place the convention is applied to a permutation.
 * e.g. `meantPermutation(Permutation.parse('231'), { indexing: 'perm-inverse' })` is 312.
 */
export function meantPermutation(w: Permutation, conventions: Pick<ConventionSet, 'indexing'>): Permutation {
  return conventions.indexing === 'perm-inverse' ? w.inverse() : w
}

function permutationIn(spec: PermutationSpec, env: EvaluationEnv): Permutation {
  return meantPermutation(permutationOf(spec), env.conventions)
}

function partitionIn(parts: readonly number[], env: EvaluationEnv): number[] {
  const lambda = toPartition(parts)
  return env.conventions.partition === 'shape-columns' ? conjugate(lambda) : lambda
}

/** Evaluate an expression to an exact value. Throws engine errors and UnsupportedClaimError. */
export function evaluate(expr: Expr, env: EvaluationEnv): Value {
  const value = evaluateNode(expr, env)
  // In a back-stable claim a symmetric function written without variables is in x_0, x_{−1}, ….
  return env.backStable && value.kind === 'symmetric' ? { kind: 'backStable', terms: liftSymmetric(value.schur, 'x') } : value
}

function evaluateNode(expr: Expr, env: EvaluationEnv): Value {
  env.meter.step()
  switch (expr.type) {
    case 'integer': return numberValue(BigInt(expr.value))
    case 'variable': return { kind: 'polynomial', poly: expr.name === 'x' ? Polynomial.x(expr.index) : Polynomial.y(expr.index) }
    case 'add': return expr.terms.map(t => evaluate(t, env)).reduce(addValues, numberValue(0))
    case 'negate': return negateValue(evaluate(expr.arg, env))
    case 'multiply': return expr.factors.reduce<Value>((acc, f) => multiplyValues(acc, evaluate(f, env), env.meter), numberValue(1))
    case 'power': return powerValue(evaluate(expr.base, env), expr.exponent, env.meter)
    case 'schubert': {
      const poly = schubertValue(permutationIn(expr.perm, env), expr.variant === 'double', env)
      return { kind: 'polynomial', poly: expr.negatedY ? poly.negateY() : poly }
    }
    case 'grothendieck': return grothendieckValue(expr, env)
    case 'backStable': {
      const w = permutationIn(expr.perm, env)
      const double = expr.variant === 'double'
      const plus = double && env.conventions.doubleSign === 'xy-plus'
      return { kind: 'backStable', terms: remember(env, `BS|${double}|${plus}|${w.key}`, () => backStableTerms(w, double, plus, env.meter)) }
    }
    case 'nonPositive': {
      const arg = evaluate(expr.arg, { ...env, backStable: false })
      if (arg.kind === 'number') return arg
      if (arg.kind !== 'symmetric') throw new UnsupportedClaimError('only a symmetric function can be taken in the non-positive variables')
      return { kind: 'backStable', terms: liftSymmetric(arg.schur, expr.set) }
    }
    case 'stanley': {
      const w = permutationIn(expr.perm, env)
      return { kind: 'symmetric', schur: remember(env, `F|${w.key}`, () => stanleySymmetricFunction(w, { budget: env.meter })) }
    }
    case 'symmetric': return symmetricValue(expr, env)
    case 'dividedDifference': {
      const value = evaluate(expr.arg, env)
      // ∂_i is linear over ℤ[parameters] and over functions of y (the ⊖ denominators), so it acts part by part.
      if (value.kind === 'parametric') return { ...value, poly: value.poly.map(p => dividedDifference(p, expr.index, 'x', env.meter)) }
      const arg = toPolynomial(value)
      return { kind: 'polynomial', poly: dividedDifference(arg, expr.index, 'x', env.meter) }
    }
    case 'determinant': {
      const entries = expr.rows.map(row => row.map(entry => evaluate(entry, env)))
      if (entries.some(row => row.length !== entries.length)) throw new UnsupportedClaimError('the determinant of a matrix that is not square')
      // Jacobi–Trudi determinants hold symmetric functions (h_k, e_k without variables): expand over values.
      if (entries.some(row => row.some(entry => entry.kind === 'symmetric'))) return valueDeterminant(entries, env)
      return { kind: 'polynomial', poly: determinant(entries.map(row => row.map(toPolynomial)), env.meter) }
    }
    case 'evaluateAtOnes': {
      const arg = evaluate(expr.arg, env)
      if (arg.kind === 'number') return arg
      const poly = arg.kind === 'symmetric'
        ? symmetricInVariables(arg.schur, expr.variableCount, env)
        : toPolynomial(arg)
      const xCount = Math.max(expr.variableCount ?? 0, poly.maxIndex('x'))
      if (expr.variableCount !== undefined && poly.maxIndex('x') > expr.variableCount) {
        throw new UnsupportedClaimError(`the polynomial involves x_${poly.maxIndex('x')} but is evaluated at ${expr.variableCount} ones`)
      }
      return numberValue(poly.evaluate(new Array(xCount).fill(1), new Array(poly.maxIndex('y')).fill(0)))
    }
    case 'length': return numberValue(permutationIn(expr.perm, env).length())
    case 'count': {
      const w = permutationIn(expr.perm, env)
      switch (expr.objects) {
        case 'bumplessPipeDreams': return numberValue(countBumplessPipeDreams(w, { budget: env.meter }))
        case 'pipeDreams': return numberValue(countPipeDreams(w, env.meter))
        case 'reducedWords': return numberValue(countReducedWords(w, env.meter))
      }
      break
    }
    case 'structureConstant': {
      const [u, v, w] = [expr.u, expr.v, expr.w].map(p => permutationIn(p, env)) as [Permutation, Permutation, Permutation]
      return numberValue(structureConstant(u, v, w, env.meter))
    }
    case 'littlewoodRichardson':
      return numberValue(littlewoodRichardson(partitionIn(expr.nu, env), partitionIn(expr.lambda, env), partitionIn(expr.mu, env)))
    case 'kostka':
      return numberValue(kostkaNumber(partitionIn(expr.shape, env), toPartition(expr.content)))
    case 'parameter':
      return { kind: 'parametric', poly: ParametricPolynomial.parameter(expr.name), denominator: [], beta: betaOf(env) }
    case 'formalGroup': {
      const left = evaluate(expr.left, env)
      const right = evaluate(expr.right, env)
      if (expr.op === 'oplus') return formalSum(left, right, env.meter)
      return formalDifference(left, right, expr.right.type === 'variable' && expr.right.name === 'y' ? expr.right.index : undefined, env.meter)
    }
    case 'specialise':
      return specialiseValue(evaluate(expr.arg, env), expr.parameter, BigInt(expr.value))
    case 'keyPolynomial': {
      const alpha = expr.composition
      return { kind: 'polynomial', poly: expr.family === 'key' ? keyPolynomial(alpha, env.meter) : demazureAtom(alpha, env.meter) }
    }
  }
  throw new UnsupportedClaimError('an expression Scholium cannot evaluate')
}

/**
 * G_w or G_w(x; y) under the claim's β (formal or a number) and the kFactor convention. Beyond S_5 the
 * numeric ⊕ form goes by the 0-Hecke route (double-grothendieck.ts), which avoids the large top class.
 */
function grothendieckValue(expr: Extract<Expr, { type: 'grothendieck' }>, env: EvaluationEnv): Value {
  const w = permutationIn(expr.perm, env)
  const double = expr.variant === 'double'
  const ominus = double && env.conventions.kFactor === 'k-ominus'
  const beta = betaOf(env)
  if (beta === null) {
    if (!double) return { kind: 'parametric', poly: remember(env, `Gf|${w.key}`, () => grothendieckFormal(w, env.meter)), denominator: [], beta }
    if (!ominus) return { kind: 'parametric', poly: remember(env, `GGf|${w.key}`, () => doubleGrothendieckFormal(w, env.meter)), denominator: [], beta }
    const r = remember(env, `GGf-|${w.key}`, () => doubleGrothendieckOminusFormal(w, env.meter))
    return { kind: 'parametric', poly: r.numerator, denominator: r.denominator, beta }
  }
  if (!double) return { kind: 'polynomial', poly: remember(env, `G|${beta}|${w.key}`, () => grothendieckPolynomial(w, beta, env.meter)) }
  if (!ominus) {
    return { kind: 'polynomial', poly: remember(env, `GG|${beta}|${w.key}`, () => w.trimmed().size > 5 ? doubleGrothendieckByHecke(w, beta, env.meter) : doubleGrothendieckPolynomial(w, beta, env.meter)) }
  }
  const r = remember(env, `GG-|${beta}|${w.key}`, () => doubleGrothendieckOminus(w, beta, env.meter))
  return { kind: 'parametric', poly: ParametricPolynomial.from(r.numerator), denominator: r.denominator, beta }
}

/** S_w or S_w(x;y) as the manuscript writes it under the current sign convention. */
function schubertValue(w: Permutation, double: boolean, env: EvaluationEnv): Polynomial {
  if (!double) return remember(env, `S|${w.key}`, () => schubertPolynomial(w, env.meter))
  const reference = remember(env, `SS|${w.key}`, () => doubleSchubertPolynomial(w, env.meter))
  return env.conventions.doubleSign === 'xy-plus' ? remember(env, `SS+|${w.key}`, () => reference.negateY()) : reference
}

function symmetricValue(expr: Extract<Expr, { type: 'symmetric' }>, env: EvaluationEnv): Value {
  const n = expr.variableCount
  const k = expr.index[0] ?? 0
  if (expr.skew) {
    // s_{λ/μ} = Σ_ν c^λ_{μν} s_ν; in n variables only ν with at most n rows survive.
    const lambda = partitionIn(expr.index, env)
    const mu = partitionIn(expr.skew, env)
    const schur = remember(env, `skew|${partitionKey(lambda)}/${partitionKey(mu)}`, () => skewSchurExpansion(lambda, mu, { budget: env.meter }))
    return n === undefined ? { kind: 'symmetric', schur } : { kind: 'polynomial', poly: schurCombinationToPolynomial(schur, n, env.meter) }
  }
  if (n !== undefined) {
    switch (expr.family) {
      case 'schur': return { kind: 'polynomial', poly: schurPolynomial(partitionIn(expr.index, env), n, env.meter) }
      case 'elementary': return { kind: 'polynomial', poly: elementarySymmetric(k, n) }
      case 'complete': return { kind: 'polynomial', poly: completeSymmetric(k, n) }
      case 'powerSum': return { kind: 'polynomial', poly: powerSum(k, n) }
      case 'monomial': return { kind: 'polynomial', poly: monomialSymmetric(toPartition(expr.index), n) }
    }
  }
  // In infinitely many variables: work in the Schur basis. A symmetric function of degree d
  // is determined by its restriction to d variables, which is what the expansions use.
  switch (expr.family) {
    case 'schur': return { kind: 'symmetric', schur: new Map([[partitionKey(partitionIn(expr.index, env)), 1]]) }
    case 'elementary': return { kind: 'symmetric', schur: new Map([[partitionKey(new Array(k).fill(1)), 1]]) }
    case 'complete': return { kind: 'symmetric', schur: new Map([[partitionKey(k > 0 ? [k] : []), 1]]) }
    case 'powerSum': return { kind: 'symmetric', schur: schurExpansion(powerSum(k, Math.max(k, 1)), Math.max(k, 1), env.meter) }
    case 'monomial': {
      const lambda = toPartition(expr.index)
      const d = Math.max(lambda.reduce((a, b) => a + b, 0), 1)
      return { kind: 'symmetric', schur: schurExpansion(monomialSymmetric(lambda, d), d, env.meter) }
    }
  }
}

function symmetricInVariables(schur: SchurCombination, variableCount: number | undefined, env: EvaluationEnv): Polynomial {
  if (variableCount === undefined) throw new UnsupportedClaimError('say how many variables a symmetric function is evaluated in, e.g. s_λ(1,…,1) with n ones')
  return schurCombinationToPolynomial(schur, variableCount, env.meter)
}

/** Largest matrix of symmetric functions expanded along rows (n! products of Schur combinations at most). */
const MAX_SYMMETRIC_DETERMINANT = 6

/** Determinant of a square matrix of values, by expansion along the first rows (memoised on the columns used). */
function valueDeterminant(entries: Value[][], env: EvaluationEnv): Value {
  const n = entries.length
  if (n > MAX_SYMMETRIC_DETERMINANT) throw new UnsupportedClaimError(`determinants of symmetric functions larger than ${MAX_SYMMETRIC_DETERMINANT} × ${MAX_SYMMETRIC_DETERMINANT} are not supported`)
  const memo = new Map<number, Value>()
  const minor = (row: number, usedColumns: number): Value => {
    if (row === n) return numberValue(1)
    const known = memo.get(usedColumns)
    if (known) return known
    let total: Value = numberValue(0)
    let sign = 1
    for (let column = 0; column < n; column++) {
      if (usedColumns & (1 << column)) continue
      const entry = entries[row]![column]!
      if (!(entry.kind === 'number' && entry.value === 0n)) {
        env.meter.step()
        const term = multiplyValues(entry, minor(row + 1, usedColumns | (1 << column)), env.meter)
        total = addValues(total, sign > 0 ? term : negateValue(term))
      }
      sign = -sign
    }
    memo.set(usedColumns, total)
    return total
  }
  return minor(0, 0)
}
