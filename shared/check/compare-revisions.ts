/**
 * Compares the claims of two checked revisions of one manuscript.
 *
 * Conventions of this module:
 * - "from" is the older revision, "to" the newer; either may be any two revisions.
 * - Failing means a verdict of mismatch or error; unsupported is neither passing nor failing.
 * - Claims are paired in three passes, each only over what earlier passes left:
 *   1. content: the same content key (kind + normalised source), so an unchanged claim that moved
 *      lines is still the same claim;
 *   2. label: the same `\label`, so an edited equation is recognised as that equation ("changed");
 *   3. subject: the same kind and the same left-hand side (the text before the first top-level `=`),
 *      preferring the same file and then the nearest line, so a corrected value next to the same
 *      left side (`#PD(1432) = 4` → `= 5`) is recognised as the fix it is.
 *   Duplicates within a pass pair up in the order the claims appear.
 * - Line numbers are never enough on their own to pair two claims; they only break ties in pass 3.
 */
import type { Verdict } from '../types/report'

/** What the comparison needs of one claim. `contentKey` must be computed the same way for both sides. */
export interface ComparableClaim {
  id: string
  file: string
  line: number
  kind: string
  verdict: Verdict
  source: string
  label?: string | null
  contentKey: string
}

export type ComparisonCategory
  = | 'fixed' // failing → verified
    | 'newlyFailing' // verified or unsupported → failing, or a new claim that fails
    | 'stillFailing' // failing → failing
    | 'unchangedVerified' // verified → verified (the source may have been edited; see `changed`)
    | 'unchecked' // a pair with an unsupported side that is none of the above
    | 'added' // only in "to", not failing
    | 'removed' // only in "from"

export const COMPARISON_CATEGORIES: readonly ComparisonCategory[] = ['fixed', 'newlyFailing', 'stillFailing', 'unchangedVerified', 'unchecked', 'added', 'removed']

export type MatchedBy = 'content' | 'label' | 'subject'

export interface ClaimComparison<C extends ComparableClaim = ComparableClaim> {
  category: ComparisonCategory
  /** How the two claims were paired; null for added and removed claims. */
  matchedBy: MatchedBy | null
  /** True when both sides exist and their content differs. */
  changed: boolean
  from: C | null
  to: C | null
}

export interface RevisionComparison<C extends ComparableClaim = ComparableClaim> {
  /** Claims of "to" in their order, each with its partner, then the removed claims of "from". */
  entries: ClaimComparison<C>[]
  counts: Record<ComparisonCategory, number>
}

/** Whether a verdict counts as failing. Example: `isFailing('error') === true`. */
export function isFailing(verdict: Verdict): boolean {
  return verdict === 'mismatch' || verdict === 'error'
}

/**
 * The left-hand side of a claim, spacing removed, or null when it has no top-level `=`.
 * Example: `claimSubject('\\Sch{1342} = x_1 x_2') === '\\Sch{1342}'`.
 */
export function claimSubject(source: string): string | null {
  let depth = 0
  for (let i = 0; i < source.length; i++) {
    const ch = source[i]
    if (ch === '\\') {
      i++ // an escaped character (\{, \=) is never structure
      continue
    }
    if (ch === '{') depth++
    else if (ch === '}') depth = Math.max(0, depth - 1)
    else if (ch === '=' && depth === 0) {
      const subject = source.slice(0, i).replace(/\\[,;:! ]/g, '').replace(/\s+/g, '')
      return subject.length > 0 ? subject : null
    }
  }
  return null
}

/** Which category a pair (or a lone claim) falls in. Example: `categorise('mismatch', 'verified') === 'fixed'`. */
export function categorise(from: Verdict | null, to: Verdict | null): ComparisonCategory {
  if (from === null && to === null) throw new Error('categorise needs at least one side')
  if (to === null) return 'removed'
  if (from === null) return isFailing(to) ? 'newlyFailing' : 'added'
  if (isFailing(to)) return isFailing(from) ? 'stillFailing' : 'newlyFailing'
  if (to === 'verified' && isFailing(from)) return 'fixed'
  if (to === 'verified' && from === 'verified') return 'unchangedVerified'
  return 'unchecked'
}

/**
 * Pairs the claims of two revisions and sorts each pair into a category.
 * Example: `compareRevisionClaims(rev1Claims, rev2Claims).counts.fixed`.
 */
export function compareRevisionClaims<C extends ComparableClaim>(from: readonly C[], to: readonly C[]): RevisionComparison<C> {
  const partnerOfTo = new Map<number, { index: number, by: MatchedBy }>()
  const takenFrom = new Set<number>()

  const pairInOrder = (keyOf: (c: C) => string | null, by: MatchedBy) => {
    const waiting = new Map<string, number[]>()
    from.forEach((c, i) => {
      const key = takenFrom.has(i) ? null : keyOf(c)
      if (key !== null) waiting.set(key, [...(waiting.get(key) ?? []), i])
    })
    to.forEach((c, j) => {
      if (partnerOfTo.has(j)) return
      const key = keyOf(c)
      const queue = key === null ? undefined : waiting.get(key)
      const i = queue?.shift()
      if (i === undefined) return
      partnerOfTo.set(j, { index: i, by })
      takenFrom.add(i)
    })
  }
  pairInOrder(c => c.contentKey, 'content')
  pairInOrder(c => c.label ? c.label : null, 'label')

  // Subjects: nearest candidate, same file first, so two edits of the same left side pair up locally.
  to.forEach((c, j) => {
    if (partnerOfTo.has(j)) return
    const subject = claimSubject(c.source)
    if (subject === null) return
    let best: { index: number, cost: number } | undefined
    from.forEach((f, i) => {
      if (takenFrom.has(i) || f.kind !== c.kind || claimSubject(f.source) !== subject) return
      const cost = (f.file === c.file ? 0 : 1e9) + Math.abs(f.line - c.line)
      if (!best || cost < best.cost) best = { index: i, cost }
    })
    if (best) {
      partnerOfTo.set(j, { index: best.index, by: 'subject' })
      takenFrom.add(best.index)
    }
  })

  const entries: ClaimComparison<C>[] = to.map((c, j) => {
    const partner = partnerOfTo.get(j)
    const old = partner ? from[partner.index] ?? null : null
    return {
      category: categorise(old?.verdict ?? null, c.verdict),
      matchedBy: partner?.by ?? null,
      changed: old !== null && old.contentKey !== c.contentKey,
      from: old,
      to: c,
    }
  })
  from.forEach((c, i) => {
    if (!takenFrom.has(i)) entries.push({ category: 'removed', matchedBy: null, changed: false, from: c, to: null })
  })

  const counts = Object.fromEntries(COMPARISON_CATEGORIES.map(k => [k, 0])) as Record<ComparisonCategory, number>
  for (const e of entries) counts[e.category]++
  return { entries, counts }
}
