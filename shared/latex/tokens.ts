/**
 * A small TeX-like tokenizer over masked text.
 *
 * Conventions: `pos`/`end` are offsets into the file's text; `depth` counts the macro expansions a
 * token came out of (0 for tokens read from the file). Runs of ordinary characters become one
 * `ch` token so that prose is cheap to skip; math code splits them again (see `splitRuns`).
 * `@` counts as a letter in control-sequence names, as inside \makeatletter.
 */

export type TokenKind = 'cs' | 'ch' | 'sp' | 'par' | 'param'

export interface Token {
  k: TokenKind
  /** Name of a control sequence (without the backslash), the characters, or the parameter digit. */
  v: string
  pos: number
  end: number
  depth: number
}

/** Characters that always form a token of their own. */
const SPECIAL = new Set(['\\', '{', '}', '$', '&', '#', '^', '_', '~', '[', ']', '%'])

function isLetterCode(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 64
}

function isSpace(ch: string | undefined): boolean {
  return ch === ' ' || ch === '\t' || ch === '\n' || ch === '\f' || ch === '\r'
}

/** Reads tokens lazily from text: `new Tokenizer('\\a b').next()` is `{ k: 'cs', v: 'a', … }`. */
export class Tokenizer {
  pos = 0
  constructor(readonly text: string, start = 0, readonly stop = text.length) {
    this.pos = start
  }

  next(): Token | undefined {
    const s = this.text
    const start = this.pos
    if (start >= this.stop) return undefined
    const ch = s[start]!
    if (ch === '\\') {
      let j = start + 1
      if (j >= this.stop) {
        this.pos = j
        return { k: 'ch', v: '\\', pos: start, end: j, depth: 0 }
      }
      if (isLetterCode(s.charCodeAt(j))) {
        while (j < this.stop && isLetterCode(s.charCodeAt(j))) j++
        const name = s.slice(start + 1, j)
        // TeX drops spaces after a control word, and one line break unless it ends a paragraph.
        let k = j
        while (s[k] === ' ' || s[k] === '\t') k++
        if (s[k] === '\n') {
          let m = k + 1
          while (s[m] === ' ' || s[m] === '\t') m++
          if (s[m] !== '\n') k = m
        }
        this.pos = Math.min(k, this.stop)
        return { k: 'cs', v: name, pos: start, end: j, depth: 0 }
      }
      this.pos = j + 1
      return { k: 'cs', v: s[j]!, pos: start, end: j + 1, depth: 0 }
    }
    if (isSpace(ch)) {
      let j = start
      let breaks = 0
      while (j < this.stop && isSpace(s[j])) {
        if (s[j] === '\n') breaks++
        j++
      }
      this.pos = j
      return { k: breaks >= 2 ? 'par' : 'sp', v: ' ', pos: start, end: j, depth: 0 }
    }
    if (ch === '$') {
      const dbl = s[start + 1] === '$' && start + 1 < this.stop
      this.pos = start + (dbl ? 2 : 1)
      return { k: 'ch', v: dbl ? '$$' : '$', pos: start, end: this.pos, depth: 0 }
    }
    if (SPECIAL.has(ch)) {
      this.pos = start + 1
      return { k: 'ch', v: ch, pos: start, end: start + 1, depth: 0 }
    }
    let j = start + 1
    while (j < this.stop && !SPECIAL.has(s[j]!) && !isSpace(s[j])) j++
    this.pos = j
    return { k: 'ch', v: s.slice(start, j), pos: start, end: j, depth: 0 }
  }
}

/** Tokenize a whole (short) string: `tokenize('a{b}').length === 4`. */
export function tokenize(text: string): Token[] {
  const t = new Tokenizer(text)
  const out: Token[] = []
  for (let tok = t.next(); tok; tok = t.next()) out.push(tok)
  return out
}

/** Split multi-character `ch` runs into one token per character (math reads characters one by one). */
export function splitRuns(tokens: Token[]): Token[] {
  const out: Token[] = []
  for (const t of tokens) {
    if (t.k === 'ch' && t.v.length > 1 && t.v !== '$$') {
      const fromFile = t.end - t.pos === t.v.length
      for (let i = 0; i < t.v.length; i++) {
        out.push({ k: 'ch', v: t.v[i]!, pos: fromFile ? t.pos + i : t.pos, end: fromFile ? t.pos + i + 1 : t.end, depth: t.depth })
      }
    }
    else out.push(t)
  }
  return out
}

/** LaTeX text of tokens: `renderTokens(tokenize('\\a{b}')) === '\\a{b}'`. */
export function renderTokens(tokens: readonly Token[]): string {
  let out = ''
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!
    if (t.k === 'cs') {
      out += '\\' + t.v
      const next = tokens[i + 1]
      if (/^[A-Za-z@]/.test(t.v) && next && next.k !== 'sp' && next.k !== 'par' && /^[A-Za-z@]/.test(next.v) && next.k !== 'cs') out += ' '
    }
    else if (t.k === 'sp' || t.k === 'par') out += ' '
    else if (t.k === 'param') out += '#' + t.v
    else out += t.v
  }
  return out.trim()
}
