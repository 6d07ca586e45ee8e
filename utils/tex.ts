/**
 * Typesetting claims in the browser with KaTeX.
 *
 * Conventions: KaTeX runs with `throwOnError: true`, so LaTeX it cannot read is shown as
 * source instead of half-rendered; the paper's own simple macros (\newcommand without an
 * optional argument, \DeclareMathOperator) are handed to KaTeX so most claims still typeset.
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

/** The group `{…}` starting at `text[start]`, with its end; undefined when unbalanced. */
function readGroup(text: string, start: number): { body: string, end: number } | undefined {
  if (text[start] !== '{') return undefined
  let depth = 0
  for (let i = start; i < text.length && i < start + 2000; i++) {
    const ch = text[i]
    if (ch === '\\') i++
    else if (ch === '{') depth++
    else if (ch === '}' && --depth === 0) return { body: text.slice(start + 1, i), end: i + 1 }
  }
  return undefined
}

const DEFINITION = /\\(newcommand|renewcommand|providecommand|DeclareMathOperator)\*?\s*(?:\{\s*(\\[A-Za-z]+)\s*\}|(\\[A-Za-z]+))\s*(?:\[(\d)\])?\s*/g

/** KaTeX macros from the paper's definitions; e.g. `\newcommand{\Sch}[1]{\mathfrak{S}_{#1}}` gives `{ '\\Sch': '\\mathfrak{S}_{#1}' }`. */
export function harvestMacros(texts: readonly string[]): Record<string, string> {
  const macros: Record<string, string> = {}
  for (const text of texts) {
    for (const match of text.matchAll(DEFINITION)) {
      const name = match[2] ?? match[3]
      const group = readGroup(text, (match.index ?? 0) + match[0].length)
      if (!name || !group) continue
      macros[name] = match[1] === 'DeclareMathOperator' ? `\\operatorname{${group.body}}` : group.body
    }
  }
  return macros
}
