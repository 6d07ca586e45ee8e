/**
 * What the notation page (pages/notation.vue) shows: the notation Scholium reads, each with an
 * example that the page typesets with KaTeX and checks with the engine in the browser. The values
 * are ordinary facts of the trade; tests/unit/app/notation-examples.test.ts names a source for each
 * and checks that the reader reads every example as its kind.
 */
import type { ClaimKind } from '#shared/types/claims'

export interface NotationExample {
  /** The math of one claim, without dollars. */
  latex: string
  kind: ClaimKind
}

export interface NotationSection {
  title: string
  /** What is read, in a sentence. */
  reads: string
  examples: NotationExample[]
}

export const NOTATION_SECTIONS: NotationSection[] = [
  {
    title: 'Schubert polynomials',
    reads: 'S_w with w in one-line notation, as a cycle, a reduced word, s_i, or w_0 with its size; single or double (x;y), (x;-y).',
    examples: [
      { latex: '\\mathfrak{S}_{2143} = x_1^2 + x_1x_2 + x_1x_3', kind: 'schubert' },
      { latex: '\\mathfrak{S}_{s_2} = x_1 + x_2', kind: 'schubert' },
      { latex: '\\mathfrak{S}_{w_0^{(3)}} = x_1^2x_2', kind: 'schubert' },
      { latex: '\\mathfrak{S}_{132}(x;y) = x_1 + x_2 - y_1 - y_2', kind: 'schubert' },
    ],
  },
  {
    title: 'Products and structure constants',
    reads: 'A product of two Schubert polynomials expanded in the Schubert basis, and the coefficients c_{u,v}^w.',
    examples: [
      { latex: '\\mathfrak{S}_{132}\\,\\mathfrak{S}_{132} = \\mathfrak{S}_{231} + \\mathfrak{S}_{1423}', kind: 'schubert' },
      { latex: 'c_{132,132}^{1423} = 1', kind: 'structureConstant' },
    ],
  },
  {
    title: 'Grothendieck polynomials',
    reads: 'G_w, single or double, with β = −1 unless the paper says otherwise.',
    examples: [{ latex: '\\mathfrak{G}_{132} = x_1 + x_2 - x_1x_2', kind: 'grothendieck' }],
  },
  {
    title: 'Symmetric functions',
    reads: 'Schur, elementary, complete, monomial and power-sum functions, in infinitely many or in named variables; products; Stanley symmetric functions F_w.',
    examples: [
      { latex: 's_{1}\\, s_{1} = s_{2} + s_{11}', kind: 'symmetricFunction' },
      { latex: 's_{21}(x_1,x_2) = x_1^2x_2 + x_1x_2^2', kind: 'symmetricFunction' },
      { latex: 'e_{2}(x_1,x_2,x_3) = x_1x_2 + x_1x_3 + x_2x_3', kind: 'symmetricFunction' },
      { latex: 'F_{213} = s_{1}', kind: 'stanley' },
    ],
  },
  {
    title: 'Coefficients',
    reads: 'Littlewood–Richardson coefficients and Kostka numbers.',
    examples: [
      { latex: 'c^{321}_{21,21} = 2', kind: 'littlewoodRichardson' },
      { latex: 'K_{21,111} = 2', kind: 'kostka' },
    ],
  },
  {
    title: 'Operators, values and counts',
    reads: 'Divided differences, the value at (1,…,1), the length of a permutation, and the numbers of reduced words, pipe dreams and bumpless pipe dreams.',
    examples: [
      { latex: '\\partial_1 (x_1^2) = x_1 + x_2', kind: 'dividedDifference' },
      { latex: '\\mathfrak{S}_{2143}(1,\\dots,1) = 3', kind: 'specialization' },
      { latex: '\\ell(2143) = 2', kind: 'length' },
      { latex: '\\#\\mathrm{Red}(321) = 2', kind: 'count' },
      { latex: '\\#\\mathrm{PD}(2143) = 3', kind: 'count' },
      { latex: '\\#\\mathrm{BPD}(2143) = 3', kind: 'count' },
    ],
  },
]

/** Tags, written in a comment after `scholium:`; the page parses each example with the reader's own tag parser. */
export const TAG_EXAMPLES: { tag: string, says: string }[] = [
  { tag: '% scholium: skip', says: 'do not check the claims on this line (or on the next line, when the tag stands alone)' },
  { tag: '% scholium: claim', says: 'this is a claim: report it even if Scholium cannot read it' },
  { tag: '% scholium: claim schubert', says: 'a claim of this kind' },
  { tag: '% scholium: use xy-plus', says: 'check the claims here with this convention' },
  { tag: '% scholium: set perm-inverse', says: 'use this convention from here to the end of the manuscript' },
  { tag: '% scholium: \\Sch means schubert', says: 'the macro \\Sch stands for a Schubert polynomial' },
]
