import type { Db } from '../database/connect'
import type { DeskSummary, ManuscriptView, ReviewListItem, RevisionFileView, RevisionView, SessionUser } from '#shared/types/api'
import { listManuscriptMembers, listManuscriptsForUser } from '../repositories/manuscripts'
import { findRevision, listRevisionFiles, listRevisions } from '../repositories/revisions'
import { latestRunsByRevision } from '../services/check-runs'
import { listAssignmentsForReferee, listSubmissionsForManuscript } from '../repositories/submissions'
import { listVenuesForEditor } from '../repositories/venues'
import type { ManuscriptGrant } from '../utils/access'

/** Revisions of a manuscript, newest first, each with its files and latest check run. */
export async function revisionViews(db: Db, manuscriptId: string, onlyRevisionId?: string): Promise<RevisionView[]> {
  const revisions = (await listRevisions(db, manuscriptId)).filter(r => !onlyRevisionId || r.id === onlyRevisionId)
  const ids = revisions.map(r => r.id)
  const [files, runs] = await Promise.all([listRevisionFiles(db, ids), latestRunsByRevision(db, ids)])
  return revisions.map(r => ({
    id: r.id,
    number: r.number,
    mainFile: r.main_file,
    note: r.note,
    uploadedBy: r.uploader,
    createdAt: r.created_at.toISOString(),
    files: files.get(r.id) ?? [],
    latestRun: runs.get(r.id) ?? null,
  }))
}

/** What never changes about a revision: its number, main file and files. */
export interface RevisionHead { number: number, mainFile: string | null, files: RevisionFileView[] }

/**
 * Revision heads, kept in this process. A stored revision never changes (a new upload is a new
 * revision, written with its files in one transaction), so a head is read once per revision id;
 * callers authorize first, so a deleted revision is never answered from here. Bounded; least
 * recently used out first.
 */
const REVISION_HEADS = 2000
const revisionHeads = new Map<string, RevisionHead>()

/** A revision's head, e.g. for the report route: from memory after the first read. Undefined: no such revision. */
export async function revisionHead(db: Db, revisionId: string): Promise<RevisionHead | undefined> {
  const kept = revisionHeads.get(revisionId)
  if (kept) {
    revisionHeads.delete(revisionId)
    revisionHeads.set(revisionId, kept)
    return kept
  }
  const [revision, files] = await Promise.all([findRevision(db, revisionId), listRevisionFiles(db, [revisionId])])
  if (!revision) return undefined
  const head = { number: revision.number, mainFile: revision.main_file, files: files.get(revisionId) ?? [] }
  revisionHeads.set(revisionId, head)
  if (revisionHeads.size > REVISION_HEADS) revisionHeads.delete(revisionHeads.keys().next().value!)
  return head
}

export async function manuscriptView(db: Db, grant: ManuscriptGrant): Promise<ManuscriptView> {
  const [members, revisions, submissions] = await Promise.all([
    listManuscriptMembers(db, grant.manuscriptId),
    revisionViews(db, grant.manuscriptId),
    listSubmissionsForManuscript(db, grant.manuscriptId),
  ])
  return {
    id: grant.manuscriptId,
    title: grant.title,
    myRole: grant.role,
    isOwner: grant.isOwner,
    conventions: grant.conventions,
    members,
    revisions,
    submissions,
  }
}

/** Everything a user's landing page shows, by the roles they hold. */
export async function deskSummary(db: Db, user: SessionUser): Promise<DeskSummary> {
  const [manuscripts, editorOf, reviews] = await Promise.all([
    listManuscriptsForUser(db, user.id),
    listVenuesForEditor(db, user.id),
    reviewList(db, user.id),
  ])
  return { user, manuscripts, editorOf, reviews }
}

/** The submissions a user referees, newest first. */
export async function reviewList(db: Db, userId: string): Promise<ReviewListItem[]> {
  const assignments = await listAssignmentsForReferee(db, userId)
  return assignments.map(a => ({
    assignmentId: a.id,
    submissionId: a.submission_id,
    manuscriptTitle: a.title,
    venueName: a.venueName,
    revisionNumber: a.number,
    assignedAt: a.created_at.toISOString(),
    released: a.released_at !== null,
  }))
}
