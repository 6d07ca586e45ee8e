/**
 * The installable command: `npm run pack:cli` packs the bundled CLI (scripts/build-cli.mjs), and
 * `npm install -g` of that tarball into an empty prefix gives a `scholium` that works from a
 * folder outside the repository, with no TypeScript compiler and no dependencies installed.
 *
 * Expected verdict: S_132 = x_1 is wrong, S_132 = x_1 + x_2 (the table of Schubert polynomials
 * for S_3 in Macdonald, "Notes on Schubert polynomials" (1991), recalled from memory).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { execFileSync, spawnSync } from 'node:child_process'
import { copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

const ROOT = join(import.meta.dirname, '../../..')
let scratch: string

beforeAll(() => { scratch = mkdtempSync(join(tmpdir(), 'scholium-pack-')) })
afterAll(() => { rmSync(scratch, { recursive: true, force: true }) })

describe('packed install', () => {
  it('npm pack, then npm install -g into an empty prefix, gives a working scholium with no dependencies', () => {
    execFileSync(process.execPath, [join(ROOT, 'scripts/build-cli.mjs')], { cwd: ROOT, stdio: 'pipe' })
    const packed = JSON.parse(execFileSync('npm', ['pack', join(ROOT, 'dist/cli'), '--json', '--pack-destination', scratch], { cwd: scratch, encoding: 'utf8' }))
    const tarball = join(scratch, packed[0].filename as string)
    expect(packed[0].files.map((f: { path: string }) => f.path).sort()).toEqual(['README.md', 'package.json', 'scholium.cjs', 'scholium.code-cache', 'scholium.mjs'])
    const manifest = JSON.parse(readFileSync(join(ROOT, 'dist/cli/package.json'), 'utf8'))
    expect(manifest.dependencies).toBeUndefined()

    const prefix = join(scratch, 'prefix')
    execFileSync('npm', ['install', '-g', '--prefix', prefix, '--no-audit', '--no-fund', '--offline', tarball], { cwd: scratch, stdio: 'pipe' })
    const command = join(prefix, 'bin/scholium')
    expect(existsSync(command)).toBe(true)
    // Nothing but the package itself was installed.
    expect(readdirSync(join(prefix, 'lib/node_modules'))).toEqual(['scholium'])

    const paperDir = mkdtempSync(join(scratch, 'paper-'))
    copyFileSync(join(ROOT, 'tests/fixtures/cli/one-wrong.tex'), join(paperDir, 'one-wrong.tex'))
    const run = spawnSync(command, ['check', 'one-wrong.tex'], { cwd: paperDir, encoding: 'utf8', env: { PATH: process.env.PATH, NO_COLOR: '1' } })
    expect(run.stderr).toBe('')
    expect(run.status).toBe(1)
    expect(run.stdout).toMatch(/5 verified, 1 mismatch/)
    expect(spawnSync(command, ['--version'], { encoding: 'utf8' }).stdout).toMatch(/^scholium engine \d+\.\d+\.\d+/)
    // The archive readers are loaded on demand inside the bundle; a .tar.gz goes through them.
    execFileSync('tar', ['czf', join(paperDir, 'paper.tar.gz'), '-C', paperDir, 'one-wrong.tex'])
    const archive = spawnSync(command, ['check', 'paper.tar.gz'], { cwd: paperDir, encoding: 'utf8', env: { PATH: process.env.PATH, NO_COLOR: '1' } })
    expect(archive.stderr).toBe('')
    expect(archive.stdout).toMatch(/5 verified, 1 mismatch/)

    // A damaged or missing code cache only costs time: V8 rejects it and compiles the bundle.
    const cache = join(prefix, 'lib/node_modules/scholium/scholium.code-cache')
    expect(existsSync(cache)).toBe(true)
    writeFileSync(cache, readFileSync(cache).subarray(0, 1000))
    const damaged = spawnSync(command, ['check', 'one-wrong.tex'], { cwd: paperDir, encoding: 'utf8', env: { PATH: process.env.PATH, NO_COLOR: '1' } })
    expect(damaged.stderr).toBe('')
    expect(damaged.status).toBe(1)
    expect(damaged.stdout).toMatch(/5 verified, 1 mismatch/)
    rmSync(cache)
    const missing = spawnSync(command, ['check', 'one-wrong.tex'], { cwd: paperDir, encoding: 'utf8', env: { PATH: process.env.PATH, NO_COLOR: '1' } })
    expect(missing.status).toBe(1)
    expect(missing.stdout).toMatch(/5 verified, 1 mismatch/)
  }, 120_000)
})
