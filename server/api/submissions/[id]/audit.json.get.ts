import type { AuditSummary } from '#shared/types/editorial'
import { auditSummary } from '../../../services/audit-summary'

/** The submission's audit summary as JSON, for its venue's editors only. */
export default defineEventHandler(async (event): Promise<AuditSummary> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { submissionEditor: id })
  return auditSummary(useDb(), grant)
})
