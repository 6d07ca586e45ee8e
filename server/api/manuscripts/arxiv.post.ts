import { z } from 'zod'
import { insertManuscript } from '../../repositories/manuscripts'
import { appendAudit } from '../../repositories/audit'
import { createRevision, readOrRefuse } from '../../services/revisions'
import { formatArxivId } from '../../arxiv/client'

const Body = z.object({
  identifier: z.string().trim().min(1, 'Give an arXiv identifier').max(60),
  title: z.string().trim().max(300).optional(),
})

/**
 * A new manuscript from an arXiv identifier. The e-print is fetched and its files read first, so a
 * wrong identifier, a PDF-only submission or a refused bundle creates nothing.
 */
export default defineEventHandler(async (event) => {
  const { user } = await authorize(event, { signedIn: true })
  const { identifier, title } = await readBodyAs(event, Body)
  const eprint = await fetchEprintOrFail(event, identifier)
  const parts = [{ filename: eprint.filename, data: eprint.data }]
  await readOrRefuse(parts)
  const name = formatArxivId(eprint.id)
  const db = useDb()
  const manuscript = await db.transaction().execute(async (trx) => {
    const created = await insertManuscript(trx, { title: title || `arXiv:${name}`, ownerId: user.id })
    await appendAudit(trx, { actorId: user.id, action: 'manuscript.created', subjectType: 'manuscript', subjectId: created.id, details: { arxiv: name } })
    return created
  })
  const revision = await createRevision(db, { manuscriptId: manuscript.id, userId: user.id, parts, note: `Fetched from arXiv: ${name}`, conventions: {} })
  setResponseStatus(event, 201)
  return { id: manuscript.id, revision, arxiv: name }
})
