/**
 * API payloads and error codes shared by the client, the server and the CLI.
 * Every failure the API returns carries one of these codes in `data.code`,
 * so a client can switch on it instead of parsing a message.
 */
import type { UploadErrorCode } from './uploads'

export type ApiErrorCode
  = | 'invalid-input'
    | 'not-signed-in'
    | 'forbidden'
    | 'not-found'
    | 'email-taken'
    | 'bad-credentials'
    | 'rate-limited'
    | UploadErrorCode // upload-<refusal code>, see shared/types/uploads.ts
    | 'body-too-large'
    | 'storage-unavailable'
    | 'mail-inbox-unavailable'
    | 'conflict'
    | 'invitation-expired'
    | 'invitation-used'
    | 'invitation-other-address'
    | 'already-member'
    | 'owner-not-removable'
    | 'mail-unavailable'
    | 'cross-site-request'
    | 'manuscript-submitted'
    | 'referee-of-manuscript'
    | ArxivFetchErrorCode

/** Why a "Fetch from arXiv" failed (server/arxiv/client.ts); nothing is stored when it does. */
export type ArxivFetchErrorCode
  = | 'arxiv-invalid-id'
    | 'arxiv-not-found'
    | 'arxiv-pdf-only'
    | 'arxiv-rate-limited'
    | 'arxiv-unavailable'
    | 'arxiv-unreadable'
    | 'arxiv-too-large'

export interface ApiErrorData {
  code: ApiErrorCode
  /** For invalid-input: which fields failed and why. */
  fields?: Record<string, string>
  /** For refused uploads: the offending entry's name, escaped to printable ASCII. */
  entry?: string
}

export type SiteRole = 'member' | 'admin'
export type ManuscriptRole = 'author' | 'coauthor'

/** The signed-in user as the session and the client see it. */
export interface SessionUser {
  id: string
  email: string
  displayName: string
  siteRole: SiteRole
}

export interface DeskSummary {
  user: SessionUser
  manuscripts: ManuscriptListItem[]
  editorOf: VenueListItem[]
  reviews: ReviewListItem[]
}

export interface ManuscriptListItem {
  id: string
  title: string
  role: ManuscriptRole
  revisionCount: number
  latestRevisionAt: string | null
  updatedAt: string
}

export interface VenueListItem {
  id: string
  slug: string
  name: string
  submissionCount: number
}

export interface ReviewListItem {
  assignmentId: string
  submissionId: string
  manuscriptTitle: string
  venueName: string
  revisionNumber: number
  assignedAt: string
  released: boolean
}

export interface RevisionFileView {
  id: string
  path: string
  sha256: string
  sizeBytes: number
}

export type CheckRunStatus = 'queued' | 'running' | 'finished' | 'failed' | 'cancelled'

export interface CheckRunView {
  id: string
  status: CheckRunStatus
  engineVersion: string | null
  claimsTotal: number | null
  claimsDone: number
  queuedAt: string
  startedAt: string | null
  finishedAt: string | null
  error: string | null
  summary: Record<string, unknown>
  /** A re-check asked for by a non-member (referee, editor); it never replaces the members' report. */
  whatIf: boolean
  /** Waiting (queued, or its worker's lease ran out) while no check worker is alive: nothing will pick it up until one starts. */
  waitingForWorker: boolean
}

export interface RevisionView {
  id: string
  number: number
  mainFile: string | null
  note: string
  uploadedBy: string
  createdAt: string
  files: RevisionFileView[]
  latestRun: CheckRunView | null
}

export interface MemberView {
  userId: string
  displayName: string
  email: string
  role: ManuscriptRole
}

/** What an invitation link shows before it is accepted (to whoever holds the link). */
export interface InvitationPreview {
  kind: 'coauthor'
  manuscriptTitle: string
  invitedBy: string
  /** The address the invitation was sent to; only an account with this address may accept it. */
  email: string
  expiresAt: string
}

/** An invitation the owner has sent and that is neither used nor expired. */
export interface PendingInvitationView {
  id: string
  email: string
  createdAt: string
  expiresAt: string
}

export interface SubmissionSummaryView {
  id: string
  venueName: string
  revisionNumber: number
  status: string
  createdAt: string
}

export interface ManuscriptView {
  id: string
  title: string
  myRole: ManuscriptRole
  isOwner: boolean
  conventions: Record<string, string>
  members: MemberView[]
  revisions: RevisionView[]
  submissions: SubmissionSummaryView[]
}

/** What an editor sees of one submission; authors never receive this shape. */
export interface EditorSubmissionRow {
  id: string
  manuscriptTitle: string
  revisionNumber: number
  submittedBy: string
  status: string
  createdAt: string
  referees: { assignmentId: string, displayName: string, email: string, released: boolean }[]
  latestRun: CheckRunView | null
}

export interface ReviewView {
  assignmentId: string
  submissionId: string
  manuscriptTitle: string
  venueName: string
  revision: RevisionView
  overallNote: string
  released: boolean
}

export interface AdminUserRow {
  id: string
  email: string
  displayName: string
  siteRole: SiteRole
  createdAt: string
}

export interface InboxMessage {
  id: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
}

/** Who is looking at a revision's report: a member of the manuscript, an assigned referee, or the venue's editor. */
export type RevisionViewer = 'member' | 'referee' | 'editor'

export interface RevisionReportView {
  manuscript: { id: string, title: string }
  revision: { id: string, number: number, mainFile: string | null, files: RevisionFileView[] }
  viewer: RevisionViewer
  /** The newest check run of this revision, finished or not. */
  run: CheckRunView | null
  /** The report of the newest finished run, or null while none has finished. */
  report: import('./report').Report | null
}

export interface SourceFileView {
  path: string
  /** The text, decoded as UTF-8 (Latin-1 when that fails); null for files that are not text (images, PDF). */
  text: string | null
}
