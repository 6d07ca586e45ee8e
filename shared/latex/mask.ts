/**
 * Hiding what TeX does not typeset as mathematics, without moving anything.
 *
 * Conventions: the masked text has exactly the length and the line breaks of the input; every
 * hidden character becomes a space, so offsets, lines and columns stay valid. Hidden: comments,
 * \iffalse … \fi, verbatim-like environments (code listings, the `comment` environment),
 * drawings (tikzpicture, tikz-cd diagrams, pgfplots axes: their coordinates and labels are not
 * claims), inline code (\verb, \lstinline, \mintinline, and any command \let or defined to one of
 * them), layout settings (\ytableausetup{…}, \tikzset{…}, \pgfplotsset{…}, …) and everything
 * after \end{document}. Comments are returned separately because tags live in them.
 */

export interface SourceComment {
  /** Offset of the '%'. */
  offset: number
  /** Text after the '%', without the line break. */
  text: string
  /** True when only whitespace precedes the '%' on its line. */
  wholeLine: boolean
}

export interface MaskedSource {
  text: string
  comments: SourceComment[]
  /** Problems found while masking (an environment never closed), with offsets. */
  problems: { offset: number, message: string }[]
}

/** Environments whose body is code or text shown as is: closed by the first matching \end. */
const VERBATIM_ENVIRONMENTS = new Set([
  'verbatim', 'verbatim*', 'lstlisting', 'minted', 'comment', 'Verbatim', 'Verbatim*', 'BVerbatim', 'LVerbatim',
  'alltt', 'filecontents', 'filecontents*', 'sageblock', 'sagesilent', 'pycode', 'luacode', 'luacode*',
])
/** Drawings: their coordinates, labels and nodes are never claims. They may nest. */
const DRAWING_ENVIRONMENTS = new Set([
  'tikzpicture', 'tikzcd', 'pgfpicture', 'axis', 'semilogxaxis', 'semilogyaxis', 'loglogaxis', 'polaraxis', 'groupplot',
  'circuitikz', 'forest', 'xy', 'picture',
])
/** Commands whose argument is code: \verb|…| with any delimiter, \lstinline[…]{…} or |…|. */
const INLINE_CODE_COMMANDS = ['verb', 'lstinline', 'Verb', 'mintinline', 'spverb']
/** Settings whose braced argument is layout, never mathematics. */
const LAYOUT_COMMANDS = new Set([
  'ytableausetup', 'tikzset', 'pgfplotsset', 'usetikzlibrary', 'usepgfplotslibrary', 'pgfkeys', 'tikzstyle', 'lstset',
  'setminted', 'setmintedinline', 'tikzcdset', 'pgfplotstableset', 'tikz', 'tcbset', 'sisetup',
])

/** Blank comments, \iffalse blocks, verbatim, drawings and inline code: `maskSource('a % b').text === 'a    '`. */
export function maskSource(src: string): MaskedSource {
  const parts: string[] = []
  const comments: SourceComment[] = []
  const problems: MaskedSource['problems'] = []
  let kept = 0 // everything before `kept` has been copied to parts
  const hide = (from: number, to: number) => {
    if (from > kept) parts.push(src.slice(kept, from))
    parts.push(src.slice(Math.max(from, kept), to).replace(/[^\n]/g, ' '))
    kept = Math.max(kept, to)
  }
  const special = /[\\%]/g
  const aliases = inlineCodeAliases(src)
  const inlineCode = new Set([...INLINE_CODE_COMMANDS, ...aliases.map(a => a.name)])
  let nextAlias = 0
  let iffalseDepth = 0
  let iffalseStart = -1
  let m: RegExpExecArray | null
  while ((m = special.exec(src)) !== null) {
    const i = m.index
    if (src[i] === '%') {
      let end = src.indexOf('\n', i)
      if (end < 0) end = src.length
      if (iffalseDepth === 0) {
        const lineStart = src.lastIndexOf('\n', i - 1) + 1
        comments.push({ offset: i, text: src.slice(i + 1, end), wholeLine: src.slice(lineStart, i).trim() === '' })
        hide(i, end)
      }
      special.lastIndex = end
      continue
    }
    // A backslash: read the control sequence name.
    let j = i + 1
    while (j < src.length && isLetter(src.charCodeAt(j))) j++
    if (j === i + 1) {
      special.lastIndex = i + 2 // control symbol such as \% or \\: skip the escaped character
      continue
    }
    const name = src.slice(i + 1, j)
    special.lastIndex = j
    if (iffalseDepth > 0) {
      if (name === 'fi') {
        iffalseDepth--
        if (iffalseDepth === 0) hide(iffalseStart, j)
      }
      else if (name === 'else' && iffalseDepth === 1) {
        // \iffalse A \else B \fi typesets B; the lone \fi left behind is harmless.
        iffalseDepth = 0
        hide(iffalseStart, j)
      }
      else if (name.startsWith('if')) iffalseDepth++
      continue
    }
    // Definitions come in file order and the scan only moves forward: one pointer, no search.
    while (nextAlias < aliases.length && aliases[nextAlias]!.end <= i) nextAlias++
    const definition = aliases[nextAlias]
    if (definition && i >= definition.start) {
      // `\let\code=\lstinline` itself is a definition, not inline code: the reader needs it whole.
      special.lastIndex = definition.end
      continue
    }
    if (name === 'iffalse') {
      iffalseDepth = 1
      iffalseStart = i
    }
    else if (inlineCode.has(name)) {
      const end = inlineCodeEnd(src, j, name === 'mintinline')
      if (end === undefined) continue
      hide(i, end)
      special.lastIndex = end
    }
    else if (LAYOUT_COMMANDS.has(name)) {
      const end = layoutArgumentEnd(src, j, name === 'tikz')
      if (end === undefined) continue
      hide(i, end)
      special.lastIndex = end
    }
    else if (name === 'begin') {
      const env = /^\s*\{([^{}\n]*)\}/.exec(src.slice(j, j + 80))
      const envName = env?.[1]!.trim()
      if (!envName || !(VERBATIM_ENVIRONMENTS.has(envName) || DRAWING_ENVIRONMENTS.has(envName))) continue
      const end = DRAWING_ENVIRONMENTS.has(envName) ? nestedEnvironmentEnd(src, envName, j) : verbatimEnd(src, envName, j)
      if (end === undefined) problems.push({ offset: i, message: `\\begin{${envName}} is never closed; the rest of the file is ignored` })
      hide(i, end ?? src.length)
      special.lastIndex = end ?? src.length
    }
    else if (name === 'end' && /^\s*\{document\}/.test(src.slice(j, j + 20))) {
      hide(i, src.length)
      special.lastIndex = src.length
    }
  }
  if (iffalseDepth > 0) {
    problems.push({ offset: iffalseStart, message: '\\iffalse is never closed by \\fi; the rest of the file is ignored' })
    hide(iffalseStart, src.length)
  }
  if (kept < src.length) parts.push(src.slice(kept))
  return { text: parts.join(''), comments, problems }
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
}

/** Offset just past `\end{name}` after `from`, or undefined. */
function verbatimEnd(src: string, name: string, from: number): number | undefined {
  const closeRe = new RegExp(`\\\\end\\s*\\{${escapeRegExp(name)}\\}`, 'g')
  closeRe.lastIndex = from
  const close = closeRe.exec(src)
  return close ? close.index + close[0].length : undefined
}

/** Like `verbatimEnd`, counting nested \begin{name} … \end{name} pairs. */
function nestedEnvironmentEnd(src: string, name: string, from: number): number | undefined {
  const re = new RegExp(`\\\\(begin|end)\\s*\\{${escapeRegExp(name)}\\}`, 'g')
  re.lastIndex = from
  let depth = 1
  for (let m = re.exec(src); m; m = re.exec(src)) {
    depth += m[1] === 'begin' ? 1 : -1
    if (depth === 0) return m.index + m[0].length
  }
  return undefined
}

/** Skip spaces and tabs (not line breaks) from `k`. */
function skipBlanks(src: string, k: number): number {
  while (src[k] === ' ' || src[k] === '\t') k++
  return k
}

/** From `k` at `[`, the offset past the matching `]` (brace-aware, one line at most); else `k`. */
function skipOptions(src: string, k: number): number {
  if (src[k] !== '[') return k
  let depth = 0
  for (let m = k + 1; m < src.length && m < k + 2000; m++) {
    const c = src[m]
    if (c === '{') depth++
    else if (c === '}') depth--
    else if (c === ']' && depth === 0) return m + 1
    else if (c === '\n' && src[m + 1] === '\n') return k
  }
  return k
}

/** From `k` at `{`, the offset past the matching `}`, or undefined if it is never closed. */
function braceEnd(src: string, k: number): number | undefined {
  let depth = 0
  for (let m = k; m < src.length; m++) {
    const c = src[m]
    if (c === '\\') m++
    else if (c === '{') depth++
    else if (c === '}' && --depth === 0) return m + 1
  }
  return undefined
}

/**
 * End of inline code after its command name at `j`: `\verb*|…|`, `\lstinline[opts]{…}`,
 * `\mintinline{lang}|…|`. A delimiter never closed on its line hides the rest of the line.
 */
function inlineCodeEnd(src: string, j: number, withLanguage: boolean): number | undefined {
  let k = j
  if (src[k] === '*') k++
  k = skipOptions(src, k)
  if (withLanguage) {
    k = skipBlanks(src, k)
    if (src[k] !== '{') return undefined
    const lang = braceEnd(src, k)
    if (lang === undefined) return undefined
    k = lang
  }
  const delim = src[k]
  // A line break, space or closing brace is no delimiter (`\newcommand{\code}{\lstinline}` defines, it does not quote).
  if (delim === undefined || delim === '\n' || delim === ' ' || delim === '}') return undefined
  const eol = src.indexOf('\n', k + 1)
  const lineEnd = eol < 0 ? src.length : eol
  if (delim === '{') {
    // Braced code (\lstinline{…}) nests braces and stays on its line.
    let depth = 0
    for (let m = k; m < lineEnd; m++) {
      if (src[m] === '{') depth++
      else if (src[m] === '}' && --depth === 0) return m + 1
    }
    return lineEnd
  }
  const close = src.indexOf(delim, k + 1)
  return close < 0 || close > lineEnd ? lineEnd : close + 1
}

/**
 * End of a layout setting's argument after the command name at `j`: `[options]{…}`; for \tikz
 * also the unbraced form `\tikz[…] \draw …;`, up to the first `;` in the paragraph.
 */
function layoutArgumentEnd(src: string, j: number, semicolonForm: boolean): number | undefined {
  let k = skipOptions(src, skipBlanks(src, j))
  k = skipBlanks(src, k)
  if (src[k] === '{') {
    const end = braceEnd(src, k)
    if (end === undefined) return undefined
    // \tikzstyle{name}=[…]: the style's options too.
    const after = /^\s*=\s*/.exec(src.slice(end, end + 20))
    return after && src[end + after[0].length] === '[' ? skipOptions(src, end + after[0].length) : end
  }
  if (!semicolonForm) return undefined
  const stop = src.indexOf(';', k)
  const para = src.indexOf('\n\n', k)
  if (stop < 0 || (para >= 0 && para < stop)) return undefined
  return stop + 1
}

/**
 * Names made to mean inline code: `\let\code=\lstinline`, `\let\v\verb`,
 * `\newcommand{\code}{\lstinline}`, `\def\code{\lstinline}` (outside comments).
 */
function inlineCodeAliases(src: string): { name: string, start: number, end: number }[] {
  if (!/\\(?:lstinline|verb|Verb|mintinline|spverb)\b/.test(src)) return []
  const names: { name: string, start: number, end: number }[] = []
  const code = INLINE_CODE_COMMANDS.join('|')
  const re = new RegExp(`\\\\(?:let\\s*\\\\([A-Za-z@]+)\\s*=?\\s*|(?:newcommand|renewcommand|providecommand)\\*?\\s*\\{\\s*\\\\([A-Za-z@]+)\\s*\\}\\s*\\{\\s*|def\\s*\\\\([A-Za-z@]+)\\s*\\{\\s*)\\\\(?:${code})(?![A-Za-z@])`, 'g')
  for (const m of src.matchAll(re)) {
    const lineStart = src.lastIndexOf('\n', m.index) + 1
    if (/(^|[^\\])%/.test(src.slice(lineStart, m.index))) continue
    names.push({ name: (m[1] ?? m[2] ?? m[3])!, start: m.index, end: m.index + m[0].length })
  }
  return names
}

function isLetter(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 64
}
