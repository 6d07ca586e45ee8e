/**
 * The demo scenario: an invented venue, its editor, authors, a coauthor and
 * a referee, and two manuscripts with real LaTeX (some examples right, some
 * deliberately wrong). Every name here is invented. Seeding is idempotent:
 * what exists already is left alone, so a second `npm start` keeps the data.
 */
import type { Db } from '../database/connect'
import { findUserByEmail, insertUser } from '../repositories/users'
import { addManuscriptMember, findManuscriptByTitleForOwner, insertManuscript } from '../repositories/manuscripts'
import { addVenueEditor, upsertVenue } from '../repositories/venues'
import { listRevisions } from '../repositories/revisions'
import { insertRefereeAssignment, insertSubmission, setRefereeNote } from '../repositories/submissions'
import { insertRefereeClaimNote, markAssignmentReleased } from '../repositories/referee-notes'
import { claimContentKey } from '../repositories/claims'
import { readManuscript } from '../../shared/latex'
import { appendAudit } from '../repositories/audit'
import { createRevision, type UploadedPart } from './revisions'
import { DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people'
import { agreeToConvention, proposeConvention } from './conventions'
import { listConventionDecisions } from '../repositories/convention-decisions'

const VENUES = {
  ledgerfield: { slug: 'ledgerfield-jac', name: 'Ledgerfield Journal of Algebraic Combinatorics', description: 'A quarterly for flag varieties, tableaux and their polynomials.' },
  brackwater: { slug: 'brackwater-notes', name: 'Brackwater Notes in Enumerative Geometry', description: 'Short notes with explicit computations.' },
}

type DemoAssets = (prefix: string) => Promise<UploadedPart[]>

export async function seedDemo(db: Db, readAssets: DemoAssets): Promise<void> {
  const ids: Record<keyof typeof DEMO_PEOPLE, string> = {} as never
  for (const [key, person] of Object.entries(DEMO_PEOPLE) as [keyof typeof DEMO_PEOPLE, typeof DEMO_PEOPLE[keyof typeof DEMO_PEOPLE]][]) {
    const existing = await findUserByEmail(db, person.email)
    ids[key] = existing?.id ?? (await insertUser(db, { email: person.email, displayName: person.displayName, siteRole: person.siteRole, passwordHash: await hashPassword(DEMO_PASSWORD) })).id
  }

  const ledgerfield = await upsertVenue(db, VENUES.ledgerfield)
  const brackwater = await upsertVenue(db, VENUES.brackwater)
  await addVenueEditor(db, ledgerfield.id, ids.editor)
  await addVenueEditor(db, brackwater.id, ids.otherEditor)

  const flags = await ensureManuscript(db, ids.author, 'Transition chains for vexillary flags')
  await addManuscriptMember(db, flags, ids.coauthor, 'coauthor')
  await ensureRevisions(db, flags, [
    { by: ids.author, prefix: 'demo:vexillary-flags:rev1', note: 'First draft with the small cases.' },
    { by: ids.coauthor, prefix: 'demo:vexillary-flags:rev2', note: 'Fixed the pipe dream count and the Grassmannian example.' },
  ], readAssets)
  await seedConventionDecision(db, { manuscriptId: flags, proposerId: ids.author, agreeingId: ids.coauthor })

  const tilings = await ensureManuscript(db, ids.soloAuthor, 'A note on bumpless tilings of small permutations')
  await ensureRevisions(db, tilings, [{ by: ids.soloAuthor, prefix: 'demo:bumpless-tilings:rev1', note: 'Submitted version.' }], readAssets)

  const [submitted] = await listRevisions(db, tilings)
  if (submitted) {
    const submission = await insertSubmission(db, { revisionId: submitted.id, venueId: ledgerfield.id, submittedBy: ids.soloAuthor })
    const assignment = await insertRefereeAssignment(db, { submissionId: submission.id, refereeId: ids.referee, invitedBy: ids.editor })
    await seedReleasedRefereeNotes(db, { assignmentId: assignment.id, submissionId: submission.id, manuscriptId: tilings, refereeId: ids.referee, editorId: ids.editor }, readAssets)
  }
}

/**
 * The coauthors of the flags manuscript settle the sign of double polynomials: the author
 * proposes x_i − y_j, the coauthor agrees, and the accepted decision fixes the manuscript's
 * convention (and re-checks its newest revision) through the same service the API uses.
 */
async function seedConventionDecision(db: Db, at: { manuscriptId: string, proposerId: string, agreeingId: string }): Promise<void> {
  if ((await listConventionDecisions(db, at.manuscriptId)).length > 0) return
  const proposal = await proposeConvention(db, await useQueue(), { manuscriptId: at.manuscriptId, userId: at.proposerId, axis: 'doubleSign', conventionId: 'xy-minus' })
  await agreeToConvention(db, await useQueue(), { manuscriptId: at.manuscriptId, userId: at.agreeingId, decisionId: proposal.decisionId })
}

/**
 * The referee's notes on the tilings manuscript, released by the editor: an overall
 * note and a note on the claim S_213(x;y) = x_1 - y_1 (line 28), which breaks the paper's
 * own x_i + y_j convention. The claim is found by reading the demo source, since its
 * check may not have run yet; the note keeps the claim's content key. Each step is
 * done only if missing, so a second start changes nothing.
 */
async function seedReleasedRefereeNotes(db: Db, at: { assignmentId: string, submissionId: string, manuscriptId: string, refereeId: string, editorId: string }, readAssets: DemoAssets): Promise<void> {
  const assignment = await db.selectFrom('referee_assignments').select(['overall_note', 'released_at']).where('id', '=', at.assignmentId).executeTakeFirstOrThrow()
  if (assignment.released_at) return
  if (!assignment.overall_note) {
    await setRefereeNote(db, at.assignmentId, 'The examples are clearly laid out and nearly all of them check. One simple transposition is written with the opposite sign convention to the rest of the note; please make it agree with Section 1.')
  }
  const hasClaimNote = await db.selectFrom('claim_comments').select('id').where('referee_assignment_id', '=', at.assignmentId).executeTakeFirst()
  if (!hasClaimNote) {
    const parts = await readAssets('demo:bumpless-tilings:rev1')
    const read = readManuscript({ files: Object.fromEntries(parts.map(p => [p.filename, new Uint8Array(p.data)])) })
    const claim = read.claims.find(c => c.source.replace(/\s+/g, '') === '\\dS{213}=x_1-y_1')
    if (claim) {
      await insertRefereeClaimNote(db, { manuscriptId: at.manuscriptId, contentKey: claimContentKey(claim), claimId: null, authorId: at.refereeId, assignmentId: at.assignmentId, body: 'With factors x_i + y_j, as in Section 1, this should read x_1 + y_1.' })
    }
  }
  if (await markAssignmentReleased(db, at.assignmentId, new Date())) {
    await appendAudit(db, { actorId: at.editorId, action: 'review.released', subjectType: 'submission', subjectId: at.submissionId, details: { assignmentId: at.assignmentId, referee: 'Referee 1', demo: true } })
  }
}

async function ensureManuscript(db: Db, ownerId: string, title: string): Promise<string> {
  const existing = await findManuscriptByTitleForOwner(db, ownerId, title)
  if (existing) return existing.id
  const created = await insertManuscript(db, { title, ownerId })
  await appendAudit(db, { actorId: ownerId, action: 'manuscript.created', subjectType: 'manuscript', subjectId: created.id, details: { demo: true } })
  return created.id
}

async function ensureRevisions(db: Db, manuscriptId: string, revisions: { by: string, prefix: string, note: string }[], readAssets: DemoAssets): Promise<void> {
  const existing = await listRevisions(db, manuscriptId)
  for (const revision of revisions.slice(existing.length)) {
    await createRevision(db, { manuscriptId, userId: revision.by, parts: await readAssets(revision.prefix), note: revision.note, conventions: {} })
  }
}
