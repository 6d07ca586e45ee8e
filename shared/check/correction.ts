/**
 * Suggested corrections: for a mismatched claim, the right-hand side rewritten so that it holds,
 * in the paper's own notation: its macros and variable names (terms that stay keep their text;
 * new terms copy the text of a term of the same kind written in the claim), its conventions (the
 * difference is the one computed under the conventions the claim was checked in), and its term
 * order (kept terms stay where they were, dropped ones go, missing ones are appended in the
 * engine's order).
 *
 * A claim that holds only under another convention is rewritten in the conventions the paper
 * follows (the ones it was checked in), with a note saying so.
 *
 * Only certain corrections are offered. A correction is `fixed` only when the corrected file,
 * read again by the reader and checked again by the engine under the same conventions, makes the
 * claim verified and leaves every other claim on that line as it was. Anything else (a statement
 * over several lines, a macro call holding both sides, a difference found from invariants alone,
 * a term the rewriter cannot write in the paper's notation) is listed with its reason, never guessed.
 *
 *   const report = withCorrections(checkManuscript({ files }), readManuscript({ files }), files)
 *   const patch = correctionsPatch(report.claims)   // a unified diff, one hunk per fixed claim
 */
import { readManuscript } from '../latex'
import { BudgetMeter, Permutation, Polynomial, monomialLatex, polynomialDifference, type Coefficient } from '../math'
import type { Claim, Expr, ReadResult } from '../types/claims'
import type { ConventionSet } from '../types/conventions'
import type { ClaimCorrection, ClaimDiff, Report, ReportClaim } from '../types/report'
import { CLAIM_BUDGET } from './claim'
import { compareSides, schubertTermLatex, schurTermLatex, writtenSchubertCombination } from './compare'
import { evaluate, meantPermutation, type EngineMemo, type EvaluationEnv } from './evaluate'
import { toPolynomial } from './values'
import { CONTEXT_LINES } from './correction-patch'

export { correctionsPatch } from './correction-patch'

type NoCorrection = { fixed: false, reason: string }
const none = (reason: string): NoCorrection => ({ fixed: false, reason })

/** A right-hand side rewritten, before it is confirmed by reading and checking the file again. */
export interface RewrittenSide {
  /** The new right-hand side, in the paper's notation. */
  text: string
}

/** One term of a right-hand side as written: its sign and its text without the sign. */
export interface WrittenTerm {
  sign: 1 | -1
  body: string
}

/**
 * Splits a right-hand side into its top-level terms, e.g. `x_1 - 2x_2` → [+ `x_1`, − `2x_2`].
 * Null when the split is not clean (unbalanced brackets, ±, an empty term).
 */
export function splitWrittenTerms(text: string): WrittenTerm[] | null {
  const terms: WrittenTerm[] = []
  let depth = 0
  let current = ''
  let sign: 1 | -1 = 1
  let leadingSignSeen = false
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!
    if (ch === '\\') {
      let j = i + 1
      if (/[A-Za-z]/.test(text[j] ?? '')) while (/[A-Za-z]/.test(text[j] ?? '')) j++
      else j++
      const name = text.slice(i, j)
      if (name === '\\pm' || name === '\\mp') return null
      current += name
      i = j - 1
      continue
    }
    if (ch === '{' || ch === '(' || ch === '[') depth++
    else if (ch === '}' || ch === ')' || ch === ']') {
      depth--
      if (depth < 0) return null
    }
    if (depth === 0 && (ch === '+' || ch === '-')) {
      if (current.trim() === '') {
        if (terms.length > 0 || leadingSignSeen) return null
        leadingSignSeen = true
        if (ch === '-') sign = -1
        continue
      }
      terms.push({ sign, body: current.trim() })
      current = ''
      sign = ch === '-' ? -1 : 1
      continue
    }
    current += ch
  }
  if (depth !== 0 || current.trim() === '') return null
  terms.push({ sign, body: current.trim() })
  return terms
}

/** How the paper writes monomials and coefficients, read from its own text. */
interface WritingStyle {
  bracedIndex: boolean
  bracedExponent: boolean
  factorSeparator: string
  coefficientSeparator: string
  operator: { plus: string, minus: string }
  writesPlainVariables: boolean
}

function styleOf(rhsText: string, lhsText: string, terms: readonly WrittenTerm[]): WritingStyle {
  const all = `${lhsText} ${rhsText}`
  const unbracedIndex = /(?<![A-Za-z\\])[xy]_\d/.test(all)
  const bracedIndex = /(?<![A-Za-z\\])[xy]_\{\d+\}/.test(all)
  const unbracedExponent = /\^\d/.test(all)
  const bracedExponent = /\^\{\d+\}/.test(all)
  const spacedFactors = terms.some(t => /[xy]_(?:\{\d+\}|\d)(?:\^(?:\{\d+\}|\d))?\s+[xy]_/.test(t.body))
  const coefficientSeparator = terms.map(t => leadingCoefficient(t.body)).find(c => c && c.rest !== '')?.separator ?? ''
  const spacedOperators = /\S\s+[+-]\s+\S/.test(rhsText) || (!/[+-]/.test(rhsText.replace(/^\s*-/, '')) && /\s=\s/.test(` ${lhsText} = `))
  return {
    bracedIndex: bracedIndex && !unbracedIndex,
    bracedExponent: bracedExponent && !unbracedExponent,
    factorSeparator: spacedFactors ? ' ' : '',
    coefficientSeparator,
    operator: spacedOperators ? { plus: ' + ', minus: ' - ' } : { plus: '+', minus: '-' },
    writesPlainVariables: /(?<![A-Za-z\\])[xy]_/.test(all),
  }
}

/** `2 x_1` → { digits: '2', separator: ' ', rest: 'x_1' }; a term without a leading number gives null. */
function leadingCoefficient(body: string): { digits: string, separator: string, rest: string } | null {
  const m = /^(\d+)(\s*(?:\\[,;:]|\\cdot|\\times)?\s*)([\s\S]*)$/.exec(body)
  if (!m) return null
  // `2^3` or `12_` are not a coefficient followed by a term.
  if (/^[\^_]/.test(m[3]!)) return null
  return { digits: m[1]!, separator: m[2]!, rest: m[3]! }
}

/** A written term's number in front and the rest: `3\Sch{132}` → 3 and `\Sch{132}`. */
function splitCoefficient(body: string): { magnitude: bigint, object: string, separator: string } {
  const c = leadingCoefficient(body)
  if (!c) return { magnitude: 1n, object: body, separator: '' }
  if (c.rest === '') return { magnitude: BigInt(c.digits), object: '', separator: '' }
  return { magnitude: BigInt(c.digits), object: c.rest, separator: c.separator }
}

function withMagnitude(object: string, magnitude: bigint, separator: string): string {
  if (object === '') return String(magnitude)
  return magnitude === 1n ? object : `${magnitude}${separator}${object}`
}

const abs = (v: bigint): bigint => (v < 0n ? -v : v)
const big = (c: Coefficient | string): bigint => BigInt(c)

/** Text written around a permutation's or partition's digits, to write another one the same way. */
interface ObjectTemplate {
  pre: string
  post: string
  /** Letters the written permutation had (it may list fixed points at the end). */
  length: number
  /** How partition parts are separated (`21` or `2,1`). */
  separator: string
}

/** What a right-hand side term is in the basis of the difference, with its written coefficient. */
interface ReadTerm {
  key: string
  coefficient: bigint
  written: WrittenTerm
  expr: Expr
}

/**
 * Rewrites the right-hand side of a mismatched claim from its difference.
 * `rhsText`, `lhsText`: the sides as written; the question's sides as read.
 */
export function rewriteRightSide(
  input: { rhsText: string, lhsText: string, lhs: Expr, rhs: Expr, diff: ClaimDiff, conventions: ConventionSet },
  memo: EngineMemo = new Map(),
): RewrittenSide | NoCorrection {
  const { diff } = input
  if (diff.basis === 'property') return none('a stated property is not rewritten')
  if (diff.basis === 'invariant') return none(`the difference was found from the ${diff.invariant} alone, without the full value`)
  // Grassmannian classes and tensors are written in notation the rewriter does not reproduce yet.
  if (diff.basis === 'class' || diff.basis === 'tensor') return none('a difference of Grassmannian classes or tensors is not rewritten automatically')
  const env: EvaluationEnv = { conventions: input.conventions, meter: new BudgetMeter(CLAIM_BUDGET), memo }
  const punctuation = /[\s,.;]*$/.exec(input.rhsText)![0]
  const rhsText = input.rhsText.slice(0, input.rhsText.length - punctuation.length)
  if (diff.basis === 'number') {
    if (!/^-?\s*\d+$/.test(rhsText.trim())) return none('the right-hand side is not a number written out')
    return { text: `${diff.computed}${punctuation}` }
  }
  if (diff.truncated) return none('too many terms differ to rewrite the statement')
  const written = splitWrittenTerms(rhsText)
  if (!written) return none('the right-hand side does not split into terms cleanly')
  const exprTerms = input.rhs.type === 'add' ? input.rhs.terms : [input.rhs]
  if (exprTerms.length !== written.length) return none('the written terms do not match the terms read')
  const style = styleOf(rhsText, input.lhsText, written)

  const read: ReadTerm[] = []
  try {
    for (let i = 0; i < written.length; i++) {
      let expr = exprTerms[i]!
      let sign = 1
      while (expr.type === 'negate') {
        sign = -sign
        expr = expr.arg
      }
      if (sign !== written[i]!.sign) return none('the written terms do not match the terms read')
      const keyed = termKey(expr, diff.basis, env)
      if (!keyed) return none('a term of the right-hand side is not a single term of the basis the difference is in')
      const split = splitCoefficient(written[i]!.body)
      // The number in front must be the whole coefficient: `x_1 \cdot 2` or `(-2)x_1` are left alone.
      if (split.magnitude !== keyed.coefficient) return none('a coefficient is not written as a number in front of its term')
      read.push({ key: keyed.key, coefficient: keyed.coefficient * BigInt(sign), written: written[i]!, expr })
    }
  }
  catch {
    return none('a term of the right-hand side could not be evaluated on its own')
  }
  const byKey = new Map<string, number>()
  for (const [i, t] of read.entries()) {
    if (byKey.has(t.key)) return none('the same term is written twice')
    byKey.set(t.key, i)
  }
  const target = new Map<number, bigint>()
  for (const e of diff.extra) {
    const i = byKey.get(e.term)
    if (i === undefined || read[i]!.coefficient !== big(e.coefficient)) return none('a written term could not be matched with the difference')
    target.set(i, 0n)
  }
  for (const w of diff.wrongCoefficient) {
    const i = byKey.get(w.term)
    if (i === undefined || read[i]!.coefficient !== big(w.claimed)) return none('a written term could not be matched with the difference')
    target.set(i, big(w.computed))
  }
  for (const m of diff.missing) if (byKey.has(m.term)) return none('a written term could not be matched with the difference')

  const out: (WrittenTerm & { key: string })[] = []
  for (const [i, t] of read.entries()) {
    const wanted = target.get(i) ?? t.coefficient
    if (wanted === 0n) continue
    if (wanted === t.coefficient) {
      out.push({ ...t.written, key: t.key })
      continue
    }
    const split = splitCoefficient(t.written.body)
    out.push({ sign: wanted < 0n ? -1 : 1, body: withMagnitude(split.object, abs(wanted), split.separator || style.coefficientSeparator), key: t.key })
  }
  const order = engineOrder(diff.basis, [...out.map(t => t.key), ...diff.missing.map(m => m.term)])
  if (!order) return none('a term of the difference could not be read back')
  const rank = new Map(order.map((key, i) => [key, i]))
  for (const m of [...diff.missing].sort((a, b) => rank.get(a.term)! - rank.get(b.term)!)) {
    const c = big(m.coefficient)
    const object = diff.basis === 'monomial'
      ? monomialText(m.term, style)
      : objectText(m.term, diff.basis, read, input.lhsText, input.lhs, input.conventions)
    if (typeof object !== 'string') return object
    // After the last term that comes before it in the engine's order, so a paper written in that
    // order stays in it and one written otherwise keeps its own order around the new term.
    const mine = rank.get(m.term)!
    let at = 0
    out.forEach((t, i) => { if (rank.get(t.key)! < mine) at = i + 1 })
    out.splice(at, 0, { sign: c < 0n ? -1 : 1, body: withMagnitude(object, abs(c), style.coefficientSeparator), key: m.term })
  }
  if (out.length === 0) return { text: `0${punctuation}` }
  const text = out.map((t, i) => (i === 0 ? (t.sign < 0 ? `-${t.body}` : t.body) : `${t.sign < 0 ? style.operator.minus : style.operator.plus}${t.body}`)).join('')
  return { text: `${text}${punctuation}` }
}

/** The keys (terms of the difference's LaTeX) in the order the engine prints them; null if one cannot be read. */
function engineOrder(basis: 'monomial' | 'schubert' | 'schur', keys: readonly string[]): string[] | null {
  const unique = [...new Set(keys)]
  if (basis === 'monomial') {
    const terms: { x: number[], y: number[], coefficient: number }[] = []
    for (const key of unique) {
      const exponents = monomialExponents(key)
      if (!exponents) return null
      terms.push({ ...exponents, coefficient: 1 })
    }
    return Polynomial.fromTerms(terms).termList().map(t => monomialLatex(t.x, t.y) || '1')
  }
  if (basis === 'schubert') {
    const entries: { key: string, perm: Permutation }[] = []
    for (const key of unique) {
      const m = /^\\mathfrak\{S\}_\{(?:(\d+)|\[([\d,]+)\])\}$/.exec(key)
      if (!m) return null
      entries.push({ key, perm: Permutation.fromOneLine(m[1] !== undefined ? [...m[1]].map(Number) : m[2]!.split(',').map(Number)) })
    }
    return entries.sort((a, b) => b.perm.length() - a.perm.length() || a.perm.key.localeCompare(b.perm.key)).map(e => e.key)
  }
  const parts = (key: string): string | null => {
    if (key === '1') return ''
    const m = /^s_\{([\d,]+)\}$/.exec(key)
    return m ? (m[1]!.includes(',') ? m[1]! : [...m[1]!].join(',')) : null
  }
  if (unique.some(k => parts(k) === null)) return null
  return unique.sort((a, b) => parts(b)!.localeCompare(parts(a)!, 'en', { numeric: true }))
}

/** `x_{1}^{2}y_{3}` → x [2], y [0, 0, 1]; `1` → no exponents. */
function monomialExponents(term: string): { x: number[], y: number[] } | null {
  const x: number[] = []
  const y: number[] = []
  if (term === '1') return { x, y }
  const pattern = /([xy])_\{(\d+)\}(?:\^\{(\d+)\})?/y
  let at = 0
  while (at < term.length) {
    pattern.lastIndex = at
    const m = pattern.exec(term)
    if (!m) return null
    at = pattern.lastIndex
    const into = m[1] === 'x' ? x : y
    const index = Number(m[2]) - 1
    while (into.length <= index) into.push(0)
    into[index] = Number(m[3] ?? 1)
  }
  return { x, y }
}

/** The basis element a written term is, and its coefficient; null when it is not one term. */
function termKey(expr: Expr, basis: 'monomial' | 'schubert' | 'schur', env: EvaluationEnv): { key: string, coefficient: bigint } | null {
  if (basis === 'schubert') {
    const combination = writtenSchubertCombination(expr, env, true)
    if (!combination || combination.size !== 1) return null
    const [key, c] = [...combination][0]!
    return { key: schubertTermLatex(key), coefficient: big(c) }
  }
  const value = evaluate(expr, env)
  if (basis === 'schur') {
    if (value.kind !== 'symmetric' || value.schur.size !== 1) return null
    const [key, c] = [...value.schur][0]!
    return { key: schurTermLatex(key), coefficient: big(c) }
  }
  const poly = toPolynomial(value)
  if (poly.size !== 1) return null
  const [term] = polynomialDifference(poly, Polynomial.constant(0)).missing
  return { key: monomialLatex(term!.x, term!.y) || '1', coefficient: big(term!.coefficient) }
}

/** A monomial of the difference (`x_{1}^{2}x_{2}`) written the way the paper writes monomials. */
function monomialText(term: string, style: WritingStyle): string | NoCorrection {
  if (term === '1') return ''
  if (!style.writesPlainVariables) return none('the paper writes its variables through macros the rewriter cannot reproduce')
  const factors: string[] = []
  const pattern = /([xy])_\{(\d+)\}(?:\^\{(\d+)\})?/y
  let at = 0
  while (at < term.length) {
    pattern.lastIndex = at
    const m = pattern.exec(term)
    if (!m) return none('a missing term could not be written in the paper\'s notation')
    at = pattern.lastIndex
    const index = m[2]!.length > 1 || style.bracedIndex ? `{${m[2]}}` : m[2]!
    const exponent = m[3] === undefined ? '' : m[3].length > 1 || style.bracedExponent ? `^{${m[3]}}` : `^${m[3]}`
    factors.push(`${m[1]}_${index}${exponent}`)
  }
  return factors.join(style.factorSeparator)
}

/** A missing Schubert or Schur term written like one the claim already writes. */
function objectText(term: string, basis: 'schubert' | 'schur', read: readonly ReadTerm[], lhsText: string, lhs: Expr, conventions: ConventionSet): string | NoCorrection {
  const template = basis === 'schubert' ? schubertTemplate(read, lhsText, lhs) : schurTemplate(read, lhsText, lhs)
  if (!template) return none(`no ${basis === 'schubert' ? 'Schubert polynomial' : 'Schur function'} in the claim is written in a way the rewriter can copy`)
  if (basis === 'schur') {
    const m = /^s_\{([\d,]+)\}$/.exec(term)
    if (!m) return none('a missing term could not be written in the paper\'s notation')
    const parts = m[1]!.includes(',') ? m[1]!.split(',') : [...m[1]!]
    if (template.separator === '' && parts.some(p => p.length > 1)) return none('a missing partition has a part above 9, which the paper\'s notation cannot show')
    return `${template.pre}${parts.join(template.separator)}${template.post}`
  }
  const m = /^\\mathfrak\{S\}_\{(\d+)\}$/.exec(term)
  if (!m) return none('a missing permutation has more than nine letters')
  // The difference names the engine's permutation; the paper writes the one it stands for.
  const entries = meantPermutation(Permutation.fromOneLine([...m[1]!].map(Number)), conventions).oneLine.slice()
  while (entries.length < template.length) entries.push(entries.length + 1)
  return `${template.pre}${entries.join('')}${template.post}`
}

function oneLineDigits(expr: Expr): { digits: string, length: number } | null {
  if (expr.type !== 'schubert' || expr.perm.form !== 'oneLine' || expr.perm.entries.some(v => v > 9)) return null
  return { digits: expr.perm.entries.join(''), length: expr.perm.entries.length }
}

function objectOf(expr: Expr): Expr {
  if (expr.type === 'multiply' && expr.factors.length === 2) {
    const [a, b] = expr.factors as [Expr, Expr]
    if (a.type === 'integer') return b
    if (b.type === 'integer') return a
  }
  return expr
}

function schubertTemplate(read: readonly ReadTerm[], lhsText: string, lhs: Expr): ObjectTemplate | null {
  for (const t of read) {
    const perm = oneLineDigits(objectOf(t.expr))
    const object = splitCoefficient(t.written.body).object
    if (!perm) continue
    const at = object.indexOf(perm.digits)
    if (at < 0 || object.indexOf(perm.digits, at + 1) >= 0) continue
    return { pre: object.slice(0, at), post: object.slice(at + perm.digits.length), length: perm.length, separator: '' }
  }
  const factors = lhs.type === 'multiply' ? lhs.factors : [lhs]
  for (const f of factors) {
    const perm = oneLineDigits(f)
    if (perm) {
      const found = templateInText(lhsText, perm.digits)
      if (found) return { ...found, length: perm.length, separator: '' }
    }
  }
  return null
}

function schurTemplate(read: readonly ReadTerm[], lhsText: string, lhs: Expr): ObjectTemplate | null {
  const candidates = (e: Expr): { digits: string, separator: string }[] => {
    if (e.type !== 'symmetric' || e.family !== 'schur' || e.skew || e.index.length === 0) return []
    const out = [{ digits: e.index.join(','), separator: ',' }]
    if (e.index.every(p => p <= 9)) out.unshift({ digits: e.index.join(''), separator: '' })
    return out
  }
  for (const t of read) {
    const object = splitCoefficient(t.written.body).object
    for (const c of candidates(objectOf(t.expr))) {
      const at = object.indexOf(c.digits)
      if (at < 0 || object.indexOf(c.digits, at + 1) >= 0) continue
      return { pre: object.slice(0, at), post: object.slice(at + c.digits.length), length: 0, separator: c.separator }
    }
  }
  const factors = lhs.type === 'multiply' ? lhs.factors : [lhs]
  for (const f of factors) {
    for (const c of candidates(f)) {
      const found = templateInText(lhsText, c.digits)
      if (found) return { ...found, length: 0, separator: c.separator }
    }
  }
  return null
}

/** `\Sch{132}\Sch{231}` and `231` → pre `\Sch{`, post `}`: the command written right before the digits. */
function templateInText(text: string, digits: string): { pre: string, post: string } | null {
  let at = text.indexOf(digits)
  while (at >= 0) {
    const before = text.slice(0, at)
    const after = text.slice(at + digits.length)
    const boundary = !/\d$/.test(before) && !/^\d/.test(after)
    const pre = boundary ? /(?:\\mathfrak\s*\{?\s*S\s*\}?\s*_\s*\{?\s*|\\[A-Za-z]+(?:\s*\{\s*[A-Za-z]\s*\})?\s*(?:_\s*)?\{?\s*|(?<![A-Za-z\\])s\s*_\s*\{?\s*)$/.exec(before)?.[0] : undefined
    if (pre) {
      const opens = pre.includes('{') && !/\{\s*[A-Za-z]\s*\}/.test(pre.slice(pre.lastIndexOf('{') - 1))
      const close = /^\s*\}/.exec(after)?.[0]
      if (!opens) return { pre, post: '' }
      if (close) return { pre, post: close }
    }
    at = text.indexOf(digits, at + 1)
  }
  return null
}

/** Where a claim's right-hand side sits on its line: the one place it follows an `=`. */
export function locateRightSide(lineText: string, source: string): { lhsText: string, rhsText: string, start: number, end: number } | null {
  const strong: { lhsText: string, rhsText: string, start: number, end: number }[] = []
  const weak: typeof strong = []
  for (let split = source.indexOf(' = '); split >= 0; split = source.indexOf(' = ', split + 1)) {
    const lhsText = source.slice(0, split)
    const rhsText = source.slice(split + 3)
    if (rhsText.trim() === '' || lhsText.trim() === '') continue
    for (let at = lineText.indexOf(rhsText); at >= 0; at = lineText.indexOf(rhsText, at + 1)) {
      const before = lineText.slice(0, at)
      const relation = /&?\s*=\s*&?\s*$/.exec(before)
      if (!relation) continue
      const place = { lhsText, rhsText, start: at, end: at + rhsText.length }
      if (before.slice(0, relation.index).trimEnd().endsWith(lhsText)) strong.push(place)
      else if (!lineText.includes(lhsText)) weak.push(place)
    }
  }
  if (strong.length === 1) return strong[0]!
  if (strong.length === 0 && weak.length === 1) return weak[0]!
  return null
}

interface FileLines {
  lines: string[]
  crlf: boolean[]
  endsWithNewline: boolean
}

function linesOf(content: string | Uint8Array): FileLines | null {
  let text: string
  if (typeof content === 'string') text = content
  else {
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(content)
    }
    catch {
      return null
    }
  }
  const raw = text.split('\n')
  const endsWithNewline = raw[raw.length - 1] === ''
  if (endsWithNewline) raw.pop()
  return { lines: raw.map(l => l.replace(/\r$/, '')), crlf: raw.map(l => l.endsWith('\r')), endsWithNewline }
}

function joinLines(file: FileLines): string {
  return file.lines.map((l, i) => `${l}${file.crlf[i] ? '\r' : ''}`).join('\n') + (file.endsWithNewline ? '\n' : '')
}

interface Candidate {
  claim: ReportClaim
  file: string
  line: number
  start: number
  end: number
  text: string
  lhsText: string
}

/**
 * Sets `correction` on every mismatched claim of `report`: a confirmed correction or the reason
 * there is none. `read` is the reading the report was made from; `files` the same sources.
 * Returns the report (changed in place).
 */
export function withCorrections(report: Report, read: ReadResult, files: Record<string, string | Uint8Array>, options: { main?: string } = {}): Report {
  const mismatches = report.claims.filter(c => c.verdict === 'mismatch')
  if (mismatches.length === 0) return report
  const readById = new Map<string, Claim>(read.claims.map(c => [c.id, c]))
  const texts = new Map<string, FileLines | null>()
  const memo: EngineMemo = new Map()
  const candidates: Candidate[] = []
  for (const claim of mismatches) {
    const proposed = propose(claim, readById.get(claim.id), files, texts, memo)
    if ('fixed' in proposed) claim.correction = proposed
    else candidates.push(proposed)
  }
  // Confirm by reading and checking again; a failed confirmation can involve a neighbour on the
  // same line, so the rest are confirmed again without it.
  let pending = candidates
  for (let round = 0; round < 3 && pending.length > 0; round++) {
    const failed = confirm(pending, report, read, files, texts, options.main ?? report.files.find(f => f.role === 'main')?.path)
    for (const c of pending) if (failed.has(c)) c.claim.correction = none('the rewritten statement could not be confirmed by checking it again')
    pending = pending.filter(c => !failed.has(c))
    if (failed.size === 0) break
  }
  for (const c of pending) if (!c.claim.correction) c.claim.correction = none('the rewritten statement could not be confirmed by checking it again')
  return report
}

function propose(claim: ReportClaim, readClaim: Claim | undefined, files: Record<string, string | Uint8Array>, texts: Map<string, FileLines | null>, memo: EngineMemo): Candidate | NoCorrection {
  if (claim.line !== claim.endLine) return none('the statement spans several lines')
  if (!claim.diff) return none('there is no term-by-term difference to correct from')
  if (!readClaim?.question) return none('the claim could not be read again')
  if (!texts.has(claim.file)) texts.set(claim.file, files[claim.file] === undefined ? null : linesOf(files[claim.file]!))
  const file = texts.get(claim.file)
  if (!file) return none('the file is not UTF-8 text')
  const lineText = file.lines[claim.line - 1]
  if (lineText === undefined) return none('the claim\'s line is not in the file')
  const place = locateRightSide(lineText, claim.source)
  if (!place) return none('the right-hand side could not be found once on its line (a macro call, or the same text twice)')
  const rewritten = rewriteRightSide({
    rhsText: place.rhsText, lhsText: place.lhsText, lhs: readClaim.question.lhs, rhs: readClaim.question.rhs,
    diff: claim.diff, conventions: claim.conventions,
  }, memo)
  if (!('text' in rewritten)) return rewritten
  return { claim, file: claim.file, line: claim.line, start: place.start, end: place.end, text: rewritten.text, lhsText: place.lhsText }
}

/** Applies the candidates, reads and checks again; returns those that did not hold. */
function confirm(candidates: readonly Candidate[], report: Report, read: ReadResult, files: Record<string, string | Uint8Array>, texts: Map<string, FileLines | null>, main: string | undefined): Set<Candidate> {
  const failed = new Set<Candidate>()
  const byLine = new Map<string, Candidate[]>()
  for (const c of candidates) {
    const key = `${c.file}\n${c.line}`
    byLine.set(key, [...(byLine.get(key) ?? []), c])
  }
  const changed = new Map<string, FileLines>()
  const afterLine = new Map<string, string>()
  for (const [key, group] of byLine) {
    const sorted = [...group].sort((a, b) => a.start - b.start)
    const overlapping = sorted.some((c, i) => i > 0 && c.start < sorted[i - 1]!.end)
    if (overlapping) {
      for (const c of group) failed.add(c)
      continue
    }
    const original = texts.get(sorted[0]!.file)!
    const file = changed.get(sorted[0]!.file) ?? { ...original, lines: [...original.lines] }
    let line = original.lines[sorted[0]!.line - 1]!
    for (const c of [...sorted].reverse()) line = line.slice(0, c.start) + c.text + line.slice(c.end)
    file.lines[sorted[0]!.line - 1] = line
    changed.set(sorted[0]!.file, file)
    afterLine.set(key, line)
  }
  if (changed.size === 0) return failed
  const patched: Record<string, string | Uint8Array> = { ...files }
  for (const [path, file] of changed) patched[path] = joinLines(file)
  const again = readManuscript({ files: patched, ...(main !== undefined ? { main } : {}) })
  const newById = new Map(again.claims.map(c => [c.id, c]))
  const memo: EngineMemo = new Map()
  const holds = (claim: Claim | undefined, conventions: ConventionSet): boolean => {
    if (!claim || claim.status !== 'ready' || !claim.question) return false
    try {
      return compareSides(claim.question.lhs, claim.question.rhs, { conventions, meter: new BudgetMeter(CLAIM_BUDGET), memo }).holds
    }
    catch {
      return false
    }
  }
  const verdictById = new Map(report.claims.map(c => [c.id, c]))
  for (const [key, group] of byLine) {
    if (!afterLine.has(key)) continue
    const [path, lineNumber] = [group[0]!.file, group[0]!.line]
    const before = read.claims.filter(c => c.file === path && c.line === lineNumber)
    const after = again.claims.filter(c => c.file === path && c.line === lineNumber)
    const corrected = new Set(group.map(c => c.claim.id))
    const neighboursHold = before.every((old) => {
      if (corrected.has(old.id)) return true
      const was = verdictById.get(old.id)
      return was?.verdict !== 'verified' || holds(newById.get(old.id), was.conventions)
    })
    for (const c of group) {
      const fresh = newById.get(c.claim.id)
      if (before.length !== after.length || !neighboursHold || !holds(fresh, c.claim.conventions)) failed.add(c)
    }
  }
  if (failed.size > 0) return failed
  for (const [key, group] of byLine) {
    const file = texts.get(group[0]!.file)!
    const index = group[0]!.line - 1
    for (const c of group) {
      const { lines, crlf, endsWithNewline } = file
      const raw = (from: number, to: number) => lines.slice(from, to).map((l, i) => (crlf[from + i] ? `${l}\r` : l))
      const below = raw(index + 1, index + 1 + CONTEXT_LINES)
      const correction: ClaimCorrection = {
        fixed: true,
        statement: `${c.lhsText} = ${c.text}`,
        ...(c.claim.holdsUnder.length > 0 ? { note: `rewritten in the paper's conventions; as written it holds under ${c.claim.holdsUnder.join(', ')}` } : {}),
        file: c.file,
        line: c.line,
        before: lines[index]!,
        after: afterLine.get(key)!,
        above: raw(Math.max(0, index - CONTEXT_LINES), index),
        below,
        ...(crlf[index] ? { crlf: true as const } : {}),
        ...(!endsWithNewline && index + 1 + below.length === lines.length ? { noNewlineAtEnd: true as const } : {}),
      }
      c.claim.correction = correction
    }
  }
  return failed
}
