/**
 * The check report: the same shape from the API (`GET /api/revisions/:id/report`)
 * and from the command line (`scholium check --json`). Versioned by `schema`;
 * fields are only ever added within a version. Every field is documented in the README.
 * Version 2 (from 1): `claims[].reproduce` is the claim's own part of its script, the shared
 * definitions are in `reproduceLibrary` once per report; `claims[].expanded` and `macros` added.
 */
import type { ClaimKind } from './claims'
import type { ConventionId, ConventionSet } from './conventions'

export const REPORT_SCHEMA = 'scholium.report/2' as const

export type Verdict = 'verified' | 'mismatch' | 'unsupported' | 'error'
export const VERDICTS: readonly Verdict[] = ['verified', 'mismatch', 'unsupported', 'error']

/** One term of a polynomial or one basis element of an expansion, as LaTeX with its coefficient. */
export interface DiffTerm {
  /** LaTeX of the monomial or basis element, e.g. `x_{1}^{2}x_{2}` or `\mathfrak{S}_{2143}` or `s_{21}`. */
  term: string
  /** Decimal string, so no precision is lost. */
  coefficient: string
}

export interface DiffWrongCoefficient {
  term: string
  /** What the manuscript writes. */
  claimed: string
  /** What the engine computes. */
  computed: string
}

/**
 * What differs between the two sides of a failing claim.
 * - polynomial: monomials; schubertBasis / schurBasis: basis elements; number: two values.
 * Lists are cut at `DIFF_LIMIT` entries; `truncated` then says how many there were.
 */
export type ClaimDiff
  = | {
    /** `class`: Schubert classes q^d σ_λ of a Grassmannian; `tensor`: s_μ ⊗ s_ν in Λ ⊗ Λ. */
    basis: 'monomial' | 'schubert' | 'schur' | 'class' | 'tensor'
    /** Computed but not written in the manuscript. */
    missing: DiffTerm[]
    /** Written in the manuscript but not in the computed value. */
    extra: DiffTerm[]
    wrongCoefficient: DiffWrongCoefficient[]
    truncated?: { missing: number, extra: number, wrongCoefficient: number }
    /** Sentences that explain the difference, e.g. "σ_{3} is 0 in H^*(Gr(2,4)): (3) does not fit in the 2×2 box". */
    notes?: string[]
  }
  | { basis: 'number', claimed: string, computed: string }
  /** A property the text states of a polynomial (supersymmetry) and the condition of its definition that fails. */
  | { basis: 'property', property: 'supersymmetry', computed: string }
  /** Found from invariants alone, without expanding (degree, value at (1,…,1), number of terms). */
  | { basis: 'invariant', invariant: 'degree' | 'value at ones' | 'number of terms', claimed: string, computed: string }

export const DIFF_LIMIT = 60

export interface ReportClaim {
  id: string
  file: string
  /** 1-based, in `file`. */
  line: number
  endLine: number
  kind: ClaimKind
  verdict: Verdict
  /**
   * For a claim that fails under the conventions it is checked in: the convention ids
   * (only the ones that differ) under which it does hold. Empty otherwise.
   */
  holdsUnder: ConventionId[]
  /** The LaTeX as written. */
  source: string
  /** LaTeX of the engine's value of the claim's reference side (the left side of its step). */
  computed: string | null
  diff: ClaimDiff | null
  /** One sentence for people: why not verified, or what was checked. */
  message: string
  label?: string
  /** The conventions this claim was checked in (tags, manuscript settings, inferred, reference). */
  conventions: ConventionSet
  /** Set when the claim holds only under a convention the rest of the paper does not follow. */
  breaksPaperConvention?: { axis: keyof ConventionSet, paper: ConventionId, claim: ConventionId }
  /** Permutations the claim mentions (one-line), for drawings. */
  permutations: number[][]
  /** Set on claims a tag asked to skip (their verdict is `unsupported`). */
  skipped?: true
  /**
   * For a verified or mismatched claim of a kind SymPy can restate: its part of a Python script
   * that recomputes both sides from the definitions and prints "matches" or the difference.
   * `reproduceScript(report.reproduceLibrary, claim.reproduce)` (shared/check/reproduce.ts) is the
   * runnable, self-contained script.
   */
  reproduce?: ReproduceSnippet
  /** The LaTeX after expanding the manuscript's own macros (absent in reports stored before it was added). */
  expanded?: string
  /** For a mismatch: the corrected statement in the paper's own notation, or why there is none. */
  correction?: ClaimCorrection
}

/**
 * A claim's own part of its SymPy script: the two sides as Python expressions and the helpers
 * (by name, in definition order) they call, e.g. `{ needs: ['ddiff', 'climb', 'schubert'],
 * left: 'schubert([1, 3, 2])', right: '(X[0] + X[1])' }`.
 */
export interface ReproduceSnippet {
  needs: string[]
  left: string
  right: string
}

/**
 * What the claims' scripts share, stored once per report: the imports, each helper's code by
 * name, and the closing lines that compare `left` with `right` and print the outcome.
 */
export interface ReproduceLibrary {
  imports: string
  helpers: Record<string, string>
  ending: string
}

/**
 * A suggested correction of a mismatched claim (shared/check/correction.ts). Only a correction that
 * was re-read and re-checked as verified is `fixed`; anything less certain says why it is not.
 */
export type ClaimCorrection
  = | {
    fixed: true
    /** The corrected claim as written in the paper's own macros, e.g. `\\Sch{132} = x_1 + x_2`. */
    statement: string
    /** Set when the claim as written holds under another convention: it was rewritten in the paper's. */
    note?: string
    file: string
    /** 1-based line of `file` that changes. */
    line: number
    /** The whole line before and after the correction, each with its own line ending removed. */
    before: string
    after: string
    /** Up to three unchanged lines either side, for the patch's context, each ending in CR if it does in the file. */
    above: string[]
    below: string[]
    /** The line ends with CR LF in the file. */
    crlf?: true
    /** The file's last line (within `below`, or the changed line itself) has no line ending. */
    noNewlineAtEnd?: true
  }
  | { fixed: false, reason: string }

export interface ConventionReport {
  /** What the paper's own claims suggest, axis by axis (only axes with evidence). */
  inferred: Partial<ConventionSet>
  /** Fixed by a manuscript setting or the command line. */
  fixed: Partial<ConventionSet>
  /** What claims were checked in, unless a tag says otherwise. */
  used: ConventionSet
  /** How many claims hold only under each choice (the evidence for `inferred`). */
  evidence: Partial<Record<ConventionId, number>>
}

export interface ReportSummary {
  claims: number
  verified: number
  mismatch: number
  unsupported: number
  error: number
  /** Mismatches that hold under another convention (a subset of `mismatch`). */
  otherConvention: number
  /** Claims the author asked to skip (a subset of `unsupported`). */
  skipped: number
  /** Pieces of math the reader passed over (the length of `Report.notRead`); absent in older reports. */
  notRead?: number
  durationMs: number
}

/** Math the reader did not understand: listed apart from the verdicts, never in the exit status. */
export interface ReportNotRead {
  file: string
  /** 1-based, in `file`. */
  line: number
  /** A short excerpt of the LaTeX as written. */
  source: string
  reason: string
}

export interface ReportFile {
  path: string
  sha256?: string
  role: 'main' | 'included' | 'unused'
  lines: number
}

export interface Report {
  schema: typeof REPORT_SCHEMA
  engine: { version: string }
  conventions: ConventionReport
  summary: ReportSummary
  files: ReportFile[]
  warnings: { code: string, message: string, file?: string, line?: number }[]
  claims: ReportClaim[]
  /** Math the reader passed over; absent in older reports. */
  notRead?: ReportNotRead[]
  /** The paper's own macros as KaTeX takes them (`{ '\\Sch': '\\mathfrak{S}_{#1}' }`); absent in older reports. */
  macros?: Record<string, string>
  /** The definitions every `claims[].reproduce` refers to; present when some claim has a script. */
  reproduceLibrary?: ReproduceLibrary
}
