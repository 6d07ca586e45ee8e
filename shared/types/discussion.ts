/**
 * Discussion among a manuscript's members: threads on claims, convention decisions,
 * and the comparison of two revisions. Referee notes are not part of these shapes.
 */
import type { ClaimComparison, ComparisonCategory } from '../check/compare-revisions'
import type { ReportClaim } from './report'

/** One comment of a members' thread on a claim. */
export interface ClaimCommentView {
  id: string
  parentId: string | null
  authorId: string
  authorName: string
  body: string
  createdAt: string
  /** The revision whose claim the comment was written on; null once that run's claims were replaced. */
  revisionNumber: number | null
}

/**
 * The thread of one claim. It is keyed by the claim's content (kind + normalised source),
 * so it follows the claim into later revisions while the claim reads the same.
 */
export interface ClaimThreadView {
  contentKey: string
  /** The report claim ids (`ReportClaim.id`) of this revision that carry this content. */
  claimIds: string[]
  /** Oldest first; replies point at their parent by `parentId`. */
  comments: ClaimCommentView[]
}

export interface RevisionCommentsView {
  /** The finished run whose claims the threads are attached to; null while none has finished. */
  checkRunId: string | null
  /** Only threads with at least one comment. */
  threads: ClaimThreadView[]
}

export type ConventionDecisionStatus = 'proposed' | 'accepted' | 'withdrawn'

export interface PersonRef { userId: string, displayName: string }

export interface ConventionDecisionView {
  id: string
  axis: string
  conventionId: string
  status: ConventionDecisionStatus
  proposedBy: PersonRef
  createdAt: string
  /** Members who agreed, with when (from the audit log). */
  agreedBy: (PersonRef & { at: string | null })[]
  /** For an open proposal: the members whose agreement is still missing. */
  waitingFor: PersonRef[]
  decidedAt: string | null
}

export interface ConventionDecisionsView {
  /** The manuscript's fixed conventions now (axes left out are inferred from the paper). */
  conventions: Record<string, string>
  decisions: ConventionDecisionView[]
}

/** One side of a compared claim: where it is in its revision and how it was judged. */
export type ComparedClaim = Pick<ReportClaim, 'id' | 'file' | 'line' | 'endLine' | 'kind' | 'verdict' | 'source' | 'message'> & { label: string | null, contentKey: string }

export interface RevisionRef { id: string, number: number, checkRunId: string }

export interface RevisionComparisonView {
  manuscript: { id: string, title: string }
  from: RevisionRef
  to: RevisionRef
  entries: ClaimComparison<ComparedClaim>[]
  counts: Record<ComparisonCategory, number>
  /** Both reports' macro tables for KaTeX (the later revision's definition wins). */
  macros: Record<string, string>
}
