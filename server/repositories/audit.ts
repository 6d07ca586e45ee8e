import type { Db } from '../database/connect'

/** Appends one entry to the audit log (the table refuses updates and deletes). */
export async function appendAudit(db: Db, entry: { actorId: string | null, action: string, subjectType: string, subjectId: string, details?: Record<string, unknown> }): Promise<void> {
  await db.insertInto('audit_log').values({
    actor_id: entry.actorId,
    action: entry.action,
    subject_type: entry.subjectType,
    subject_id: entry.subjectId,
    details: JSON.stringify(entry.details ?? {}),
  }).execute()
}
