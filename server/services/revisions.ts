import type { Db } from '../database/connect'
import { chooseMainFile } from '../../shared/latex'
import type { UploadErrorCode } from '#shared/types/uploads'
import { insertRevisionWithFiles, isStorageKeyReferenced, type StoredFile } from '../repositories/revisions'
import { requestCheckRun } from './check-runs'
import { holdSources } from './storage-sweep'
import { touchManuscript } from '../repositories/manuscripts'
import { appendAudit } from '../repositories/audit'
import { readUploadedFiles, UPLOAD_LIMITS, UploadRefusedError, type BundleFile, type UploadedFile, type UploadRefusalCode } from '../uploads'

/** A file held in memory (demo seed, tests); the web server passes files received to disk. */
export type UploadedPart = Extract<UploadedFile, { data: Buffer }>

/**
 * Stores a new revision: validate every file first, then put the bytes in S3
 * by content hash, then record revision, files, a queued check run and its
 * queue job in one transaction. A refusal or failure at any step
 * leaves nothing half-stored: objects this call created and nobody else
 * references are removed again.
 */
export async function createRevision(db: Db, input: { manuscriptId: string, userId: string, parts: UploadedFile[], note: string, conventions: Record<string, string> }) {
  const files = await readOrRefuse(input.parts)
  // The reader's own rule, decided once here and stored; the worker hands it back to the reader.
  const mainFile = chooseMainFile(Object.fromEntries(files.map(f => [f.path, f.bytes]))) ?? null
  const createdKeys: string[] = []
  const stored: StoredFile[] = []
  try {
    for (const file of files) {
      const { key, created } = await putSource(file.bytes, file.sha256)
      if (created) createdKeys.push(key)
      stored.push({ path: file.path, storageKey: key, sha256: file.sha256, sizeBytes: file.size })
    }
  }
  catch (error) {
    await removeUnreferenced(db, createdKeys)
    console.error('[upload] storage failed', error)
    fail(503, 'storage-unavailable', 'File storage is unavailable; nothing was stored')
  }

  let result: { revision: { id: string, number: number }, checkRunId: string }
  try {
    const queue = await useQueue()
    result = await db.transaction().execute(async (trx) => {
      // Against a storage sweep running meanwhile: the objects are locked and known to be there.
      await holdSources(trx, sourceStore(), stored.map((f, i) => ({ storageKey: f.storageKey, sha256: f.sha256, bytes: files[i]!.bytes })))
      const revision = await insertRevisionWithFiles(trx, { manuscriptId: input.manuscriptId, uploadedBy: input.userId, mainFile, note: input.note, files: stored })
      const run = await requestCheckRun(trx, queue, { revisionId: revision.id, requestedBy: input.userId, conventions: input.conventions })
      await touchManuscript(trx, input.manuscriptId)
      await appendAudit(trx, {
        actorId: input.userId,
        action: 'revision.uploaded',
        subjectType: 'manuscript',
        subjectId: input.manuscriptId,
        details: { revision: revision.number, files: stored.map(f => ({ path: f.path, sha256: f.sha256, size: f.sizeBytes })) },
      })
      return { revision, checkRunId: run.id }
    })
  }
  catch (error) {
    await removeUnreferenced(db, createdKeys)
    throw error
  }
  return { id: result.revision.id, number: result.revision.number, checkRunId: result.checkRunId, files: stored.map(f => ({ path: f.path, sha256: f.sha256, sizeBytes: f.sizeBytes })) }
}

/** Reads and validates uploaded files; a refusal is a 422 with its code. Exported so a caller can refuse before creating anything. */
export async function readOrRefuse(parts: UploadedFile[]): Promise<BundleFile[]> {
  try {
    return await readUploadedFiles(parts)
  }
  catch (error) {
    if (error instanceof UploadRefusedError) {
      // The message is ours alone; the (escaped) entry name travels separately, never inside it.
      fail(422, `upload-${error.code}` satisfies UploadErrorCode, REFUSAL_MESSAGES[error.code], error.entry ? { entry: error.entry } : {})
    }
    throw error
  }
}

const MB = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`
const REFUSAL_MESSAGES: Record<UploadRefusalCode, string> = {
  'empty': 'The upload contains no files',
  'too-large': `The upload is too large: at most ${MB(UPLOAD_LIMITS.maxTotalBytes)} unpacked, ${MB(UPLOAD_LIMITS.maxFileBytes)} per file`,
  'too-many-files': `The upload has too many files: at most ${UPLOAD_LIMITS.maxFiles}`,
  'file-type': `A file is not part of a LaTeX source; accepted: ${[...UPLOAD_LIMITS.allowedExtensions].join(' ')}`,
  'path-unsafe': 'A file path is unsafe (absolute, leaving the bundle, or with control characters)',
  'path-too-long': `A file path is too long or too deeply nested (at most ${UPLOAD_LIMITS.maxPathDepth} folders)`,
  'link-entry': 'The archive contains a link; upload the files themselves',
  'special-entry': 'The archive contains a device or other special entry',
  'compression-ratio': `The archive unpacks to more than ${UPLOAD_LIMITS.maxCompressionRatio} times its size`,
  'archive-corrupt': 'The archive cannot be read to the end; it may be damaged',
  'archive-unsupported': 'The archive uses encryption or a compression method Scholium does not read',
  'nested-archive': 'The archive contains another archive; unpack it first',
  'mixed-upload': 'Send either one archive or plain files, not both',
  'duplicate-path': 'Two files in the upload have the same path',
  'no-tex': 'The upload contains no .tex file',
}

async function removeUnreferenced(db: Db, keys: string[]): Promise<void> {
  for (const key of keys) {
    if (await isStorageKeyReferenced(db, key).catch(() => true)) continue
    await deleteSource(key).catch(error => console.error('[upload] could not remove orphan object', key, error))
  }
}
