/**
 * Prose with `$…$` math, split for rendering: the interface's own texts (convention choices,
 * notes) typeset their math with KaTeX instead of showing raw LaTeX.
 */
export type MathTextSegment = { kind: 'text', text: string } | { kind: 'math', tex: string }

/** Split at unescaped `$`; e.g. `mathTextSegments('factors $x_i$')` is a text and a math segment. An unpaired `$` stays text. */
export function mathTextSegments(text: string): MathTextSegment[] {
  const segments: MathTextSegment[] = []
  let rest = text
  while (rest.length > 0) {
    const open = rest.search(/(?<!\\)\$/)
    const close = open < 0 ? -1 : rest.slice(open + 1).search(/(?<!\\)\$/)
    if (open < 0 || close < 0) { segments.push({ kind: 'text', text: rest }); break }
    if (open > 0) segments.push({ kind: 'text', text: rest.slice(0, open) })
    segments.push({ kind: 'math', tex: rest.slice(open + 1, open + 1 + close) })
    rest = rest.slice(open + close + 2)
  }
  return segments
}
