/**
 * Hiding what TeX does not typeset, without moving anything.
 *
 * Conventions: the masked text has exactly the length and the line breaks of the input; every
 * hidden character becomes a space, so offsets, lines and columns stay valid. Hidden: comments,
 * \iffalse … \fi, verbatim-like environments, the `comment` environment, \verb, and everything
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
  problems: { offset: number; message: string }[]
}

const VERBATIM_ENVIRONMENTS = new Set(['verbatim', 'verbatim*', 'lstlisting', 'minted', 'comment', 'Verbatim', 'alltt'])

/** Blank comments, \iffalse blocks and verbatim: `maskSource('a % b').text === 'a    '`. */
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
      } else if (name === 'else' && iffalseDepth === 1) {
        // \iffalse A \else B \fi typesets B; the lone \fi left behind is harmless.
        iffalseDepth = 0
        hide(iffalseStart, j)
      } else if (name.startsWith('if')) iffalseDepth++
      continue
    }
    if (name === 'iffalse') {
      iffalseDepth = 1
      iffalseStart = i
    } else if (name === 'verb') {
      let k = j
      if (src[k] === '*') k++
      const delim = src[k]
      if (delim === undefined || delim === '\n') continue
      const close = src.indexOf(delim, k + 1)
      const eol = src.indexOf('\n', k + 1)
      const end = close < 0 || (eol >= 0 && eol < close) ? (eol < 0 ? src.length : eol) : close + 1
      hide(i, end)
      special.lastIndex = end
    } else if (name === 'begin') {
      const env = /^\s*\{([^{}\n]*)\}/.exec(src.slice(j, j + 80))
      if (!env || !VERBATIM_ENVIRONMENTS.has(env[1]!.trim())) continue
      const envName = env[1]!.trim()
      const closeRe = new RegExp(`\\\\end\\s*\\{${envName.replace(/[*]/g, '\\*')}\\}`, 'g')
      closeRe.lastIndex = j
      const close = closeRe.exec(src)
      const end = close ? close.index + close[0].length : src.length
      if (!close) problems.push({ offset: i, message: `\\begin{${envName}} is never closed; the rest of the file is ignored` })
      hide(i, end)
      special.lastIndex = end
    } else if (name === 'end' && /^\s*\{document\}/.test(src.slice(j, j + 20))) {
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

function isLetter(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 64
}
