import { auditSummary, auditSummaryCsv } from '../../../services/audit-summary'

/** The submission's audit summary as a CSV download, for its venue's editors only. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { submissionEditor: id })
  const csv = auditSummaryCsv(await auditSummary(useDb(), grant))
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="submission-${id}-audit.csv"`)
  return csv
})
