// Tables indexed by two letters and tables turned on their side (shared/latex/tables.ts,
// readTwoLetterTable and readTransposedIndexTable). Expected values, each from outside our code:
// - LR coefficients from Debian's lrcalc: `lrcalc lrcoef 3 2 1 - 2 1 - 2 1` = 2, and
//   c^{321}_{31,2} = c^{321}_{31,11} = c^{321}_{22,2} = c^{321}_{22,11} = c^{321}_{211,2} = c^{321}_{211,11} = 1
//   (`lrcalc lrcoef 3 2 1 - 3 1 - 2` and so on), c^{321}_{21,3} = 1 (`lrcalc lrcoef 3 2 1 - 2 1 - 3`);
// - Schubert polynomials S_132 = x_1+x_2, S_213 = x_1, S_231 = x_1x_2 (divided differences of x_1^2x_2 with
//   Debian's python3-sympy); ℓ(231) = 2 inversions (common practice);
// - products of Schubert polynomials worked out with sympy from those: S_132·S_132 = S_231 + S_1423,
//   S_132·S_213 = S_213·S_132 = S_231 + S_312, S_213·S_213 = S_312 (Monk's rule), so c^{231}_{uv} is 1, 1, 1, 0
//   at (132,132), (132,213), (213,132), (213,213).
import { describe, expect, it } from 'vitest'
import { checkManuscript } from '../../../shared/check/index'

function checked(tex: string) {
  const report = checkManuscript({ files: { 'snippet.tex': tex } })
  return { claims: report.claims.map(c => [c.line, c.verdict, c.source]), notRead: (report.notRead ?? []).map(n => n.reason) }
}
const verdicts = (tex: string) => checked(tex).claims.map(([, verdict]) => verdict)
const table = (...rows: string[]) => ['\\begin{tabular}{c|ccc}', ...rows, '\\end{tabular}'].join('\n')

describe('tables of an object in two letters', () => {
  const lr = (wrong = '1') => table(
    '$c^{321}_{\\lambda\\mu}$ & $\\mu = (2)$ & $\\mu = (1,1)$ \\\\ \\hline',
    '$\\lambda = (3,1)$ & $1$ & $1$ \\\\',
    `$\\lambda = (2,2)$ & $1$ & $${wrong}$ \\\\`,
  )

  it('reads each cell as the corner at its row and column, at the cell\'s line', () => {
    expect(checked(lr()).claims).toEqual([
      [3, 'verified', 'c^{321}_{\\lambda\\mu} = 1 at \\lambda = (3,1), \\mu = (2)'],
      [3, 'verified', 'c^{321}_{\\lambda\\mu} = 1 at \\lambda = (3,1), \\mu = (1,1)'],
      [4, 'verified', 'c^{321}_{\\lambda\\mu} = 1 at \\lambda = (2,2), \\mu = (2)'],
      [4, 'verified', 'c^{321}_{\\lambda\\mu} = 1 at \\lambda = (2,2), \\mu = (1,1)'],
    ])
  })

  it('flags a wrong cell and only that cell', () => {
    expect(verdicts(lr('0'))).toEqual(['verified', 'verified', 'verified', 'mismatch'])
  })

  it('takes the other letter of the corner for bare column heads when the rows write theirs', () => {
    const tex = table('$c^{321}_{\\lambda\\mu}$ & $(2,1)$ & $(3)$ \\\\', '$\\lambda = (2,1)$ & $2$ & $0$ \\\\')
    expect(verdicts(tex)).toEqual(['verified', 'mismatch'])
  })

  it('reads a table of Schubert structure constants with u per row and v per column', () => {
    const tex = table(
      '$c^{231}_{uv}$ & $v = 132$ & $v = 213$ \\\\',
      '$u = 132$ & $1$ & $1$ \\\\',
      '$u = 213$ & $1$ & $1$ \\\\',
    )
    expect(verdicts(tex)).toEqual(['verified', 'verified', 'verified', 'mismatch'])
  })

  it('uses the bound third letter: Let ν = (3,2,1), then c^ν_{λμ} in the corner', () => {
    const tex = `Let $\\nu = (3,2,1)$.\n${table('$c^{\\nu}_{\\lambda\\mu}$ & $\\mu = (2,1)$ \\\\', '$\\lambda = (2,1)$ & $2$ \\\\')}`
    expect(verdicts(tex)).toEqual(['verified'])
  })

  it.each([
    ['both sides bare: which letter runs along the rows is not said', table('$c^{321}_{\\lambda\\mu}$ & $(2)$ & $(1,1)$ \\\\', '$(3,1)$ & $1$ & $1$ \\\\', '$(2,2)$ & $1$ & $0$ \\\\')],
    ['two letters on one side', table('$c^{321}_{\\lambda\\mu}$ & $\\mu = (2)$ & $\\lambda = (1,1)$ \\\\', '$\\lambda = (3,1)$ & $1$ & $1$ \\\\', '$\\lambda = (2,2)$ & $1$ & $0$ \\\\')],
    ['a head letter the corner does not use', table('$c^{321}_{\\lambda\\mu}$ & $\\nu = (2)$ & $\\nu = (1,1)$ \\\\', '$\\lambda = (3,1)$ & $1$ & $1$ \\\\', '$\\lambda = (2,2)$ & $1$ & $0$ \\\\')],
    ['a column head that is not a value', table('$c^{321}_{\\lambda\\mu}$ & $\\mu = (2)$ & $\\mu \\subset \\lambda$ \\\\', '$\\lambda = (3,1)$ & $1$ & $1$ \\\\', '$\\lambda = (2,2)$ & $1$ & $0$ \\\\')],
    ['three free letters in the corner', table('$c^{\\nu}_{\\lambda\\mu}$ & $\\mu = (2)$ & $\\mu = (1,1)$ \\\\', '$\\lambda = (3,1)$ & $1$ & $1$ \\\\', '$\\lambda = (2,2)$ & $1$ & $0$ \\\\')],
  ])('stays silent and lists the table as not read: %s', (_, tex) => {
    const result = checked(tex)
    expect(result.claims.map(([, verdict]) => verdict)).not.toContain('mismatch')
    expect(result.claims.map(([, verdict]) => verdict)).not.toContain('verified')
    expect(result.notRead.length).toBeGreaterThan(0)
  })
})

describe('index tables turned on their side', () => {
  const sideways = table(
    '$w$ & $132$ & $213$ & $231$ \\\\ \\hline',
    '$\\mathfrak{S}_w$ & $x_1+x_2$ & $x_1$ & $x_1x_2$ \\\\',
    '$\\ell(w)$ & $1$ & $1$ & $1$ \\\\',
  )

  it('reads each cell as the row\'s object at the column\'s index', () => {
    expect(checked(sideways).claims).toEqual([
      [3, 'verified', '\\mathfrak{S}_w = x_1+x_2 at w = 132'],
      [3, 'verified', '\\mathfrak{S}_w = x_1 at w = 213'],
      [3, 'verified', '\\mathfrak{S}_w = x_1x_2 at w = 231'],
      [4, 'verified', '\\ell(w) = 1 at w = 132'],
      [4, 'verified', '\\ell(w) = 1 at w = 213'],
      [4, 'mismatch', '\\ell(w) = 1 at w = 231'],
    ])
  })

  it('reads a partition-indexed table on its side', () => {
    const tex = table('$\\lambda$ & $(1)$ & $(1,1)$ \\\\', '$s_\\lambda(x_1,x_2)$ & $x_1+x_2$ & $x_1x_2 + x_1$ \\\\')
    expect(verdicts(tex)).toEqual(['verified', 'mismatch'])
  })

  it('lists a row that is no object in the letter as not read, and reads the rest', () => {
    const tex = table('$w$ & $132$ & $213$ \\\\', '$\\mathfrak{S}_w$ & $x_1+x_2$ & $x_1$ \\\\', '$w^{-1}$ & $132$ & $213$ \\\\')
    const result = checked(tex)
    expect(result.claims.map(([, verdict]) => verdict)).toEqual(['verified', 'verified'])
    expect(result.notRead).toContain('a table row whose index could not be read')
  })

  it('is not this shape when a head of the first row is not an index, or the letter is bound', () => {
    for (const tex of [
      table('$w$ & $132$ & $n$ \\\\', '$\\mathfrak{S}_w$ & $x_1+x_2$ & $x_1$ \\\\'),
      `Let $w = 2143$.\n${table('$w$ & $132$ & $213$ \\\\', '$\\mathfrak{S}_w$ & $x_1+x_2$ & $x_1 + x_3$ \\\\')}`,
    ]) {
      const found = verdicts(tex)
      expect(found, tex).not.toContain('mismatch')
      expect(found, tex).not.toContain('verified')
    }
  })
})
