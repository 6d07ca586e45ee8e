/**
 * A dropped folder is sent as files named by their path inside it (components/upload/UploadDrop.vue).
 * Regression guard: the multipart reader used to keep only the last segment of a file name, so a
 * folder's `sections/one.tex` arrived as `one.tex` and `\input{sections/one}` found nothing.
 */
import { describe, expect, it } from 'vitest'
import { filesForm, newMember } from './helpers'

describe('uploading a folder', () => {
  it('keeps each file\'s path inside the folder', async () => {
    const me = await newMember('folder')
    const { body } = await me.client.post('/api/manuscripts', { title: 'Folder upload' })
    const res = await me.client.post(`/api/manuscripts/${body.id}/revisions`, filesForm([
      { name: 'main.tex', content: '\\documentclass{article}\n\\begin{document}\\input{sections/one}\\end{document}\n' },
      { name: 'sections/one.tex', content: '$\\ell(2143) = 2$\n' },
    ]))
    expect(res.status).toBe(201)
    expect(res.body.files.map((f: { path: string }) => f.path).sort()).toEqual(['main.tex', 'sections/one.tex'])
  })

  it('still refuses a path that leaves the folder', async () => {
    const me = await newMember('folder-escape')
    const { body } = await me.client.post('/api/manuscripts', { title: 'Folder upload' })
    const res = await me.client.post(`/api/manuscripts/${body.id}/revisions`, filesForm([{ name: '../outside.tex', content: '\\documentclass{article}\n' }]))
    expect(res.status).toBe(422)
    expect(res.body.data.code).toBe('upload-path-unsafe')
  })
})
