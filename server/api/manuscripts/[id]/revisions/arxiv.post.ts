import { z } from 'zod'
import { createRevision } from '../../../../services/revisions'
import { formatArxivId } from '../../../../arxiv/client'

const Body = z.object({ identifier: z.string().trim().min(1, 'Give an arXiv identifier').max(60) })

/** "Fetch from arXiv": the e-print of an identifier, stored as the manuscript's next revision through the upload path. */
export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  const { identifier } = await readBodyAs(event, Body)
  const eprint = await fetchEprintOrFail(event, identifier)
  const revision = await createRevision(useDb(), {
    manuscriptId: id, userId: grant.user.id, parts: [{ filename: eprint.filename, data: eprint.data }],
    note: `Fetched from arXiv: ${formatArxivId(eprint.id)}`, conventions: grant.conventions,
  })
  setResponseStatus(event, 201)
  return { ...revision, arxiv: formatArxivId(eprint.id) }
})
