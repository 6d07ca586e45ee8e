/**
 * Checks one claim under every combination of the conventions that matter to it,
 * so the run can tell "wrong" from "right under another convention" and infer
 * which conventions the paper follows.
 */
import type { Claim, Expr, PermutationSpec } from '../types/claims'
import { CONVENTION_AXES, REFERENCE_CONVENTIONS, axisOfConvention, type ConventionAxis, type ConventionId, type ConventionSet } from '../types/conventions'
import type { ClaimDiff } from '../types/report'
import { BETA, BudgetMeter, MathError, type Budget } from '../math'
import { compareSides } from './compare'
import { permutationOf, type EngineMemo } from './evaluate'
import { INFINITE_WITH_FINITE, UnsupportedClaimError } from './values'

export interface VariantResult {
  conventions: ConventionSet
  holds: boolean
  computed: string | null
  diff: ClaimDiff | null
}

export type ClaimEvaluation
  = | { status: 'evaluated', axes: ConventionAxis[], fixed: Partial<ConventionSet>, variants: VariantResult[], permutations: number[][] }
    | { status: 'unsupported' | 'error' | 'skipped', message: string, permutations: number[][] }

/** Budget for one claim; the run's AbortSignal stops it from outside. */
export const CLAIM_BUDGET: Required<Omit<Budget, 'signal'>> = { maxTerms: 400_000, maxSteps: 40_000_000, maxMilliseconds: 10_000 }

/**
 * Evaluates `claim` under each combination of its free convention axes.
 * `fixed` holds choices set outside the claim (manuscript setting, command line);
 * a tag on the claim overrides them.
 */
export function evaluateClaim(claim: Claim, options: { fixed?: Partial<ConventionSet>, memo?: EngineMemo, budget?: Budget } = {}): ClaimEvaluation {
  const permutations = claim.question ? permutationsIn(claim.question.lhs, claim.question.rhs) : []
  if (claim.status === 'skipped') return { status: 'skipped', message: 'skipped at the author\'s request (a scholium: skip tag)', permutations }
  if (claim.status !== 'ready' || !claim.question) {
    return { status: claim.status === 'error' ? 'error' : 'unsupported', message: claim.reason ?? 'the claim could not be read', permutations }
  }
  const fixed: Partial<ConventionSet> = { ...options.fixed }
  for (const id of claim.conventions) {
    const axis = axisOfConvention(id)
    if (axis) (fixed as Record<string, string>)[axis] = id
  }
  // Fixed axes are varied too: the verdict is judged under the fixed choice, but a failing
  // claim should still say under which other conventions it would hold.
  const axes = relevantAxes(claim.question.lhs, claim.question.rhs)
  const formalBeta = writesBeta(claim.question.lhs, claim.question.rhs)
  const backStable = writesBackStable(claim.question.lhs, claim.question.rhs)
  const memo = options.memo ?? new Map()
  const variants: VariantResult[] = []
  try {
    for (const conventions of combinations(axes, fixed)) {
      // Each convention variant gets its own meter: the time limit is per evaluation, not shared.
      const meter = new BudgetMeter({ ...CLAIM_BUDGET, ...options.budget })
      const comparison = compareSides(claim.question.lhs, claim.question.rhs, { conventions, meter, memo, formalBeta, ...(backStable ? { backStable } : {}), ...(claim.question.setting ? { grassmannian: claim.question.setting } : {}) })
      variants.push({ conventions, ...comparison })
    }
  }
  catch (error) {
    return { ...describeFailure(error, claim.question), permutations }
  }
  return { status: 'evaluated', axes, fixed, variants, permutations }
}

function describeFailure(error: unknown, question: Claim['question']): { status: 'unsupported' | 'error', message: string } {
  if (error instanceof UnsupportedClaimError) {
    if (error.message === INFINITE_WITH_FINITE && question) return { status: 'unsupported', message: `${error.message}${variablesAdvice(question.lhs, question.rhs)}` }
    return { status: 'unsupported', message: error.message }
  }
  if (error instanceof MathError) {
    switch (error.code) {
      case 'TOO_LARGE': return { status: 'error', message: `over budget: ${error.message}` }
      case 'ABORTED': return { status: 'error', message: 'over budget: the run ran out of time' }
      case 'NOT_IN_SPAN': case 'NOT_SYMMETRIC': return { status: 'unsupported', message: error.message }
      default: return { status: 'error', message: `malformed: ${error.message}` }
    }
  }
  return { status: 'error', message: `internal error: ${(error as Error)?.message ?? String(error)}` }
}

const FAMILY_LETTERS = { schur: 's', elementary: 'e', complete: 'h', monomial: 'm', powerSum: 'p' } as const

/**
 * Advice that fits the claim's own object in infinitely many variables: `; write h_{2}(x_1,…,x_n)
 * to fix its variables` for h_2. A Stanley function F_w, only read without variables, gets no such advice.
 */
function variablesAdvice(...sides: Expr[]): string {
  const found = sides.map(firstInfiniteObject).find(Boolean)
  if (!found) return ''
  if (found.type === 'stanley') return '; F_w is read in infinitely many variables: compare it with symmetric functions such as s_λ'
  const parts = (p: number[]) => (p.some(v => v > 9) ? p.join(',') : p.join(''))
  const index = found.skew ? `${parts(found.index)}/${parts(found.skew)}` : parts(found.index)
  return `; write ${FAMILY_LETTERS[found.family]}_{${index}}(x_1,…,x_n) to fix its variables`
}

function firstInfiniteObject(e: Expr): Extract<Expr, { type: 'symmetric' | 'stanley' }> | undefined {
  if (e.type === 'stanley' || (e.type === 'symmetric' && e.variableCount === undefined)) return e
  const children: Expr[] = e.type === 'add'
    ? e.terms
    : e.type === 'multiply'
      ? e.factors
      : e.type === 'negate'
        ? [e.arg]
        : e.type === 'power'
          ? [e.base]
          : e.type === 'dividedDifference'
            ? [e.arg]
            : e.type === 'determinant' ? e.rows.flat() : e.type === 'evaluateAtOnes' ? [e.arg] : []
  for (const c of children) {
    const found = firstInfiniteObject(c)
    if (found) return found
  }
  return undefined
}

/** Every convention set over `axes`, the other axes taken from `fixed` or the reference. */
function combinations(axes: ConventionAxis[], fixed: Partial<ConventionSet>): ConventionSet[] {
  let sets: ConventionSet[] = [{ ...REFERENCE_CONVENTIONS, ...fixed }]
  for (const axis of axes) {
    const choices = Object.keys(CONVENTION_AXES[axis].choices) as ConventionId[]
    sets = sets.flatMap(set => choices.map(choice => ({ ...set, [axis]: choice })))
  }
  return sets
}

/** Calls `visit` on every node of the expressions, parents before children. */
function walk(exprs: readonly Expr[], visit: (e: Expr) => void): void {
  for (const e of exprs) {
    visit(e)
    switch (e.type) {
      case 'add': walk(e.terms, visit); break
      case 'multiply': walk(e.factors, visit); break
      case 'negate': case 'dividedDifference': case 'evaluateAtOnes': case 'integral': case 'coproduct': case 'specialise': case 'nonPositive': case 'supersymmetric': walk([e.arg], visit); break
      case 'tensor': case 'formalGroup': walk([e.left, e.right], visit); break
      case 'power': walk([e.base], visit); break
      case 'determinant': walk(e.rows.flat(), visit); break
      default: break
    }
  }
}

/** True if the claim writes β (as a parameter, in ⊕ or ⊖, or in a specialisation): β stays formal. */
export function writesBeta(...exprs: Expr[]): boolean {
  let found = false
  walk(exprs, (e) => {
    if ((e.type === 'parameter' && e.name === BETA) || e.type === 'formalGroup' || (e.type === 'specialise' && e.parameter === BETA)) found = true
  })
  return found
}

/** True if the claim writes ←S_w or a symmetric function in x_{≤0}: it is compared in the back-stable ring. */
export function writesBackStable(...exprs: Expr[]): boolean {
  let found = false
  walk(exprs, (e) => {
    if (e.type === 'backStable' || e.type === 'nonPositive') found = true
  })
  return found
}

/** Which convention axes can change the value of these expressions. */
export function relevantAxes(...exprs: Expr[]): ConventionAxis[] {
  const found = new Set<ConventionAxis>()
  const formalBeta = writesBeta(...exprs)
  walk(exprs, (e) => {
    switch (e.type) {
      case 'schubert': case 'backStable':
        found.add('indexing')
        if (e.variant === 'double') found.add('doubleSign')
        break
      case 'grothendieck':
        found.add('indexing')
        if (e.variant === 'double') found.add('kFactor')
        if (!formalBeta) found.add('beta')
        break
      case 'stanley': found.add('indexing'); found.add('partition'); break
      case 'symmetric': if (e.family === 'schur') found.add('partition'); break
      case 'littlewoodRichardson': case 'kostka': found.add('partition'); break
      case 'length': case 'count': case 'structureConstant': found.add('indexing'); break
      default: break
    }
  })
  return (Object.keys(CONVENTION_AXES) as ConventionAxis[]).filter(axis => found.has(axis))
}

/** Permutations a claim mentions, in one-line notation, for the report's drawings. */
export function permutationsIn(...exprs: Expr[]): number[][] {
  const seen = new Map<string, number[]>()
  const add = (spec: PermutationSpec) => {
    try {
      const w = permutationOf(spec).trimmed()
      seen.set(w.key, [...w.oneLine])
    }
    catch { /* malformed permutations are reported by the evaluation itself */ }
  }
  walk(exprs, (e) => {
    switch (e.type) {
      case 'schubert': case 'grothendieck': case 'stanley': case 'length': case 'count': case 'backStable': add(e.perm); break
      case 'structureConstant': add(e.u); add(e.v); add(e.w); break
      default: break
    }
  })
  return [...seen.values()]
}
