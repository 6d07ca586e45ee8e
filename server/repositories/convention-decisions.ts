import { sql } from 'kysely'
import type { Db } from '../database/connect'

/** Convention decisions of a manuscript; `agreed_by` holds user ids, the times of agreement are in the audit log. */

export async function insertConventionDecision(db: Db, input: { manuscriptId: string, axis: string, conventionId: string, proposedBy: string }) {
  return db.insertInto('convention_decisions')
    .values({ manuscript_id: input.manuscriptId, axis: input.axis, convention_id: input.conventionId, proposed_by: input.proposedBy, agreed_by: '[]' })
    .returning(['id'])
    .executeTakeFirstOrThrow()
}

/** The open proposal on one axis, if any. */
export async function findOpenDecisionOnAxis(db: Db, manuscriptId: string, axis: string) {
  return db.selectFrom('convention_decisions').select('id')
    .where('manuscript_id', '=', manuscriptId).where('axis', '=', axis).where('status', '=', 'proposed')
    .executeTakeFirst()
}

/** One decision of a manuscript, locked for the rest of the transaction so agreements are counted one at a time. */
export async function lockConventionDecision(db: Db, manuscriptId: string, decisionId: string) {
  return db.selectFrom('convention_decisions').selectAll()
    .where('id', '=', decisionId).where('manuscript_id', '=', manuscriptId)
    .forUpdate()
    .executeTakeFirst()
}

export async function setDecisionAgreements(db: Db, decisionId: string, agreedBy: string[]): Promise<void> {
  await db.updateTable('convention_decisions').set({ agreed_by: JSON.stringify(agreedBy) }).where('id', '=', decisionId).execute()
}

export async function closeConventionDecision(db: Db, decisionId: string, status: 'accepted' | 'withdrawn'): Promise<void> {
  await db.updateTable('convention_decisions').set({ status, decided_at: new Date() }).where('id', '=', decisionId).execute()
}

/** All decisions of a manuscript, newest first, with the proposer's name. */
export async function listConventionDecisions(db: Db, manuscriptId: string) {
  return db.selectFrom('convention_decisions as d')
    .innerJoin('users as u', 'u.id', 'd.proposed_by')
    .select(['d.id', 'd.axis', 'd.convention_id', 'd.status', 'd.proposed_by', 'u.display_name as proposerName', 'd.agreed_by', 'd.created_at', 'd.decided_at'])
    .where('d.manuscript_id', '=', manuscriptId)
    .orderBy('d.created_at', 'desc')
    .execute()
}

/** When each member agreed to each decision, from the audit log (`convention.agreed` entries). */
export async function listAgreementTimes(db: Db, decisionIds: string[]): Promise<Map<string, Date>> {
  const times = new Map<string, Date>()
  if (decisionIds.length === 0) return times
  const rows = await db.selectFrom('audit_log')
    .select(['subject_id', 'actor_id', 'at'])
    .where('subject_type', '=', 'convention-decision')
    .where('subject_id', 'in', decisionIds)
    .where('action', '=', 'convention.agreed')
    .execute()
  for (const r of rows) if (r.actor_id) times.set(`${r.subject_id}:${r.actor_id}`, r.at)
  return times
}

/** Locks the manuscript row and returns its conventions, so two changes never overwrite each other. */
export async function lockManuscriptConventions(db: Db, manuscriptId: string): Promise<Record<string, string>> {
  const row = await sql<{ conventions: Record<string, string> }>`select conventions from manuscripts where id = ${manuscriptId} for update`.execute(db)
  return row.rows[0]?.conventions ?? {}
}
