/**
 * The stored report's validator (shared/types/report-schema.ts) keeps every field the check core
 * writes. zod drops keys a schema does not name, so a field left out of the schema would vanish
 * from every stored report without an error: this guards the merge that moved corrections from
 * the claims rows into the report document, and the Grassmannian `class` diffs with `notes`.
 *
 * Right values: S_132 = x_1 + x_2 and S_2143 = x_1^2 + x_1x_2 + x_1x_3 (the table of Schubert
 * polynomials for S_3 and S_4, Macdonald, "Notes on Schubert polynomials" (1991), from memory);
 * σ_2 σ_{11} = σ_{31} = 0 in H^*(Gr(2,4)), since (3,1) does not fit in the 2×2 box (Pieri rule,
 * common practice).
 */
import { describe, expect, it } from 'vitest'
import { checkManuscript } from '../../../shared/check'
import { DamagedReportError, parseReport } from '../../../shared/types/report-schema'

const tex = String.raw`\documentclass{article}
\newcommand{\Sch}[1]{\mathfrak{S}_{#1}}
\begin{document}
We have $\Sch{132} = x_1 + x_2 + x_3$.
\begin{align*}
\Sch{2143} &= x_1^2 + x_1 x_2
 + x_1 x_4
\end{align*}
In $H^*(\mathrm{Gr}(2,4))$ we have $\sigma_2 \cdot \sigma_{11} = \sigma_{31}$.
\end{document}
`

describe('parseReport', () => {
  const report = checkManuscript({ files: { 'main.tex': tex } })
  const stored = JSON.parse(JSON.stringify(report)) as unknown

  it('keeps corrections (made and refused), class diffs with notes, scripts, expansions and macros', () => {
    const claims = report.claims.filter(c => c.verdict === 'mismatch')
    expect(claims.map(c => c.correction?.fixed)).toEqual([true, false, false])
    expect(claims[2]!.diff).toMatchObject({ basis: 'class', notes: [expect.stringContaining('2×2 box')] })
    expect(report.claims[0]!.reproduce).toBeDefined()
    expect(report.claims[0]!.expanded).toBeDefined()
    expect(report.macros).toEqual({ '\\Sch': '\\mathfrak{S}_{#1}' })
    expect(parseReport(stored)).toEqual(stored)
  })

  it('refuses a damaged document, naming where', () => {
    const damaged = JSON.parse(JSON.stringify(report)) as { claims: { correction?: unknown }[] }
    damaged.claims[0]!.correction = { fixed: true, statement: 'x' }
    expect(() => parseReport(damaged)).toThrow(DamagedReportError)
    expect(() => parseReport(damaged)).toThrow(/claims\.0\.correction/)
  })
})
