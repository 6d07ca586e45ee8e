/**
 * A manuscript's fixed conventions, set directly or by a decision of its members.
 *
 * Acceptance rule for a decision: a proposal is accepted once every member of the
 * manuscript other than the proposer has agreed, counted against the members at the
 * time of each agreement (so a coauthor who joins while a proposal is open must agree
 * too). On a manuscript with one member a proposal is accepted at once. One proposal
 * may be open per axis; only its proposer may withdraw it. Accepting sets that axis
 * of the manuscript's conventions and re-checks the newest revision with them.
 *
 * Lock order, everywhere: the manuscript row, then the decision row.
 */
import type { Db } from '../database/connect'
import type { ConventionDecisionsView, ConventionDecisionStatus } from '#shared/types/discussion'
import { appendAudit } from '../repositories/audit'
import { requestCheckRun, type CheckQueue } from './check-runs'
import { DomainError } from './domain-error'
import { listRevisions } from '../repositories/revisions'
import { listManuscriptMembers } from '../repositories/manuscripts'
import {
  closeConventionDecision, findOpenDecisionOnAxis, insertConventionDecision, listAgreementTimes,
  listConventionDecisions, lockConventionDecision, lockManuscriptConventions, setDecisionAgreements,
} from '../repositories/convention-decisions'

/**
 * Inside a transaction: replaces the manuscript's conventions with `change(current)`, writes
 * the audit entry and requests a run of the newest revision (row and job in this transaction).
 */
export async function applyConventionsInTransaction(trx: Db, queue: CheckQueue, input: { manuscriptId: string, actorId: string, change: (current: Record<string, string>) => Record<string, string>, decisionId?: string }): Promise<{ conventions: Record<string, string>, checkRunId: string | null }> {
  const before = await lockManuscriptConventions(trx, input.manuscriptId)
  const conventions = input.change(before)
  await trx.updateTable('manuscripts').set({ conventions: JSON.stringify(conventions), updated_at: new Date() }).where('id', '=', input.manuscriptId).execute()
  await appendAudit(trx, { actorId: input.actorId, action: 'manuscript.conventions-set', subjectType: 'manuscript', subjectId: input.manuscriptId, details: { before, after: conventions, ...(input.decisionId ? { decisionId: input.decisionId } : {}) } })
  const [newest] = await listRevisions(trx, input.manuscriptId)
  const checkRunId = newest ? (await requestCheckRun(trx, queue, { revisionId: newest.id, requestedBy: input.actorId, conventions })).id : null
  return { conventions, checkRunId }
}

/** Fixes the manuscript's conventions (axes left out are inferred) and re-checks its newest revision. */
export async function setManuscriptConventions(db: Db, queue: CheckQueue, input: { manuscriptId: string, actorId: string, conventions: Record<string, string> }) {
  return db.transaction().execute(trx => applyConventionsInTransaction(trx, queue, { ...input, change: () => input.conventions }))
}

export interface DecisionOutcome { decisionId: string, status: ConventionDecisionStatus, checkRunId: string | null }

/** A member proposes a convention on one axis; accepted at once when nobody else has to agree. */
export async function proposeConvention(db: Db, queue: CheckQueue, input: { manuscriptId: string, userId: string, axis: string, conventionId: string }): Promise<DecisionOutcome> {
  return db.transaction().execute(async (trx) => {
    const current = await lockManuscriptConventions(trx, input.manuscriptId)
    if (current[input.axis] === input.conventionId) throw new DomainError('conflict', 'The manuscript already follows this convention')
    if (await findOpenDecisionOnAxis(trx, input.manuscriptId, input.axis)) throw new DomainError('conflict', 'A proposal on this axis is already open; agree to it or wait until it is withdrawn')
    const { id } = await insertConventionDecision(trx, { ...input, proposedBy: input.userId })
    await appendAudit(trx, { actorId: input.userId, action: 'convention.proposed', subjectType: 'convention-decision', subjectId: id, details: { manuscriptId: input.manuscriptId, axis: input.axis, conventionId: input.conventionId } })
    return acceptIfAgreed(trx, queue, { id, manuscriptId: input.manuscriptId, proposedBy: input.userId, axis: input.axis, conventionId: input.conventionId, agreedBy: [] }, input.userId)
  })
}

/** A member other than the proposer agrees; agreeing twice changes nothing. */
export async function agreeToConvention(db: Db, queue: CheckQueue, input: { manuscriptId: string, userId: string, decisionId: string }): Promise<DecisionOutcome> {
  return db.transaction().execute(async (trx) => {
    await lockManuscriptConventions(trx, input.manuscriptId)
    const decision = await lockConventionDecision(trx, input.manuscriptId, input.decisionId)
    if (!decision) throw new DomainError('not-found', 'No such convention decision')
    if (decision.status !== 'proposed') throw new DomainError('conflict', 'This proposal is no longer open')
    if (decision.proposed_by === input.userId) throw new DomainError('conflict', 'The proposer\'s agreement is implied by the proposal')
    const agreedBy = decision.agreed_by as string[]
    if (agreedBy.includes(input.userId)) return { decisionId: decision.id, status: decision.status, checkRunId: null }
    const updated = [...agreedBy, input.userId]
    await setDecisionAgreements(trx, decision.id, updated)
    await appendAudit(trx, { actorId: input.userId, action: 'convention.agreed', subjectType: 'convention-decision', subjectId: decision.id, details: { manuscriptId: input.manuscriptId, axis: decision.axis, conventionId: decision.convention_id } })
    return acceptIfAgreed(trx, queue, { id: decision.id, manuscriptId: input.manuscriptId, proposedBy: decision.proposed_by, axis: decision.axis, conventionId: decision.convention_id, agreedBy: updated }, input.userId)
  })
}

/** The proposer takes an open proposal back. */
export async function withdrawConvention(db: Db, input: { manuscriptId: string, userId: string, decisionId: string }): Promise<DecisionOutcome> {
  return db.transaction().execute(async (trx) => {
    await lockManuscriptConventions(trx, input.manuscriptId)
    const decision = await lockConventionDecision(trx, input.manuscriptId, input.decisionId)
    if (!decision) throw new DomainError('not-found', 'No such convention decision')
    if (decision.proposed_by !== input.userId) throw new DomainError('forbidden', 'Only the member who proposed it may withdraw a proposal')
    if (decision.status !== 'proposed') throw new DomainError('conflict', 'This proposal is no longer open')
    await closeConventionDecision(trx, decision.id, 'withdrawn')
    await appendAudit(trx, { actorId: input.userId, action: 'convention.withdrawn', subjectType: 'convention-decision', subjectId: decision.id, details: { manuscriptId: input.manuscriptId, axis: decision.axis, conventionId: decision.convention_id } })
    return { decisionId: decision.id, status: 'withdrawn' as const, checkRunId: null }
  })
}

/** The members (other than the proposer) who have not agreed yet. */
function missingAgreements(members: { userId: string }[], proposedBy: string, agreedBy: readonly string[]): string[] {
  return members.map(m => m.userId).filter(id => id !== proposedBy && !agreedBy.includes(id))
}

async function acceptIfAgreed(trx: Db, queue: CheckQueue, d: { id: string, manuscriptId: string, proposedBy: string, axis: string, conventionId: string, agreedBy: string[] }, actorId: string): Promise<DecisionOutcome> {
  const members = await listManuscriptMembers(trx, d.manuscriptId)
  if (missingAgreements(members, d.proposedBy, d.agreedBy).length > 0) return { decisionId: d.id, status: 'proposed', checkRunId: null }
  await closeConventionDecision(trx, d.id, 'accepted')
  await appendAudit(trx, { actorId, action: 'convention.accepted', subjectType: 'convention-decision', subjectId: d.id, details: { manuscriptId: d.manuscriptId, axis: d.axis, conventionId: d.conventionId, agreedBy: d.agreedBy } })
  const { checkRunId } = await applyConventionsInTransaction(trx, queue, { manuscriptId: d.manuscriptId, actorId, decisionId: d.id, change: current => ({ ...current, [d.axis]: d.conventionId }) })
  return { decisionId: d.id, status: 'accepted', checkRunId }
}

/** The manuscript's conventions and every decision about them, with who proposed and who agreed when. */
export async function conventionDecisionsView(db: Db, manuscriptId: string): Promise<ConventionDecisionsView> {
  const [rows, members, conventions] = await Promise.all([
    listConventionDecisions(db, manuscriptId),
    listManuscriptMembers(db, manuscriptId),
    db.selectFrom('manuscripts').select('conventions').where('id', '=', manuscriptId).executeTakeFirstOrThrow(),
  ])
  const times = await listAgreementTimes(db, rows.map(r => r.id))
  // Names of people who agreed but have since left the manuscript are still shown, from their user rows.
  const agreedIds = [...new Set(rows.flatMap(r => r.agreed_by as string[]))]
  const names = new Map(members.map(m => [m.userId, m.displayName]))
  const missingNames = agreedIds.filter(id => !names.has(id))
  if (missingNames.length > 0) {
    for (const u of await db.selectFrom('users').select(['id', 'display_name']).where('id', 'in', missingNames).execute()) names.set(u.id, u.display_name)
  }
  const person = (userId: string) => ({ userId, displayName: names.get(userId) ?? 'a former member' })
  return {
    conventions: conventions.conventions,
    decisions: rows.map(r => ({
      id: r.id,
      axis: r.axis,
      conventionId: r.convention_id,
      status: r.status,
      proposedBy: { userId: r.proposed_by, displayName: r.proposerName },
      createdAt: r.created_at.toISOString(),
      agreedBy: (r.agreed_by as string[]).map(id => ({ ...person(id), at: times.get(`${r.id}:${id}`)?.toISOString() ?? null })),
      waitingFor: r.status === 'proposed' ? missingAgreements(members, r.proposed_by, r.agreed_by as string[]).map(person) : [],
      decidedAt: r.decided_at?.toISOString() ?? null,
    })),
  }
}
