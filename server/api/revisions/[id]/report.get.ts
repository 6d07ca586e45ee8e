import { createHash } from 'node:crypto'
import { z } from 'zod'
import type { CheckRunView, RevisionReportView } from '#shared/types/api'
import { revisionHead } from '../../../services/views'
import { checkRunProgress, revisionRunState } from '../../../services/check-runs'
import { findCheckRun, loadRunReport } from '../../../repositories/check-runs'

const Query = z.object({ run: z.string().uuid().optional() })

/**
 * A revision's newest run and the report of its newest finished run (same JSON schema as the
 * CLI's); with `?run=<id>`, that run of the revision instead (e.g. a referee's what-if run).
 * A finished run's report never changes, so once the run shown is finished the answer has an
 * ETag and a matching If-None-Match gets 304 without the report being loaded.
 * The answer is written as JSON text here, so a cached report is not serialised again.
 */
export default defineEventHandler(async (event): Promise<RevisionReportView | null> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const { run: runId } = await queryAs(event, Query)
  const grant = await authorize(event, { revision: id })
  const db = useDb()
  // Per request only the runs are read (one query); the revision's head never changes and comes
  // from memory after the first read (services/views.ts), the finished report from the report cache.
  const revision = await revisionHead(db, id)
  if (!revision) fail(404, 'not-found', 'No such revision')
  let run: CheckRunView | null
  let reportRunId: string | undefined
  if (runId) {
    const row = await findCheckRun(db, runId)
    if (!row || row.revision_id !== id) fail(404, 'not-found', 'No such check run')
    run = await checkRunProgress(db, runId)
    reportRunId = row.status === 'finished' ? row.id : undefined
  }
  else {
    ({ run, reportRunId } = await revisionRunState(db, id))
  }
  const head = {
    manuscript: { id: grant.manuscriptId, title: grant.title },
    revision: { id, number: revision.number, mainFile: revision.mainFile, files: revision.files },
    viewer: grant.viewer,
    run,
  }
  if (run && run.status === 'finished' && run.id === reportRunId) {
    const etag = `"${createHash('sha256').update(JSON.stringify(head)).digest('base64url').slice(0, 27)}"`
    setResponseHeader(event, 'etag', etag)
    // Private: the answer depends on who asks (viewer); revalidate so a new run is seen at once.
    setResponseHeader(event, 'cache-control', 'private, no-cache')
    if (getRequestHeader(event, 'if-none-match')?.split(/\s*,\s*/).includes(etag)) {
      setResponseStatus(event, 304)
      return null
    }
  }
  // The finished report comes serialised from the in-process cache (server/utils/report-cache.ts);
  // only the small head is serialised per request.
  const report = reportRunId ? await finishedReportJson(reportRunId, () => loadRunReport(db, reportRunId)) : null
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  return `${JSON.stringify(head).slice(0, -1)},"report":${report ?? 'null'}}` as unknown as RevisionReportView
})
