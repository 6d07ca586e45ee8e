/**
 * `scholium check arxiv:<id>` against the fake e-print endpoint (scripts/fake-arxiv.ts), started here
 * on a free port and named through NUXT_ARXIV_BASE_URL, as the web server is.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { startFakeArxiv, type FakeArxiv } from '../../../scripts/fake-arxiv'

const ROOT = join(import.meta.dirname, '../../..')

// Asynchronous, so the fake in this process can answer while the command runs.
function scholium(...args: string[]): Promise<{ code: number | null, stdout: string, stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [join(ROOT, 'bin/scholium.mjs'), ...args], { cwd: ROOT, env: { ...process.env, NO_COLOR: '1', NUXT_ARXIV_BASE_URL: fake.url } })
    let stdout = ''
    let stderr = ''
    child.stdout.on('data', (c) => { stdout += c })
    child.stderr.on('data', (c) => { stderr += c })
    child.on('close', code => resolve({ code, stdout, stderr }))
  })
}

let fake: FakeArxiv
beforeAll(async () => { fake = await startFakeArxiv() })
afterAll(async () => { await fake.close() })

describe('scholium check arxiv:<id>', () => {
  it('checks a gzipped-tar e-print with its included files', async () => {
    const run = await scholium('check', 'arxiv:2612.00001v1', '--json')
    expect(run.stderr).toBe('')
    const report = JSON.parse(run.stdout)
    expect(report.files.map((f: any) => f.path).sort()).toEqual(['main.tex', 'sections/double.tex'])
    expect(report.claims.some((c: any) => c.file === 'sections/double.tex')).toBe(true)
  })

  it('checks a single-file e-print and an old-style identifier', async () => {
    const single = JSON.parse((await scholium('check', 'arxiv:2612.00002', '--json')).stdout)
    expect(single.files.map((f: any) => f.path)).toEqual(['2612.00002.tex'])
    expect(single.summary.claims).toBeGreaterThan(0)
    const old = JSON.parse((await scholium('check', 'arxiv:math/0613001', '--json')).stdout)
    expect(old.files.map((f: any) => f.path)).toEqual(['tilings.tex'])
  })

  it('refuses a PDF-only submission, an unknown id and a malformed one with exit 2 and a clear message', async () => {
    const pdf = await scholium('check', 'arxiv:2612.00003')
    expect(pdf.code).toBe(2)
    expect(pdf.stderr).toContain('only a PDF')
    const missing = await scholium('check', 'arxiv:2612.09999')
    expect(missing.code).toBe(2)
    expect(missing.stderr).toContain('(not-found)')
    const malformed = await scholium('check', 'arxiv:not-an-id')
    expect(malformed.code).toBe(2)
    expect(malformed.stderr).toContain('(invalid-id)')
  })
})
