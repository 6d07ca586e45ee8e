/**
 * Precision rules: equalities that look like claims but are settings, definitions, multiplicities,
 * products in the symmetric group or identities in unbound letters. A false alarm is the worst
 * defect, so each rule errs towards silence; what the reader could not understand goes to the
 * "not read" list instead of becoming an `unsupported` claim.
 */
import type { Expr } from '../types/claims'
import type { SideResult } from './expression'
import { containsObject, exprTypes } from './classify'
import { isChar, type MathNode } from './math-tree'
import { isUnreadMacroReason } from './macros'

/** What to do with one `lhs = rhs` step before any claim is made. */
export type StepJudgement =
  | { type: 'claim' }
  /** Not an assertion at all (a setting, a definition, a count in prose). */
  | { type: 'silent' }
  /** Possibly an assertion, but the reader cannot be sure what it says. */
  | { type: 'notRead'; reason: string }
  /** An assertion about a known object that Scholium cannot check. */
  | { type: 'unsupported'; reason: string }

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
  const letter = (head.k === 'ch' && /^[a-zA-Z]$/.test(head.v)) || (head.k === 'cs' && GREEK.test(head.v))
  if (!letter) return false
  for (let i = 1; i < nodes.length; i += 2) {
    if (!(isChar(nodes[i], '_') || isChar(nodes[i], '^')) || !nodes[i + 1]) return false
  }
  return true
}

const GREEK = /^(alpha|beta|gamma|delta|epsilon|varepsilon|zeta|eta|theta|iota|kappa|lambda|mu|nu|xi|pi|rho|sigma|tau|upsilon|phi|varphi|chi|psi|omega|Gamma|Delta|Theta|Lambda|Xi|Pi|Sigma|Phi|Psi|Omega)$/

/** A product of s_k with one-part indices and no sum: a word in simple transpositions (`s_2s_1`). */
function isTranspositionWord(e: Expr): boolean {
  const factors = e.type === 'multiply' ? e.factors : [e]
  return factors.every(f => {
    const base = f.type === 'power' ? f.base : f
    return (base.type === 'symmetric' && base.family === 'schur' && base.index.length === 1)
      || (base.type === 'schubertClass' && base.partition.length === 1)
  })
}

const factorCount = (e: Expr) => (e.type === 'multiply' ? e.factors.length : e.type === 'power' ? e.exponent : 1)
const isOne = (e: Expr) => e.type === 'integer' && e.value === '1'

/**
 * `s_2s_1s_2 = s_1s_2s_1`, `s_1^2 = 1`: relations between words in simple transpositions. Read as
 * Schur functions they would be false alarms; `s_1 s_1 = s_2` (one factor on a side) stays a claim.
 */
function isGroupWordEquation(lhs: Expr, rhs: Expr): boolean {
  if (isTranspositionWord(lhs) && isTranspositionWord(rhs)) return factorCount(lhs) >= 2 && factorCount(rhs) >= 2
  return (isTranspositionWord(lhs) && factorCount(lhs) >= 2 && isOne(rhs)) || (isTranspositionWord(rhs) && factorCount(rhs) >= 2 && isOne(lhs))
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

/** Commands and environments that draw a filled tableau (not just a shape). */
const DRAWN_TABLEAU = new Set(['ytableaushort', 'young', 'youngtab', 'Young', 'tableau'])

/** True if a tableau is drawn in the nodes: `s_{\ytableaushort{12,3}}`, `\begin{ytableau}…`. */
function containsDrawnTableau(nodes: MathNode[]): boolean {
  return nodes.some(n =>
    (n.k === 'cs' && DRAWN_TABLEAU.has(n.v)) ||
    (n.k === 'env' && (n.name === 'ytableau' || containsDrawnTableau(n.children))) ||
    (n.k === 'group' && containsDrawnTableau(n.children)))
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
  if (hasCycleFactor(step.lhsNodes) || hasCycleFactor(step.rhsNodes)) return { type: 'notRead', reason: 'a product of permutations in the symmetric group' }
  if (l.ok && r.ok) {
    if (isGroupWordEquation(l.expr, r.expr)) {
      return { type: 'notRead', reason: 'a word in simple transpositions s_i (a product in the group), not Schur functions' }
    }
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
  const recognised = failures.find(f => f.recognised)
  if (recognised) return { type: 'unsupported', reason: recognised.reason }
  return { type: 'notRead', reason: shortReason(failures[0]!.reason) }
}

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
