/**
 * The manuscript's own macros: reading their definitions and expanding them, within limits.
 *
 * Conventions: arguments are read unexpanded, as TeX does. Tokens coming out of an expansion carry
 * the position of the macro's use (never of its definition) and a depth one higher than the macro
 * token; passing `limits.maxExpansionDepth` or the output budget raises `ExpansionError`, so a
 * self-referential macro ends with a clear message instead of a hang.
 * - `\let\a\b` copies the meaning \b has now: a user macro's definition, or else the command
 *   itself as TeX knows it (a "primitive" copy that is never expanded again), so
 *   `\let\oldsum\sum \renewcommand{\sum}{\oldsum\limits}` is not recursive.
 * - xparse argument types m, o, O, s, t, r, R, d, D, e, E, v and (for environments) b are read
 *   exactly; \IfBooleanTF and \IfNoValueTF (with their T and F forms) are decided when their
 *   argument is one of these. A macro whose specification holds anything else (argument
 *   processors >{…}, g, l, u) is kept as "unread": its uses become the token `\unread@name`, which
 *   no notation reader knows, so the math around it is listed as not read instead of being
 *   guessed. A use the reader cannot expand exactly (an r argument whose delimiter is missing, an
 *   \IfBooleanTF on something else) is left unread the same way.
 * - User environments (\newenvironment) expand at \begin and \end; `onUserEnvironment` tells a
 *   listener where they start and end, since their own \begin/\end tokens are consumed.
 */
import { Tokenizer, renderTokens, splitRuns, type Token } from './tokens'

/** One item of a \def parameter text: a parameter number or a literal delimiter token. */
type PatternItem = { param: number } | { literal: Token }

/**
 * One argument of a macro. `optional` is o/O (in brackets) or d/D (with `open`/`close`), with a
 * default (none: xparse's -NoValue-); `required` is r/R; `boolean` is s (token `*`) or t<token>;
 * `embellishments` is e/E, one argument per token; `verbatim` is v; `body` is an environment's b.
 * `noSpace` (xparse's `!`) means spaces before an optional argument end the call.
 */
export type ArgumentSpec
  = | { kind: 'mandatory' }
    | { kind: 'optional', default?: Token[], open?: string, close?: string, noSpace?: boolean }
    | { kind: 'required', open: string, close: string }
    | { kind: 'boolean', token: string, noSpace?: boolean }
    | { kind: 'embellishments', tokens: string[], defaults: (Token[] | undefined)[] }
    | { kind: 'verbatim' }
    | { kind: 'body' }

/** How many parameters (#1 …) an argument fills: one, or one per embellishment token. */
const paramCount = (spec: ArgumentSpec) => (spec.kind === 'embellishments' ? spec.tokens.length : 1)

export interface MacroDefinition {
  name: string
  /** Number of parameters (#1 … #9). */
  params: number
  /** Undelimited arguments in order (\newcommand, \NewDocumentCommand); absent means `params` mandatory ones. */
  args?: ArgumentSpec[]
  /** For \def with delimiters; undefined when every parameter is undelimited. */
  pattern?: PatternItem[]
  /** Replacement text; `param` tokens stand for arguments. */
  body: Token[]
  /** A \let copy of something that is not a user macro: its one body token, never expanded again. */
  primitive?: boolean
  /** Why the reader does not expand this macro (an argument specification it does not follow). */
  unread?: string
  /** Where it was defined, for messages. */
  file: string
  offset: number
}

/** An environment from \newenvironment or \NewDocumentEnvironment. */
export interface EnvironmentDefinition {
  name: string
  /** The begin code, with the environment's arguments. */
  begin: MacroDefinition
  end: Token[]
  file: string
  offset: number
}

/** What one defining command declared. */
export type Definition
  = | { type: 'macro', macro: MacroDefinition }
    | { type: 'environment', environment: EnvironmentDefinition }
    | { type: 'theorem', name: string }

/** The FILES-and-macros stage's output that later stages read: macros, environments, theorem-like blocks. */
export class MacroTable {
  readonly macros = new Map<string, MacroDefinition>()
  readonly environments = new Map<string, EnvironmentDefinition>()
  /** Environments declared with \newtheorem (or \declaretheorem): example, remark, proof-like blocks. */
  readonly theoremEnvironments = new Set<string>()

  add(d: Definition): void {
    if (d.type === 'macro') this.macros.set(d.macro.name, d.macro)
    else if (d.type === 'environment') this.environments.set(d.environment.name, d.environment)
    else this.theoremEnvironments.add(d.name)
  }
}

/** Prefix of the token that stands for a use of an unread macro. */
export const UNREAD_MACRO_PREFIX = 'unread@'

/** Why math using an unread macro is not read: `unreadMacroReason('Sw')`. */
export function unreadMacroReason(name: string): string {
  if (name === NO_VALUE_NAME) return 'a left-out optional argument (-NoValue-) is used here; the reader does not follow it'
  return `\\${name} takes arguments the reader does not follow`
}

/** True for the reason `unreadMacroReason` gives. */
export function isUnreadMacroReason(reason: string): boolean {
  return /the reader does not follow( it)?$/.test(reason)
}

/**
 * The definitions KaTeX can use as they stand, as its `macros` option takes them: plain
 * parameters only (no optional argument, no \def delimiters), since KaTeX reads neither. \let
 * copies of commands and macros the reader does not follow are left out too: KaTeX would
 * expand a copy again (`\let\oldsum\sum \renewcommand{\sum}{\oldsum\limits}` would loop).
 * e.g. `\newcommand{\Sch}[1]{\mathfrak{S}_{#1}}` gives `{ '\\Sch': '\\mathfrak{S}_{#1}' }`.
 */
export function katexMacros(definitions: Iterable<MacroDefinition>): Record<string, string> {
  const table: Record<string, string> = {}
  for (const d of definitions) {
    if (d.pattern || d.primitive || d.unread || d.args?.some(a => a.kind === 'optional')) continue
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

/** What xparse hands a macro for an absent `o` argument (-NoValue-): an unread token, so such math is not read. */
const NO_VALUE_NAME = 'NoValue-'
const NO_VALUE: Token[] = [{ k: 'cs', v: 'unread@' + NO_VALUE_NAME, pos: 0, end: 0, depth: 0 }]
/** What an s or t argument hands the macro, as xparse does: \BooleanTrue or \BooleanFalse. */
const BOOLEAN_TRUE = 'BooleanTrue'
const BOOLEAN_FALSE = 'BooleanFalse'
/** A verbatim (v) argument: its contents are code, never math, so math it lands in is not read. */
const VERBATIM_NAME = 'verbatim-argument'
/** xparse's tests on arguments, decided when the argument is a value the reader made (boolean, -NoValue-). */
const CONDITIONALS: Record<string, { test: 'boolean' | 'noValue' | 'value', branches: 'TF' | 'T' | 'F' }> = {
  IfBooleanTF: { test: 'boolean', branches: 'TF' }, IfBooleanT: { test: 'boolean', branches: 'T' }, IfBooleanF: { test: 'boolean', branches: 'F' },
  IfNoValueTF: { test: 'noValue', branches: 'TF' }, IfNoValueT: { test: 'noValue', branches: 'T' }, IfNoValueF: { test: 'noValue', branches: 'F' },
  IfValueTF: { test: 'value', branches: 'TF' }, IfValueT: { test: 'value', branches: 'T' }, IfValueF: { test: 'value', branches: 'F' },
}
/** The key a delimiter or token is compared by: its character, or `\name` for a control sequence. */
const tokenKey = (t: Token) => (t.k === 'cs' ? '\\' + t.v : t.v)

/** A use that cannot be expanded exactly: the macro's uses are then left unread. */
class InexactUse extends Error {}

/**
 * A token stream with TeX-like expansion of user macros.
 * `next()` expands; `nextRaw()` does not. Names in `protectedNames` (notation declared by tags)
 * are never expanded.
 */
export class Expander {
  private frames: { toks: Token[], i: number }[] = []
  /** Told where a user environment begins and ends (its \begin and \end tokens are consumed). */
  onUserEnvironment: ((name: string, edge: 'begin' | 'end', pos: number) => void) | undefined

  constructor(
    readonly tokenizer: Tokenizer,
    readonly table: MacroTable,
    readonly protectedNames: Set<string>,
    readonly limits: ExpansionLimits,
    readonly budget: ExpansionBudget,
  ) {}

  get macros(): Map<string, MacroDefinition> {
    return this.table.macros
  }

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
      if ((t.v === 'begin' || t.v === 'end') && this.table.environments.size) {
        if (this.expandEnvironment(t)) continue
        return t
      }
      const def = this.table.macros.get(t.v)
      if (!def && CONDITIONALS[t.v] && !this.protectedNames.has(t.v)) {
        if (this.expandConditional(t, CONDITIONALS[t.v]!)) continue
        return t
      }
      if (!def || this.protectedNames.has(t.v)) return t
      if (def.primitive) {
        // The meaning \let copied: handed out as it is, never looked up again.
        const meaning = def.body[0]!
        return { k: meaning.k, v: meaning.v, pos: t.pos, end: t.end, depth: t.depth + 1 }
      }
      if (def.unread) return { k: 'cs', v: UNREAD_MACRO_PREFIX + t.v, pos: t.pos, end: t.end, depth: t.depth }
      this.expand(t, def)
    }
  }

  /** `\begin{name}` or `\end{name}` of a user environment: replace it by its code. False if it is not one. */
  private expandEnvironment(t: Token): boolean {
    const nameToks: Token[] = []
    let open = this.nextRaw()
    while (open && SPACE_KINDS.has(open.k)) {
      nameToks.push(open)
      open = this.nextRaw()
    }
    let env: EnvironmentDefinition | undefined
    if (open) nameToks.push(open)
    if (open && open.k === 'ch' && open.v === '{') {
      let name = ''
      for (let i = 0; i < 40; i++) {
        const u = this.nextRaw()
        if (!u) break
        nameToks.push(u)
        if (u.k === 'ch' && u.v === '}') {
          env = this.table.environments.get(name.trim())
          break
        }
        if (u.k === 'ch' && u.v === '{') break
        name += u.k === 'cs' ? '\\' + u.v : u.v
      }
    }
    if (!env) {
      this.pushBack(nameToks)
      return false
    }
    this.onUserEnvironment?.(env.name, t.v === 'begin' ? 'begin' : 'end', t.pos)
    const owner: Token = { ...t, v: t.v === 'begin' ? `begin{${env.name}}` : `end{${env.name}}` }
    // An environment with a body argument (b) is expanded whole at \begin: its code, then its end code.
    if (t.v === 'begin' && env.begin.args?.some(a => a.kind === 'body')) this.expand(owner, { ...env.begin, body: [...env.begin.body, ...env.end] })
    else if (t.v === 'begin') this.expand(owner, env.begin)
    else this.expand(owner, { ...env.begin, params: 0, args: undefined, pattern: undefined, body: env.end })
    return true
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
    }
    else {
      const specs: ArgumentSpec[] = def.args ?? Array.from({ length: def.params }, () => ({ kind: 'mandatory' }) as const)
      // The default comes from the definition: stamp it with the use site's position.
      const stamp = (fallback: Token[] | undefined) => (fallback ?? NO_VALUE).map(d => ({ ...d, pos: t.pos, end: t.end, depth: t.depth + 1 }))
      const marker = (v: string): Token[] => [{ k: 'cs', v, pos: t.pos, end: t.end, depth: t.depth + 1 }]
      try {
        for (const spec of specs) {
          if (spec.kind === 'mandatory') {
            const a = this.readArgument(t)
            noteEnd(a)
            args.push(a)
          }
          else if (spec.kind === 'optional' || spec.kind === 'required') {
            const open = spec.kind === 'optional' ? spec.open ?? '[' : spec.open
            const close = spec.kind === 'optional' ? spec.close ?? ']' : spec.close
            const got = open === '[' && close === ']' && !(spec.kind === 'optional' && spec.noSpace) ? this.readOptional(t) : this.readDelimited(t, open, close, spec.kind === 'optional' && !!spec.noSpace)
            if (got) {
              noteEnd(got)
              args.push(got)
            }
            else if (spec.kind === 'required') throw new InexactUse()
            else args.push(stamp(spec.default))
          }
          else if (spec.kind === 'boolean') {
            args.push(marker(this.readBooleanToken(spec.token, !!spec.noSpace) ? BOOLEAN_TRUE : BOOLEAN_FALSE))
          }
          else if (spec.kind === 'embellishments') {
            const found = this.readEmbellishments(t, spec.tokens)
            spec.tokens.forEach((token, k) => {
              const a = found.get(token)
              if (a) noteEnd(a)
              args.push(a ?? stamp(spec.defaults[k]))
            })
          }
          else if (spec.kind === 'verbatim') {
            this.readVerbatim(t)
            args.push(marker(UNREAD_MACRO_PREFIX + VERBATIM_NAME))
          }
          else {
            args.push(this.readEnvironmentBody(t, def.name))
          }
        }
      }
      catch (e) {
        if (!(e instanceof InexactUse)) throw e
        this.pushBack([{ k: 'cs', v: UNREAD_MACRO_PREFIX + def.name, pos: t.pos, end: t.end, depth: t.depth }])
        return
      }
    }
    const last = this.lastRaw
    if (last && last !== t && last.depth === t.depth && last.end > end) end = last.end
    const out: Token[] = []
    for (const b of def.body) {
      if (b.k === 'param') {
        const a = args[Number(b.v) - 1] ?? []
        for (const x of a) out.push(x)
      }
      else out.push({ k: b.k, v: b.v, pos: t.pos, end, depth: t.depth + 1 })
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

  /**
   * A delimited argument `<open>…<close>` (xparse d, D, r, R), or undefined when the next token is
   * not `open` (put back). Nested pairs of the delimiters and braces are kept whole.
   */
  readDelimited(owner: Token, open: string, close: string, noSpace: boolean): Token[] | undefined {
    const skipped: Token[] = []
    let t = this.nextRawChar()
    while (!noSpace && t && SPACE_KINDS.has(t.k)) {
      skipped.push(t)
      t = this.nextRawChar()
    }
    if (!t || tokenKey(t) !== open) {
      if (t) this.pushBack([t])
      this.lastRaw = undefined
      return undefined
    }
    const out: Token[] = []
    let braces = 0
    let nested = 0
    for (;;) {
      const u = this.nextRawChar()
      if (!u) throw new ExpansionError(`the argument of \\${owner.v} opened by "${open}" is never closed by "${close}"`, t.pos)
      const key = tokenKey(u)
      if (u.k === 'ch' && u.v === '{') braces++
      else if (u.k === 'ch' && u.v === '}') braces--
      else if (braces === 0 && key === close && nested === 0) return out
      else if (braces === 0 && key === close) nested--
      else if (braces === 0 && key === open && open !== close) nested++
      out.push(u)
      if (out.length > this.limits.maxArgumentTokens) {
        throw new ExpansionError(`the argument of \\${owner.v} runs past ${this.limits.maxArgumentTokens} tokens`, t.pos)
      }
    }
  }

  /** An s or t argument: true if the next token (after spaces, unless `noSpace`) is `token`, which is consumed. */
  private readBooleanToken(token: string, noSpace: boolean): boolean {
    const skipped: Token[] = []
    let t = this.nextRawChar()
    while (!noSpace && t && SPACE_KINDS.has(t.k)) {
      skipped.push(t)
      t = this.nextRawChar()
    }
    if (t && tokenKey(t) === token) return true
    if (t) this.pushBack([t])
    this.lastRaw = undefined
    return false
  }

  /** e{^_}: each token of `tokens`, at most once and in any order, followed by its argument. */
  private readEmbellishments(owner: Token, tokens: string[]): Map<string, Token[]> {
    const found = new Map<string, Token[]>()
    for (;;) {
      let t = this.nextRawChar()
      while (t && SPACE_KINDS.has(t.k)) t = this.nextRawChar()
      if (!t || !tokens.includes(tokenKey(t)) || found.has(tokenKey(t))) {
        if (t) this.pushBack([t])
        this.lastRaw = undefined
        return found
      }
      found.set(tokenKey(t), this.readArgument(owner))
    }
  }

  /** A v argument: between braces or two equal characters; consumed whole, since it is code and never math. */
  private readVerbatim(owner: Token): void {
    let t = this.nextRawChar()
    while (t && SPACE_KINDS.has(t.k)) t = this.nextRawChar()
    if (!t) throw new ExpansionError(`\\${owner.v} is missing its verbatim argument at the end of the input`, owner.pos)
    if (t.k === 'ch' && t.v === '{') {
      this.readGroupBody(t, owner)
      return
    }
    const delimiter = tokenKey(t)
    for (let n = 0; ; n++) {
      const u = this.nextRawChar()
      if (!u || n > this.limits.maxArgumentTokens) throw new ExpansionError(`the verbatim argument of \\${owner.v} is never closed by "${delimiter}"`, t.pos)
      if (tokenKey(u) === delimiter) return
    }
  }

  /** A b argument: the tokens up to the matching \end{name} (nested \begin{name} kept), which is consumed. */
  private readEnvironmentBody(owner: Token, name: string): Token[] {
    const out: Token[] = []
    let depth = 0
    for (;;) {
      const t = this.nextRaw()
      if (!t) throw new ExpansionError(`\\begin{${name}} is never ended by \\end{${name}}`, owner.pos)
      if (t.k === 'cs' && (t.v === 'begin' || t.v === 'end')) {
        const nameToks = this.readEnvironmentName()
        const here = nameToks.map(u => u.v).join('')
        if (here === `{${name}}`) {
          if (t.v === 'begin') depth++
          else if (depth-- === 0) {
            this.onUserEnvironment?.(name, 'end', t.pos)
            return out
          }
        }
        out.push(t, ...nameToks)
      }
      else out.push(t)
      if (out.length > this.limits.maxArgumentTokens) throw new ExpansionError(`the body of \\begin{${name}} runs past ${this.limits.maxArgumentTokens} tokens`, owner.pos)
    }
  }

  /** After \begin or \end: the tokens of `{name}` (or whatever single token follows). */
  private readEnvironmentName(): Token[] {
    const first = this.nextRaw()
    if (!first) return []
    if (!(first.k === 'ch' && first.v === '{')) return [first]
    const out: Token[] = [first]
    for (let i = 0; i < 40; i++) {
      const u = this.nextRaw()
      if (!u) break
      out.push(u)
      if (u.k === 'ch' && (u.v === '}' || u.v === '{')) break
    }
    return out
  }

  /**
   * \IfBooleanTF{#1}{…}{…} and the other xparse tests: decided when the tested argument is what
   * the reader handed the macro (\BooleanTrue, \BooleanFalse, -NoValue-, or any value for
   * \IfNoValueTF); the chosen branch is pushed back. False (nothing consumed) otherwise.
   */
  private expandConditional(t: Token, conditional: { test: 'boolean' | 'noValue' | 'value', branches: 'TF' | 'T' | 'F' }): boolean {
    const next = this.peekRaw()
    if (!next || next.k === 'sp') return false
    const tested = this.readArgument(t)
    const only = tested.length === 1 ? tested[0]! : undefined
    let result: boolean
    if (conditional.test === 'boolean') {
      if (!only || only.k !== 'cs' || (only.v !== BOOLEAN_TRUE && only.v !== BOOLEAN_FALSE)) {
        // Not a boolean the reader made: leave the test unread (its math is then not read).
        this.pushBack([{ k: 'cs', v: UNREAD_MACRO_PREFIX + t.v, pos: t.pos, end: t.end, depth: t.depth }])
        return true
      }
      result = only.v === BOOLEAN_TRUE
    }
    else {
      const noValue = !!only && only.k === 'cs' && only.v === UNREAD_MACRO_PREFIX + NO_VALUE_NAME
      result = conditional.test === 'noValue' ? noValue : !noValue
    }
    const whenTrue = conditional.branches === 'F' ? [] : this.readArgument(t)
    const whenFalse = conditional.branches === 'T' ? [] : this.readArgument(t)
    this.pushBack(result ? whenTrue : whenFalse)
    return true
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

/** Commands that define macros, environments or theorem-like blocks; handled by `readDefinition`. */
export const DEFINING_COMMANDS = new Set([
  'newcommand', 'renewcommand', 'providecommand', 'def', 'gdef', 'edef', 'xdef', 'let',
  'DeclareMathOperator', 'DeclareRobustCommand',
  'NewDocumentCommand', 'RenewDocumentCommand', 'ProvideDocumentCommand', 'DeclareDocumentCommand',
  'newenvironment', 'renewenvironment', 'NewDocumentEnvironment', 'RenewDocumentEnvironment', 'DeclareDocumentEnvironment',
  'newtheorem', 'declaretheorem', 'spnewtheorem',
])

/**
 * Read a definition whose command token `cmd` was just consumed. Returns what it declared (or
 * undefined for \providecommand of a known name), or throws ExpansionError for malformed input.
 * Example: after `\DeclareMathOperator{\sch}{\mathfrak{S}}`, \sch expands to `\mathfrak{S}`.
 */
export function readDefinition(
  cmd: Token,
  x: Expander,
  file: string,
): Definition | undefined {
  const name = cmd.v
  const macro = (m: MacroDefinition): Definition => ({ type: 'macro', macro: m })
  const star = (): boolean => {
    const p = x.nextRawNonSpace()
    if (p && p.k === 'ch' && p.v.startsWith('*')) {
      if (p.v.length > 1) x.pushBack([{ ...p, v: p.v.slice(1) }])
      return true
    }
    if (p) x.pushBack([p])
    return false
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
  /** A braced name of letters (an environment or counter): `{example}`. */
  const readWord = (): string => {
    const t = x.nextRawNonSpace()
    if (t && t.k === 'ch' && t.v === '{') {
      const word = x.readGroupBody(t, cmd).map(u => (u.k === 'cs' ? '\\' + u.v : u.v)).join('').trim()
      if (/^[A-Za-z@*0-9-]+$/.test(word)) return word
      throw new ExpansionError(`\\${name}{${word}}: "${word}" is not an environment name`, cmd.pos)
    }
    throw new ExpansionError(`\\${name} must be followed by a name in braces`, cmd.pos)
  }
  /** `[n][default]` after \newcommand{\name} or \newenvironment{name}. */
  const readNewcommandArgs = (what: string): { params: number, args?: ArgumentSpec[] } => {
    const count = x.readOptional(cmd)
    if (!count) return { params: 0 }
    const digits = count.map(u => u.v).join('').trim()
    if (!/^[0-9]$/.test(digits)) throw new ExpansionError(`\\${name}{${what}}: "[${digits}]" is not a number of arguments`, cmd.pos)
    const params = Number(digits)
    const opt = x.readOptional(cmd)
    if (!opt || params === 0) return { params }
    const args: ArgumentSpec[] = [{ kind: 'optional', default: opt }]
    for (let i = 1; i < params; i++) args.push({ kind: 'mandatory' })
    return { params, args }
  }

  if (name === 'let') {
    const target = readName()
    let t = x.nextRawNonSpace()
    if (t && t.k === 'ch' && t.v.startsWith('=')) {
      if (t.v.length > 1) t = { ...t, v: t.v.slice(1), pos: t.pos + 1 }
      else t = x.nextRawNonSpace()
    }
    if (!t) throw new ExpansionError('\\let has no second token', cmd.pos)
    if (t.k === 'ch' && t.v.length > 1) {
      // `\let\eq=ab`: only the first character is the meaning; the rest is ordinary text.
      x.pushBack([{ ...t, v: t.v.slice(1), pos: t.pos + 1 }])
      t = { ...t, v: t.v[0]!, end: t.pos + 1 }
    }
    const existing = t.k === 'cs' ? x.macros.get(t.v) : undefined
    if (existing) return macro({ ...existing, name: target.v, file, offset: cmd.pos })
    return macro({ name: target.v, params: 0, body: [t], primitive: true, file, offset: cmd.pos })
  }
  if (name === 'DeclareMathOperator') {
    star()
    const target = readName()
    const text = readBody()
    return macro({ name: target.v, params: 0, body: operatorBody(text, cmd), file, offset: cmd.pos })
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
        return macro({
          name: target.v,
          params,
          pattern: delimited ? items.filter(it => 'param' in it || it.literal.k !== 'sp') : undefined,
          body,
          file,
          offset: cmd.pos,
        })
      }
      paramText.push(t)
      if (paramText.length > 100) throw new ExpansionError(`\\${name}\\${target.v}: parameter text too long`, cmd.pos)
    }
  }
  if (name === 'NewDocumentCommand' || name === 'RenewDocumentCommand' || name === 'ProvideDocumentCommand' || name === 'DeclareDocumentCommand') {
    const target = readName()
    const spec = readBody()
    const body = toReplacementText(readBody())
    if (name === 'ProvideDocumentCommand' && x.macros.has(target.v)) return undefined
    const parsed = parseArgumentSpec(spec)
    if ('unread' in parsed) return macro({ name: target.v, params: 0, body: [], unread: parsed.unread, file, offset: cmd.pos })
    return macro({ name: target.v, params: countParams(parsed.args), args: parsed.args, body, file, offset: cmd.pos })
  }
  if (name === 'newenvironment' || name === 'renewenvironment') {
    star()
    const envName = readWord()
    const { params, args } = readNewcommandArgs(envName)
    const begin = toReplacementText(readBody())
    const end = toReplacementText(readBody())
    const beginDef: MacroDefinition = { name: envName, params, args, body: begin, file, offset: cmd.pos }
    return { type: 'environment', environment: { name: envName, begin: beginDef, end, file, offset: cmd.pos } }
  }
  if (name === 'NewDocumentEnvironment' || name === 'RenewDocumentEnvironment' || name === 'DeclareDocumentEnvironment') {
    const envName = readWord()
    const spec = readBody()
    const begin = toReplacementText(readBody())
    const end = toReplacementText(readBody())
    const parsed = parseArgumentSpec(spec, { environment: true })
    // An environment whose arguments are not followed still ends where it ends: its code is dropped.
    const beginDef: MacroDefinition = 'unread' in parsed
      ? { name: envName, params: 0, body: [], file, offset: cmd.pos }
      : { name: envName, params: countParams(parsed.args), args: parsed.args, body: begin, file, offset: cmd.pos }
    return { type: 'environment', environment: { name: envName, begin: beginDef, end: 'unread' in parsed ? [] : end, file, offset: cmd.pos } }
  }
  if (name === 'newtheorem' || name === 'spnewtheorem') {
    // \newtheorem{name}[counter]{Title}[within], \newtheorem*{name}{Title}
    star()
    const envName = readWord()
    x.readOptional(cmd)
    readBody()
    x.readOptional(cmd)
    return { type: 'theorem', name: envName }
  }
  if (name === 'declaretheorem') {
    // thmtools: \declaretheorem[options]{name} (the options may come after the name too)
    x.readOptional(cmd)
    const envName = readWord()
    x.readOptional(cmd)
    return { type: 'theorem', name: envName }
  }
  // \newcommand, \renewcommand, \providecommand, \DeclareRobustCommand (each also with *)
  star()
  const target = readName()
  const { params, args } = readNewcommandArgs('\\' + target.v)
  const body = toReplacementText(readBody())
  if (name === 'providecommand' && x.macros.has(target.v)) return undefined
  return macro({ name: target.v, params, args, body, file, offset: cmd.pos })
}

/**
 * What \DeclareMathOperator{\name}{text} stands for. An operator name is upright text: `Des`,
 * `Red`, `Gr` become \operatorname{…}, plain names and never an object. When the text is a single
 * symbol (`\mathfrak{S}`, `\ell`, `\mathcal{A}`), LaTeX prints that symbol as an operator, so the
 * macro means the symbol itself: \sch_w is a Schubert polynomial as \mathfrak{S}_w is.
 */
function operatorBody(text: Token[], cmd: Token): Token[] {
  const toks = text.filter(t => t.k !== 'sp')
  if (isSingleSymbol(toks)) return toks
  return [
    { k: 'cs', v: 'operatorname', pos: cmd.pos, end: cmd.end, depth: 0 },
    { k: 'ch', v: '{', pos: cmd.pos, end: cmd.end, depth: 0 },
    ...text,
    { k: 'ch', v: '}', pos: cmd.pos, end: cmd.end, depth: 0 },
  ]
}

/** One control word followed only by braced arguments or one letter: `\ell`, `\mathfrak{S}`, `\mathfrak S`. */
function isSingleSymbol(toks: Token[]): boolean {
  const head = toks[0]
  if (!head || head.k !== 'cs' || !/^[A-Za-z]+$/.test(head.v)) return false
  // `\mathfrak S`: one character as the argument, unbraced.
  if (toks.length === 2) return toks[1]!.k === 'ch' && toks[1]!.v.length === 1 && /^[A-Za-z]$/.test(toks[1]!.v)
  let depth = 0
  for (let i = 1; i < toks.length; i++) {
    const t = toks[i]!
    if (t.k === 'ch' && t.v === '{') depth++
    else if (t.k === 'ch' && t.v === '}') depth--
    else if (depth === 0) return false
  }
  return depth === 0
}

const countParams = (args: ArgumentSpec[]) => args.reduce((n, a) => n + paramCount(a), 0)

/**
 * An xparse argument specification, each item optionally prefixed by `+` (long arguments read
 * the same here) or `!` (no spaces before an optional argument): m, o, O{default}, s, t<token>,
 * r<open><close>, R<open><close>{default}, d<open><close>, D<open><close>{default}, e{tokens},
 * E{tokens}{defaults}, v, and b (the body, last, for environments only). Anything else (>{…}
 * processors, g, G, l, u) is not followed, and the macro is then unread: never guessed.
 * Example: `parseArgumentSpec(tokenize('s m O{1}'))` gives a star, a mandatory and an optional argument.
 */
export function parseArgumentSpec(spec: Token[], options: { environment?: boolean } = {}): { args: ArgumentSpec[] } | { unread: string } {
  const toks = splitRuns(spec).filter(t => t.k !== 'sp')
  const args: ArgumentSpec[] = []
  let i = 0
  /** A braced group at `i` (its contents, and `i` moved past it), or undefined. */
  const braced = (): Token[] | undefined => {
    if (!(toks[i]?.k === 'ch' && toks[i]!.v === '{')) return undefined
    const inner: Token[] = []
    let depth = 0
    for (; i < toks.length; i++) {
      const u = toks[i]!
      if (u.k === 'ch' && u.v === '{') {
        if (depth++ === 0) continue
      }
      else if (u.k === 'ch' && u.v === '}') {
        if (--depth === 0) {
          i++
          return inner
        }
      }
      inner.push(u)
    }
    return undefined
  }
  /** One delimiter or token at `i`: a character or a control sequence (never a brace). */
  const single = (): string | undefined => {
    const u = toks[i]
    if (!u || (u.k === 'ch' && (u.v === '{' || u.v === '}')) || u.k === 'param') return undefined
    i++
    return tokenKey(u)
  }
  let noSpace = false
  while (i < toks.length) {
    const t = toks[i++]!
    const type = t.k === 'ch' ? t.v : '\\' + t.v
    if (type === '+') continue
    if (type === '!') {
      noSpace = true
      continue
    }
    let arg: ArgumentSpec | undefined
    if (type === 'm') arg = { kind: 'mandatory' }
    else if (type === 'o') arg = { kind: 'optional', ...(noSpace ? { noSpace } : {}) }
    else if (type === 'O') {
      const def = braced()
      if (def) arg = { kind: 'optional', default: def, ...(noSpace ? { noSpace } : {}) }
    }
    else if (type === 's') arg = { kind: 'boolean', token: '*', ...(noSpace ? { noSpace } : {}) }
    else if (type === 't') {
      const token = single()
      if (token) arg = { kind: 'boolean', token, ...(noSpace ? { noSpace } : {}) }
    }
    else if (type === 'r' || type === 'R' || type === 'd' || type === 'D') {
      const open = single()
      const close = single()
      const def = type === 'R' || type === 'D' ? braced() : undefined
      if (open && close && (def || type === 'r' || type === 'd')) {
        // R's default stands in only after an error in LaTeX; a use without the delimiter is left unread.
        arg = type === 'r' || type === 'R'
          ? { kind: 'required', open, close }
          : { kind: 'optional', open, close, ...(def ? { default: def } : {}), ...(noSpace ? { noSpace } : {}) }
      }
    }
    else if (type === 'e' || type === 'E') {
      const tokens = braced()
      const defaults = type === 'E' ? braced() : []
      if (tokens && defaults) {
        const keys = tokens.filter(u => u.k !== 'sp').map(tokenKey)
        // E's defaults: one braced group (or one token) per embellishment, in order.
        const values: (Token[] | undefined)[] = []
        for (let k = 0; k < defaults.length; k++) {
          const u = defaults[k]!
          if (u.k === 'ch' && u.v === '{') {
            const group: Token[] = []
            let depth = 1
            for (k++; k < defaults.length; k++) {
              const w = defaults[k]!
              if (w.k === 'ch' && w.v === '{') depth++
              else if (w.k === 'ch' && w.v === '}' && --depth === 0) break
              group.push(w)
            }
            values.push(group)
          }
          else values.push([u])
        }
        arg = { kind: 'embellishments', tokens: keys, defaults: keys.map((_, k) => values[k]) }
      }
    }
    else if (type === 'v') arg = { kind: 'verbatim' }
    else if (type === 'b' && options.environment && i === toks.length) arg = { kind: 'body' }
    if (!arg) return { unread: `argument type "${type}" is not followed` }
    noSpace = false
    args.push(arg)
    if (countParams(args) > 9) return { unread: 'more than nine arguments' }
  }
  return { args }
}
