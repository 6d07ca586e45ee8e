/**
 * Capacity limits of the reader, in the spirit of TeX's own: every loop that input can drive is
 * bounded by one of these, and reaching one yields a warning or an error claim, never a hang.
 */

export interface ReaderLimits {
  /** Nested macro expansions before a macro is called runaway (TeX's input stack is similar). */
  maxExpansionDepth: number
  /** Tokens all macro expansions of one run may produce. */
  maxExpansionTokens: number
  /** Tokens in one macro argument or definition body. */
  maxArgumentTokens: number
  /** Tokens in one piece of math before it is called unclosed. */
  maxMathTokens: number
  /** Nesting of \input/\include. */
  maxIncludeDepth: number
  /** Macro definitions kept; later ones are ignored with a warning. */
  maxDefinitions: number
  /** Claims reported; later ones are dropped with a warning. */
  maxClaims: number
  /** Characters read over all files; the rest is ignored with a warning. */
  maxTotalChars: number
}

export const DEFAULT_LIMITS: ReaderLimits = {
  maxExpansionDepth: 100,
  maxExpansionTokens: 5_000_000,
  maxArgumentTokens: 100_000,
  maxMathTokens: 50_000,
  maxIncludeDepth: 20,
  maxDefinitions: 200_000,
  maxClaims: 100_000,
  maxTotalChars: 64 * 1024 * 1024,
}
