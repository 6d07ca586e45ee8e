/**
 * The database as Kysely sees it. Column names are snake_case, as in the
 * migrations; repositories turn rows into camelCase domain objects.
 */
import type { ColumnType, Generated, Insertable, Selectable } from 'kysely'
import type { Report } from '../../shared/types/report'

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>
type Json<T> = ColumnType<T, string | undefined, string>
/** Read only: the database computes it (a generated column). */
type Derived<T> = ColumnType<T, never, never>

export interface UsersTable {
  id: Generated<string>
  email: string
  display_name: string
  password_hash: string
  site_role: Generated<'member' | 'admin'>
  session_version: Generated<number>
  created_at: Timestamp
}

export interface AttemptLimitsTable {
  scope: string
  key: string
  attempts: number
  last_attempt_at: Timestamp
  blocked_until: Timestamp | null
  last_refused: Generated<boolean>
}

export interface SignInFailuresTable {
  id: Generated<string>
  email_key: string
  client_address: string
  failed_at: Timestamp
}

export interface UserSessionsTable {
  id: Generated<string>
  user_id: string
  created_at: Timestamp
}

export interface WorkerHeartbeatsTable {
  worker_id: string
  host: string
  pid: number
  concurrency: number
  started_at: Timestamp
  seen_at: Timestamp
}

export interface VenuesTable {
  id: Generated<string>
  slug: string
  name: string
  description: Generated<string>
  created_at: Timestamp
}

export interface VenueEditorsTable {
  venue_id: string
  user_id: string
  created_at: Timestamp
}

export interface ManuscriptsTable {
  id: Generated<string>
  title: string
  owner_id: string
  conventions: Json<Record<string, string>>
  created_at: Timestamp
  updated_at: Timestamp
}

export interface ManuscriptMembersTable {
  manuscript_id: string
  user_id: string
  role: 'author' | 'coauthor'
  created_at: Timestamp
}

export interface RevisionsTable {
  id: Generated<string>
  manuscript_id: string
  number: number
  main_file: string | null
  note: Generated<string>
  uploaded_by: string
  created_at: Timestamp
}

export interface RevisionFilesTable {
  id: Generated<string>
  revision_id: string
  path: string
  storage_key: string
  sha256: string
  size_bytes: number
  uploaded_by: string
  uploaded_at: Timestamp
}

export type CheckRunStatus = 'queued' | 'running' | 'finished' | 'failed' | 'cancelled'

export interface CheckRunsTable {
  id: Generated<string>
  revision_id: string
  status: Generated<CheckRunStatus>
  engine_version: string | null
  conventions: Json<Record<string, unknown>>
  claims_total: number | null
  claims_done: Generated<number>
  timings: Json<Record<string, number>>
  /**
   * The whole report of a finished run (null before): one document, the same shape the CLI prints.
   * Read it through server/repositories/check-runs.ts `loadRunReport`, which validates it.
   */
  report: Json<Report | null>
  /** The report's head, derived by the database: the report without claims, macros and script library. */
  summary: Derived<Record<string, unknown>>
  error: string | null
  attempts: Generated<number>
  requested_by: string | null
  queued_at: Timestamp
  started_at: Timestamp | null
  finished_at: Timestamp | null
  lease_owner: string | null
  lease_until: Timestamp | null
  /** Asked for by a non-member (referee, editor): never the members' current report. */
  what_if: Generated<boolean>
}

/**
 * One row per claim of a finished run: only an index (threads, referee notes and comparisons join
 * on it); the claim itself is in check_runs.report.
 */
export interface ClaimsTable {
  id: Generated<string>
  check_run_id: string
  ordinal: number
  file: string
  line: number
  end_line: number
  source: string
  kind: string
  label: string | null
  content_key: string
  /** The claim's id in the report (`main.tex:30:1`). */
  report_id: string
  verdict: 'verified' | 'mismatch' | 'unsupported' | 'error' | null
  checked_at: Timestamp | null
}

export interface SubmissionsTable {
  id: Generated<string>
  revision_id: string
  venue_id: string
  submitted_by: string
  status: Generated<'submitted' | 'in-review' | 'decided' | 'withdrawn'>
  created_at: Timestamp
  updated_at: Timestamp
}

export interface RefereeAssignmentsTable {
  id: Generated<string>
  submission_id: string
  referee_id: string
  invited_by: string
  status: Generated<'active' | 'completed' | 'withdrawn'>
  overall_note: Generated<string>
  released_at: Timestamp | null
  created_at: Timestamp
}

export interface ClaimCommentsTable {
  id: Generated<string>
  manuscript_id: string
  content_key: string
  claim_id: string | null
  parent_id: string | null
  author_id: string
  referee_assignment_id: string | null
  body: string
  created_at: Timestamp
}

export interface ConventionDecisionsTable {
  id: Generated<string>
  manuscript_id: string
  axis: string
  convention_id: string
  proposed_by: string
  status: Generated<'proposed' | 'accepted' | 'withdrawn'>
  agreed_by: Json<string[]>
  created_at: Timestamp
  decided_at: Timestamp | null
}

export interface InvitationsTable {
  id: Generated<string>
  kind: 'coauthor' | 'referee' | 'password-reset'
  token_hash: string
  email: string
  manuscript_id: string | null
  submission_id: string | null
  invited_by: string | null
  expires_at: Timestamp
  used_at: Timestamp | null
  created_at: Timestamp
}

export interface AuditLogTable {
  id: Generated<string>
  at: Timestamp
  actor_id: string | null
  action: string
  subject_type: string
  subject_id: string
  details: Json<Record<string, unknown>>
}

export interface Database {
  users: UsersTable
  sign_in_failures: SignInFailuresTable
  attempt_limits: AttemptLimitsTable
  user_sessions: UserSessionsTable
  worker_heartbeats: WorkerHeartbeatsTable
  venues: VenuesTable
  venue_editors: VenueEditorsTable
  manuscripts: ManuscriptsTable
  manuscript_members: ManuscriptMembersTable
  revisions: RevisionsTable
  revision_files: RevisionFilesTable
  check_runs: CheckRunsTable
  claims: ClaimsTable
  submissions: SubmissionsTable
  referee_assignments: RefereeAssignmentsTable
  claim_comments: ClaimCommentsTable
  convention_decisions: ConventionDecisionsTable
  invitations: InvitationsTable
  audit_log: AuditLogTable
}

export type CheckRunRow = Selectable<CheckRunsTable>
/** A check run row without its report document, which only `loadRunReport` reads. */
export type CheckRunHead = Omit<CheckRunRow, 'report'>
export type UserRow = Selectable<UsersTable>
export type NewUser = Insertable<UsersTable>
