/**
 * Claims found in a manuscript: the questions the reader hands to the check pipeline.
 *
 * Conventions of this module:
 * - A claim is a question, never an answer: the reader does not compute anything.
 * - Lines and columns are 1-based and refer to the original file (before macro expansion).
 * - Integers in expressions are decimal strings, so that no coefficient loses precision in JSON.
 * - Permutations are `PermutationSpec`s in exactly the shapes the pipeline maps to the engine;
 *   partitions are `number[]` (weakly decreasing positive parts, `[]` for the empty partition).
 */
import type { ConventionId } from './conventions'

/** A permutation as written in the manuscript, e.g. `{ form: 'oneLine', entries: [2, 1, 4, 3] }`. */
export type PermutationSpec
  = | { form: 'oneLine', entries: number[] }
    | { form: 'cycles', cycles: number[][] }
    | { form: 'word', letters: number[] }
    | { form: 'longest', n: number }

/** A partition, largest part first, e.g. `[2, 1]`. */
export type Partition = number[]

/** Which variables a Schubert-type object is written in: `x` alone, or `x` and `y` (double). */
export type SchubertVariant = 'single' | 'double'

/** Families of symmetric functions written with a one-letter name. */
export type SymmetricFamily = 'schur' | 'elementary' | 'complete' | 'monomial' | 'powerSum'

/** Combinatorial objects whose number the manuscript states. */
export type CountedObject = 'bumplessPipeDreams' | 'pipeDreams' | 'reducedWords'

/**
 * An expression the pipeline evaluates with the engine.
 * Example: `x_1^2 - y_1` is
 * `{ type: 'add', terms: [{ type: 'power', base: {type:'variable',name:'x',index:1}, exponent: 2 }, { type: 'negate', arg: {type:'variable',name:'y',index:1} }] }`.
 */
export type Expr
  = | { type: 'integer', value: string }
    | { type: 'variable', name: 'x' | 'y', index: number }
    | { type: 'add', terms: Expr[] }
    | { type: 'negate', arg: Expr }
    | { type: 'multiply', factors: Expr[] }
    | { type: 'power', base: Expr, exponent: number }
  /** \mathfrak S_w (single) or \mathfrak S_w(x;y) (double). */
  /** `negatedY`: written S_w(x;-y), the double polynomial with every y_j replaced by −y_j. */
    | { type: 'schubert', perm: PermutationSpec, variant: SchubertVariant, negatedY?: true }
  /** \mathfrak G_w, single or double. */
    | { type: 'grothendieck', perm: PermutationSpec, variant: SchubertVariant }
  /** Stanley symmetric function F_w. */
    | { type: 'stanley', perm: PermutationSpec }
  /**
   * s_λ, e_k, h_k, m_λ, p_k. `index` is the partition (for e, h, p a one-part partition [k]).
   * `variableCount` is n when written in x_1, …, x_n; absent for symmetric functions in infinitely many variables.
   * `skew` is μ in a skew Schur function s_{λ/μ} (family 'schur' only; λ is `index`).
   */
    | { type: 'symmetric', family: SymmetricFamily, index: Partition, variableCount?: number, skew?: Partition }
  /** Divided difference ∂_i applied to `arg`. */
    | { type: 'dividedDifference', index: number, arg: Expr }
  /** Determinant of a square matrix of expressions, listed row by row. */
    | { type: 'determinant', rows: Expr[][] }
  /** `arg` with every x_i set to 1 (and every y_j to 0 for a double object), e.g. \mathfrak S_w(1,…,1). */
    | { type: 'evaluateAtOnes', arg: Expr, variableCount?: number }
  /** Coxeter length ℓ(w), the number of inversions. */
    | { type: 'length', perm: PermutationSpec }
  /** #BPD(w), #PD(w), #Red(w). */
    | { type: 'count', objects: CountedObject, perm: PermutationSpec }
  /** Schubert structure constant c_{u,v}^w: coefficient of S_w in S_u S_v. */
    | { type: 'structureConstant', u: PermutationSpec, v: PermutationSpec, w: PermutationSpec }
  /** Littlewood–Richardson coefficient c^ν_{λ,μ}: coefficient of s_ν in s_λ s_μ. */
    | { type: 'littlewoodRichardson', lambda: Partition, mu: Partition, nu: Partition }
  /** Kostka number K_{λμ}: number of semistandard tableaux of shape λ and content μ. */
    | { type: 'kostka', shape: Partition, content: Partition }
  /**
   * The Schubert class σ_λ in H*(Gr(k,n)) or QH*(Gr(k,n)) of the claim's `setting`. `partition`
   * is λ as written; it may leave the k × (n − k) box (then the class is 0, and a claim that
   * writes it is told so).
   */
    | { type: 'schubertClass', partition: Partition }
  /** The quantum parameter q of QH*(Gr(k,n)) (deg q = n). */
    | { type: 'quantumParameter' }
  /** ∫_{Gr(k,n)} of a class: its coefficient of the point class. `space` is set when written as a subscript. */
    | { type: 'integral', arg: Expr, space?: GrassmannianSpace }
  /** deg Gr(k,n): the degree of the Grassmannian in its Plücker embedding, ∫σ_1^{k(n−k)}. */
    | { type: 'grassmannianDegree', space: GrassmannianSpace }
  /** a ⊗ b of two symmetric functions (written `s_2\otimes s_1`), an element of Λ ⊗ Λ. */
    | { type: 'tensor', left: Expr, right: Expr }
  /** Δ(f): the coproduct of a symmetric function, Δ(s_λ) = Σ c^λ_{μν} s_μ ⊗ s_ν. */
    | { type: 'coproduct', arg: Expr }
  /**
   * A formal parameter of the coefficient ring (shared/math/parameter-ring.ts): `beta` in a
   * K-theory claim, or a letter the paper declares with a `parameters` tag (`q`, `t`, `gamma`).
   */
    | { type: 'parameter', name: string }
  /** `a \oplus b` = a + b + βab and `a \ominus b` = (a − b)/(1 + βb), β formal (shared/math/double-grothendieck.ts). */
    | { type: 'formalGroup', op: 'oplus' | 'ominus', left: Expr, right: Expr }
  /** `arg` with a parameter given a value, written `…|_{\beta=0}`; `value` is a decimal integer. */
    | { type: 'specialise', arg: Expr, parameter: string, value: string }
  /** Key polynomial κ_α (`key`) or Demazure atom A_α (`atom`) of a weak composition α. */
    | { type: 'keyPolynomial', family: 'key' | 'atom', composition: number[] }
  /**
   * Back-stable Schubert polynomial ←S_w (`\overleftarrow{\mathfrak{S}}_w`), single or double
   * (factors x − y): symmetric in x_0, x_{−1}, … (and y_0, y_{−1}, …) times a polynomial in x_1, x_2, ….
   */
    | { type: 'backStable', perm: PermutationSpec, variant: SchubertVariant }
  /** A symmetric function without variables (`arg`) taken in the non-positive variables x_0, x_{−1}, … (or y_0, y_{−1}, …). */
    | { type: 'nonPositive', set: 'x' | 'y', arg: Expr }
  /**
   * "`arg` is supersymmetric in x_1..x_k; y_1..y_k", stated by the text (notation/supersymmetry.ts):
   * the left side of a claim whose right side is the integer 1 (the statement holds).
   */
    | { type: 'supersymmetric', arg: Expr, k: number }

/** The Grassmannian Gr(k, n) of k-planes in ℂ^n, as named in the text (1 ≤ k ≤ n − 1). */
export interface GrassmannianSpace {
  k: number
  n: number
}

/**
 * Where σ_λ lives, set by the text ("in $H^*(\mathrm{Gr}(2,4))$", "$X = \mathrm{Gr}(3,7)$",
 * "$QH^*(\mathrm{Gr}(2,5))$") or a tag (`scholium: in Gr(2,4)`): classical cohomology or quantum
 * cohomology of Gr(k,n).
 */
export interface GrassmannianSetting extends GrassmannianSpace {
  ring: 'cohomology' | 'quantum'
  /** The letter the text gave the space ("$X = \mathrm{Gr}(3,7)$"), so that ∫_X can be read. */
  name?: string
}

/** The question a claim asks: is `lhs` equal to `rhs`? */
export interface EqualityQuestion {
  type: 'equality'
  lhs: Expr
  rhs: Expr
  /** Set when the claim is about classes of a Grassmannian: both sides are evaluated in that ring. */
  setting?: GrassmannianSetting
}

export type ClaimQuestion = EqualityQuestion

/** What a claim is about; the main object decides (see shared/latex/classify). */
export type ClaimKind
  = | 'schubert'
    | 'grothendieck'
    | 'stanley'
    | 'symmetricFunction'
    | 'polynomial'
    | 'dividedDifference'
    | 'determinant'
    | 'specialization'
    | 'length'
    | 'count'
    | 'structureConstant'
    | 'littlewoodRichardson'
    | 'kostka'
    | 'key'
    | 'backStable'
    | 'supersymmetry'
    | 'grassmannian'
    | 'quantumGrassmannian'
    | 'coproduct'
    | 'unknown'

export const CLAIM_KINDS: readonly ClaimKind[] = [
  'schubert', 'grothendieck', 'stanley', 'symmetricFunction', 'polynomial', 'dividedDifference',
  'determinant', 'specialization', 'length', 'count', 'structureConstant', 'littlewoodRichardson',
  'kostka', 'key', 'backStable', 'supersymmetry', 'grassmannian', 'quantumGrassmannian', 'coproduct', 'unknown',
]

/**
 * - `ready`: the question is complete and can be checked.
 * - `skipped`: the author asked not to check it (tag); the question is kept when it could be read.
 * - `unsupported`: looks like a claim but uses notation the reader cannot turn into a question.
 * - `error`: the LaTeX around it is malformed (unbalanced braces, runaway macro, unclosed math).
 */
export type ClaimStatus = 'ready' | 'skipped' | 'unsupported' | 'error'

/** A value bound by the text ("Let $w = 25143$"). */
export type ContextValue
  = | { kind: 'permutation', perm: PermutationSpec }
    | { kind: 'partition', parts: Partition }
    | { kind: 'integer', value: number }
  /** A weak composition ("Let $\alpha = (0,2,1)$"), for key polynomials and atoms. */
    | { kind: 'composition', parts: number[] }

export interface Claim {
  /** `file:line:index`, index counting claims that start on that line from 1; stable within a run. */
  id: string
  file: string
  line: number
  endLine: number
  column: number
  /** LaTeX as written (before macro expansion); for a chain step, `lhs = rhs` of that step. */
  source: string
  /** The same after expanding the manuscript's own macros. */
  expandedSource: string
  kind: ClaimKind
  status: ClaimStatus
  /** Present when the claim could be read (status `ready`, and `skipped` claims that parse). */
  question?: ClaimQuestion
  /** Why the claim is not `ready`. */
  reason?: string
  /** Conventions set by tags for this claim, one per axis at most. */
  conventions: ConventionId[]
  /** \label{...} of the equation or row, for matching claims across revisions. */
  label?: string
  /** True for displayed math (equation, align, \[ \], $$), false for inline math. */
  display: boolean
  /** Context values (Let $w = …$) this claim used, by symbol. */
  context?: Record<string, ContextValue>
  /** True when a tag named the kind or forced the claim. */
  tagged?: boolean
}

export type WarningCode
  = | 'encoding'
    | 'binary'
    | 'main-file'
    | 'missing-file'
    | 'include-cycle'
    | 'path-escape'
    | 'limit'
    | 'macro'
    | 'tag'
    | 'syntax'

/** Something the reader wants the author to know that is not a claim. */
export interface ReaderWarning {
  code: WarningCode
  message: string
  file?: string
  line?: number
}

export interface ReadFileInfo {
  path: string
  encoding: 'utf-8' | 'latin-1' | 'binary'
  lines: number
  /** main: the root; included: reached by \input/\include/\subfile; unused: in the bundle but never reached. */
  role: 'main' | 'included' | 'unused'
}

/**
 * Math the reader met but did not understand well enough to claim anything about it.
 * Never a verdict: it is listed apart so the author can see what was passed over.
 */
export interface NotReadMath {
  file: string
  /** 1-based, in `file`. */
  line: number
  /** The LaTeX as written, cut to about 120 characters. */
  source: string
  /** Why it was not read, in a few words. */
  reason: string
}

export interface ReadResult {
  claims: Claim[]
  warnings: ReaderWarning[]
  files: ReadFileInfo[]
  /** Math passed over because the reader could not be sure what it says (never counted as a verdict). */
  notRead: NotReadMath[]
  /** The manuscript's own macros KaTeX can take (`\\name` → body with #1…), for typesetting what is written. */
  macros?: Record<string, string>
}
