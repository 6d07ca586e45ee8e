/**
 * From per-claim evaluations to verdicts: infer the paper's conventions from its own
 * claims, check every claim under them, and flag the claims that only hold under
 * a convention the rest of the paper does not follow.
 */
import type { Claim, Expr } from '../types/claims'
import { CONVENTION_AXES, REFERENCE_CONVENTIONS, type ConventionAxis, type ConventionId, type ConventionSet } from '../types/conventions'
import type { ClaimDiff, ConventionReport, ReportClaim, Verdict } from '../types/report'
import type { ClaimEvaluation, VariantResult } from './claim'

/**
 * Evidence for a choice on an axis: a claim that holds, and holds only with that choice.
 * The choice with the most evidence wins; ties keep the reference convention.
 */
export function inferConventions(evaluations: readonly ClaimEvaluation[], fixed: Partial<ConventionSet>): ConventionReport {
  const evidence: Partial<Record<ConventionId, number>> = {}
  for (const ev of evaluations) {
    if (ev.status !== 'evaluated') continue
    const holding = ev.variants.filter(v => v.holds)
    if (holding.length === 0) continue
    for (const axis of ev.axes) {
      // A claim whose own tag (or the run) fixes the axis says nothing about the paper's habit.
      if (ev.fixed[axis] !== undefined) continue
      const choices = new Set(holding.map(v => v.conventions[axis]))
      if (choices.size === 1) {
        const id = [...choices][0] as ConventionId
        evidence[id] = (evidence[id] ?? 0) + 1
      }
    }
  }
  const inferred: Partial<ConventionSet> = {}
  for (const axis of Object.keys(CONVENTION_AXES) as ConventionAxis[]) {
    if (fixed[axis] !== undefined) continue
    const choices = Object.keys(CONVENTION_AXES[axis].choices) as ConventionId[]
    const counts = choices.map(c => evidence[c] ?? 0)
    const best = Math.max(...counts)
    if (best === 0) continue
    const reference = REFERENCE_CONVENTIONS[axis] as ConventionId
    const winner = (evidence[reference] ?? 0) === best ? reference : choices[counts.indexOf(best)]!
    ;(inferred as Record<string, string>)[axis] = winner
  }
  return { inferred, fixed, used: { ...REFERENCE_CONVENTIONS, ...inferred, ...fixed }, evidence }
}

/** The report line of one claim, checked under `used` unless its own tags say otherwise. */
export function decideClaim(claim: Claim, ev: ClaimEvaluation, conventions: ConventionReport): ReportClaim {
  const base = {
    id: claim.id,
    file: claim.file,
    line: claim.line,
    endLine: claim.endLine,
    kind: claim.kind,
    source: claim.source,
    ...(claim.label ? { label: claim.label } : {}),
    permutations: ev.permutations,
    holdsUnder: [] as ConventionId[],
    computed: null as string | null,
    diff: null as ClaimDiff | null,
  }
  if (ev.status !== 'evaluated') {
    if (ev.status === 'skipped') return { ...base, verdict: 'unsupported', skipped: true, message: ev.message, conventions: conventions.used }
    return { ...base, verdict: ev.status, message: ev.message, conventions: conventions.used }
  }
  const effective: ConventionSet = { ...conventions.used, ...ev.fixed }
  const matches = (v: VariantResult) => ev.axes.every(axis => v.conventions[axis] === effective[axis])
  const checked = ev.variants.find(matches) ?? ev.variants[0]!
  const result = { ...base, conventions: effective, computed: checked.computed, diff: checked.diff }
  if (checked.holds) return { ...result, verdict: 'verified' as Verdict, message: verifiedMessage(claim) }

  const alternatives = ev.variants.filter(v => v.holds)
    .map(v => ({ v, differing: ev.axes.filter(axis => v.conventions[axis] !== effective[axis]) }))
    .sort((a, b) => a.differing.length - b.differing.length)
  const nearest = alternatives[0]
  if (!nearest) return { ...result, verdict: 'mismatch', message: mismatchMessage(checked.diff) }

  const holdsUnder = nearest.differing.map(axis => nearest.v.conventions[axis] as ConventionId)
  const slip = betaZeroSignSlip(claim, holdsUnder, effective)
  const breaking = nearest.differing.find(axis => conventions.inferred[axis] !== undefined && ev.fixed[axis] === undefined)
  const labels = holdsUnder.map(describeConvention).join(' and ')
  return {
    ...result,
    verdict: 'mismatch',
    holdsUnder,
    message: slip ?? (breaking
      ? `Holds only with ${labels}, but the rest of the paper follows ${describeConvention(effective[breaking] as ConventionId)}.`
      : `Holds only with ${labels}; under the conventions checked it fails.`),
    ...(breaking ? { breaksPaperConvention: { axis: breaking, paper: effective[breaking] as ConventionId, claim: nearest.v.conventions[breaking] as ConventionId } } : {}),
  }
}

/**
 * A β = 0 specialisation of G_w(x; y) that holds only in the other double Grothendieck normalisation
 * is the sign slip y_j ↦ −y_j: name it, and the normalisation the claim is checked in.
 */
function betaZeroSignSlip(claim: Claim, holdsUnder: ConventionId[], effective: ConventionSet): string | undefined {
  if (holdsUnder.length !== 1 || (holdsUnder[0] !== 'k-oplus' && holdsUnder[0] !== 'k-ominus')) return undefined
  const q = claim.question
  if (!q || (!hasBetaZeroOfDoubleGrothendieck(q.lhs) && !hasBetaZeroOfDoubleGrothendieck(q.rhs))) return undefined
  const paper = effective.kFactor
  const factor = paper === 'k-oplus' ? 'x_i ⊕ y_j' : 'x_i ⊖ y_j'
  const gives = paper === 'k-oplus' ? 'S_w(x; −y), factors x_i + y_j' : 'S_w(x; y), factors x_i − y_j'
  const other = paper === 'k-oplus' ? 'x_i ⊖ y_j' : 'x_i ⊕ y_j'
  return `True only with y_j ↦ −y_j: the paper's G_w(x; y) uses ${factor}, so at β = 0 it is ${gives}; the stated value is what ${other} gives.`
}

function hasBetaZeroOfDoubleGrothendieck(e: Expr): boolean {
  switch (e.type) {
    case 'specialise': return e.parameter === 'beta' && e.value === '0' && containsDoubleGrothendieck(e.arg)
    case 'add': return e.terms.some(hasBetaZeroOfDoubleGrothendieck)
    case 'multiply': return e.factors.some(hasBetaZeroOfDoubleGrothendieck)
    case 'negate': return hasBetaZeroOfDoubleGrothendieck(e.arg)
    case 'power': return hasBetaZeroOfDoubleGrothendieck(e.base)
    default: return false
  }
}

function containsDoubleGrothendieck(e: Expr): boolean {
  switch (e.type) {
    case 'grothendieck': return e.variant === 'double'
    case 'add': return e.terms.some(containsDoubleGrothendieck)
    case 'multiply': return e.factors.some(containsDoubleGrothendieck)
    case 'negate': case 'specialise': case 'evaluateAtOnes': return containsDoubleGrothendieck(e.arg)
    case 'power': return containsDoubleGrothendieck(e.base)
    default: return false
  }
}

function describeConvention(id: ConventionId): string {
  for (const axis of Object.values(CONVENTION_AXES)) {
    const choices = axis.choices as Record<string, string>
    if (id in choices) return `${id} (${choices[id]})`
  }
  return id
}

function verifiedMessage(claim: Claim): string {
  if (claim.question?.lhs.type === 'supersymmetric') return `Supersymmetric in x_1..x_${claim.question.lhs.k}; y_1..y_${claim.question.lhs.k}, as stated.`
  return claim.question?.rhs.type === 'integer' ? 'The value agrees with the computation.' : 'Both sides agree term by term.'
}

function mismatchMessage(diff: ClaimDiff | null): string {
  if (!diff) return 'The two sides differ.'
  switch (diff.basis) {
    case 'number': return `The manuscript has ${diff.claimed}; the computation gives ${diff.computed}.`
    case 'property': return `Not ${diff.property === 'supersymmetry' ? 'supersymmetric' : diff.property}: ${diff.computed}.`
    case 'invariant': return `The ${diff.invariant} is ${diff.claimed} in the manuscript but ${diff.computed} by computation; found without expanding.`
    default: {
      const parts: string[] = []
      const count = (list: unknown[], total: number | undefined, word: string) => {
        const n = total ?? list.length
        if (n > 0) parts.push(`${n} ${word}`)
      }
      const unit = { monomial: 'term', schubert: 'Schubert term', schur: 'Schur term', class: 'class', tensor: 'tensor term' }[diff.basis]
      count(diff.missing, diff.truncated?.missing, `${unit}${(diff.truncated?.missing ?? diff.missing.length) === 1 ? '' : 's'} missing`)
      count(diff.extra, diff.truncated?.extra, `extra ${unit}${(diff.truncated?.extra ?? diff.extra.length) === 1 ? '' : 's'}`)
      count(diff.wrongCoefficient, diff.truncated?.wrongCoefficient, `wrong coefficient${(diff.truncated?.wrongCoefficient ?? diff.wrongCoefficient.length) === 1 ? '' : 's'}`)
      const counts = `${parts.join(', ')}.`.replace(/^./, c => c.toUpperCase())
      return diff.notes?.length ? `${counts} ${diff.notes.map(n => `${n}.`).join(' ')}` : counts
    }
  }
}
