import { z } from 'zod'
import type { RevisionReportView } from '#shared/types/api'
import { revisionViews } from '../../../services/views'
import { latestFinishedRun, loadRunReport } from '../../../repositories/claims'

const Params = z.object({ id: z.string() })

/** A revision's newest run and the report of its newest finished run (same JSON schema as the CLI's). */
export default defineEventHandler(async (event): Promise<RevisionReportView> => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { revision: id })
  const db = useDb()
  const [revision] = await revisionViews(db, grant.manuscriptId, id)
  if (!revision) fail(404, 'not-found', 'No such revision')
  const finished = await latestFinishedRun(db, id)
  return {
    manuscript: { id: grant.manuscriptId, title: grant.title },
    revision: { id, number: revision.number, mainFile: revision.mainFile, files: revision.files },
    viewer: grant.viewer,
    run: revision.latestRun,
    report: finished ? await loadRunReport(db, finished.id) : null,
  }
})
