import type { SourceFileView } from '#shared/types/api'
import { listRevisionFileKeys } from '../../../repositories/revisions'
import { decodeText, isTextPath } from '../../../storage/source-text'

/** Every file of the revision with its text (the report page loads one file at a time from `source`). */
export default defineEventHandler(async (event): Promise<{ files: SourceFileView[] }> => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  await authorize(event, { revision: id })
  const files = await listRevisionFileKeys(useDb(), id)
  return {
    files: await Promise.all(files.map(async f => ({
      path: f.path,
      text: isTextPath(f.path) ? decodeText(await getSource(f.storage_key)) : null,
    }))),
  }
})
