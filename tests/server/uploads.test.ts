import { createHash } from 'node:crypto'
import { readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { GetObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { db, filesForm, newMember, SMALL_TEX } from './helpers'
import { makeTarGz, makeZip } from '../helpers/archives'

const s3 = new S3Client({
  endpoint: process.env.NUXT_S3_ENDPOINT,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
})
const sha256 = (content: string | Uint8Array) => createHash('sha256').update(content).digest('hex')

/** Every object file s3rver keeps on disk, to prove a refused upload stored nothing. */
function storedObjectCount(): number {
  const root = process.env.S3_DIR!
  let count = 0
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name)
      if (statSync(path).isDirectory()) walk(path)
      else if (name.endsWith('._S3rver_object')) count++
    }
  }
  walk(root)
  return count
}

async function freshManuscript() {
  const me = await newMember('uploader')
  const { body } = await me.client.post('/api/manuscripts', { title: 'Upload target' })
  return { ...me, manuscriptId: body.id as string }
}

describe('uploading a revision', () => {
  it('stores a single .tex file in S3 under its SHA-256 and lists it on the revision', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const content = `${SMALL_TEX}% unique ${Math.random()}\n`
    const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'draft.tex', content }]))
    expect(res.status).toBe(201)
    expect(res.body.files).toEqual([{ path: 'draft.tex', sha256: sha256(content), sizeBytes: Buffer.byteLength(content) }])
    const row = await db.selectFrom('revision_files').selectAll().where('revision_id', '=', res.body.id).executeTakeFirstOrThrow()
    const object = await s3.send(new GetObjectCommand({ Bucket: process.env.NUXT_S3_BUCKET, Key: row.storage_key }))
    expect(await object.Body!.transformToString()).toBe(content)
    expect(row.storage_key).toContain(sha256(content))
  })

  it('unpacks an arXiv-style .tar.gz with a top folder and numbers revisions in order', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const bundle = await makeTarGz([
      { path: 'paper/main.tex', content: '\\documentclass{amsart}\n\\begin{document}\\input{sections/one}\\end{document}\n' },
      { path: 'paper/sections/one.tex', content: '$\\ell(2143) = 2$\n' },
    ])
    const first = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'paper.tar.gz', content: bundle }]))
    expect(first.status).toBe(201)
    expect(first.body.files.map((f: { path: string }) => f.path).sort()).toEqual(['main.tex', 'sections/one.tex'])
    const second = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'again.tar.gz', content: bundle }]))
    expect(second.body.number).toBe(2)
    const view = await client.get(`/api/manuscripts/${manuscriptId}`)
    expect(view.body.revisions.map((r: { number: number, mainFile: string }) => [r.number, r.mainFile])).toEqual([[2, 'main.tex'], [1, 'main.tex']])
  })

  it('refuses a zip with a path that leaves the bundle, with a code, storing nothing', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const before = storedObjectCount()
    const zip = makeZip([
      { path: 'fine.tex', content: `\\documentclass{article} % ${Math.random()}` },
      { path: '../escape.tex', content: 'outside' },
    ])
    const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([{ name: 'bundle.zip', content: zip }]))
    expect(res.status).toBe(422)
    expect(res.body.data.code).toBe('upload-path-unsafe')
    expect(res.body.message).not.toContain('../escape.tex')
    expect(res.body.data.entry).toContain('escape.tex')
    expect(await db.selectFrom('revisions').select('id').where('manuscript_id', '=', manuscriptId).execute()).toEqual([])
    expect(storedObjectCount()).toBe(before)
  })

  it('refuses a file type that is not part of a LaTeX source', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([
      { name: 'paper.tex', content: SMALL_TEX },
      { name: 'tool.exe', content: 'MZ' },
    ]))
    expect(res.status).toBe(422)
    expect(res.body.data.code).toBe('upload-file-type')
  })

  it('refuses an upload without files', async () => {
    const { client, manuscriptId } = await freshManuscript()
    const res = await client.post(`/api/manuscripts/${manuscriptId}/revisions`, filesForm([]))
    expect(res.status).toBe(400)
    expect(res.body.data.code).toBe('upload-empty')
  })
})
