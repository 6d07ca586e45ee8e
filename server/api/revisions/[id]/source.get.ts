import { z } from 'zod'
import type { SourceFileView } from '#shared/types/api'
import { listRevisionFileKeys } from '../../../repositories/revisions'
import { decodeText, isTextPath } from '../../../storage/source-text'

const Query = z.object({ path: z.string().min(1).max(1024) })

/** One file of the revision with its text: the report page loads each file tab when it is opened. */
export default defineEventHandler(async (event): Promise<SourceFileView> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const { path } = await queryAs(event, Query)
  await authorize(event, { revision: id })
  const file = (await listRevisionFileKeys(useDb(), id)).find(f => f.path === path)
  if (!file) fail(404, 'not-found', 'No such file in this revision')
  return { path: file.path, text: isTextPath(file.path) ? decodeText(await getSource(file.storage_key)) : null }
})
