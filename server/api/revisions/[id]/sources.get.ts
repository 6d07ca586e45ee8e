import { z } from 'zod'
import type { SourceFileView } from '#shared/types/api'
import { listRevisionFileKeys } from '../../../repositories/revisions'

const Params = z.object({ id: z.string() })
const TEXT_FILE = /\.(tex|sty|cls|bib|bbl|txt|md|cfg|def|clo|bst|tikz|csv|dat)$/i

/** The revision's text files, for the line-by-line report. */
export default defineEventHandler(async (event): Promise<{ files: SourceFileView[] }> => {
  const { id } = await routeParamsAs(event, Params)
  await authorize(event, { revision: id })
  const files = await listRevisionFileKeys(useDb(), id)
  return {
    files: await Promise.all(files.map(async f => ({
      path: f.path,
      text: TEXT_FILE.test(f.path) ? decodeText(await getSource(f.storage_key)) : null,
    }))),
  }
})

function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes)
  }
  catch {
    return new TextDecoder('latin1').decode(bytes)
  }
}
