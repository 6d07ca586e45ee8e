/**
 * `scholium check --format junit` and `--format annotations`, run as a user runs them
 * (node bin/scholium.mjs …) on the invented manuscripts in tests/fixtures/cli/.
 *
 * Expected verdicts and where they come from:
 * - one-wrong.tex line 8 writes S_132 = x_1, but S_132 = x_1 + x_2 (the table of Schubert
 *   polynomials for S_3 in Macdonald, "Notes on Schubert polynomials" (1991), recalled from memory);
 *   its five other claims hold (see tests/unit/cli/check.test.ts for each source).
 * - bundle/sections/products.tex line 6 is wrong by Monk's rule (common practice); its other claims hold.
 * The JUnit output is parsed by Python's own XML parser (xml.etree.ElementTree), not by our code.
 */
import { describe, it, expect } from 'vitest'
import { spawnSync } from 'node:child_process'
import { join, relative } from 'node:path'

const ROOT = join(import.meta.dirname, '../../..')
const FIXTURES = join(ROOT, 'tests/fixtures/cli')

function scholium(...args: string[]): { code: number | null, stdout: string, stderr: string } {
  const run = spawnSync(process.execPath, [join(ROOT, 'bin/scholium.mjs'), ...args], {
    cwd: ROOT, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' }, timeout: 60_000,
  })
  return { code: run.status, stdout: run.stdout, stderr: run.stderr }
}

/** Test cases of a JUnit document as Python's XML parser sees them: [suite, line, outcome]. */
function junitCases(xmlText: string): { suites: number, cases: [string, string, string][], totals: Record<string, string> } {
  const script = `
import sys, json, xml.etree.ElementTree as ET
root = ET.fromstring(sys.stdin.read())
cases = []
for suite in root.iter('testsuite'):
    for case in suite.iter('testcase'):
        kinds = [child.tag for child in case]
        cases.append([case.get('file'), case.get('line'), kinds[0] if kinds else 'passed'])
print(json.dumps({'suites': len(list(root.iter('testsuite'))), 'cases': cases, 'totals': dict(root.attrib)}))
`
  const run = spawnSync('python3', ['-c', script], { input: xmlText, encoding: 'utf8' })
  if (run.status !== 0) throw new Error(`the JUnit output is not well-formed XML: ${run.stderr}`)
  return JSON.parse(run.stdout)
}

describe('--format junit', () => {
  it('one test case per claim, the wrong claim a failure, in well-formed XML', () => {
    const file = relative(ROOT, join(FIXTURES, 'one-wrong.tex'))
    const run = scholium('check', file, '--format', 'junit')
    expect(run.stderr).toBe('')
    expect(run.code).toBe(1)
    const parsed = junitCases(run.stdout)
    expect(parsed.totals).toMatchObject({ tests: '6', failures: '1', errors: '0' })
    expect(parsed.cases).toHaveLength(6)
    expect(parsed.cases.filter(c => c[2] === 'failure')).toEqual([[file, '8', 'failure']])
    expect(parsed.cases.filter(c => c[2] === 'passed')).toHaveLength(5)
  })
  it('an error claim is a JUnit error', () => {
    const run = scholium('check', join(FIXTURES, 'malformed.tex'), '--format=junit')
    const parsed = junitCases(run.stdout)
    expect(parsed.totals).toMatchObject({ errors: '1' })
    expect(parsed.cases.filter(c => c[2] === 'error')).toHaveLength(1)
  })
})

describe('--format annotations', () => {
  it('one ::error line per failing claim, naming the file as given and its line', () => {
    const file = relative(ROOT, join(FIXTURES, 'one-wrong.tex'))
    const run = scholium('check', file, '--format', 'annotations')
    expect(run.code).toBe(1)
    const lines = run.stdout.trim().split('\n')
    expect(lines).toHaveLength(1)
    expect(lines[0]).toMatch(new RegExp(`^::error file=${file.replace(/[.]/g, '\\.')},line=8,title=Scholium mismatch::`))
    // The message stays on one line: newlines inside it are escaped as %0A.
    expect(lines[0]).toContain('%0A')
  })
  it('a folder: the annotation names the file inside it relative to where the command ran', () => {
    const folder = relative(ROOT, join(FIXTURES, 'bundle'))
    const run = scholium('check', folder, '--format', 'annotations')
    expect(run.stdout.trim().split('\n').map(l => l.replace(/,title=.*$/, ''))).toEqual([`::error file=${folder}/sections/products.tex,line=6`])
  })
  it('a correct manuscript prints nothing and exits 0', () => {
    const run = scholium('check', join(FIXTURES, 'all-correct.tex'), '--format', 'annotations')
    expect(run.code).toBe(0)
    expect(run.stdout).toBe('')
  })
})

describe('--format is checked', () => {
  it('an unknown format and two formats at once are refused with exit 2', () => {
    expect(scholium('check', 'x.tex', '--format', 'xml')).toMatchObject({ code: 2 })
    expect(scholium('check', 'x.tex', '--format', 'xml').stderr).toMatch(/--format needs one of text, json, junit, annotations/)
    expect(scholium('check', 'x.tex', '--json', '--format', 'junit').stderr).toMatch(/two outputs/)
  })
})
