/**
 * Typesetting claims in the browser with KaTeX.
 *
 * Conventions: KaTeX runs with `throwOnError: true`, so LaTeX it cannot read is shown as
 * source instead of half-rendered; the paper's own macros come from the report (`Report.macros`,
 * built by the reader), so most claims typeset as written.
 */
import katex from 'katex'

/** HTML of `latex` typeset, or null when KaTeX refuses it; e.g. `typeset('x_1')` is a string. */
export function typeset(latex: string, macros: Record<string, string> = {}, displayMode = false): string | null {
  try {
    // KaTeX mutates the macros object with \gdef; give it a copy.
    return katex.renderToString(latex, { throwOnError: true, displayMode, macros: { ...macros }, output: 'htmlAndMathml' })
  }
  catch {
    return null
  }
}
