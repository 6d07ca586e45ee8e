/**
 * The manuscript's own macros: reading their definitions and expanding them, within limits.
 *
 * Conventions: arguments are read unexpanded, as TeX does. Tokens coming out of an expansion carry
 * the position of the macro's use (never of its definition) and a depth one higher than the macro
 * token; passing `limits.maxExpansionDepth` or the output budget raises `ExpansionError`, so a
 * self-referential macro ends with a clear message instead of a hang.
 */
import { Tokenizer, renderTokens, splitRuns, type Token } from './tokens'

/** One item of a \def parameter text: a parameter number or a literal delimiter token. */
type PatternItem = { param: number } | { literal: Token }

export interface MacroDefinition {
  name: string
  /** Number of parameters (#1 … #9). */
  params: number
  /** For \newcommand with an optional first argument: its default value. */
  optionalDefault?: Token[]
  /** For \def with delimiters; undefined when every parameter is undelimited. */
  pattern?: PatternItem[]
  /** Replacement text; `param` tokens stand for arguments. */
  body: Token[]
  /** Where it was defined, for messages. */
  file: string
  offset: number
}

/**
 * The definitions KaTeX can use as they stand, as its `macros` option takes them: plain
 * parameters only (no optional argument, no \def delimiters), since KaTeX reads neither.
 * e.g. `\newcommand{\Sch}[1]{\mathfrak{S}_{#1}}` gives `{ '\\Sch': '\\mathfrak{S}_{#1}' }`.
 */
export function katexMacros(definitions: Iterable<MacroDefinition>): Record<string, string> {
  const table: Record<string, string> = {}
  for (const d of definitions) {
    if (d.optionalDefault || d.pattern) continue
    table[`\\${d.name}`] = renderTokens(d.body)
  }
  return table
}

export class ExpansionError extends Error {
  constructor(message: string, readonly pos: number) {
    super(message)
  }
}

export interface ExpansionLimits {
  maxExpansionDepth: number
  maxExpansionTokens: number
  maxArgumentTokens: number
}

/** Shared expansion budget for one run. */
export interface ExpansionBudget {
  produced: number
}

const SPACE_KINDS = new Set(['sp', 'par'])

/**
 * A token stream with TeX-like expansion of user macros.
 * `next()` expands; `nextRaw()` does not. Names in `protectedNames` (notation declared by tags)
 * are never expanded.
 */
export class Expander {
  private frames: { toks: Token[]; i: number }[] = []

  constructor(
    readonly tokenizer: Tokenizer,
    readonly macros: Map<string, MacroDefinition>,
    readonly protectedNames: Set<string>,
    readonly limits: ExpansionLimits,
    readonly budget: ExpansionBudget,
  ) {}

  /** True when no expanded tokens are pending, so the tokenizer position can be saved and restored. */
  get atFileLevel(): boolean {
    return this.frames.length === 0
  }

  /** Drop pending expanded tokens (after an error). */
  clearPending(): void {
    this.frames = []
  }

  /** The last token handed out by `nextRaw` (to find where a macro call ends). */
  private lastRaw: Token | undefined

  nextRaw(): Token | undefined {
    while (this.frames.length) {
      const f = this.frames[this.frames.length - 1]!
      if (f.i < f.toks.length) return (this.lastRaw = f.toks[f.i++])
      this.frames.pop()
    }
    return (this.lastRaw = this.tokenizer.next())
  }

  /** Like nextRaw, but a run of characters yields its first character only (for \def delimiters). */
  nextRawChar(): Token | undefined {
    const t = this.nextRaw()
    if (!t || t.k !== 'ch' || t.v.length <= 1 || t.v === '$$') return t
    const [first, ...rest] = splitRuns([t])
    this.pushBack(rest)
    return first
  }

  pushBack(toks: Token[]): void {
    if (toks.length) this.frames.push({ toks, i: 0 })
  }

  peekRaw(): Token | undefined {
    const t = this.nextRaw()
    if (t) this.pushBack([t])
    return t
  }

  /** Next non-space raw token. */
  nextRawNonSpace(): Token | undefined {
    let t = this.nextRaw()
    while (t && SPACE_KINDS.has(t.k)) t = this.nextRaw()
    return t
  }

  /** Next token with user macros expanded. */
  next(): Token | undefined {
    for (;;) {
      const t = this.nextRaw()
      if (!t || t.k !== 'cs') return t
      const def = this.macros.get(t.v)
      if (!def || this.protectedNames.has(t.v)) return t
      this.expand(t, def)
    }
  }

  private expand(t: Token, def: MacroDefinition): void {
    if (t.depth + 1 > this.limits.maxExpansionDepth) {
      throw new ExpansionError(
        `macro \\${t.v} is nested more than ${this.limits.maxExpansionDepth} expansions deep; is it defined in terms of itself?`,
        t.pos,
      )
    }
    const args: Token[][] = []
    let end = t.end
    const noteEnd = (a: Token[]) => {
      for (const x of a) if (x.depth === t.depth && x.end > end) end = x.end
    }
    if (def.pattern) {
      this.matchPattern(t, def, args)
      for (const a of args) noteEnd(a)
    } else {
      let first = 0
      if (def.optionalDefault) {
        const opt = this.readOptional(t)
        // The default comes from the definition: stamp it with the use site's position.
        args.push(opt ?? def.optionalDefault.map(d => ({ ...d, pos: t.pos, end: t.end, depth: t.depth + 1 })))
        if (opt) noteEnd(opt)
        first = 1
      }
      for (let i = first; i < def.params; i++) {
        const a = this.readArgument(t)
        noteEnd(a)
        args.push(a)
      }
    }
    const last = this.lastRaw
    if (last && last !== t && last.depth === t.depth && last.end > end) end = last.end
    const out: Token[] = []
    for (const b of def.body) {
      if (b.k === 'param') {
        const a = args[Number(b.v) - 1] ?? []
        for (const x of a) out.push(x)
      } else out.push({ k: b.k, v: b.v, pos: t.pos, end, depth: t.depth + 1 })
    }
    this.budget.produced += out.length
    if (this.budget.produced > this.limits.maxExpansionTokens) {
      throw new ExpansionError(
        `macro expansion produced more than ${this.limits.maxExpansionTokens} tokens (last: \\${t.v}); the output limit stops it`,
        t.pos,
      )
    }
    this.pushBack(out)
  }

  /** A mandatory argument: one token or a balanced group, braces stripped. */
  readArgument(owner: Token): Token[] {
    const t = this.nextRawNonSpace()
    if (!t) throw new ExpansionError(`\\${owner.v} is missing an argument at the end of the input`, owner.pos)
    if (t.k === 'ch' && t.v === '}') {
      throw new ExpansionError(`\\${owner.v} expects an argument but found "}"`, t.pos)
    }
    if (t.k === 'ch' && t.v === '{') return this.readGroupBody(t, owner)
    if (t.k === 'ch' && t.v.length > 1) {
      // A run of characters: the argument is its first character only.
      const fromFile = t.end - t.pos === t.v.length
      this.pushBack([{ ...t, v: t.v.slice(1), pos: fromFile ? t.pos + 1 : t.pos }])
      return [{ ...t, v: t.v[0]!, end: fromFile ? t.pos + 1 : t.end }]
    }
    return [t]
  }

  /** After an opening brace: the tokens up to the matching closing brace. */
  readGroupBody(open: Token, owner: Token): Token[] {
    const out: Token[] = []
    let depth = 1
    for (;;) {
      const t = this.nextRaw()
      if (!t) throw new ExpansionError(`unbalanced braces: the "{" opened for \\${owner.v} is never closed`, open.pos)
      if (t.k === 'ch' && t.v === '{') depth++
      else if (t.k === 'ch' && t.v === '}') {
        depth--
        if (depth === 0) return out
      }
      out.push(t)
      if (out.length > this.limits.maxArgumentTokens) {
        throw new ExpansionError(
          `unbalanced braces: the argument of \\${owner.v} runs past ${this.limits.maxArgumentTokens} tokens`,
          open.pos,
        )
      }
    }
  }

  /** An optional [argument], or undefined (the peeked token is put back). */
  readOptional(owner: Token): Token[] | undefined {
    const skipped: Token[] = []
    let t = this.nextRaw()
    while (t && SPACE_KINDS.has(t.k)) {
      skipped.push(t)
      t = this.nextRaw()
    }
    if (!t || !(t.k === 'ch' && t.v === '[')) {
      if (t) this.pushBack([t])
      this.lastRaw = undefined // the peeked token is not part of the call
      return undefined
    }
    const out: Token[] = []
    let depth = 0
    for (;;) {
      const u = this.nextRaw()
      if (!u) throw new ExpansionError(`the optional argument of \\${owner.v} is never closed by "]"`, t.pos)
      if (u.k === 'ch' && u.v === '{') depth++
      else if (u.k === 'ch' && u.v === '}') depth--
      else if (u.k === 'ch' && u.v === ']' && depth === 0) return out
      out.push(u)
      if (out.length > this.limits.maxArgumentTokens) {
        throw new ExpansionError(`the optional argument of \\${owner.v} runs past ${this.limits.maxArgumentTokens} tokens`, t.pos)
      }
    }
  }

  private matchPattern(t: Token, def: MacroDefinition, args: Token[][]): void {
    const pattern = def.pattern!
    let i = 0
    while (i < pattern.length) {
      const item = pattern[i]!
      if ('literal' in item) {
        const u = this.nextRawChar()
        if (!u || u.k !== item.literal.k || u.v !== item.literal.v) {
          throw new ExpansionError(`use of \\${def.name} does not match its definition`, t.pos)
        }
        i++
        continue
      }
      const delims: Token[] = []
      let j = i + 1
      for (let next = pattern[j]; next && 'literal' in next; next = pattern[++j]) delims.push(next.literal)
      if (delims.length === 0) {
        args[item.param - 1] = this.readArgument(t)
        i++
        continue
      }
      // Delimited: collect until the delimiter sequence appears at brace depth 0.
      const got: Token[] = []
      let depth = 0
      for (;;) {
        const u = this.nextRawChar()
        if (!u) throw new ExpansionError(`use of \\${def.name} does not match its definition (delimiter never found)`, t.pos)
        if (u.k === 'ch' && u.v === '{') depth++
        if (u.k === 'ch' && u.v === '}') depth--
        got.push(u)
        if (depth === 0 && got.length >= delims.length && endsWith(got, delims)) {
          got.length -= delims.length
          break
        }
        if (got.length > this.limits.maxArgumentTokens) {
          throw new ExpansionError(`the argument of \\${def.name} runs past ${this.limits.maxArgumentTokens} tokens`, t.pos)
        }
      }
      const first = got[0]
      const last = got[got.length - 1]
      // TeX strips one pair of braces around a whole delimited argument.
      const stripped = first && last && first.v === '{' && last.v === '}' && isSingleGroup(got) ? got.slice(1, -1) : got
      args[item.param - 1] = stripped
      i = j
    }
  }
}

function endsWith(got: Token[], delims: Token[]): boolean {
  const off = got.length - delims.length
  for (let i = 0; i < delims.length; i++) {
    const a = got[off + i]!
    const b = delims[i]!
    if (a.k !== b.k || a.v !== b.v) return false
  }
  return true
}

function isSingleGroup(toks: Token[]): boolean {
  let depth = 0
  for (let i = 0; i < toks.length; i++) {
    const t = toks[i]!
    if (t.k === 'ch' && t.v === '{') depth++
    if (t.k === 'ch' && t.v === '}') {
      depth--
      if (depth === 0 && i !== toks.length - 1) return false
    }
  }
  return true
}

/** Turn `#1` in a definition's replacement text into parameter tokens (and `##` into `#`). */
export function toReplacementText(toks: Token[]): Token[] {
  const out: Token[] = []
  for (let i = 0; i < toks.length; i++) {
    const t = toks[i]!
    if (t.k === 'ch' && t.v === '#') {
      const n = toks[i + 1]
      if (n && n.k === 'ch' && /^[1-9]/.test(n.v)) {
        out.push({ ...t, k: 'param', v: n.v[0]! })
        if (n.v.length > 1) out.push({ ...n, v: n.v.slice(1) })
        i++
        continue
      }
      if (n && n.k === 'ch' && n.v === '#') {
        out.push(t)
        i++
        continue
      }
    }
    out.push(t)
  }
  return out
}

/** Commands that define macros and are handled by `readDefinition`. */
export const DEFINING_COMMANDS = new Set([
  'newcommand', 'renewcommand', 'providecommand', 'def', 'gdef', 'edef', 'xdef', 'let',
  'DeclareMathOperator', 'DeclareRobustCommand',
])

/**
 * Read a definition whose command token `cmd` was just consumed. Returns the definition (or undefined
 * for \providecommand of a known name), or throws ExpansionError for malformed input.
 */
export function readDefinition(
  cmd: Token,
  x: Expander,
  file: string,
): MacroDefinition | undefined {
  const name = cmd.v
  const star = () => {
    const p = x.nextRawNonSpace()
    if (p && p.k === 'ch' && p.v.startsWith('*')) {
      if (p.v.length > 1) x.pushBack([{ ...p, v: p.v.slice(1) }])
    } else if (p) x.pushBack([p])
  }
  const readName = (): Token => {
    const t = x.nextRawNonSpace()
    if (t && t.k === 'cs') return t
    if (t && t.k === 'ch' && t.v === '{') {
      const inner = x.readGroupBody(t, cmd).filter(u => u.k !== 'sp')
      if (inner.length === 1 && inner[0]!.k === 'cs') return inner[0]!
    }
    throw new ExpansionError(`\\${name} must be followed by the name of a macro`, cmd.pos)
  }
  const readBody = (): Token[] => {
    const t = x.nextRawNonSpace()
    if (!t) throw new ExpansionError(`\\${name} has no replacement text`, cmd.pos)
    if (t.k === 'ch' && t.v === '{') return x.readGroupBody(t, cmd)
    return [t]
  }
  if (name === 'let') {
    const target = readName()
    let t = x.nextRawNonSpace()
    if (t && t.k === 'ch' && t.v === '=') t = x.nextRawNonSpace()
    if (!t) throw new ExpansionError('\\let has no second token', cmd.pos)
    const existing = t.k === 'cs' ? x.macros.get(t.v) : undefined
    if (existing) return { ...existing, name: target.v, file, offset: cmd.pos }
    return { name: target.v, params: 0, body: [t], file, offset: cmd.pos }
  }
  if (name === 'DeclareMathOperator') {
    star()
    const target = readName()
    const text = readBody()
    const body: Token[] = [
      { k: 'cs', v: 'operatorname', pos: cmd.pos, end: cmd.end, depth: 0 },
      { k: 'ch', v: '{', pos: cmd.pos, end: cmd.end, depth: 0 },
      ...text,
      { k: 'ch', v: '}', pos: cmd.pos, end: cmd.end, depth: 0 },
    ]
    return { name: target.v, params: 0, body, file, offset: cmd.pos }
  }
  if (name === 'def' || name === 'gdef' || name === 'edef' || name === 'xdef') {
    const target = readName()
    const paramText: Token[] = []
    for (;;) {
      const t = x.nextRaw()
      if (!t) throw new ExpansionError(`\\${name}\\${target.v} has no replacement text`, cmd.pos)
      if (t.k === 'ch' && t.v === '{') {
        const body = toReplacementText(x.readGroupBody(t, cmd))
        const pattern = toReplacementText(splitRuns(paramText))
        const items: PatternItem[] = pattern.map(u => (u.k === 'param' ? { param: Number(u.v) } : { literal: u }))
        const params = items.filter(it => 'param' in it).length
        const delimited = items.some(it => 'literal' in it && it.literal.k !== 'sp')
        return {
          name: target.v,
          params,
          pattern: delimited ? items.filter(it => 'param' in it || it.literal.k !== 'sp') : undefined,
          body,
          file,
          offset: cmd.pos,
        }
      }
      paramText.push(t)
      if (paramText.length > 100) throw new ExpansionError(`\\${name}\\${target.v}: parameter text too long`, cmd.pos)
    }
  }
  // \newcommand, \renewcommand, \providecommand, \DeclareRobustCommand
  star()
  const target = readName()
  let params = 0
  let optionalDefault: Token[] | undefined
  const count = x.readOptional(cmd)
  if (count) {
    const digits = count.map(u => u.v).join('').trim()
    if (!/^[0-9]$/.test(digits)) throw new ExpansionError(`\\${name}{\\${target.v}}: "[${digits}]" is not a number of arguments`, cmd.pos)
    params = Number(digits)
    const opt = x.readOptional(cmd)
    if (opt) optionalDefault = opt
  }
  const body = toReplacementText(readBody())
  if (name === 'providecommand' && x.macros.has(target.v)) return undefined
  return { name: target.v, params, optionalDefault, body, file, offset: cmd.pos }
}
