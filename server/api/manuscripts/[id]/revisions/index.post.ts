import { createRevision } from '../../../../services/revisions'
import { MalformedUploadError, MAX_UPLOAD_REQUEST_BYTES, receiveMultipartUpload, UPLOAD_LIMITS, UploadRefusedError, type ReceivedUpload } from '../../../../uploads'

export default defineEventHandler(async (event) => {
  const { id } = await routeParamsAs(event, uuidParams('id'))
  const grant = await authorize(event, { manuscript: id })
  let upload: ReceivedUpload
  try {
    // Streamed to a temporary folder with a hard byte limit on the stream itself, so a body
    // without Content-Length (chunked) is stopped as soon as it crosses the limit.
    upload = await receiveMultipartUpload(event.node.req, { fileField: 'files', maxRequestBytes: MAX_UPLOAD_REQUEST_BYTES, maxFiles: UPLOAD_LIMITS.maxFiles, maxFieldBytes: 8 * 1024 })
  }
  catch (error) {
    if (error instanceof UploadRefusedError) {
      // The rest of the body is left unread: close the connection after answering.
      setResponseHeader(event, 'connection', 'close')
      if (error.code === 'too-large') fail(413, 'upload-too-large', 'The upload is larger than 60 MB')
      fail(413, `upload-${error.code}`, 'The upload has too many files')
    }
    if (error instanceof MalformedUploadError) fail(400, 'invalid-input', 'Send the files as multipart/form-data')
    throw error
  }
  try {
    if (upload.files.length === 0) fail(400, 'upload-empty', 'Choose at least one file')
    const note = (upload.fields.note ?? '').slice(0, 2000)
    const revision = await createRevision(useDb(), { manuscriptId: id, userId: grant.user.id, parts: upload.files, note, conventions: grant.conventions })
    setResponseStatus(event, 201)
    return revision
  }
  finally {
    await upload.dispose()
  }
})
