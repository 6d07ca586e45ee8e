/**
 * Payloads of the editorial side: a venue's submissions table, referee notes
 * (the referee's own view and the authors' released view) and the audit summary.
 *
 * Who may receive what: `VenueSubmissionRow` and `AuditSummary` go to a venue's
 * editors only; `ReviewNotesView` to the referee of that assignment only;
 * `ReleasedRefereeNotes` to the manuscript's members, and it carries no referee
 * identity at all — a referee is "Referee 1", "Referee 2", numbered per submission.
 */
import type { EditorSubmissionRow } from './api'
import type { Verdict } from './report'

export type SubmissionStatus = 'submitted' | 'in-review' | 'decided' | 'withdrawn'
export const SUBMISSION_STATUSES: readonly SubmissionStatus[] = ['submitted', 'in-review', 'decided', 'withdrawn']

/** Columns the editor's table sorts by. */
export type SubmissionSortKey = 'date' | 'title' | 'status' | Verdict
export const SUBMISSION_SORT_KEYS: readonly SubmissionSortKey[] = ['date', 'title', 'status', 'verified', 'mismatch', 'unsupported', 'error']

/** Claims per verdict in the newest finished check of a revision. */
export type VerdictCounts = Record<Verdict, number> & { claims: number }

export interface VenueSubmissionRow extends EditorSubmissionRow {
  /** From the newest finished run; null while none has finished. */
  checkCounts: VerdictCounts | null
}

export interface VenueSubmissionsPage {
  venue: { id: string, name: string, slug: string }
  submissions: VenueSubmissionRow[]
  page: number
  pageSize: number
  /** Rows matching the filters, over all pages. */
  total: number
}

/** A claim of the submitted revision's newest finished run, for the referee's claim picker. */
export interface ReviewClaimOption {
  id: string
  file: string
  line: number
  kind: string
  verdict: Verdict | null
  source: string
}

export interface RefereeClaimNote {
  id: string
  body: string
  createdAt: string
  /** Where the claim is in the submitted revision; null when it cannot be found any more. */
  file: string | null
  line: number | null
  source: string | null
}

/** The referee's own notes of one assignment. */
export interface ReviewNotesView {
  overallNote: string
  released: boolean
  claimNotes: RefereeClaimNote[]
  claims: ReviewClaimOption[]
}

/** Released notes as the authors see them: a number, never a name or an address. */
export interface ReleasedRefereeNotes {
  submissionId: string
  venueName: string
  revisionNumber: number
  referee: string
  releasedAt: string
  overallNote: string
  claimNotes: RefereeClaimNote[]
}

export interface AuditRun {
  id: string
  status: string
  requestedBy: string | null
  queuedAt: string
  finishedAt: string | null
  engineVersion: string | null
  /** Conventions fixed for this run (manuscript setting or re-check). */
  conventions: Record<string, unknown>
  /** What this run inferred from the paper's claims and what it checked in; empty until it finishes. */
  inferred: Record<string, string>
  used: Record<string, string>
  counts: VerdictCounts | null
}

export interface AuditEvent {
  at: string
  action: string
  /** The actor's display name (editors may see referees here), and their part in this submission. */
  who: string | null
  whoRole: 'author' | 'coauthor' | 'referee' | 'editor' | 'other' | null
  subjectType: string
  subjectId: string
  details: Record<string, unknown>
}

/** What an editor can export about one submission (JSON, CSV, printable page). */
export interface AuditSummary {
  submission: { id: string, venueName: string, manuscriptTitle: string, revisionId: string, revisionNumber: number, status: string, submittedBy: string, createdAt: string }
  /** The newest finished run's counts; null while none has finished. */
  counts: VerdictCounts | null
  engineVersion: string | null
  conventions: { inferred: Record<string, string>, used: Record<string, string> } | null
  files: { path: string, sha256: string, sizeBytes: number }[]
  runs: AuditRun[]
  events: AuditEvent[]
  generatedAt: string
}
