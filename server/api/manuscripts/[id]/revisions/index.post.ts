import { z } from 'zod'
import { createRevision, type UploadedPart } from '../../../../services/revisions'

const Params = z.object({ id: z.string() })
/** Checked before reading the body, so an oversized request is refused without buffering it. */
const MAX_REQUEST_BYTES = 60 * 1024 * 1024

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, Params)
  const grant = await authorize(event, { manuscript: id })
  const length = Number(getRequestHeader(event, 'content-length') ?? '0')
  if (length > MAX_REQUEST_BYTES) fail(413, 'upload-too-large', 'The upload is larger than 60 MB')
  const form = await readMultipartFormData(event)
  if (!form) fail(400, 'invalid-input', 'Send the files as multipart/form-data')
  const parts: UploadedPart[] = []
  let note = ''
  for (const field of form) {
    if (field.name === 'note' && !field.filename) note = field.data.toString('utf8').slice(0, 2000)
    else if (field.name === 'files' && field.filename) parts.push({ filename: field.filename, data: field.data })
  }
  if (parts.length === 0) fail(400, 'upload-empty', 'Choose at least one file')
  const revision = await createRevision(useDb(), { manuscriptId: id, userId: grant.user.id, parts, note, conventions: grant.conventions })
  setResponseStatus(event, 201)
  return revision
})
