/**
 * Suggested corrections (shared/check/correction.ts): the corrected statement in the paper's own
 * notation, only when re-reading and re-checking confirms it, and the patch that applies it.
 *
 * Right values and where they come from:
 * - S_132 = x_1 + x_2, S_2143 = x_1^2 + x_1x_2 + x_1x_3, S_231 = x_1x_2, S_1423 = x_1^2 + x_1x_2 + x_2^2:
 *   the table of Schubert polynomials for S_3 and S_4 in Macdonald, "Notes on Schubert polynomials"
 *   (1991), recalled from memory.
 * - S_132 S_132 = S_231 + S_1423: Monk's rule (common practice); s_1 s_1 = s_2 + s_11: the Pieri rule.
 * - S_132(x;y) = x_1 + x_2 - y_1 - y_2 with factors x_i - y_j: one divided difference of
 *   (x_1 - y_1)(x_1 - y_2)(x_2 - y_1) (common practice); with factors x_i + y_j every y_j changes sign.
 * - ℓ(2143) = 2 (two inversions, counted by hand).
 */
import { describe, expect, it } from 'vitest'
import { execFileSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { checkManuscript, correctionsPatch } from '../../../shared/check'
import { locateRightSide, splitWrittenTerms } from '../../../shared/check/correction'
import type { ConventionSet } from '../../../shared/types/conventions'
import type { ReportClaim } from '../../../shared/types/report'

const PREAMBLE = String.raw`\documentclass{article}
\newcommand{\Sch}[1]{\mathfrak{S}_{#1}}
\newcommand{\xx}[1]{x_{#1}}
\begin{document}
`
const END = '\\end{document}\n'

function check(body: string, fixed: Partial<ConventionSet> = {}): ReportClaim[] {
  return checkManuscript({ files: { 'main.tex': `${PREAMBLE}${body}\n${END}` } }, { fixed }).claims
}

function only(body: string, fixed: Partial<ConventionSet> = {}): ReportClaim {
  const mismatches = check(body, fixed).filter(c => c.verdict === 'mismatch')
  expect(mismatches).toHaveLength(1)
  return mismatches[0]!
}

function statement(claim: ReportClaim): string {
  if (!claim.correction?.fixed) throw new Error(`no correction: ${claim.correction?.reason}`)
  return claim.correction.statement
}

describe('splitting a right-hand side into terms', () => {
  it('splits on top-level signs only, keeping braces and brackets whole', () => {
    expect(splitWrittenTerms('x_1 - 2x_{2} + 3')).toEqual([{ sign: 1, body: 'x_1' }, { sign: -1, body: '2x_{2}' }, { sign: 1, body: '3' }])
    expect(splitWrittenTerms('-x_1^{-1} + (x_2 - y_1)')).toEqual([{ sign: -1, body: 'x_1^{-1}' }, { sign: 1, body: '(x_2 - y_1)' }])
  })
  it('refuses what it cannot split cleanly', () => {
    expect(splitWrittenTerms('x_1 \\pm x_2')).toBeNull()
    expect(splitWrittenTerms('x_1 + + x_2')).toBeNull()
    expect(splitWrittenTerms('{x_1 + x_2')).toBeNull()
  })
})

describe('finding the right-hand side on its line', () => {
  it('finds it after the relation, with an alignment mark', () => {
    const line = '  \\Sch{132} &= x_1 + x_3 \\\\'
    const found = locateRightSide(line, '\\Sch{132} = x_1 + x_3')
    expect(found && line.slice(found.start, found.end)).toBe('x_1 + x_3')
  })
  it('gives up when the same statement is written twice on the line', () => {
    expect(locateRightSide('$\\ell(2143) = 3$ and $\\ell(2143) = 3$', '\\ell(2143) = 3')).toBeNull()
  })
})

describe('corrected statements in the paper\'s notation', () => {
  it('keeps the paper\'s macro, drops a wrong term and fixes a coefficient', () => {
    expect(statement(only('$\\Sch{132} = x_1 - 2x_2 + 3$'))).toBe('\\Sch{132} = x_1 + x_2')
  })

  it('keeps the paper\'s order for the terms that stay and its way of writing monomials', () => {
    // Written out of the engine's order, with spaces between factors: the new term x_1 x_2 is written the same way.
    expect(statement(only('$\\Sch{2143} = x_1 x_3 + x_1^2$'))).toBe('\\Sch{2143} = x_1 x_3 + x_1^2 + x_1 x_2')
    // In the engine's order, the missing term goes where the engine puts it; braces as the paper writes them.
    expect(statement(only('$\\Sch{2143} = x_{1}^{2}+x_{1}x_{3}$'))).toBe('\\Sch{2143} = x_{1}^{2}+x_{1}x_{2}+x_{1}x_{3}')
  })

  it('writes a missing Schubert polynomial with the macro the claim uses for the others', () => {
    expect(statement(only('$\\Sch{132}\\Sch{132} = \\Sch{1423} + 2\\Sch{2413}$'))).toBe('\\Sch{132}\\Sch{132} = \\Sch{1423} + \\Sch{2314}')
  })

  it('copies the macro from the left-hand side when the right side has no Schubert polynomial to copy', () => {
    // S_w with w bound in the text: its digits are not on the line, so the template comes from the left.
    expect(statement(only('Let $w = 1423$. Then $\\Sch{132}\\Sch{132} = \\Sch{w}$.'))).toBe('\\Sch{132}\\Sch{132} = \\Sch{w} + \\Sch{231}')
  })

  it('writes a missing Schur function like the others', () => {
    expect(statement(only('$s_{1}\\, s_{1} = s_{2}$'))).toBe('s_{1}\\, s_{1} = s_{2} + s_{11}')
  })

  it('corrects a number', () => {
    expect(statement(only('$\\ell(2143) = 3$'))).toBe('\\ell(2143) = 2')
  })

  it('follows the paper\'s sign convention for double polynomials', () => {
    const claim = only('$\\mathfrak{S}_{132}(x;y) = x_1 + x_2 - y_1 - y_2 + x_1 y_1$', { doubleSign: 'xy-plus' })
    expect(claim.conventions.doubleSign).toBe('xy-plus')
    expect(statement(claim)).toBe('\\mathfrak{S}_{132}(x;y) = x_1 + x_2 + y_1 + y_2')
    expect(statement(only('$\\mathfrak{S}_{132}(x;y) = x_1 + x_2 + y_1 + y_2$', { doubleSign: 'xy-minus' }))).toBe('\\mathfrak{S}_{132}(x;y) = x_1 + x_2 - y_1 - y_2')
  })

  it('drops a term written through a variable macro, but does not invent that macro for a missing one', () => {
    expect(statement(only('$\\Sch{231} = \\xx{1}\\xx{2} + \\xx{1}\\xx{3}$'))).toBe('\\Sch{231} = \\xx{1}\\xx{2}')
    const missing = only('$\\Sch{2143} = \\xx{1}^2 + \\xx{1}\\xx{2}$')
    expect(missing.correction).toEqual({ fixed: false, reason: expect.stringContaining('macros') })
  })

  it('gives no correction for a statement over several lines', () => {
    const claim = only('\\begin{align*}\n\\Sch{2143} &= x_1^2 + x_1 x_2\n + x_1 x_4\n\\end{align*}')
    expect(claim.correction).toEqual({ fixed: false, reason: 'the statement spans several lines' })
  })

  it('gives no correction when the same statement is written twice on one line', () => {
    const claims = check('$\\ell(2143) = 3$ and again $\\ell(2143) = 3$.').filter(c => c.verdict === 'mismatch')
    expect(claims).toHaveLength(2)
    for (const c of claims) expect(c.correction?.fixed).toBe(false)
  })

  it('leaves verified claims alone and fixes two claims on one line together', () => {
    const claims = check('$\\ell(2143) = 3$, $\\Sch{132} = x_1 + x_2$ and $\\Sch{231} = 2x_1x_2$.')
    expect(claims.map(c => c.verdict)).toEqual(['mismatch', 'verified', 'mismatch'])
    expect(claims[1]!.correction).toBeUndefined()
    const after = '$\\ell(2143) = 2$, $\\Sch{132} = x_1 + x_2$ and $\\Sch{231} = x_1x_2$.'
    for (const c of [claims[0]!, claims[2]!]) expect(c.correction).toMatchObject({ fixed: true, after })
  })
})

describe('the corrections patch', () => {
  it('is empty when nothing is fixed', () => {
    expect(correctionsPatch([{ correction: { fixed: false, reason: 'x' } }, {}])).toBe('')
  })

  it('applies with git apply, CR LF endings and a last line without a newline included, and the result checks clean', () => {
    const dir = mkdtempSync(join(tmpdir(), 'scholium-correction-'))
    try {
      const source = `${PREAMBLE}$\\ell(2143) = 3$\r\n\r\nText.\r\n\r\nText.\r\n\r\nText.\r\n\r\n$\\Sch{132} = x_1$\n\\end{document}`
      writeFileSync(join(dir, 'main.tex'), source)
      const report = checkManuscript({ files: { 'main.tex': readFileSync(join(dir, 'main.tex')) } })
      expect(report.summary.mismatch).toBe(2)
      const patch = correctionsPatch(report.claims)
      expect(patch.match(/^@@ /gm)).toHaveLength(2)
      writeFileSync(join(dir, 'fix.patch'), patch)
      execFileSync('git', ['apply', '--check', 'fix.patch'], { cwd: dir })
      execFileSync('git', ['apply', 'fix.patch'], { cwd: dir })
      const fixed = readFileSync(join(dir, 'main.tex'), 'utf8')
      expect(fixed).toContain('$\\ell(2143) = 2$\r\n')
      expect(fixed.endsWith('$\\Sch{132} = x_1 + x_2$\n\\end{document}')).toBe(true)
      expect(checkManuscript({ files: { 'main.tex': fixed } }).summary.mismatch).toBe(0)
    }
    finally {
      rmSync(dir, { recursive: true, force: true })
    }
  })
})

// Regression: a mismatch of Grassmannian classes (a diff in the `class` basis, added with the
// Grassmannian claims) reached the term rewriter, which only knows polynomial and Schur-type bases.
// σ_1 σ_1 = σ_2 + σ_{11} in H^*(Gr(2,4)) (the Pieri rule, common practice), so dropping σ_{11} is a mismatch.
describe('claims the rewriter does not write', () => {
  it('gives no automatic correction for Grassmannian classes, with a reason', () => {
    const claim = only('In $H^*(\\mathrm{Gr}(2,4))$ we have $\\sigma_1\\sigma_1 = \\sigma_2$.')
    expect(claim.correction?.fixed).toBe(false)
    expect(claim.correction && !claim.correction.fixed ? claim.correction.reason : '').toMatch(/Grassmannian/)
  })
})
