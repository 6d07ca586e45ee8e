/**
 * Reading one side of an equation into an `Expr`, and permutations and partitions into specs.
 *
 * Conventions (the rules are documented in docs/tags.md, "What the reader recognises"):
 * - One-line notation: digits written together (`2143`, `{2\,1\,4\,3}`) are one entry each;
 *   use `[…]` or commas for entries of 10 or more.
 * - A single parenthesised list `(a_1,…,a_k)` is one-line notation when its entries are exactly
 *   1…k with k ≥ 3 (and k = n when n is bound); otherwise, and for several lists `(1\,3)(2\,4)`,
 *   it is cycle notation.
 * - `w_0` needs n: `w_0^{(n)}`, or a binding "Let $n = 4$".
 * - A subscript of s made of simple transpositions (`s_1 s_2 s_1`) is a permutation only where a
 *   permutation is expected (subscripts of \mathfrak S, bindings); elsewhere s_k is a Schur function.
 * - c^{ν}_{λ,μ}: a Littlewood–Richardson coefficient when all three read as partitions with
 *   |ν| = |λ| + |μ|; else a Schubert structure constant when all three read as permutations.
 * - An operator ∂_i applies to the rest of its product term: `\partial_1 x_1^2 x_2` is ∂_1(x_1^2 x_2).
 */
import type { ContextValue, Expr, GrassmannianSetting, Partition, PermutationSpec, CountedObject, SymmetricFamily } from '../types/claims'
import { MATRIX_ENVS, plainText, splitCommas, type MathNode } from './math-tree'
import type { NotationObject } from './tags'
import { alphabetOfList, declaredAlphabet, type Alphabet } from './notation/alphabet'
import { UNREAD_MACRO_PREFIX, unreadMacroReason } from './macros'
import { readGrassmannianSpace } from './notation/grassmannian'
import { backStableAt, hasBackStableMarker, nonPositiveAlphabetAt, type ChernFamily } from './notation/back-stable'
import { formalGroupOperator, hasKTheoryMarker, keyFamilyAt, KTheoryReadError, parameterOf, readComposition, readSpecialisation } from './notation/k-theory'

/** Why a side could not be read. It is control flow, thrown and caught often, so it records no stack trace. */
export class ParseFail extends Error {
  constructor(message: string) {
    const limit = Error.stackTraceLimit
    Error.stackTraceLimit = 0
    super(message)
    Error.stackTraceLimit = limit
  }
}

export interface ParseContext {
  bindings: ReadonlyMap<string, ContextValue>
  notation: ReadonlyMap<string, NotationObject>
  /** The alphabet this claim declares in an argument list (`s_{21}(a,b,c)`), if any. */
  alphabet?: Alphabet
  /** The Grassmannian the text has named (σ_λ and q are read only inside one). */
  grassmannian?: GrassmannianSetting
  /** Parameters declared by a `parameters` tag (notation/k-theory.ts). */
  parameters?: ReadonlySet<string>
  /** The claim writes K-theory (\mathfrak{G}, ⊕, ⊖), so \beta is the parameter β. */
  kTheory?: boolean
  /** Chern-class letters declared by a `chern` tag (notation/back-stable.ts). */
  chern?: ReadonlyMap<string, ChernFamily>
  /** The claim writes a back-stable Schubert polynomial, so declared Chern-class letters are read. */
  backStable?: boolean
}

export type SideResult
  = | { ok: true, expr: Expr, meaningful: boolean, used: Map<string, ContextValue> }
    | { ok: false, reason: string, recognised: boolean, used: Map<string, ContextValue> }

/** Font commands that wrap a name: \mathrm{BPD}, \operatorname{Red}, … */
const NAME_COMMANDS = new Set(['mathrm', 'operatorname', 'text', 'textrm', 'mathsf', 'mathit', 'textup', 'mathcal', 'rm', 'mathbf', 'textsf', 'mathtt'])
const COUNT_NAMES: Record<string, CountedObject> = {
  BPD: 'bumplessPipeDreams', bpd: 'bumplessPipeDreams', PD: 'pipeDreams', pd: 'pipeDreams', RP: 'pipeDreams',
  Red: 'reducedWords', red: 'reducedWords', R: 'reducedWords', RW: 'reducedWords',
}
const UNSUPPORTED_OPERATORS = new Set(['sum', 'prod', 'frac', 'dfrac', 'tfrac', 'binom', 'sqrt', 'int', 'lim', 'bigoplus', 'bigotimes', 'otimes', 'oplus', 'pm', 'mp', 'cdots', 'ldots', 'dots', 'dotsb', 'dotsc', 'vdots', 'ddots'])
const PERMUTATION_SYMBOLS = new Set(['u', 'v', 'w', 'x', 'y', 'z', '\\sigma', '\\pi', '\\tau', '\\rho'])
const PARTITION_SYMBOLS = new Set(['\\lambda', '\\mu', '\\nu', '\\kappa', '\\alpha', '\\beta', '\\gamma', '\\rho'])

const isCh = (n: MathNode | undefined, v: string): boolean => !!n && n.k === 'ch' && n.v === v
const isCs = (n: MathNode | undefined, v: string): boolean => !!n && n.k === 'cs' && n.v === v
const isDigit = (n: MathNode | undefined): boolean => !!n && n.k === 'ch' && n.v >= '0' && n.v <= '9' && n.v.length === 1
const isMatrix = (n: MathNode | undefined): boolean => !!n && n.k === 'env' && MATRIX_ENVS.has(n.name)
const childrenOf = (n: MathNode): MathNode[] => (n.k === 'group' || n.k === 'env' ? n.children : [n])

/** How a symbol node is named in bindings: `w`, `w'`, `\sigma`. */
function symbolName(n: MathNode | undefined): string | undefined {
  if (!n) return undefined
  if (n.k === 'ch' && /^[A-Za-z]$/.test(n.v)) return n.v
  if (n.k === 'cs' && /^[A-Za-z]+$/.test(n.v)) return '\\' + n.v
  return undefined
}

function describe(n: MathNode): string {
  if (n.k === 'cs') {
    return '\\' + n.v
  }
  if (n.k === 'ch') return n.v
  if (n.k === 'group') return '{…}'
  return `\\begin{${n.name}}`
}

/** Strip redundant braces: `{{x}}` → `x`. */
function unwrap(nodes: MathNode[]): MathNode[] {
  let cur = nodes
  while (cur.length === 1 && cur[0]!.k === 'group') cur = cur[0]!.children
  return cur
}

function readInteger(nodes: MathNode[]): number | undefined {
  const ns = unwrap(nodes)
  if (!ns.length || !ns.every(isDigit)) return undefined
  const v = Number(ns.map(n => (n as { v: string }).v).join(''))
  return Number.isSafeInteger(v) ? v : undefined
}

export class SideParser {
  private i = 0
  recognised = false
  readonly used = new Map<string, ContextValue>()
  private meaningful = false

  constructor(private nodes: MathNode[], public ctx: ParseContext) {}

  /** Parse the whole node list as an expression. */
  static parseSide(nodes: MathNode[], ctx: ParseContext): SideResult {
    const p = new SideParser(nodes, ctx)
    try {
      if (!nodes.length) throw new ParseFail('empty side')
      const expr = p.parseAll()
      return { ok: true, expr, meaningful: p.meaningful, used: p.used }
    }
    catch (e) {
      if (!(e instanceof ParseFail) && !(e instanceof KTheoryReadError)) throw e
      return { ok: false, reason: e.message, recognised: p.recognised || mentionsKnownObject(nodes, ctx), used: p.used }
    }
  }

  /**
   * Parse both sides of an equation, with the alphabet either side declares in an argument list
   * (`s_{21}(a,b,c) = a^2b + …`, `m_2(x_0,x_1,x_2) = x_0^2 + …`, `\mathfrak{S}_w(x;z)`).
   */
  static parseEquation(lhs: MathNode[], rhs: MathNode[], ctx: ParseContext): [SideResult, SideResult] {
    const alphabet = declaredAlphabet(lhs, rhs)
    const kTheory = hasKTheoryMarker(lhs, ctx) || hasKTheoryMarker(rhs, ctx)
    const backStable = hasBackStableMarker(lhs) || hasBackStableMarker(rhs)
    const claimCtx: ParseContext = alphabet || kTheory || backStable
      ? { ...ctx, ...(alphabet ? { alphabet } : {}), ...(kTheory ? { kTheory } : {}), ...(backStable ? { backStable } : {}) }
      : ctx
    return [SideParser.parseSide(lhs, claimCtx), SideParser.parseSide(rhs, claimCtx)]
  }

  private parseAll(): Expr {
    // `\left. X \right|_{\beta=0}`: the opening \left. only pairs with the closing bar.
    const leftDot = isCs(this.peek(), 'left') && isCh(this.peek(1), '.')
    if (leftDot) this.i += 2
    let e = this.parseSum()
    const special = readSpecialisation(this.nodes, this.i, this.ctx)
    if (special) {
      this.i += special.length
      this.recognised = true
      e = { type: 'specialise', arg: e, parameter: special.parameter, value: special.value }
    }
    else if (leftDot) throw new ParseFail('\\left. without a closing \\right|_{…}')
    if (this.i < this.nodes.length) {
      const n = this.nodes[this.i]!
      throw new ParseFail(isCh(n, ')') ? 'unbalanced ")"' : `unexpected ${describe(n)}`)
    }
    return e
  }

  private sub(nodes: MathNode[]): Expr {
    const p = new SideParser(nodes, this.ctx)
    try {
      if (!nodes.length) throw new ParseFail('empty group')
      return p.parseAll()
    }
    finally {
      this.recognised ||= p.recognised
      this.meaningful ||= p.meaningful
      for (const [k, v] of p.used) this.used.set(k, v)
    }
  }

  private peek(o = 0): MathNode | undefined {
    return this.nodes[this.i + o]
  }

  private parseSum(): Expr {
    const terms: Expr[] = []
    let sign = 1
    if (isCh(this.peek(), '+')) this.i++
    else if (isCh(this.peek(), '-')) {
      this.i++
      sign = -1
    }
    for (;;) {
      let t = this.parseTensorTerm()
      // a ⊕ b ⊕ c, left to right; mixing ⊕/⊖ with + or − at one level is not read.
      while (formalGroupOperator(this.peek())) {
        const op = formalGroupOperator(this.peek())!
        if (terms.length > 0 || sign < 0) throw new ParseFail(`\\${op} next to + or − is ambiguous; write parentheses`)
        this.i++
        this.recognised = true
        t = { type: 'formalGroup', op, left: t, right: this.parseTensorTerm() }
        if (isCh(this.peek(), '+') || isCh(this.peek(), '-')) throw new ParseFail(`\\${op} next to + or − is ambiguous; write parentheses`)
      }
      terms.push(sign < 0 ? { type: 'negate', arg: t } : t)
      if (isCh(this.peek(), '+')) sign = 1
      else if (isCh(this.peek(), '-')) sign = -1
      else break
      this.i++
    }
    return terms.length === 1 ? terms[0]! : { type: 'add', terms }
  }

  private startsFactor(n: MathNode | undefined): boolean {
    if (!n) return false
    if (n.k === 'ch') return !['+', '-', ')', ']', '=', '|', '^', '_', ',', ';'].includes(n.v)
    if (n.k === 'cs') {
      return n.v !== 'right' && n.v !== 'cdot' && n.v !== 'times' && n.v !== 'rvert' && n.v !== 'rangle' && n.v !== 'otimes' && !this.isClassProduct(n)
        && !formalGroupOperator(n) && !isSpecialisationBar(this.nodes, this.i, this.ctx)
    }
    return true
  }

  /** `\star` and `\ast` multiply classes in a Grassmannian setting (the quantum product in QH*). */
  private isClassProduct(n: MathNode | undefined): boolean {
    return !!this.ctx.grassmannian && (isCs(n, 'star') || isCs(n, 'ast'))
  }

  /** `a \otimes b`: binds looser than a product, tighter than a sum (`2 s_2 \otimes s_1`). */
  private parseTensorTerm(): Expr {
    let t = this.parseProduct()
    while (isCs(this.peek(), 'otimes')) {
      this.i++
      this.recognised = true
      t = { type: 'tensor', left: t, right: this.parseProduct() }
    }
    return t
  }

  private parseProduct(): Expr {
    const factors: Expr[] = [this.parseFactor()]
    for (;;) {
      const n = this.peek()
      if (isCs(n, 'cdot') || isCs(n, 'times') || isCh(n, '*') || this.isClassProduct(n)) {
        this.i++
        factors.push(this.parseFactor())
      }
      else if (this.startsFactor(n)) factors.push(this.parseFactor())
      else break
    }
    return factors.length === 1 ? factors[0]! : { type: 'multiply', factors }
  }

  private parseFactor(): Expr {
    let base = this.parsePrimary()
    while (isCh(this.peek(), '^')) {
      this.i++
      const arg = this.peek()
      if (!arg) throw new ParseFail('"^" without an exponent')
      this.i++
      const e = readInteger(childrenOf(arg))
      if (e === undefined) throw new ParseFail(`exponent ${describeNodes(childrenOf(arg))} is not a non-negative integer`)
      base = { type: 'power', base, exponent: e }
    }
    return base
  }

  /** Read `_x` and `^y` after a head, in either order. */
  private readScripts(): { sub?: MathNode[], sup?: MathNode[] } {
    const out: { sub?: MathNode[], sup?: MathNode[] } = {}
    for (;;) {
      const n = this.peek()
      const which = isCh(n, '_') ? 'sub' : isCh(n, '^') ? 'sup' : undefined
      if (!which || out[which]) return out
      const arg = this.peek(1)
      if (!arg) throw new ParseFail(`"${n && (n as { v: string }).v}" without an argument`)
      this.i += 2
      out[which] = childrenOf(arg)
    }
  }

  /** If a parenthesised list follows, return its content (without consuming unless `consume`). */
  private parenthesised(): { content: MathNode[], length: number } | undefined {
    const n = this.peek()
    let open = 1
    let close: (m: MathNode) => boolean
    if (isCh(n, '(')) close = m => isCh(m, ')')
    else if (isCs(n, 'left') && isCh(this.peek(1), '(')) {
      open = 2
      close = m => isCs(m, 'right')
    }
    else return undefined
    let depth = 0
    for (let j = this.i + open; j < this.nodes.length; j++) {
      const m = this.nodes[j]!
      if (isCh(m, '(') || isCs(m, 'left')) depth++
      else if (depth > 0 && (isCh(m, ')') || isCs(m, 'right'))) {
        depth--
        if (isCs(m, 'right')) j++
      }
      else if (depth === 0 && close(m)) {
        const length = j - this.i + (open === 2 ? 2 : 1)
        return { content: this.nodes.slice(this.i + open, j), length }
      }
    }
    throw new ParseFail('unbalanced "("')
  }

  private parsePrimary(): Expr {
    const n = this.peek()
    if (!n) throw new ParseFail('missing operand at the end')
    if (isDigit(n)) {
      let s = ''
      while (isDigit(this.peek())) s += (this.nodes[this.i++] as { v: string }).v
      return { type: 'integer', value: BigInt(s).toString() }
    }
    const paren = this.parenthesised()
    if (paren) {
      this.i += paren.length
      return this.sub(paren.content)
    }
    if (n.k === 'group') {
      this.i++
      return this.sub(n.children)
    }
    if (n.k === 'env') {
      if (n.name === 'vmatrix' || n.name === 'Vmatrix') {
        this.i++
        return this.determinant(n)
      }
      throw new ParseFail(MATRIX_ENVS.has(n.name) ? `a matrix (${n.name}) is not a value; write \\det or use vmatrix` : `unsupported environment ${n.name}`)
    }
    const parameter = parameterOf(n, this.ctx)
    if (parameter && !isCh(this.peek(1), '_')) {
      this.i++
      this.meaningful = true
      return { type: 'parameter', name: parameter }
    }
    const backStableLength = backStableAt(this.nodes, this.i)
    if (backStableLength) {
      this.i += backStableLength
      return this.backStable()
    }
    const keyFamily = keyFamilyAt(this.nodes, this.i)
    if (keyFamily) {
      const start = this.i
      this.i += keyFamily.length
      const { sub, sup } = this.readScripts()
      if (sup) this.i -= 2
      const composition = readComposition(sub!, this.ctx, this.used, keyFamily.family === 'atom')
      if (!composition) {
        this.i = start
        throw new ParseFail(keyFamily.family === 'key' ? 'unknown symbol \\kappa' : 'unknown symbol \\mathcal{A}')
      }
      this.recognised = true
      this.meaningful = true
      this.variableArguments()
      return { type: 'keyPolynomial', family: keyFamily.family, composition }
    }
    if (n.k === 'ch') {
      this.i++
      const alphabet = this.ctx.alphabet
      if (alphabet?.kind === 'letters' && alphabet.letters.includes(n.v) && !isCh(this.peek(), '_')) {
        this.meaningful = true
        return { type: 'variable', name: 'x', index: alphabet.letters.indexOf(n.v) + 1 }
      }
      if (alphabet?.kind === 'secondZ' && n.v === 'z') return this.variable('y', 'z')
      if (alphabet?.kind === 'indexed' && n.v === alphabet.letter && isCh(this.peek(), '_')) return this.variable('x', n.v)
      const chern = this.ctx.backStable ? this.ctx.chern?.get(n.v) : undefined
      if (chern && isCh(this.peek(), '_')) return this.chernClass(chern)
      switch (n.v) {
        case 'x':
        case 'y':
          return this.variable(n.v)
        case 'F':
          return this.stanley()
        case 's':
          return this.symmetric('schur', n)
        case 'e':
          return this.symmetric('elementary', n)
        case 'h':
          return this.symmetric('complete', n)
        case 'm':
          return this.symmetric('monomial', n)
        case 'p':
          return this.symmetric('powerSum', n)
        case 'c':
          return this.coefficient()
        case 'q':
          if (this.ctx.grassmannian?.ring === 'quantum' && !isCh(this.peek(), '_')) {
            this.meaningful = true
            return { type: 'quantumParameter' }
          }
          // q next to classes of plain H*(Gr(k,n)): the paper may mean QH* without saying so; never guess.
          if (this.ctx.grassmannian?.ring === 'cohomology' && !isCh(this.peek(), '_')) {
            throw new ParseFail('q in H^*(Gr(k,n)), not QH^*: the quantum parameter is not read there')
          }
          break
        case 'C':
          return this.capitalCoefficient()
        case '[':
          // [X_\lambda], [\Omega_\lambda]: the class of a Schubert variety. Papers index these by
          // codimension (the class is σ_λ) or by dimension (σ of the complement), so never guess.
          if ((isCh(this.peek(), 'X') || isCs(this.peek(), 'Omega')) && isCh(this.peek(1), '_')) {
            throw new ParseFail('[X_λ] is not read: papers index Schubert varieties by codimension (class σ_λ) or by dimension (σ of the complement); write σ_λ')
          }
          // [x_1^2]\mathfrak{S}_{312}: the coefficient of a monomial in what follows.
          if (this.i === 1 && isCoefficientExtraction(this.nodes, this.ctx)) throw new ParseFail(COEFFICIENT_EXTRACTION)
          break
        case 'K':
          return this.kostka()
        case '|':
          // |\begin{matrix}…\end{matrix}|: a determinant.
          if (isMatrix(this.peek()) && isCh(this.peek(1), '|')) {
            this.i += 2
            return this.determinant(this.nodes[this.i - 2]!)
          }
          return this.countBetweenBars(m => isCh(m, '|'))
      }
      // `ws_1`, `s_2 w`: a letter bound to a permutation, as a factor, multiplies in the group.
      if (this.ctx.bindings.get(n.v)?.kind === 'permutation' && !isCh(this.peek(), '(')) {
        throw new ParseFail(`${n.v} is a permutation here: a product in the symmetric group is not read`)
      }
      throw new ParseFail(`unknown symbol ${n.v}`)
    }
    // control sequence
    this.i++
    const object = this.ctx.notation.get(n.v)
    if (object) return this.notationObject(object)
    switch (n.v) {
      case 'mathfrak': {
        const arg = this.peek()
        const letter = arg ? plainText(childrenOf(arg)).trim() : ''
        this.i++
        if (letter === 'S') return this.schubertLike('schubert')
        if (letter === 'G') return this.schubertLike('grothendieck')
        throw new ParseFail(`unknown symbol \\mathfrak{${letter}}`)
      }
      case 'ell':
        return this.lengthOf()
      case '#':
        return this.countAfterHash()
      case 'lvert':
        return this.countBetweenBars(m => isCs(m, 'rvert'))
      case 'left':
        // \left|\begin{array}…\end{array}\right|: a determinant.
        if (isCh(this.peek(), '|') && isMatrix(this.peek(1)) && isCs(this.peek(2), 'right') && isCh(this.peek(3), '|')) {
          this.i += 4
          return this.determinant(this.nodes[this.i - 3]!)
        }
        if (isCh(this.peek(), '|')) {
          this.i++
          return this.countBetweenBars(m => isCs(m, 'right'), true)
        }
        break
      case 'partial':
        return this.dividedDifference()
      case 'det':
        return this.detOperator()
      case 'sigma':
        if (isCh(this.peek(), '_') && !this.ctx.bindings.has('\\sigma')) return this.schubertClass()
        break
      case 'int':
        if (this.integralSpace()) return this.integral()
        break
      case 'deg':
        return this.degreeOfGrassmannian()
      case 'Delta':
        return this.coproduct()
    }
    if (n.v.startsWith(UNREAD_MACRO_PREFIX)) throw new ParseFail(unreadMacroReason(n.v.slice(UNREAD_MACRO_PREFIX.length)))
    if (UNSUPPORTED_OPERATORS.has(n.v)) throw new ParseFail(`unsupported notation \\${n.v}`)
    if (NAME_COMMANDS.has(n.v) && this.peek()?.k === 'group') {
      const name = plainText(childrenOf(this.peek()!)).trim()
      throw new ParseFail(`unknown symbol \\${n.v}{${name}}`)
    }
    throw new ParseFail(`unknown symbol \\${n.v}`)
  }

  private variable(name: 'x' | 'y', written: string = name): Expr {
    const { sub, sup } = this.readScripts()
    if (sup) this.i -= 2 // leave the power to parseFactor
    if (!sub) throw new ParseFail(`variable ${written} without an index`)
    const index = readInteger(sub)
    // In a claim whose alphabet starts at x_0, x_i is the engine's x_{i+1}.
    const shift = name === 'x' && this.ctx.alphabet?.kind === 'fromZero' ? 1 : 0
    if (index === undefined || index + shift < 1) throw new ParseFail(`index ${describeNodes(sub)} of ${written} is not a positive integer`)
    this.meaningful = true
    return { type: 'variable', name, index: index + shift }
  }

  private notationObject(object: NotationObject): Expr {
    this.recognised = true
    switch (object) {
      case 'schubert':
        return this.schubertLike('schubert')
      case 'grothendieck':
        return this.schubertLike('grothendieck')
      case 'stanley':
        return this.stanley()
      case 'schur':
        return this.symmetric('schur')
      case 'elementary':
        return this.symmetric('elementary')
      case 'complete':
        return this.symmetric('complete')
      case 'monomial':
        return this.symmetric('monomial')
      case 'powersum':
        return this.symmetric('powerSum')
    }
  }

  private permutationFromScript(sub: MathNode[] | undefined, what: string): PermutationSpec {
    if (!sub) throw new ParseFail(`${what} without a permutation subscript`)
    return readPermutation(sub, this.ctx, this.used)
  }

  private schubertLike(type: 'schubert' | 'grothendieck'): Expr {
    const recognisedBefore = this.recognised
    this.recognised = true
    const what = type === 'schubert' ? '\\mathfrak{S}' : '\\mathfrak{G}'
    const { sub, sup } = this.readScripts()
    // A superscript that is a non-negative integer is a power (\mathfrak{S}_{132}^2); any other
    // superscript (\mathfrak{G}^{(\beta)}, \mathfrak{S}^{(n)}) is a different object.
    // \mathfrak{G}^{(\beta)}_w and \mathfrak{G}^{\beta}_w name the parameter, not a power.
    const namesBeta = type === 'grothendieck' && !!sup && isBetaSuperscript(sup, this.ctx)
    const exponent = sup && !namesBeta ? readInteger(sup) : undefined
    if (sup && !namesBeta && exponent === undefined) throw new ParseFail(`superscript on ${what} is not supported`)
    if (type === 'schubert' && sub && isSymmetricGroupIndex(sub, this.ctx)) {
      this.recognised = recognisedBefore
      throw new ParseFail(`\\mathfrak{S}_{${describeNodes(sub)}} with a number that is no permutation is the symmetric group, not a Schubert polynomial`)
    }
    const perm = this.permutationFromScript(sub, what)
    const args = this.variableArguments()
    this.meaningful = true
    const obj: Extract<Expr, { type: 'schubert' | 'grothendieck' }> = { type, perm, variant: args.kind === 'double' ? 'double' : 'single' }
    if (args.negatedY) {
      if (type !== 'schubert') throw new ParseFail(`${what}(x;-y) is not supported`)
      ;(obj as Extract<Expr, { type: 'schubert' }>).negatedY = true
    }
    const value: Expr = args.kind === 'ones' ? { type: 'evaluateAtOnes', arg: obj, variableCount: args.count } : obj
    return exponent === undefined ? value : { type: 'power', base: value, exponent }
  }

  /**
   * Optional variables after an object: (x), (x;y), (x,y), (\mathbf x;\mathbf y), (x_1,…,x_n),
   * or (1,…,1). A parenthesis that is none of these is left for multiplication.
   */
  private variableArguments(): { kind: 'none' | 'single' | 'double' | 'ones', count?: number, negatedY?: boolean } {
    const paren = this.parenthesised()
    if (!paren) return { kind: 'none' }
    const content = paren.content
    const declared = this.ctx.alphabet ? alphabetOfList(content) : undefined
    if (declared && declared.kind === this.ctx.alphabet!.kind) {
      this.i += paren.length
      if (declared.kind === 'secondZ') return { kind: 'double' }
      return { kind: 'single', count: declared.kind === 'letters' ? declared.letters.length : splitCommas(content).length }
    }
    // (x;y), (x|y) and (x;-y): the second alphabet after a semicolon or a bar; a minus sign in
    // front of it means y replaced by −y.
    const groups = splitAt(content, m => isCh(m, ';') || isCh(m, '|') || isCs(m, 'mid') || isCs(m, 'vert'))
    const negatedY = groups.length === 2 && isCh(groups[1]![0], '-') && groups[1]!.length > 1
    if (negatedY) {
      const second = splitCommas(groups[1]!.slice(1))
      const ys = second.map(it => variableLetter(it, this.ctx, this.used))
      if (!ys.every(l => l?.letter === 'y')) return { kind: 'none' }
      const xs = splitCommas(groups[0]!).map(it => variableLetter(it, this.ctx, this.used))
      if (!xs.every(l => l?.letter === 'x')) return { kind: 'none' }
      this.i += paren.length
      return { kind: 'double', negatedY: true }
    }
    const items = groups.flatMap(g => splitCommas(g))
    const letters = items.map(it => variableLetter(it, this.ctx, this.used))
    let result: { kind: 'none' | 'single' | 'double' | 'ones', count?: number } | undefined
    if (letters.every(l => l !== undefined)) {
      const set = new Set(letters.map(l => l!.letter))
      if (set.size === 1 && set.has('x')) result = { kind: 'single', count: countOf(letters) }
      else if (set.size === 2 && set.has('x') && set.has('y')) result = { kind: 'double' }
    }
    else if (items.every(it => isOne(it) || isDots(it)) && items.some(isOne)) {
      const hasDots = items.some(isDots)
      result = { kind: 'ones', count: hasDots ? undefined : items.length }
    }
    if (!result) return { kind: 'none' }
    this.i += paren.length
    return result
  }

  private stanley(): Expr {
    const { sub, sup } = this.readScripts()
    if (!sub || sup) throw new ParseFail('unknown symbol F')
    // F is a flag member, a field or a function as often as a Stanley function: F_5 (no
    // permutation of 1..1) names something else, so F is known only once its index reads.
    const number = readInteger(sub)
    if (number !== undefined && number !== 0 && !isStanleyIndex(sub, this.ctx)) throw new ParseFail(`F_{${describeNodes(sub)}} with a number that is no permutation names something else (a flag member, a term of a sequence)`)
    const perm = this.permutationFromScript(sub, 'F')
    this.recognised = true
    const nonPositive = nonPositiveAlphabetAt(this.nodes, this.i)
    if (nonPositive) this.i += nonPositive.length
    else this.variableArguments()
    this.meaningful = true
    return nonPositive ? { type: 'nonPositive', set: nonPositive.set, arg: { type: 'stanley', perm } } : { type: 'stanley', perm }
  }

  private symmetric(family: SymmetricFamily, letterNode?: MathNode): Expr {
    const { sub, sup } = this.readScripts()
    const letter = { schur: 's', elementary: 'e', complete: 'h', monomial: 'm', powerSum: 'p' }[family]
    if (!sub) throw new ParseFail(`unknown symbol ${letterNode ? letter : 'macro'}`)
    if (sup) this.i -= 2
    this.recognised = true
    const multiplicative = family === 'elementary' || family === 'complete' || family === 'powerSum'
    const skewShape = family === 'schur' ? splitSkewShape(sub) : undefined
    let skew: Partition | undefined
    let index: Partition
    if (skewShape) {
      index = readPartition(skewShape.outer, this.ctx, this.used)
      skew = readPartition(skewShape.inner, this.ctx, this.used)
      if (skew.some((part, row) => part > (index[row] ?? 0))) throw new ParseFail(`(${skew.join(',')}) does not fit inside (${index.join(',')}), so ${letter}_{λ/μ} is not a skew shape`)
    }
    else index = multiplicative ? readMultiplicativeIndex(sub, this.ctx, this.used) : readPartition(sub, this.ctx, this.used)
    // s_λ[x_-], s_λ(x_0, x_{-1}, \dots): in the non-positive variables (notation/back-stable.ts).
    const nonPositive = nonPositiveAlphabetAt(this.nodes, this.i)
    if (nonPositive) {
      this.i += nonPositive.length
      this.meaningful = true
      const arg: Expr = { type: 'symmetric', family, index, ...(skew && skew.length ? { skew } : {}) }
      const spread: Expr = multiplicative && index.length > 1
        ? { type: 'multiply', factors: index.map(part => ({ type: 'symmetric', family, index: [part] })) }
        : arg
      return { type: 'nonPositive', set: nonPositive.set, arg: spread }
    }
    const args = this.variableArguments()
    this.meaningful = true
    let variableCount: number | undefined
    if (args.kind === 'single' && args.count !== undefined) variableCount = args.count
    else if (args.kind === 'single') throw new ParseFail(`number of variables of ${letter}_{…}(x_1,…) is unclear; write x_1,\\dots,x_4`)
    else if (args.kind === 'double') throw new ParseFail(`${letter} in two sets of variables is not supported`)
    const single = (parts: Partition): Expr => ({
      type: 'symmetric', family, index: parts,
      ...(variableCount === undefined ? {} : { variableCount }),
      ...(skew && skew.length ? { skew } : {}),
    })
    // e_λ, h_λ, p_λ are products over the parts of λ: e_{21} = e_2 e_1.
    const obj: Expr = multiplicative && index.length > 1 ? { type: 'multiply', factors: index.map(part => single([part])) } : single(index)
    if (args.kind === 'ones') return { type: 'evaluateAtOnes', arg: obj, variableCount: args.count }
    return obj
  }

  /** \overleftarrow{\mathfrak{S}}_w, ←S_w(x), ←S_w(x;y), with a power as for \mathfrak{S}. */
  private backStable(): Expr {
    this.recognised = true
    const { sub, sup } = this.readScripts()
    const exponent = sup ? readInteger(sup) : undefined
    if (sup && exponent === undefined) throw new ParseFail('superscript on \\overleftarrow{\\mathfrak{S}} is not supported')
    const perm = this.permutationFromScript(sub, '\\overleftarrow{\\mathfrak{S}}')
    const args = this.variableArguments()
    if (args.negatedY || args.kind === 'ones') throw new ParseFail('back-stable Schubert polynomials are read in (x) or (x;y) only')
    this.meaningful = true
    const value: Expr = { type: 'backStable', perm, variant: args.kind === 'double' ? 'double' : 'single' }
    return exponent === undefined ? value : { type: 'power', base: value, exponent }
  }

  /** c_k under a `chern c h` tag: h_k (or e_k) in the non-positive variables; c_0 = 1. */
  private chernClass(family: ChernFamily): Expr {
    const { sub, sup } = this.readScripts()
    if (sup) this.i -= 2
    const k = sub ? readInteger(sub) : undefined
    if (k === undefined) throw new ParseFail('a Chern class c_k needs an integer k')
    this.recognised = true
    this.meaningful = true
    if (k === 0) return { type: 'integer', value: '1' }
    return { type: 'nonPositive', set: 'x', arg: { type: 'symmetric', family, index: [k] } }
  }

  private lengthOf(): Expr {
    const paren = this.parenthesised()
    // A lone ℓ is a letter (a number of parts, an index), not the length function.
    if (!paren) throw new ParseFail('\\ell without (w) is a letter, not the length function')
    this.recognised = true
    this.i += paren.length
    this.meaningful = true
    return { type: 'length', perm: readPermutation(paren.content, this.ctx, this.used) }
  }

  private countedSet(nodes: MathNode[], betweenBars = false): Expr {
    // \mathrm{BPD}(w), \operatorname{Red}(2143), \text{PD}(w)
    let j = 0
    const head = nodes[j]
    if (!head) throw new ParseFail('nothing to count')
    let name: string | undefined
    if (head.k === 'cs' && NAME_COMMANDS.has(head.v) && nodes[j + 1]) {
      name = plainText(childrenOf(nodes[j + 1]!)).trim()
      j += 2
    }
    else if (head.k === 'ch') {
      name = ''
      while (nodes[j]?.k === 'ch' && /^[A-Za-z]$/.test((nodes[j] as { v: string }).v)) name += (nodes[j++] as { v: string }).v
    }
    const objects = name !== undefined ? COUNT_NAMES[name] : undefined
    // |\lambda|, |w|, |a|: a size or an absolute value, not a set of objects.
    if (!objects && betweenBars && nodes.length === 1 && symbolName(head)) throw new ParseFail(`|${symbolName(head)}| (a size or an absolute value) is not a set Scholium counts`)
    if (!objects) throw new ParseFail(`unknown set ${name ? name : describe(head)} to count (known: BPD, PD, Red)`)
    this.recognised = true
    const rest = nodes.slice(j)
    let permNodes: MathNode[] | undefined
    if (isCh(rest[0], '(') && isCh(rest[rest.length - 1], ')')) permNodes = rest.slice(1, -1)
    else if (isCs(rest[0], 'left') && isCs(rest[rest.length - 2], 'right')) permNodes = rest.slice(2, -2)
    else if (isCh(rest[0], '_') && rest.length === 2) permNodes = childrenOf(rest[1]!)
    if (!permNodes) throw new ParseFail(`cannot read the permutation of ${name}`)
    this.meaningful = true
    return { type: 'count', objects, perm: readPermutation(permNodes, this.ctx, this.used) }
  }

  private countAfterHash(): Expr {
    // \# followed by the set: take the head, its argument and one parenthesised list or subscript.
    const start = this.i
    const head = this.peek()
    if (!head) throw new ParseFail('\\# without a set')
    let j = this.i + (head.k === 'cs' && NAME_COMMANDS.has(head.v) ? 2 : 1)
    if (head.k === 'ch') while (this.nodes[j]?.k === 'ch' && /^[A-Za-z]$/.test((this.nodes[j] as { v: string }).v)) j++
    this.i = j
    const paren = this.parenthesised()
    if (paren) j += paren.length
    else if (isCh(this.nodes[j], '_')) j += 2
    this.i = j
    return this.countedSet(this.nodes.slice(start, j))
  }

  private countBetweenBars(isClose: (m: MathNode) => boolean, leftRight = false): Expr {
    let j = this.i
    while (j < this.nodes.length && !isClose(this.nodes[j]!)) j++
    if (j >= this.nodes.length) throw new ParseFail('unclosed "|"')
    const inner = this.nodes.slice(this.i, j)
    this.i = j + (leftRight ? 2 : 1)
    return this.countedSet(inner, true)
  }

  private coefficient(): Expr {
    const { sub, sup } = this.readScripts()
    if (!sub || !sup) throw new ParseFail('unknown symbol c')
    this.recognised = true
    const lower = splitPair(sub)
    if (!lower) throw new ParseFail(`cannot split the subscript of c into two indices; separate them with a comma`)
    this.meaningful = true
    const expr = readCoefficient(lower[0], lower[1], sup, this.ctx, this.used)
    // Indices told apart only by spacing (c^{42}_{21\,21}) are partitions; read them only when
    // the sizes fit, never as permutations.
    if (splitBySpacing(sub) && !(expr.type === 'littlewoodRichardson' && sizeOf(expr.nu) === sizeOf(expr.lambda) + sizeOf(expr.mu))) {
      throw new ParseFail('the indices of c, told apart only by spacing, do not read as partitions with |ν| = |λ| + |μ|')
    }
    return expr
  }

  /**
   * C^{ν}_{λ,μ}: some papers write the Littlewood–Richardson coefficient with a capital C. A
   * capital C is read only when all three indices are partitions with |ν| = |λ| + |μ|; otherwise
   * (a constant, a Schubert structure constant in another paper's notation) it is not read.
   */
  private capitalCoefficient(): Expr {
    const start = this.i
    const { sub, sup } = this.readScripts()
    const lower = sub && sup ? splitPair(sub) : undefined
    if (sub && sup && lower) {
      const used = new Map<string, ContextValue>()
      try {
        const expr = readCoefficient(lower[0], lower[1], sup, this.ctx, used)
        if (expr.type === 'littlewoodRichardson' && sizeOf(expr.nu) === sizeOf(expr.lambda) + sizeOf(expr.mu)) {
          this.recognised = true
          this.meaningful = true
          for (const [name, value] of used) this.used.set(name, value)
          return expr
        }
      }
      catch (e) {
        if (!(e instanceof ParseFail)) throw e
      }
    }
    this.i = start
    throw new ParseFail('unknown symbol C')
  }

  private kostka(): Expr {
    const { sub, sup } = this.readScripts()
    if (!sub || sup) throw new ParseFail('unknown symbol K')
    this.recognised = true
    const pair = splitPair(sub)
    if (!pair) throw new ParseFail('cannot split the subscript of K into shape and content; separate them with a comma')
    this.meaningful = true
    return {
      type: 'kostka',
      shape: readPartition(pair[0], this.ctx, this.used),
      content: readPartition(pair[1], this.ctx, this.used),
    }
  }

  private dividedDifference(): Expr {
    this.recognised = true
    const { sub, sup } = this.readScripts()
    if (sup) throw new ParseFail('powers of \\partial are not supported')
    const index = sub ? readInteger(sub) : undefined
    const letter = sub && index === undefined ? freeLetter(sub, this.ctx) : undefined
    if (letter) throw new ParseFail(`${letter} is not bound (the index of \\partial_${letter}): a general identity`)
    if (index === undefined || index < 1) throw new ParseFail('\\partial needs a positive integer index, as in \\partial_1')
    if (!this.startsFactor(this.peek())) throw new ParseFail(`\\partial_${index} is applied to nothing`)
    const arg = this.parseProduct()
    this.meaningful = true
    return { type: 'dividedDifference', index, arg }
  }

  /**
   * σ_λ (`\sigma_{21}`, `\sigma_{(2,1)}`, `\sigma_{2,1}`, `\sigma_\lambda` with λ bound), a class
   * of the Grassmannian the text named; `\sigma_1^4` is a power. Outside a setting σ_λ is not read.
   */
  private schubertClass(): Expr {
    const setting = this.ctx.grassmannian
    if (!setting) throw new ParseFail('σ_λ is read only where the text names its Grassmannian (in $H^*(\\mathrm{Gr}(k,n))$) or a tag sets it')
    const { sub, sup } = this.readScripts()
    const exponent = sup ? readInteger(sup) : undefined
    if (sup && exponent === undefined) throw new ParseFail('a superscript on σ_λ other than a power is not read')
    const partition = readPartition(sub!, this.ctx, this.used)
    // σ_i(x_1) is a map applied to something (a reflection, a permutation), not a class; a
    // parenthesis holding classes, σ_1(σ_1 + σ_2), is a product.
    const paren = this.parenthesised()
    if (paren && !paren.content.some(m => isCs(m, 'sigma') || isCh(m, 'q'))) throw new ParseFail('σ_λ(…) is a map applied to an argument, not a Schubert class')
    this.recognised = true
    this.meaningful = true
    const cls: Expr = { type: 'schubertClass', partition }
    return exponent === undefined ? cls : { type: 'power', base: cls, exponent }
  }

  /** The space of `\int_{\mathrm{Gr}(2,4)}`, `\int_X` (X named the space) or a bare `\int` in a setting. */
  private integralSpace(): GrassmannianSetting | undefined {
    const setting = this.ctx.grassmannian
    if (!isCh(this.peek(), '_')) return isCh(this.peek(), '^') ? undefined : setting && { ...setting, ring: 'cohomology' }
    const sub = this.peek(1)
    if (!sub) return undefined
    const nodes = unwrap(childrenOf(sub))
    const found = readGrassmannianSpace(nodes, 0, true)
    if (found && found.end === nodes.length) return { ring: 'cohomology', ...found.space }
    const name = symbolName(nodes[0])
    if (nodes.length === 1 && setting?.name !== undefined && name === setting.name) return { ...setting, ring: 'cohomology' }
    return undefined
  }

  /** ∫ of the rest of the product term, e.g. `\int_{\mathrm{Gr}(2,4)} \sigma_1^4`. */
  private integral(): Expr {
    const space = this.integralSpace()!
    const written = isCh(this.peek(), '_')
    if (written) this.i += 2
    this.recognised = true
    if (!this.startsFactor(this.peek())) throw new ParseFail('\\int of nothing')
    const saved = this.ctx
    this.ctx = { ...saved, grassmannian: space }
    let arg: Expr
    try {
      arg = this.parseProduct()
    }
    finally {
      this.ctx = saved
    }
    this.meaningful = true
    return { type: 'integral', arg, ...(written ? { space: { k: space.k, n: space.n } } : {}) }
  }

  /** `\deg \mathrm{Gr}(2,4)`, `\deg(\mathrm{Gr}(2,4))`: the degree of the Grassmannian (not of a class). */
  private degreeOfGrassmannian(): Expr {
    const paren = isCh(this.peek(), '(')
    const at = this.i + (paren ? 1 : 0)
    const found = readGrassmannianSpace(this.nodes, at, true)
    if (!found || (paren && !isCh(this.nodes[found.end], ')'))) throw new ParseFail('unknown symbol \\deg')
    this.i = found.end + (paren ? 1 : 0)
    this.recognised = true
    this.meaningful = true
    return { type: 'grassmannianDegree', space: found.space }
  }

  /** `\Delta(s_{21})`: the coproduct of a symmetric function written without variables. */
  private coproduct(): Expr {
    const paren = this.parenthesised()
    if (!paren) throw new ParseFail('unknown symbol \\Delta')
    const saved = this.i
    this.i += paren.length
    let arg: Expr
    try {
      arg = this.sub(paren.content)
    }
    catch (e) {
      this.i = saved
      throw e
    }
    if (!isSymmetricFunction(arg)) throw new ParseFail('Δ(…) is read only of symmetric functions written without variables')
    this.recognised = true
    this.meaningful = true
    return { type: 'coproduct', arg }
  }

  private detOperator(): Expr {
    this.recognised = true
    const n = this.peek()
    if (n?.k === 'env' && MATRIX_ENVS.has(n.name)) {
      this.i++
      return this.determinant(n)
    }
    const paren = this.parenthesised()
    if (paren) {
      const inner = paren.content
      if (inner.length === 1 && inner[0]!.k === 'env' && MATRIX_ENVS.has(inner[0]!.name)) {
        this.i += paren.length
        return this.determinant(inner[0]!)
      }
    }
    throw new ParseFail('\\det must be followed by a matrix environment')
  }

  private determinant(env: MathNode): Expr {
    this.recognised = true
    const rows: Expr[][] = []
    let cur: MathNode[][] = [[]]
    const flush = () => {
      if (cur.some(c => c.length)) rows.push(cur.map(c => this.sub(c)))
      cur = [[]]
    }
    for (const m of childrenOf(env)) {
      if (isCs(m, '\\') || isCs(m, 'cr')) flush()
      else if (isCh(m, '&')) cur.push([])
      else cur[cur.length - 1]!.push(m)
    }
    flush()
    if (!rows.length || rows.some(r => r.length !== rows.length)) {
      throw new ParseFail(`the matrix is not square (${rows.length} rows, row lengths ${rows.map(r => r.length).join(', ')})`)
    }
    this.meaningful = true
    return { type: 'determinant', rows }
  }
}

/** A symmetric function in the Schur-type bases, without variables: what Δ applies to. */
function isSymmetricFunction(e: Expr): boolean {
  switch (e.type) {
    case 'integer': return true
    case 'symmetric': return e.variableCount === undefined
    case 'add': return e.terms.every(isSymmetricFunction)
    case 'multiply': return e.factors.every(isSymmetricFunction)
    case 'negate': return isSymmetricFunction(e.arg)
    case 'power': return isSymmetricFunction(e.base)
    default: return false
  }
}

/** `(\beta)` or `\beta` as the superscript of \mathfrak{G}. */
function isBetaSuperscript(sup: MathNode[], ctx: ParseContext): boolean {
  let ns = unwrap(sup)
  if (isCh(ns[0], '(') && isCh(ns[ns.length - 1], ')')) ns = ns.slice(1, -1)
  return ns.length === 1 && parameterOf(ns[0], ctx) === 'beta'
}

/** A bar that starts a specialisation `|_{\beta=0}` (possibly sized, `\big|`), so not a factor. */
function isSpecialisationBar(nodes: MathNode[], at: number, ctx: ParseContext): boolean {
  try {
    return readSpecialisation(nodes, at, ctx) !== undefined
  }
  catch (e) {
    if (e instanceof KTheoryReadError) return false
    throw e
  }
}

const sizeOf = (parts: readonly number[]): number => parts.reduce((sum, part) => sum + part, 0)

/** Why coefficient extraction `[x^a]F` gives no claim (the word "is not read" makes it not-read math). */
const COEFFICIENT_EXTRACTION = 'coefficient extraction [x^a]F is not read'

/**
 * `[x_1^2]F`, `[x^a]F` at the start of a side: a bracketed monomial in x (or x^a with a letter
 * exponent) followed by what it is the coefficient of. `s_1[x_-]` (an alphabet in brackets after
 * an object) is not one: the bracket does not open the side.
 */
function isCoefficientExtraction(nodes: MathNode[], ctx: ParseContext): boolean {
  const close = nodes.findIndex(m => isCh(m, ']'))
  if (!isCh(nodes[0], '[') || close < 2 || close === nodes.length - 1) return false
  const inner = nodes.slice(1, close)
  if (inner.length === 3 && isCh(inner[0], 'x') && isCh(inner[1], '^')) return true
  const monomial = SideParser.parseSide(inner, ctx)
  const isMonomial = (e: Expr): boolean =>
    e.type === 'variable' || (e.type === 'power' && isMonomial(e.base)) || (e.type === 'multiply' && e.factors.every(isMonomial))
  return monomial.ok && isMonomial(monomial.expr)
}

/**
 * `\mathfrak{S}_4`, `\mathfrak{S}_{10}`: a number of one or two digits that is no permutation in
 * one-line notation names the symmetric group (as S_4 does); `\mathfrak{S}_{21}` is a Schubert polynomial.
 */
function isSymmetricGroupIndex(sub: MathNode[], ctx: ParseContext): boolean {
  const ns = unwrap(sub)
  return ns.length <= 2 && readInteger(ns) !== undefined && !isStanleyIndex(ns, ctx)
}

/** F_k with a plain number k: a Stanley function only when k is a permutation in one-line notation (F_{21}). */
function isStanleyIndex(sub: MathNode[], ctx: ParseContext): boolean {
  try {
    readPermutation(sub, ctx, new Map())
    return true
  }
  catch (e) {
    if (e instanceof ParseFail) return false
    throw e
  }
}

/** LaTeX-like text of nodes for messages, cut after 40 nodes with the count of what was cut. */
function describeNodes(nodes: MathNode[], max = 40): string {
  if (nodes.length > max) return `${nodes.slice(0, max).map(describe).join('')}… (${nodes.length - max} more)`
  return nodes.map(describe).join('') || '(empty)'
}

function splitAt(nodes: MathNode[], isSep: (m: MathNode) => boolean): MathNode[][] {
  const out: MathNode[][] = [[]]
  for (const n of nodes) {
    if (isSep(n)) out.push([])
    else out[out.length - 1]!.push(n)
  }
  return out
}

/** One entry of a variable list: `x`, `x_3`, `\\mathbf y`, `\\dots`, or `x_n` with n bound to an integer. */
function variableLetter(item: MathNode[], ctx?: ParseContext, used?: Map<string, ContextValue>): { letter: 'x' | 'y', index?: number, dots?: boolean } | undefined {
  const ns = unwrap(item).filter(n => !(n.k === 'cs' && (n.v === 'mathbf' || n.v === 'boldsymbol' || n.v === 'bm')))
  if (ns.length === 1 && ns[0]!.k === 'group') return variableLetter(ns[0]!.children, ctx, used)
  if (isDots(ns)) return { letter: 'x', dots: true }
  const first = ns[0]
  if (!first) return undefined
  const letter = first.k === 'ch' && (first.v === 'x' || first.v === 'y') ? first.v : first.k === 'group' ? plainText(first.children) : undefined
  if (letter !== 'x' && letter !== 'y') return undefined
  if (ns.length === 1) return { letter }
  if (ns.length === 3 && isCh(ns[1], '_')) {
    const index = readInteger(childrenOf(ns[2]!))
    if (index !== undefined) return { letter, index }
    const sym = ctx ? lookupSymbol(childrenOf(ns[2]!), ctx) : undefined
    if (sym?.value?.kind === 'integer') {
      used?.set(sym.name, sym.value)
      return { letter, index: sym.value.value }
    }
    return { letter }
  }
  return undefined
}

/** x_1,…,x_n → n; x_1,x_2,x_3 → 3; unclear → undefined. */
function countOf(letters: ({ letter: 'x' | 'y', index?: number, dots?: boolean } | undefined)[]): number | undefined {
  const indices = letters.filter(l => l && !l.dots).map(l => l!.index)
  if (indices.some(i => i === undefined)) return undefined
  const last = indices[indices.length - 1]
  if (last === undefined) return undefined
  if (letters.some(l => l?.dots)) return indices[0] === 1 ? last : undefined
  return indices.every((v, k) => v === k + 1) ? last : undefined
}

function isOne(item: MathNode[]): boolean {
  const ns = unwrap(item)
  return ns.length === 1 && isCh(ns[0], '1')
}

function isDots(item: MathNode[]): boolean {
  const ns = unwrap(item)
  if (ns.length === 1 && ns[0]!.k === 'cs' && ['dots', 'ldots', 'cdots', 'dotsc', 'dotsb'].includes(ns[0]!.v)) return true
  return ns.length === 3 && ns.every(n => isCh(n, '.'))
}

/**
 * A skew shape `λ/μ` in a subscript: `(3,2)/(1)`, `32/1`, `\lambda/\mu`. Exactly one top-level
 * slash with something on both sides; anything else is not a skew shape.
 */
function splitSkewShape(nodes: MathNode[]): { outer: MathNode[], inner: MathNode[] } | undefined {
  const parts: MathNode[][] = [[]]
  let depth = 0
  for (const n of unwrap(nodes)) {
    if (isCh(n, '(') || isCh(n, '[')) depth++
    if (isCh(n, ')') || isCh(n, ']')) depth--
    if (depth === 0 && isCh(n, '/')) parts.push([])
    else parts[parts.length - 1]!.push(n)
  }
  if (parts.length !== 2 || !parts[0]!.length || !parts[1]!.length) return undefined
  return { outer: parts[0]!, inner: parts[1]! }
}

/**
 * A Young diagram drawn with ytableau's `\ydiagram{2,1}`: the arguments are the row lengths.
 * In English notation they are listed top row first; a paper in French notation that lists them
 * bottom row first (as drawn) gives the same weakly decreasing list, so the partition is the
 * same. A list that is not weakly decreasing (`\ydiagram{1,2}`: English nonsense, or French rows
 * listed top-down) or a skew diagram (`\ydiagram{1+2,3}`) is left unread: we do not guess.
 */
function readYoungDiagram(nodes: MathNode[]): Partition | undefined {
  const ns = unwrap(nodes)
  if (!(ns.length === 2 && isCs(ns[0], 'ydiagram') && ns[1]!.k === 'group')) return undefined
  const rows = splitCommas(ns[1]!.children).map(readInteger)
  if (!rows.length || rows.some(r => r === undefined || r < 1)) throw new ParseFail('\\ydiagram{…} with offsets or non-numeric rows is not read')
  const parts = rows as number[]
  if (parts.some((r, j) => j > 0 && r > parts[j - 1]!)) throw new ParseFail(`\\ydiagram{${parts.join(',')}} does not list weakly decreasing rows; left unread (English or French order is unclear)`)
  return parts
}

/**
 * The index of e, h or p: one digit (`e_3`), an
 * integer symbol the paper bound ("Let $k = 3$"), or a partition (`e_{21}`, `h_{(2,2)}`, bound λ).
 * Digits written together are parts, as for s_λ: `e_{21}` is e_{(2,1)}, never e with index 21.
 */
function readMultiplicativeIndex(nodes: MathNode[], ctx: ParseContext, used: Map<string, ContextValue>): Partition {
  const sym = lookupSymbol(nodes, ctx)
  if (sym?.value?.kind === 'integer') {
    used.set(sym.name, sym.value)
    if (sym.value.value < 0) throw new ParseFail(`${sym.name} = ${sym.value.value} is negative`)
    return sym.value.value === 0 ? [] : [sym.value.value]
  }
  return readPartition(nodes, ctx, used)
}

/**
 * Split `u,v`, `\lambda\mu` (two symbols) or `21\,21` (two digit runs separated by spacing) into
 * two node lists. Spacing commands are dropped from the tree, so the separation is seen as a gap
 * between the source positions of two neighbouring digits; `2121` with no gap is ambiguous and
 * is not split.
 */
function splitPair(nodes: MathNode[]): [MathNode[], MathNode[]] | undefined {
  const ns = unwrap(nodes)
  const parts = splitCommas(ns)
  if (parts.length === 2) return [parts[0]!, parts[1]!]
  if (parts.length === 1 && ns.length === 2 && symbolName(ns[0]) && symbolName(ns[1]) && !isDigit(ns[0]) && !isDigit(ns[1])) {
    return [[ns[0]!], [ns[1]!]]
  }
  const gap = splitBySpacing(ns)
  if (gap !== undefined) return [ns.slice(0, gap), ns.slice(gap)]
  return undefined
}

/** In digits only, the place of the one gap left by dropped spacing (`21\,21` → 2); else undefined. */
function splitBySpacing(nodes: MathNode[]): number | undefined {
  const ns = unwrap(nodes)
  if (ns.length < 2 || !ns.every(isDigit)) return undefined
  const gaps: number[] = []
  for (let j = 1; j < ns.length; j++) if (ns[j]!.pos > ns[j - 1]!.end) gaps.push(j)
  return gaps.length === 1 ? gaps[0] : undefined
}

function lookupSymbol(nodes: MathNode[], ctx: ParseContext): { name: string, value?: ContextValue } | undefined {
  const ns = unwrap(nodes)
  let name = symbolName(ns[0])
  if (!name || ns.length > 2) return undefined
  if (ns.length === 2) {
    if (!isCh(ns[1], '\'')) return undefined
    name += '\''
  }
  return { name, value: ctx.bindings.get(name) }
}

/**
 * Read a permutation: bound symbol, one-line digits, [..] or (..) lists, cycles, words in s_i, w_0.
 * Example: the nodes of `2143` give `{ form: 'oneLine', entries: [2, 1, 4, 3] }`.
 */
export function readPermutation(nodes: MathNode[], ctx: ParseContext, used: Map<string, ContextValue>): PermutationSpec {
  const ns = unwrap(nodes)
  if (!ns.length) throw new ParseFail('empty permutation')
  const sym = lookupSymbol(ns, ctx)
  if (sym && !(ns.length === 1 && isDigit(ns[0]))) {
    if (sym.value?.kind === 'permutation') {
      used.set(sym.name, sym.value)
      return sym.value.perm
    }
    if (sym.value) throw new ParseFail(`${sym.name} is bound to ${article(sym.value.kind)} ${sym.value.kind}, not a permutation`)
    if (PERMUTATION_SYMBOLS.has(sym.name.replace(/'$/, ''))) throw new ParseFail(`permutation ${sym.name} is not bound (write "Let $${sym.name} = 2143$" before the claim)`)
    throw new ParseFail(`${sym.name} is not bound (a permutation is expected here)`)
  }
  // w_0, w_0^{(n)}
  if (isCh(ns[0], 'w') && ns.length >= 3) {
    let sub: MathNode[] | undefined
    let sup: MathNode[] | undefined
    for (let j = 1; j + 1 < ns.length; j += 2) {
      if (isCh(ns[j], '_')) sub = childrenOf(ns[j + 1]!)
      else if (isCh(ns[j], '^')) sup = childrenOf(ns[j + 1]!)
      else throw unreadablePermutation(ns, ctx)
    }
    if (readInteger(sub ?? []) === 0 && ns.length % 2 === 1) {
      let n: number | undefined
      if (sup) {
        const inner = unwrap(sup)
        const stripped = isCh(inner[0], '(') && isCh(inner[inner.length - 1], ')') ? inner.slice(1, -1) : inner
        n = readInteger(stripped)
        if (n === undefined) throw new ParseFail(`cannot read the superscript of w_0^{${describeNodes(sup)}}; only w_0^{(n)}, the longest permutation of S_n, is read`)
      }
      else {
        const bound = ctx.bindings.get('n')
        if (bound?.kind !== 'integer') throw new ParseFail('n is not bound: w_0 needs n (write w_0^{(n)} or "Let $n = 4$")')
        used.set('n', bound)
        n = bound.value
      }
      if (n < 1) throw new ParseFail('w_0 needs n ≥ 1')
      return { form: 'longest', n }
    }
    throw unreadablePermutation(ns, ctx)
  }
  // s_1 s_2 s_1
  if (isCh(ns[0], 's') && isCh(ns[1], '_')) {
    const letters: number[] = []
    for (let j = 0; j < ns.length; j += 3) {
      if (!isCh(ns[j], 's') || !isCh(ns[j + 1], '_') || !ns[j + 2]) throw new ParseFail(`cannot read ${describeNodes(ns)} as a word in simple transpositions`)
      const k = readInteger(childrenOf(ns[j + 2]!))
      const letter = k === undefined ? freeLetter(childrenOf(ns[j + 2]!), ctx) : undefined
      if (letter) throw new ParseFail(`${letter} is not bound (the index of s_${letter}): a general statement`)
      if (k === undefined || k < 1) throw new ParseFail(`s_{${describeNodes(childrenOf(ns[j + 2]!))}} is not a simple transposition`)
      letters.push(k)
    }
    return { form: 'word', letters }
  }
  if (ns.every(isDigit)) return checkOneLine(ns.map(n => Number((n as { v: string }).v)))
  if (isCh(ns[0], '[') && isCh(ns[ns.length - 1], ']')) return checkOneLine(readEntries(ns.slice(1, -1)))
  if (isCh(ns[0], '(')) {
    const cycles: number[][] = []
    let j = 0
    while (j < ns.length) {
      if (!isCh(ns[j], '(')) throw unreadablePermutation(ns, ctx)
      let k = j + 1
      while (k < ns.length && !isCh(ns[k], ')')) k++
      if (k >= ns.length) throw new ParseFail('unbalanced "(" in a permutation')
      cycles.push(readEntries(ns.slice(j + 1, k)))
      j = k + 1
    }
    if (cycles.length === 1) {
      const only = cycles[0]!
      const bound = ctx.bindings.get('n')
      const nOk = bound?.kind !== 'integer' || bound.value === only.length
      if (only.length >= 3 && isPermutationOfOneToN(only) && nOk) return { form: 'oneLine', entries: only }
    }
    const seen = new Set<number>()
    for (const c of cycles) {
      for (const v of c) {
        if (v < 1 || seen.has(v)) throw new ParseFail(`cycles ${describeNodes(ns)} repeat an entry or contain 0`)
        seen.add(v)
      }
    }
    return { form: 'cycles', cycles }
  }
  if (splitCommas(ns).length > 1) return checkOneLine(readEntries(ns))
  throw unreadablePermutation(ns, ctx)
}

/**
 * Why a subscript is no permutation: a macro the reader did not follow, a letter the text never
 * bound (`ws_i`, `wt_{ab}`: a general statement), or else plain unreadable notation.
 */
function unreadablePermutation(ns: MathNode[], ctx: ParseContext): ParseFail {
  const unread = findUnreadMacro(ns)
  if (unread) return new ParseFail(unreadMacroReason(unread))
  const letter = freeLetter(ns, ctx)
  if (letter) return new ParseFail(`${letter} is not bound (in the permutation ${describeNodes(ns)}): a general statement`)
  return new ParseFail(`cannot read ${describeNodes(ns)} as a permutation`)
}

function findUnreadMacro(nodes: MathNode[]): string | undefined {
  for (const n of nodes) {
    if (n.k === 'cs' && n.v.startsWith(UNREAD_MACRO_PREFIX)) return n.v.slice(UNREAD_MACRO_PREFIX.length)
    if (n.k === 'group' || n.k === 'env') {
      const inner = findUnreadMacro(n.children)
      if (inner) return inner
    }
  }
  return undefined
}

/** The first letter (Latin or Greek) in the nodes that the text has not bound, if any: `i` in `s_i`. */
function freeLetter(nodes: MathNode[], ctx: ParseContext): string | undefined {
  for (const n of nodes) {
    if (n.k === 'group' || n.k === 'env') {
      const inner = freeLetter(n.children, ctx)
      if (inner) return inner
      continue
    }
    const name = n.k === 'ch' && /^[A-Za-z]$/.test(n.v) ? n.v : n.k === 'cs' && GREEK_LETTERS.test(n.v) ? '\\' + n.v : undefined
    if (name && !ctx.bindings.has(name)) return name
  }
  return undefined
}

const GREEK_LETTERS = /^(alpha|beta|gamma|delta|epsilon|zeta|eta|theta|iota|kappa|lambda|mu|nu|xi|pi|rho|sigma|tau|upsilon|phi|chi|psi|omega)$/

const article = (word: string) => (/^[aeiou]/.test(word) ? 'an' : 'a')

function readEntries(nodes: MathNode[]): number[] {
  const items = splitCommas(nodes)
  if (items.length === 1) {
    // digits written together or with spacing: one entry each
    const only = unwrap(items[0]!)
    if (!only.length || !only.every(isDigit)) throw new ParseFail(`cannot read ${describeNodes(nodes)} as a list of numbers`)
    return only.map(n => Number((n as { v: string }).v))
  }
  return items.map((it) => {
    const v = readInteger(it)
    if (v === undefined) throw new ParseFail(`"${describeNodes(it)}" is not a number`)
    return v
  })
}

/** A list of numbers for a message, cut after 16 with the count of what was cut: `1,2,…(+14 more)`. */
function listForMessage(values: number[], sep: string, max = 16): string {
  if (values.length <= max) return values.join(sep)
  return `${values.slice(0, max).join(sep)}… (${values.length - max} more)`
}

function isPermutationOfOneToN(entries: number[]): boolean {
  const seen = new Set(entries)
  return seen.size === entries.length && entries.every(v => v >= 1 && v <= entries.length)
}

function checkOneLine(entries: number[]): PermutationSpec {
  if (!isPermutationOfOneToN(entries)) {
    // Digits written together are one entry each: 12345678910 is eleven entries, not ten.
    const hint = entries.length > 9 && entries.every(v => v <= 9) ? '; write entries of 10 or more with commas or in [ ]' : ''
    throw new ParseFail(`${listForMessage(entries, entries.some(v => v > 9) ? ',' : '')} is not a permutation of 1..${entries.length}${hint}`)
  }
  return { form: 'oneLine', entries }
}

/** Read a partition: `21`, `2,1`, `(2,1)`, `(2,1^2)`, a bound \lambda, or \emptyset. */
export function readPartition(nodes: MathNode[], ctx: ParseContext, used: Map<string, ContextValue>): Partition {
  let ns = unwrap(nodes)
  const diagram = readYoungDiagram(ns)
  if (diagram) return diagram
  const sym = lookupSymbol(ns, ctx)
  if (sym && !isDigit(ns[0])) {
    if (sym.value?.kind === 'partition') {
      used.set(sym.name, sym.value)
      return sym.value.parts
    }
    if (ns.length === 1 && (isCs(ns[0], 'emptyset') || isCs(ns[0], 'varnothing'))) return []
    if (sym.value) throw new ParseFail(`${sym.name} is bound to ${article(sym.value.kind)} ${sym.value.kind}, not a partition`)
    if (PARTITION_SYMBOLS.has(sym.name.replace(/'$/, ''))) throw new ParseFail(`partition ${sym.name} is not bound (write "Let $${sym.name} = (2,1)$" before the claim)`)
    throw new ParseFail(`${sym.name} is not bound (a partition is expected here)`)
  }
  if (isCh(ns[0], '(') && isCh(ns[ns.length - 1], ')')) ns = ns.slice(1, -1)
  let parts: number[]
  const items = splitCommas(ns)
  if (items.length === 1 && unwrap(items[0]!).every(isDigit)) {
    parts = unwrap(items[0]!).map(n => Number((n as { v: string }).v))
    if (parts.length > 1 && parts.includes(0)) throw new ParseFail(`${parts.join('')} is ambiguous as a partition; write parts of 10 or more with commas`)
  }
  else {
    parts = []
    for (const it of items) {
      const u = unwrap(it)
      const hat = u.findIndex(m => isCh(m, '^'))
      if (hat > 0) {
        const part = readInteger(u.slice(0, hat))
        const times = readInteger(u.slice(hat + 1))
        if (part === undefined || times === undefined) throw new ParseFail(`"${describeNodes(it)}" is not a part`)
        for (let r = 0; r < times; r++) parts.push(part)
      }
      else {
        const v = readInteger(u)
        const letter = v === undefined ? freeLetter(u, ctx) : undefined
        if (letter) throw new ParseFail(`${letter} is not bound (in the index ${describeNodes(nodes)}): a general statement`)
        if (v === undefined) throw new ParseFail(`"${describeNodes(it)}" is not a part of a partition`)
        parts.push(v)
      }
    }
  }
  while (parts.length && parts[parts.length - 1] === 0) parts.pop()
  for (let j = 0; j < parts.length; j++) {
    if (parts[j]! < 1 || (j > 0 && parts[j]! > parts[j - 1]!)) throw new ParseFail(`(${listForMessage(parts, ',')}) is not a partition (parts must be positive and weakly decreasing)`)
  }
  return parts
}

function readCoefficient(
  a: MathNode[],
  b: MathNode[],
  top: MathNode[],
  ctx: ParseContext,
  used: Map<string, ContextValue>,
): Expr {
  const tryRead = <T>(f: () => T): T | undefined => {
    try {
      return f()
    }
    catch (e) {
      if (e instanceof ParseFail) return undefined
      throw e
    }
  }
  const scratch = new Map<string, ContextValue>()
  const lambda = tryRead(() => readPartition(a, ctx, scratch))
  const mu = tryRead(() => readPartition(b, ctx, scratch))
  const nu = tryRead(() => readPartition(top, ctx, scratch))
  const size = (p: number[]) => p.reduce((s, v) => s + v, 0)
  const partitionsFit = lambda && mu && nu && size(nu) === size(lambda) + size(mu)
  if (partitionsFit) {
    for (const [k, v] of scratch) used.set(k, v)
    return { type: 'littlewoodRichardson', lambda, mu, nu }
  }
  const pu = tryRead(() => readPermutation(a, ctx, scratch))
  const pv = tryRead(() => readPermutation(b, ctx, scratch))
  const pw = tryRead(() => readPermutation(top, ctx, scratch))
  if (pu && pv && pw) {
    for (const [k, v] of scratch) used.set(k, v)
    return { type: 'structureConstant', u: pu, v: pv, w: pw }
  }
  if (lambda && mu && nu) {
    for (const [k, v] of scratch) used.set(k, v)
    return { type: 'littlewoodRichardson', lambda, mu, nu }
  }
  // Re-run one reader to surface its reason.
  readPermutation(a, ctx, new Map())
  readPermutation(b, ctx, new Map())
  readPermutation(top, ctx, new Map())
  throw new ParseFail('cannot read the indices of c as partitions or permutations')
}

/** If `nodes` is `symbol = …` with a bindable symbol, the symbol's name. */
export function bindableSymbol(nodes: MathNode[]): { name: string, family: 'permutation' | 'partition' | 'integer' } | undefined {
  const ns = unwrap(nodes)
  let name = symbolName(ns[0])
  if (!name) return undefined
  if (ns.length === 2 && isCh(ns[1], '\'')) name += '\''
  else if (ns.length !== 1) return undefined
  if (name === 'n' || name === 'k' || name === 'm') return { name, family: 'integer' }
  if (PARTITION_SYMBOLS.has(name)) return { name, family: 'partition' }
  const base = name.replace(/'$/, '')
  if (PERMUTATION_SYMBOLS.has(base) && base !== 'x' && base !== 'y' && base !== 'z') return { name, family: 'permutation' }
  return undefined
}

const OBJECT_LETTERS = new Set(['F', 's', 'e', 'h', 'm', 'p', 'c', 'K'])

/** True if the nodes mention an object the reader knows (even where it could not read the whole side). */
export function mentionsKnownObject(nodes: MathNode[], ctx: ParseContext): boolean {
  for (let j = 0; j < nodes.length; j++) {
    const n = nodes[j]!
    if (n.k === 'group' || n.k === 'env') {
      if (mentionsKnownObject(n.children, ctx)) return true
      continue
    }
    if (n.k === 'cs') {
      if (ctx.notation.has(n.v) || n.v === 'partial' || n.v === 'det') return true
      // ℓ is the length function only before its argument (a lone ℓ or λ_ℓ is a letter); \# counts
      // only a set Scholium knows (not \#\{ i : … \}).
      if (n.v === 'ell' && (isCh(nodes[j + 1], '(') || isCs(nodes[j + 1], 'left'))) return true
      if (n.v === '#' && countsKnownSet(nodes, j + 1)) return true
      if (n.v === 'mathfrak') {
        const arg = nodes[j + 1]
        const letter = arg ? plainText(childrenOf(arg)).trim() : ''
        const sub = isCh(nodes[j + 2], '_') ? nodes[j + 3] : undefined
        if (letter === 'S' && sub && isSymmetricGroupIndex(childrenOf(sub), ctx)) continue
        if (letter === 'S' || letter === 'G') return true
      }
      continue
    }
    if (OBJECT_LETTERS.has(n.v) && isCh(nodes[j + 1], '_')) {
      const sub = nodes[j + 2]
      const first = sub ? unwrap(childrenOf(sub))[0] : undefined
      // c_1 without a superscript is a letter (a part of a code), not c^ν_{λμ}; F_5 is a flag member.
      if (n.v === 'c' && !isCh(nodes[j + 3], '^')) continue
      if (n.v === 'F' && !(sub && isStanleyIndex(childrenOf(sub), ctx))) continue
      if (isDigit(first) || isCh(first, '(')) return true
    }
  }
  return false
}

/** True if the nodes from `j` name a set Scholium counts: `\mathrm{BPD}(w)`, `\Red(w)`, `PD(w)`. */
function countsKnownSet(nodes: MathNode[], j: number): boolean {
  const head = nodes[j]
  if (!head) return false
  if (head.k === 'cs' && NAME_COMMANDS.has(head.v) && nodes[j + 1]) return plainText(childrenOf(nodes[j + 1]!)).trim() in COUNT_NAMES
  let name = ''
  for (let k = j; nodes[k]?.k === 'ch' && /^[A-Za-z]$/.test((nodes[k] as { v: string }).v); k++) name += (nodes[k] as { v: string }).v
  return name in COUNT_NAMES
}
