/**
 * The `scholium check` command, run as a separate process exactly as a user runs it
 * (node bin/scholium.mjs …), on the invented manuscripts in tests/fixtures/cli/.
 *
 * Expected values and where they come from:
 * - S_132 = x_1 + x_2, S_2143 = x_1^2 + x_1x_2 + x_1x_3, S_312 = x_1^2, S_231 = x_1x_2: the table of
 *   Schubert polynomials for S_3 and S_4 in Macdonald, "Notes on Schubert polynomials" (1991), recalled from memory.
 * - S_213 S_213 = S_312, S_213 S_132 = S_231 + S_312, S_132 S_132 = S_231 + S_1423: Monk's rule (common practice).
 * - s_1 s_1 = s_2 + s_11: the Pieri rule; c^{321}_{21,21} = 2: the example in lrcalc's documentation;
 *   c^{2}_{1,1} = 1 (not 2): the Pieri rule.
 * - S_321(x;y) = (x_1−y_1)(x_1−y_2)(x_2−y_1) and S_231(x;y) = (x_1−y_1)(x_2−y_1), S_132(x;y) = x_1+x_2−y_1−y_2:
 *   the product formula for w_0 and one divided difference (common practice, Lascoux–Schützenberger's definition).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, readdirSync, rmSync, statSync, symlinkSync, writeFileSync, mkdirSync, copyFileSync } from 'node:fs'
import { createHash } from 'node:crypto'
import { tmpdir } from 'node:os'
import { join, relative } from 'node:path'
import { makeTarGz, makeZip } from '../../helpers/archives'

const ROOT = join(import.meta.dirname, '../../..')
const FIXTURES = join(ROOT, 'tests/fixtures/cli')
const ESC = String.fromCharCode(27)

function scholium(...args: string[]): { code: number | null, stdout: string, stderr: string } {
  const run = spawnSync(process.execPath, [join(ROOT, 'bin/scholium.mjs'), ...args], {
    cwd: ROOT, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' }, maxBuffer: 64 << 20, timeout: 60_000,
  })
  return { code: run.status, stdout: run.stdout, stderr: run.stderr }
}

function report(...args: string[]): any {
  const run = scholium(...args, '--json')
  expect(run.stderr).toBe('')
  return JSON.parse(run.stdout)
}

/** Every file under `dir`, relative path → content. */
function filesUnder(dir: string): { path: string, content: Buffer }[] {
  const out: { path: string, content: Buffer }[] = []
  const walk = (d: string) => {
    for (const name of readdirSync(d).sort()) {
      const full = join(d, name)
      if (statSync(full).isDirectory()) walk(full)
      else out.push({ path: relative(dir, full).split('\\').join('/'), content: readFileSync(full) })
    }
  }
  walk(dir)
  return out
}

let scratch: string
beforeAll(() => { scratch = mkdtempSync(join(tmpdir(), 'scholium-cli-')) })
afterAll(() => { rmSync(scratch, { recursive: true, force: true }) })

describe('exit codes', () => {
  it('0 when every claim of a correct manuscript is verified', () => {
    const run = scholium('check', join(FIXTURES, 'all-correct.tex'))
    expect(run.stderr).toBe('')
    expect(run.code).toBe(0)
    expect(run.stdout).toMatch(/6 verified, 0 mismatch/)
    // Not a terminal: no colour codes.
    expect(run.stdout).not.toContain(ESC)
  })
  it('1 when one claim is wrong, and the text marks that line', () => {
    const run = scholium('check', join(FIXTURES, 'one-wrong.tex'))
    expect(run.code).toBe(1)
    const line8 = run.stdout.split('\n').find(l => /^\s+8\s/.test(l))
    expect(line8).toMatch(/≠ mismatch\s+\\Sch\{132\} = x_1$/)
    // The term the manuscript dropped is named in the difference.
    expect(run.stdout).toMatch(/missing\s+\+x_\{2\}/)
    expect(run.stdout).toMatch(/5 verified, 1 mismatch/)
    expect(run.stdout).toMatch(/not prove/)
  })
  it('1 when a claim could not be computed (an error verdict counts as a failure)', () => {
    const run = scholium('check', join(FIXTURES, 'malformed.tex'))
    expect(run.code).toBe(1)
    expect(run.stdout).toMatch(/^\s+4\s+! error/m)
    expect(run.stdout).toMatch(/1 verified, 0 mismatch, 1 error/)
  })
  it('2 on a path that does not exist', () => {
    const run = scholium('check', join(scratch, 'no-such-paper.tex'))
    expect(run.code).toBe(2)
    expect(run.stderr).toMatch(/no such file or folder/)
    expect(run.stdout).toBe('')
  })
  it('2 on a corrupt zip, naming the refusal', () => {
    const path = join(scratch, 'broken.zip')
    writeFileSync(path, 'PK\u0003\u0004 this is not really a zip archive')
    const run = scholium('check', path)
    expect(run.code).toBe(2)
    expect(run.stderr).toMatch(/archive-corrupt/)
  })
  it('2 on an unknown convention, listing the valid ids', () => {
    const run = scholium('check', join(FIXTURES, 'all-correct.tex'), '--convention', 'xy-times')
    expect(run.code).toBe(2)
    expect(run.stderr).toMatch(/unknown convention "xy-times"/)
    for (const id of ['xy-minus', 'xy-plus', 'perm-w', 'perm-inverse', 'shape-rows', 'shape-columns', 'beta-minus', 'beta-plus']) expect(run.stderr).toContain(id)
  })
  it('2 on an unknown option, two choices on one axis, or a file that is not LaTeX', () => {
    expect(scholium('check', join(FIXTURES, 'all-correct.tex'), '--fast').code).toBe(2)
    const clash = scholium('check', join(FIXTURES, 'all-correct.tex'), '--convention=xy-plus,xy-minus')
    expect(clash.code).toBe(2)
    expect(clash.stderr).toMatch(/same axis/)
    const notes = join(scratch, 'notes.md')
    writeFileSync(notes, '# not a manuscript')
    expect(scholium('check', notes).code).toBe(2)
    const noTex = join(scratch, 'no-tex')
    mkdirSync(noTex)
    writeFileSync(join(noTex, 'refs.bib'), '@book{x, title={y}}')
    const run = scholium('check', noTex)
    expect(run.code).toBe(2)
    expect(run.stderr).toMatch(/no-tex/)
  })
  it('--help prints the usage with the exit codes and exits 0', () => {
    const run = scholium('--help')
    expect(run.code).toBe(0)
    expect(run.stdout).toMatch(/Exit status: 0/)
  })
})

describe('--json', () => {
  it('prints exactly the report: schema, documented fields, lines, verdicts and file hashes', () => {
    const r = report('check', join(FIXTURES, 'one-wrong.tex'))
    expect(r.schema).toBe('scholium.report/2')
    expect(Object.keys(r).sort()).toEqual(['claims', 'conventions', 'engine', 'files', 'macros', 'notRead', 'reproduceLibrary', 'schema', 'summary', 'warnings'])
    expect(Object.keys(r.summary).sort()).toEqual(['claims', 'durationMs', 'error', 'mismatch', 'notRead', 'otherConvention', 'skipped', 'unsupported', 'verified'])
    expect(r.summary).toMatchObject({ claims: 6, verified: 5, mismatch: 1, unsupported: 0, error: 0 })
    expect(r.claims.map((c: any) => [c.line, c.verdict])).toEqual([
      [8, 'mismatch'], [9, 'verified'], [10, 'verified'], [11, 'verified'], [14, 'verified'], [14, 'verified'],
    ])
    const wrong = r.claims[0]
    expect(wrong).toMatchObject({ file: 'one-wrong.tex', kind: 'schubert', holdsUnder: [] })
    expect(wrong.diff).toEqual({ basis: 'monomial', missing: [{ term: 'x_{2}', coefficient: '1' }], extra: [], wrongCoefficient: [] })
    const bytes = readFileSync(join(FIXTURES, 'one-wrong.tex'))
    expect(r.files).toEqual([{ path: 'one-wrong.tex', role: 'main', lines: bytes.toString('utf8').split('\n').length, sha256: createHash('sha256').update(bytes).digest('hex') }])
  })
  it('stores the scripts\' shared definitions once: each claim keeps only its own lines and the names it needs', () => {
    const r = report('check', join(FIXTURES, 'one-wrong.tex'))
    const withScript = r.claims.filter((c: any) => c.reproduce)
    expect(withScript.length).toBeGreaterThan(3)
    for (const c of withScript) {
      expect(Object.keys(c.reproduce).sort()).toEqual(['left', 'needs', 'right'])
      expect(c.reproduce.left + c.reproduce.right).not.toMatch(/def |import/)
      for (const name of c.reproduce.needs) expect(r.reproduceLibrary.helpers[name]).toMatch(new RegExp(`^def ${name}\\(`))
    }
  })
  it('exits 1 with --json too, and writes nothing to stderr', () => {
    const run = scholium('check', join(FIXTURES, 'one-wrong.tex'), '--json')
    expect(run.code).toBe(1)
    expect(run.stderr).toBe('')
  })
})

describe('--script-for', () => {
  // \Sch{132} = x_1 is wrong (S_132 = x_1 + x_2, Macdonald's table above); Debian's python3-sympy runs the script.
  it('prints a runnable SymPy script for one claim, which Debian\'s python3 runs to "differs by"; an unknown id exits 2', () => {
    const wrong = report('check', join(FIXTURES, 'one-wrong.tex')).claims[0]
    const run = scholium('check', join(FIXTURES, 'one-wrong.tex'), '--script-for', wrong.id)
    expect(run.code).toBe(0)
    expect(run.stdout).toMatch(/^# Recomputes/)
    const python = spawnSync('/usr/bin/python3', ['-'], { input: run.stdout, encoding: 'utf8', timeout: 60_000 })
    expect(python.stderr).toBe('')
    expect(python.stdout.trim()).toMatch(/^differs by /)
    const unknown = scholium('check', join(FIXTURES, 'one-wrong.tex'), '--script-for', 'nowhere.tex:1:1')
    expect(unknown.code).toBe(2)
    expect(unknown.stderr).toContain('no claim with that id')
  })
})

describe('folders and archives', () => {
  const strip = (r: any) => ({ ...r, summary: { ...r.summary, durationMs: 0 } })
  it('a folder, a .tar.gz and a .zip of it give the same report', async () => {
    const folder = join(FIXTURES, 'bundle')
    const entries = filesUnder(folder).map(f => ({ path: `two-tables/${f.path}`, content: f.content }))
    const tgz = join(scratch, 'two-tables.tar.gz')
    writeFileSync(tgz, await makeTarGz(entries))
    const zip = join(scratch, 'two-tables.zip')
    writeFileSync(zip, makeZip(entries))
    const fromFolder = strip(report('check', folder))
    expect(fromFolder.files.map((f: any) => [f.path, f.role])).toEqual([['main.tex', 'main'], ['sections/products.tex', 'included']])
    expect(fromFolder.claims.map((c: any) => [c.file, c.line, c.verdict])).toEqual([
      ['main.tex', 9, 'verified'], ['main.tex', 9, 'verified'],
      ['sections/products.tex', 3, 'verified'], ['sections/products.tex', 4, 'verified'], ['sections/products.tex', 6, 'mismatch'],
    ])
    expect(strip(report('check', tgz))).toEqual(fromFolder)
    expect(strip(report('check', zip))).toEqual(fromFolder)
  })
  it('a folder: dotfiles are not read, other file types are left out with a warning, links leaving it are refused', () => {
    const dir = join(scratch, 'working-copy')
    mkdirSync(join(dir, '.git'), { recursive: true })
    copyFileSync(join(FIXTURES, 'all-correct.tex'), join(dir, 'paper.tex'))
    writeFileSync(join(dir, '.git', 'notes.tex'), '\\[ \\mathfrak{S}_{132} = x_1 \\]')
    writeFileSync(join(dir, 'paper.aux'), '\\relax')
    const r = report('check', dir)
    expect(r.files.map((f: any) => f.path)).toEqual(['paper.tex'])
    expect(r.warnings).toEqual([{ code: 'file-left-out', file: 'paper.aux', message: expect.stringMatching(/left out/) }])
    expect(r.summary.mismatch).toBe(0)

    symlinkSync(join(FIXTURES, 'one-wrong.tex'), join(dir, 'borrowed.tex'))
    const run = scholium('check', dir)
    expect(run.code).toBe(2)
    expect(run.stderr).toMatch(/borrowed\.tex: a link that leaves the folder/)
  })
  it('a single .tex file is read alone, and says so when it inputs other files', () => {
    const r = report('check', join(FIXTURES, 'bundle', 'main.tex'))
    expect(r.files.map((f: any) => f.path)).toEqual(['main.tex'])
    expect(r.warnings.map((w: any) => w.code)).toEqual(['missing-file', 'single-file'])
    expect(r.claims).toHaveLength(2)
  })
  it('--main chooses the main file, and an unknown one is refused', () => {
    expect(report('check', join(FIXTURES, 'bundle'), '--main', 'main.tex').files[0]).toMatchObject({ path: 'main.tex', role: 'main' })
    const run = scholium('check', join(FIXTURES, 'bundle'), '--main', 'paper.tex')
    expect(run.code).toBe(2)
    expect(run.stderr).toMatch(/no such file/)
  })
})

describe('--convention', () => {
  it('fixing xy-plus turns the x_i + y_j claim from a mismatch into verified (and the x_i − y_j ones into mismatches)', () => {
    const file = join(FIXTURES, 'double-signs.tex')
    const inferred = report('check', file)
    expect(inferred.conventions.inferred.doubleSign).toBe('xy-minus')
    expect(inferred.claims.map((c: any) => [c.line, c.verdict])).toEqual([[7, 'verified'], [9, 'verified'], [11, 'mismatch']])
    expect(inferred.claims[2].holdsUnder).toEqual(['xy-plus'])

    for (const args of [['--convention', 'xy-plus'], ['--convention=xy-plus'], ['--convention=perm-w,xy-plus']]) {
      const fixed = report('check', file, ...args)
      expect(fixed.conventions.fixed.doubleSign).toBe('xy-plus')
      expect(fixed.conventions.used.doubleSign).toBe('xy-plus')
      expect(fixed.claims.map((c: any) => [c.line, c.verdict])).toEqual([[7, 'mismatch'], [9, 'mismatch'], [11, 'verified']])
    }
    expect(scholium('check', file, '--convention', 'xy-plus').code).toBe(1)
  })
})

describe('colour', () => {
  it('only when asked: the text report carries ANSI codes with a colour painter and none without', async () => {
    const { renderReport, painter } = await import('../../../scripts/cli/render')
    const r = report('check', join(FIXTURES, 'one-wrong.tex'))
    expect(renderReport(r, 'one-wrong.tex', painter(true))).toContain(`${ESC}[31m≠ mismatch`)
    expect(renderReport(r, 'one-wrong.tex', painter(false))).not.toContain(ESC)
  })
})
