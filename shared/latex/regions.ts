/**
 * Stage "math regions": from the expanded token stream of a file, the pieces of math ($…$, \[…\],
 * math environments) as token lists with their place in the file.
 *
 * Conventions: a region's `pos`/`end` are offsets in the file's original text, from its opener to
 * the end of its closer. Collecting never throws on content: an unclosed region or a runaway macro
 * comes back as a `failure` that the claims stage turns into an error claim.
 */
import type { TagDirective } from './tags'
import { ExpansionError, type Expander } from './macros'
import type { Token } from './tokens'

/** What the stages after the files stage need to know about a file. */
export interface SourceFile {
  path: string
  /** The text as read (after decoding), for sources and excerpts. */
  original: string
  /** The same with comments and verbatim masked out, for looking at prose. */
  masked: string
  /** Offsets of line starts (see decode.lineStarts). */
  starts: number[]
  /** Tags attached to a line (skip, claim, use). */
  lineTags: Map<number, TagDirective[]>
}

/** Environments whose body is math. */
export const MATH_ENVIRONMENTS = new Set([
  'equation', 'equation*', 'align', 'align*', 'gather', 'gather*', 'multline', 'multline*', 'flalign', 'flalign*',
  'alignat', 'alignat*', 'eqnarray', 'eqnarray*', 'displaymath', 'math', 'dmath', 'dmath*',
])

/** Environments holding one equation (a \label anywhere in them names every claim inside). */
export const SINGLE_EQUATION_ENVS = new Set(['equation', 'equation*', 'multline', 'multline*', 'displaymath', 'dmath', 'dmath*'])

/** How a region ends: `$`, `$$`, a control sequence (`\]`, `\)`) or `\end{name}`. */
export type Closer = { kind: '$' } | { kind: '$$' } | { kind: 'cs', name: string } | { kind: 'env', name: string }

/** One piece of math, ready for the statements stage. */
export interface MathRegion {
  file: SourceFile
  tokens: Token[]
  /** Offset of the opener. */
  pos: number
  /** Offset just after the closer. */
  end: number
  display: boolean
  /** The math environment, when the region is one. */
  env?: string
}

/** The tokens up to a region's closer; `failure` when it could not be closed cleanly. */
export interface CollectedMath {
  tokens: Token[]
  end: number
  failure?: { message: string, pos: number }
}

/** How the opener of a region is called in messages: `$`, `\[`, `\begin{align}`. */
function openerName(closer: Closer): string {
  if (closer.kind === 'env') return `\\begin{${closer.name}}`
  if (closer.kind === 'cs') return closer.name === ']' ? '\\[' : '\\('
  return closer.kind
}

/**
 * Read tokens (expanding macros) up to the closer of the region opened by `open`. On a runaway
 * macro the rest is read unexpanded; on a region that never closes the reader is put back to just
 * after the opener (when it reads the file itself) so that the text after it is still read.
 */
export function collectMath(expander: Expander, open: Token, closer: Closer, maxTokens: number): CollectedMath {
  const savedPos = expander.atFileLevel ? expander.tokenizer.pos : undefined
  const tokens: Token[] = []
  let braceDepth = 0
  let sameEnvDepth = 0
  let failure: CollectedMath['failure']
  let expand = true
  let end = open.end
  const what = openerName(closer)
  for (;;) {
    let token: Token | undefined
    try {
      token = expand ? expander.next() : expander.nextRaw()
    }
    catch (e) {
      if (!(e instanceof ExpansionError)) throw e
      failure ??= { message: e.message, pos: e.pos }
      expander.clearPending()
      expand = false
      continue
    }
    if (!token) {
      failure = { message: `${what} is never closed`, pos: open.pos }
      if (savedPos !== undefined) expander.tokenizer.pos = savedPos
      break
    }
    if (token.k === 'ch' && token.v === '{') braceDepth++
    else if (token.k === 'ch' && token.v === '}') braceDepth--
    if (closer.kind === '$' || closer.kind === '$$') {
      if (token.k === 'par') {
        failure = { message: `${what} math is not closed before the end of the paragraph`, pos: open.pos }
        break
      }
      if (token.k === 'ch' && braceDepth <= 0 && (token.v === '$' || token.v === '$$')) {
        // `$a$$b$`: the second dollar of `$$` opens the next inline math.
        if (closer.kind === '$' && token.v === '$$') expander.pushBack([{ ...token, v: '$', pos: token.pos + 1 }])
        end = closer.kind === '$' && token.v === '$$' ? token.pos + 1 : token.end
        break
      }
    }
    else if (closer.kind === 'cs') {
      if (token.k === 'cs' && token.v === closer.name) {
        end = token.end
        break
      }
    }
    else if (token.k === 'cs' && (token.v === 'end' || token.v === 'begin')) {
      const nameTokens: Token[] = []
      const env = readEnvName(expander, nameTokens)
      if (env === closer.name && token.v === 'begin') sameEnvDepth++
      if (env === closer.name && token.v === 'end') {
        if (sameEnvDepth === 0) {
          end = nameTokens[nameTokens.length - 1]?.end ?? token.end
          break
        }
        sameEnvDepth--
      }
      tokens.push(token, ...nameTokens)
      continue
    }
    tokens.push(token)
    if (tokens.length > maxTokens) {
      failure = { message: `${what} is not closed within ${maxTokens} tokens`, pos: open.pos }
      expander.clearPending()
      if (savedPos !== undefined) expander.tokenizer.pos = savedPos
      break
    }
  }
  return { tokens, end, failure }
}

/** Read `{name}` after \begin or \end (raw); the tokens read are appended to `into`. */
export function readEnvName(expander: Expander, into?: Token[]): string | undefined {
  const open = expander.nextRawNonSpace()
  if (!open) return undefined
  if (!(open.k === 'ch' && open.v === '{')) {
    expander.pushBack([open])
    return undefined
  }
  into?.push(open)
  let name = ''
  for (let i = 0; i < 40; i++) {
    const token = expander.nextRaw()
    if (!token) return undefined
    into?.push(token)
    if (token.k === 'ch' && token.v === '}') return name.trim()
    name += token.k === 'cs' ? '\\' + token.v : token.v
  }
  return undefined
}

/** Text-mode tables whose rows may be claims (tables.ts reads them). */
export const TABLE_ENVIRONMENTS = new Set(['tabular', 'tabular*', 'tabularx', 'tabulary', 'longtable', 'longtable*'])

/**
 * After `\begin{tabular}`: skip the width (tabular*, tabularx), the position and the column
 * specification, which are not content. Throws ExpansionError on a missing argument.
 */
export function skipTableArguments(expander: Expander, env: string, owner: Token): void {
  if (env === 'tabular*' || env === 'tabularx' || env === 'tabulary') expander.readArgument(owner)
  expander.readOptional(owner)
  expander.readArgument(owner)
}
