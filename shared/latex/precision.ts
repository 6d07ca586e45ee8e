/**
 * Precision rules: equalities that look like claims but are settings, definitions, multiplicities,
 * products in the symmetric group or identities in unbound letters. A false alarm is the worst
 * defect, so each rule errs towards silence; what the reader could not understand goes to the
 * "not read" list instead of becoming an `unsupported` claim.
 */
import type { Expr } from '../types/claims'
import type { SideResult } from './expression'
import { containsObject, exprTypes } from './classify'
import { isChar, renderNodes, type MathNode } from './math-tree'
import { isUnreadMacroReason } from './macros'

/** What to do with one `lhs = rhs` step before any claim is made. */
export type StepJudgement
  = | { type: 'claim' }
  /** Not an assertion at all (a setting, a definition, a count in prose). */
    | { type: 'silent' }
  /** Possibly an assertion, but the reader cannot be sure what it says. */
    | { type: 'notRead', reason: string }
  /** An assertion about a known object that Scholium cannot check. */
    | { type: 'unsupported', reason: string }

/** Words right before inline math that make it a setting or a definition ("Setting $x_2=-y_2$"). */
const DEFINING_LEAD_IN = /(?:^|[^a-z])(let|letting|set|setting|put|putting|write|writes|written|denote|denotes|denoting|define|defines|defining|substitute|substituting|substitution|specialize|specializing|specialise|specialising|specialization|take|taking|with|where|assume|assuming|suppose|fix|fixing|given|choose|choosing|if|when|whenever|for|at|evaluate|evaluating|plug|plugging|replace|replacing)(?:\s+(?:that|again|now|instead|in|by))?\s*$/i

/**
 * The last words of prose before `pos` (back to the previous math, paragraph or sentence end),
 * lower-cased: `proseBefore('Setting $x$', 8) === 'setting '`.
 */
export function proseBefore(masked: string, pos: number): string {
  const from = Math.max(0, pos - 60)
  let text = masked.slice(from, pos)
  const cut = Math.max(text.lastIndexOf('$'), text.lastIndexOf('\n\n'), text.lastIndexOf('\\]'), text.lastIndexOf('\\)'))
  if (cut >= 0) text = text.slice(cut + 1)
  return text.replace(/\\[a-zA-Z]+\*?/g, ' ').replace(/[{}~]/g, ' ')
}

/** True if the prose before inline math introduces a setting or a definition. */
export function isDefiningLeadIn(prose: string): boolean {
  return DEFINING_LEAD_IN.test(prose)
}

/**
 * Notation a notation reader declines on purpose (`\ydiagram{1,3}`: English or French order
 * unclear; `\ydiagram{1+2,3}`): its message says "left unread" or "is not read". Not read.
 */
export function isDeliberatelyUnread(reason: string): boolean {
  return /\b(left unread|is not read)\b/.test(reason)
}

/** Unbound letters (λ, w) make a general identity, not an example: never a verdict. */
export function isUnboundReason(reason: string): boolean {
  return / is not bound\b/.test(reason)
}

/** q counts as a variable here: "put $q = 0$" in a QH* section is a setting. */
const isLoneVariable = (e: Expr) => e.type === 'variable' || e.type === 'quantumParameter'

/** `x_2 = -y_2`, `q = 0`: one side a lone variable and the other without objects is a substitution. */
function isSubstitution(lhs: Expr, rhs: Expr): boolean {
  return (isLoneVariable(lhs) && !containsObject(rhs)) || (isLoneVariable(rhs) && !containsObject(lhs))
}

/** `m_3 = 1`: a symmetric function of positive degree set equal to a number is a multiplicity or a count. */
function isSymmetricEqualToNumber(lhs: Expr, rhs: Expr): boolean {
  const constantSymmetric = (a: Expr, b: Expr) =>
    a.type === 'symmetric' && a.variableCount === undefined && a.index.some(p => p > 0) && (b.type === 'integer' || (b.type === 'negate' && b.arg.type === 'integer'))
  return constantSymmetric(lhs, rhs) || constantSymmetric(rhs, lhs)
}

/** `c`, `m_3`, `q_3`, `c^{\nu}_{\lambda\mu}`, `\lambda`: a letter with indices, the thing a setting names. */
export function isLoneSymbol(nodes: MathNode[]): boolean {
  const head = nodes[0]
  if (!head) return false
  const letter = (head.k === 'ch' && /^[a-zA-Z]$/.test(head.v)) || (head.k === 'cs' && (GREEK.test(head.v) || head.v === 'ell'))
  if (!letter) return false
  // A prime right after the letter (λ'_j, w') belongs to its name.
  const from = isChar(nodes[1], '\'') ? 2 : 1
  for (let i = from; i < nodes.length; i += 2) {
    if (!(isChar(nodes[i], '_') || isChar(nodes[i], '^')) || !nodes[i + 1]) return false
  }
  return true
}

const GREEK = /^(alpha|beta|gamma|delta|epsilon|varepsilon|zeta|eta|theta|iota|kappa|lambda|mu|nu|xi|pi|rho|sigma|tau|upsilon|phi|varphi|chi|psi|omega|Gamma|Delta|Theta|Lambda|Xi|Pi|Sigma|Phi|Psi|Omega)$/

/**
 * A product of s_k with one-part indices and no sum: a word in simple transpositions (`s_2s_1`),
 * with powers of letters and of bracketed words (`(s_1s_2)^3`).
 */
function isTranspositionWord(e: Expr): boolean {
  if (e.type === 'multiply') return e.factors.every(isTranspositionWord)
  if (e.type === 'power') return isTranspositionWord(e.base)
  return (e.type === 'symmetric' && e.family === 'schur' && e.index.length === 1 && e.variableCount === undefined && !e.skew)
    || (e.type === 'schubertClass' && e.partition.length === 1)
}

/** Letters in a word: `(s_1s_2)^3` has six. */
const factorCount = (e: Expr): number =>
  e.type === 'multiply' ? e.factors.reduce((n, f) => n + factorCount(f), 0) : e.type === 'power' ? e.exponent * factorCount(e.base) : 1
const isOne = (e: Expr) => e.type === 'integer' && e.value === '1'

/**
 * `s_2s_1s_2 = s_1s_2s_1`, `s_1^2 = 1`, `(s_1s_2)^3 = 1`: relations between words in simple
 * transpositions. Read as Schur functions they would be false alarms; `s_1 s_1 = s_2` (one
 * factor on a side) stays a claim.
 */
function isGroupWordEquation(lhs: Expr, rhs: Expr): boolean {
  if (isTranspositionWord(lhs) && isTranspositionWord(rhs)) return factorCount(lhs) >= 2 && factorCount(rhs) >= 2
  return (isTranspositionWord(lhs) && factorCount(lhs) >= 2 && isOne(rhs)) || (isTranspositionWord(rhs) && factorCount(rhs) >= 2 && isOne(lhs))
}

/** `e`, `1`, `\mathrm{id}`, `\operatorname{Id}`, `\mathrm{e}`: the identity element of a group. */
function isIdentityElement(nodes: MathNode[]): boolean {
  if (nodes.length === 1) {
    const n = nodes[0]!
    if (n.k === 'ch') return n.v === 'e' || n.v === '1'
    if (n.k === 'cs') return n.v === 'id' || n.v === 'Id'
    if (n.k === 'group') return isIdentityElement(n.children)
    return false
  }
  if (nodes.length === 2 && nodes[0]!.k === 'cs' && /^(mathrm|operatorname|text|textrm|mathit|mathbf)$/.test(nodes[0]!.v)) {
    const arg = nodes[1]!
    const text = arg.k === 'group' ? arg.children.map(c => (c.k === 'ch' ? c.v : '?')).join('') : arg.k === 'ch' ? arg.v : '?'
    return /^(id|Id|e|1)$/.test(text)
  }
  return false
}

/** A word in simple transpositions set equal to the identity (`(s_1s_2)^3 = e`, `s_1^2 = \mathrm{id}`). */
function isWordEqualToIdentity(word: SideResult, other: MathNode[]): boolean {
  return word.ok && isTranspositionWord(word.expr) && factorCount(word.expr) >= 2 && isIdentityElement(other)
}

/** Cycle notation `(132)` as a factor at the top of a side (not an argument `f(132)` or an index). */
function hasCycleFactor(nodes: MathNode[]): boolean {
  for (let i = 0; i < nodes.length; i++) {
    if (!isChar(nodes[i], '(')) continue
    const before = nodes[i - 1]
    if (before && !isChar(before, ')')) continue
    let j = i + 1
    while (j < nodes.length && nodes[j]!.k === 'ch' && /^\d$/.test((nodes[j] as { v: string }).v)) j++
    if (j - i - 1 >= 2 && isChar(nodes[j], ')') && (i > 0 || j + 1 < nodes.length)) return true
  }
  return false
}

/** A whole side in cycle notation, `(1\,3)`, `(132)`: a permutation, never the number 13 or 132. */
function isLoneCycle(nodes: MathNode[]): boolean {
  if (nodes.length < 4 || !isChar(nodes[0], '(') || !isChar(nodes[nodes.length - 1], ')')) return false
  return nodes.slice(1, -1).every(n => n.k === 'ch' && /^\d$/.test(n.v))
}

/** Commands and environments that draw a filled tableau (not just a shape). */
const DRAWN_TABLEAU = new Set(['ytableaushort', 'young', 'youngtab', 'Young', 'tableau'])

/** True if a tableau is drawn in the nodes: `s_{\ytableaushort{12,3}}`, `\begin{ytableau}…`. */
function containsDrawnTableau(nodes: MathNode[]): boolean {
  return nodes.some(n =>
    (n.k === 'cs' && DRAWN_TABLEAU.has(n.v))
    || (n.k === 'env' && (n.name === 'ytableau' || containsDrawnTableau(n.children)))
    || (n.k === 'group' && containsDrawnTableau(n.children)))
}

/** Set-builder braces (`\{`, `\}`, `\lbrace`, `\rbrace`) and the angle brackets of generators (`\langle s_1, s_2 \rangle`). */
const isSetOpen = (n: MathNode) => n.k === 'cs' && (n.v === '{' || n.v === 'lbrace' || n.v === 'langle')
const isSetClose = (n: MathNode) => n.k === 'cs' && (n.v === '}' || n.v === 'rbrace' || n.v === 'rangle')

/**
 * A side cut out of a set `\{ w \in S_n : \ell(w) = k \}` (or out of `\langle s_1, s_2 \rangle`
 * at a comma): a set brace that does not close on the same side. The equation is a condition on
 * the members of a set, or part of a list of generators, not a claim.
 */
function isInsideSet(lhsNodes: MathNode[], rhsNodes: MathNode[]): boolean {
  const balance = (nodes: MathNode[]) => {
    let depth = 0
    let min = 0
    for (const n of nodes) {
      if (isSetOpen(n)) depth++
      else if (isSetClose(n)) min = Math.min(min, --depth)
    }
    return { depth, min }
  }
  const unbalanced = (b: { depth: number, min: number }) => b.depth !== 0 || b.min < 0
  return unbalanced(balance(lhsNodes)) || unbalanced(balance(rhsNodes))
}

/** A side that is a tuple `(c_1, \dots, c_n)`, `\left(a, b\right)`: a sequence, not a value. */
function isTuple(nodes: MathNode[]): boolean {
  let inner: MathNode[]
  if (isChar(nodes[0], '(') && isChar(nodes[nodes.length - 1], ')')) inner = nodes.slice(1, -1)
  else if (nodes[0]?.k === 'cs' && nodes[0].v === 'left' && isChar(nodes[1], '(') && nodes[nodes.length - 2]?.k === 'cs' && (nodes[nodes.length - 2] as { v: string }).v === 'right') inner = nodes.slice(2, -2)
  else return false
  let depth = 0
  let comma = false
  for (const n of inner) {
    if (isChar(n, '(') || isChar(n, '[')) depth++
    else if (isChar(n, ')') || isChar(n, ']')) {
      // `(a)(b)`: the first parenthesis closes before the end, so the side is no single tuple.
      if (--depth < 0) return false
    }
    else if (depth === 0 && isChar(n, ',')) comma = true
  }
  return comma && depth === 0
}

/**
 * Around a math region: the letters its sentence makes general ("for every $w$", "$w \\mapsto
 * w^{-1}$", "$\\forall w$"), whose bindings then do not apply; whether the paragraph is about a
 * group (S_n, transpositions, Coxeter or braid relations) or plainly about Schur functions; and
 * whether the sentence first gives variables values. Each is read from the masked text (comments
 * and code blanked) only when a rule asks, since most regions need none of them.
 */
export interface Surroundings {
  readonly generalLetters: ReadonlySet<string>
  readonly topic: 'group' | 'schur' | undefined
  /** The sentence sets variables to values first ("Using $x_1 = 1, x_2 = 2$ we get …"). */
  /** The variables the sentence gives values before the math (`x_3 = 0` gives "x_3"), empty when none. */
  readonly substituted: ReadonlySet<string>
}

export const NO_SURROUNDINGS: Surroundings = { generalLetters: new Set(), topic: undefined, substituted: new Set() }

/** `$x_1 = 1`, `x_{2} = -y_2`, `, x_3 = 0`: a variable given a value in the math of a sentence. */
const VARIABLE_SET = /(?:^|[$,;\s(])([xy])_\{?([0-9a-z])\}?\s*=\s*(?:-\s*)?(?:\d|[xy]_)/g
const QUANTIFIED = /(?:\bfor\s+(?:all|every|each|any)\s*\$\s*|\\forall\s*)([a-zA-Z]|\\[a-zA-Z]+)(?![a-zA-Z])/gi
const MAPPED = /(?:^|[^\\a-zA-Z])([a-zA-Z]|\\[a-zA-Z]+)\s*\\mapsto/g
const GROUP_WORDS = /\b(groups?|transpositions?|coxeter|braid|reflections?|generators?|relations?|permutations?|reduced words?|weyl)\b|\bS_\{?[0-9n]|\\mathfrak\{?S\}?_\{?[n0-9]\}?\b/i
const SCHUR_WORDS = /\bschur\b|\bsymmetric functions?\b/i

/** The surroundings of the region starting at `pos`: the sentence and the paragraph before it. */
export function surroundingsOf(masked: string, pos: number): Surroundings {
  let paragraphText: string | undefined
  let sentenceText: string | undefined
  const paragraph = () => {
    if (paragraphText === undefined) {
      paragraphText = masked.slice(Math.max(0, pos - 600), pos)
      const par = paragraphText.lastIndexOf('\n\n')
      if (par >= 0) paragraphText = paragraphText.slice(par + 2)
    }
    return paragraphText
  }
  // The sentence: back to the last full stop followed by a space (math rarely holds one).
  const sentence = () => {
    if (sentenceText === undefined) {
      const text = paragraph()
      const stop = Math.max(text.lastIndexOf('. '), text.lastIndexOf('.\n'))
      sentenceText = stop >= 0 ? text.slice(stop + 2) : text
    }
    return sentenceText
  }
  let letters: Set<string> | undefined
  let topic: { value: 'group' | 'schur' | undefined } | undefined
  let substituted: Set<string> | undefined
  return {
    get generalLetters() {
      if (!letters) {
        letters = new Set<string>()
        const text = sentence()
        if (text.includes('mapsto') || /for|forall/i.test(text)) {
          for (const m of text.matchAll(QUANTIFIED)) letters.add(m[1]!)
          for (const m of text.matchAll(MAPPED)) letters.add(m[1]!)
        }
      }
      return letters
    },
    get topic() {
      topic ??= { value: GROUP_WORDS.test(paragraph()) ? 'group' : SCHUR_WORDS.test(paragraph()) ? 'schur' : undefined }
      return topic.value
    },
    get substituted() {
      substituted ??= new Set([...sentence().matchAll(VARIABLE_SET)].map(m => `${m[1]}_${m[2]}`))
      return substituted
    },
  }
}

/**
 * Whether a substitution earlier in the sentence can change the claim. Only a claim that lists its
 * variables, `e_3(x_1,x_2) = 0` after "Setting $x_3 = 0$", and names none of the substituted ones
 * is untouched; one with no argument list (`\mathfrak{S}_{132} = 3`) lives in every variable.
 */
function touchedBySubstitution(step: StepToJudge, substituted: ReadonlySet<string>): boolean {
  if (substituted.size === 0) return false
  const text = renderNodes([...step.lhsNodes, ...step.rhsNodes]).replace(/[{}\s]/g, '')
  if (!/\((?:[a-z]_|[a-z][,;|)])/.test(text)) return true
  return [...substituted].some(variable => text.includes(variable))
}

export interface StepToJudge {
  lhs: SideResult
  rhs: SideResult
  lhsNodes: MathNode[]
  rhsNodes: MathNode[]
  /** Set when the prose before the math introduces a setting or definition. */
  definingLeadIn: boolean
  /** A later step of a chain already about an object: plain numbers still belong to it. */
  inObjectChain: boolean
  /** What the sentence and paragraph around the step say (general letters, group or Schur topic). */
  surroundings?: Surroundings
}

/**
 * Decide whether `lhs = rhs` is a claim. Example: `judgeStep` of `x_2 = -y_2` is silent,
 * of `s_\lambda s_\mu = \sum …` with λ unbound is not read, of `\mathfrak{S}_{132} = x_1+x_2` a claim.
 */
export function judgeStep(step: StepToJudge): StepJudgement {
  const { lhs: l, rhs: r } = step
  if (step.definingLeadIn && isLoneSymbol(step.lhsNodes)) return { type: 'silent' }
  if (containsDrawnTableau(step.lhsNodes) || containsDrawnTableau(step.rhsNodes)) {
    return { type: 'notRead', reason: 'a tableau drawn with \\ytableaushort or \\young is not read; only \\ydiagram shapes are' }
  }
  if (hasCycleFactor(step.lhsNodes) || hasCycleFactor(step.rhsNodes) || isLoneCycle(step.lhsNodes) || isLoneCycle(step.rhsNodes)) return { type: 'notRead', reason: 'a product of permutations in the symmetric group' }
  if (isInsideSet(step.lhsNodes, step.rhsNodes)) return { type: 'notRead', reason: 'a condition inside a set {… : …} or a part of ⟨…⟩, not a claim' }
  if (isTuple(step.lhsNodes) || isTuple(step.rhsNodes)) return { type: 'notRead', reason: 'a tuple (…, …) is a sequence of values, not an object Scholium checks' }
  const surroundings = step.surroundings ?? NO_SURROUNDINGS
  const general = l.used.size || r.used.size ? [...l.used.keys(), ...r.used.keys()].find(name => surroundings.generalLetters.has(name)) : undefined
  if (general) return { type: 'notRead', reason: `${general} stands for any ${general} in this sentence (for every ${general}, ${general} ↦ …): a general statement, not the bound example` }
  // After "Using $x_1 = 1$" in the same sentence, an object set equal to a value is evaluated there.
  if (((l.ok && containsObject(l.expr)) || (r.ok && containsObject(r.expr))) && touchedBySubstitution(step, surroundings.substituted)) {
    return { type: 'notRead', reason: 'the sentence first gives the variables values (x_i = …): the claim holds under that substitution, which is not read' }
  }
  // A word in the s_i is a product in the symmetric group unless the paragraph plainly speaks of Schur functions.
  const groupWords = () => surroundings.topic !== 'schur'
  if ((isWordEqualToIdentity(l, step.rhsNodes) || isWordEqualToIdentity(r, step.lhsNodes)) && groupWords()) {
    return { type: 'notRead', reason: GROUP_WORD_REASON }
  }
  if (l.ok && r.ok) {
    if (isGroupWordEquation(l.expr, r.expr) && groupWords()) return { type: 'notRead', reason: GROUP_WORD_REASON }
    if (isSubstitution(l.expr, r.expr)) return { type: 'silent' }
    if (isSymmetricEqualToNumber(l.expr, r.expr)) return { type: 'silent' }
    if (containsObject(l.expr) || containsObject(r.expr)) return { type: 'claim' }
    const hasVariable = exprTypes(l.expr).has('variable') || exprTypes(r.expr).has('variable')
    const atomic = (e: Expr) => e.type === 'variable' || e.type === 'integer'
    if (hasVariable && (!atomic(l.expr) || !atomic(r.expr))) return { type: 'claim' }
    if (step.inObjectChain) return { type: 'claim' }
    return { type: 'silent' }
  }
  const failures = [l, r].filter((s): s is Extract<SideResult, { ok: false }> => !s.ok)
  const unreadMacro = failures.find(f => isUnreadMacroReason(f.reason) || isDeliberatelyUnread(f.reason))
  if (unreadMacro) return { type: 'notRead', reason: unreadMacro.reason }
  // `0 = F_0 \subset F_1`: an index 0 is no permutation; F_0, V_0 name the members of a flag.
  if (failures.some(f => /^0 is not a permutation\b/.test(f.reason))) {
    return { type: 'notRead', reason: 'an index 0 is not a permutation: a name such as F_0 in a flag or a sequence, not an object' }
  }
  const unbound = failures.find(f => isUnboundReason(f.reason))
  if (unbound) return { type: 'notRead', reason: unboundReason(unbound.reason) }
  // `\ell(\lambda)` with λ a partition, `\mathfrak{S}_\mu`: the paper's own notation for another object.
  const otherKind = failures.find(f => / is bound to an? \w+, not an? \w+$/.test(f.reason))
  if (otherKind) return { type: 'notRead', reason: `${otherKind.reason}: another notation, not read` }
  if (l.ok !== r.ok) {
    const good = (l.ok ? l : r) as Extract<SideResult, { ok: true }>
    const bad = failures[0]!
    if (bad.recognised) return { type: 'unsupported', reason: bad.reason }
    if (good.expr.type === 'variable') return { type: 'silent' }
    if (containsObject(good.expr) || exprTypes(good.expr).has('variable')) return { type: 'notRead', reason: shortReason(bad.reason) }
    return { type: 'silent' }
  }
  // `M = N - \ell(w)`, `F_5 = \mathbb{C}^5`: a letter the reader does not know, set equal to
  // something it cannot read either, is being named or defined, even if the other side mentions ℓ(w).
  const named = !l.ok && !l.recognised && isLoneSymbol(step.lhsNodes) ? l : !r.ok && !r.recognised && isLoneSymbol(step.rhsNodes) ? r : undefined
  if (named && !named.ok) return { type: 'notRead', reason: `${named.reason}: a letter named or defined here, not an object` }
  const recognised = failures.find(f => f.recognised)
  if (recognised) return { type: 'unsupported', reason: recognised.reason }
  return { type: 'notRead', reason: shortReason(failures[0]!.reason) }
}

const GROUP_WORD_REASON = 'a word in simple transpositions s_i (a product in the group), not Schur functions'

/**
 * The not-read reason for an unbound letter, keeping the advice that fits it: `w is not bound
 * here: a general statement, not an example (to check one, write "Let $w = 2143$" first)`.
 */
function unboundReason(reason: string): string {
  const name = /(\S+) is not bound/.exec(reason)![1]
  const advice = /\(write (.*)\)[^)]*$/.exec(reason)?.[1]?.replace(/ before the claim$/, '')
  const base = `${name} is not bound here: a general statement, not an example`
  return advice ? `${base} (to check one, write ${advice} first)` : base
}

/** Cut a message to about 200 characters. */
export function shortReason(reason: string, max = 200): string {
  return reason.length <= max ? reason : reason.slice(0, max - 1).trimEnd() + '…'
}
