/**
 * The notation page's examples (utils/notation-examples.ts) are read as the kind they illustrate and
 * hold, and its tags parse without errors. Sources of the values:
 * - S_2143, S_132, S_231, S_1423, S_321 = x_1^2x_2, S_132(x;y): Macdonald, "Notes on Schubert
 *   polynomials" (1991), table for S_3 and S_4, recalled from memory; S_132 S_132 = S_231 + S_1423 and
 *   c_{132,132}^{1423} = 1: Monk's rule (common practice).
 * - G_132 = x_1 + x_2 − x_1x_2 (β = −1): one isobaric divided difference of x_1^2 (common practice).
 * - s_1 s_1 = s_2 + s_11, F_213 = s_1: the Pieri rule and F_{s_i} = s_1 (common practice);
 *   s_21(x_1,x_2), e_2(x_1,x_2,x_3): by hand from semistandard tableaux.
 * - c^{321}_{21,21} = 2: the example in lrcalc's documentation; K_{21,111} = 2: the two standard tableaux of shape 21.
 * - ∂_1 x_1^2 = x_1 + x_2, ℓ(2143) = 2, #Red(321) = 2, #PD(2143) = #BPD(2143) = 3 = S_2143(1,1,1): by hand.
 */
import { describe, expect, it } from 'vitest'
import { checkManuscript } from '../../../shared/check'
import { parseTag } from '../../../shared/latex/tags'
import { NOTATION_SECTIONS, TAG_EXAMPLES } from '../../../utils/notation-examples'

describe('the notation page', () => {
  for (const section of NOTATION_SECTIONS) {
    for (const example of section.examples) {
      it(`${section.title}: ${example.latex} is read as ${example.kind} and holds`, () => {
        const report = checkManuscript({ files: { 'example.tex': `\\documentclass{article}\n\\begin{document}\n$${example.latex}$\n\\end{document}\n` } })
        expect(report.claims).toHaveLength(1)
        expect(report.claims[0]).toMatchObject({ kind: example.kind, verdict: 'verified' })
      })
    }
  }
  it('every tag example parses with no error', () => {
    for (const t of TAG_EXAMPLES) expect(parseTag(t.tag.replace(/^%\s*/, '')).errors, t.tag).toEqual([])
  })
})
