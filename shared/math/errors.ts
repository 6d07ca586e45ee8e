/**
 * Typed errors of the math engine.
 *
 * Every failure the engine reports carries a stable `code` so that callers
 * (server, worker, CLI, browser) can tell "the input is malformed" from
 * "the computation is too large" from "the claim is outside the span".
 */

export type MathErrorCode
  = | 'PARSE'
    | 'INVALID_ARGUMENT'
    | 'TOO_LARGE'
    | 'ABORTED'
    | 'OVERFLOW'
    | 'NOT_IN_SPAN'
    | 'NOT_SYMMETRIC'

/** Base class of all engine errors; `code` is stable across releases. */
export class MathError extends Error {
  readonly code: MathErrorCode
  constructor(code: MathErrorCode, message: string) {
    super(message)
    this.code = code
    this.name = new.target.name
  }
}

/** Malformed text given to a parser, e.g. `parsePermutation('21x3')`. */
export class ParseError extends MathError {
  constructor(message: string) {
    super('PARSE', message)
  }
}

/** A well-formed but meaningless argument, e.g. a permutation `[1,1,2]`. */
export class InvalidArgumentError extends MathError {
  constructor(message: string) {
    super('INVALID_ARGUMENT', message)
  }
}

/** A computation exceeded its budget (terms, steps) or was aborted. */
export class BudgetExceededError extends MathError {
  /** Which limit was hit. */
  readonly limit: 'terms' | 'steps' | 'time' | 'signal'
  constructor(limit: 'terms' | 'steps' | 'time' | 'signal', message: string) {
    super(limit === 'signal' ? 'ABORTED' : 'TOO_LARGE', message)
    this.limit = limit
  }
}

/** An integer coefficient left the exactly representable range (|c| < 2^53). */
export class CoefficientOverflowError extends MathError {
  constructor(message = 'coefficient exceeds 2^53 - 1; the engine refuses to round it') {
    super('OVERFLOW', message)
  }
}

/** A polynomial asked to be expanded in a basis whose span does not contain it. */
export class NotInSpanError extends MathError {
  constructor(message: string) {
    super('NOT_IN_SPAN', message)
  }
}

/** A polynomial required to be symmetric is not. */
export class NotSymmetricError extends MathError {
  constructor(message: string) {
    super('NOT_SYMMETRIC', message)
  }
}
