/**
 * Budgets for computations that can grow large.
 *
 * A budget bounds the number of terms any intermediate result may hold and
 * the number of elementary steps taken; an optional AbortSignal stops the
 * work from outside. When a bound is hit the computation throws
 * BudgetExceededError instead of hanging or exhausting memory.
 */
import { BudgetExceededError } from './errors'

export interface Budget {
  /** Largest number of terms (monomials, permutations, objects) any intermediate result may hold. */
  maxTerms?: number
  /** Largest number of elementary steps. */
  maxSteps?: number
  /** Abort from outside; checked every few thousand steps. */
  signal?: AbortSignal
  /**
   * Wall-clock limit in milliseconds from the meter's creation, checked every few thousand
   * steps. A busy thread never runs its timers, so a signal alone cannot stop synchronous work.
   */
  maxMilliseconds?: number
}

/** Defaults chosen so that a whole manuscript rechecks in about a second and nothing exhausts memory. */
export const DEFAULT_BUDGET: Required<Omit<Budget, 'signal' | 'maxMilliseconds'>> = {
  maxTerms: 2_000_000,
  maxSteps: 200_000_000,
}

/** Counts steps and terms against a Budget; `meter.step()` throws once a limit is passed. */
export class BudgetMeter {
  readonly maxTerms: number
  readonly maxSteps: number
  readonly signal: AbortSignal | undefined
  readonly deadline: number
  steps = 0
  private nextSignalCheck = 4096

  constructor(budget: Budget = {}) {
    this.maxTerms = budget.maxTerms ?? DEFAULT_BUDGET.maxTerms
    this.maxSteps = budget.maxSteps ?? DEFAULT_BUDGET.maxSteps
    this.signal = budget.signal
    this.deadline = budget.maxMilliseconds === undefined ? Infinity : performance.now() + budget.maxMilliseconds
    if (this.signal?.aborted) throw new BudgetExceededError('signal', 'computation aborted before it started')
  }

  /** Record `n` elementary steps; e.g. `meter.step(terms.length)`. */
  step(n = 1): void {
    this.steps += n
    if (this.steps > this.maxSteps) {
      throw new BudgetExceededError('steps', `computation too large: more than ${this.maxSteps} steps`)
    }
    if (this.steps >= this.nextSignalCheck) {
      this.nextSignalCheck = this.steps + 4096
      if (this.signal?.aborted) throw new BudgetExceededError('signal', 'computation aborted')
      if (performance.now() > this.deadline) throw new BudgetExceededError('time', 'computation too large: it ran out of time')
    }
  }

  /** Check the time limit now, between phases that do not count steps; e.g. `meter.checkTime()`. */
  checkTime(): void {
    if (performance.now() > this.deadline) throw new BudgetExceededError('time', 'computation too large: it ran out of time')
  }

  /** Check that a result of `count` terms is allowed; e.g. `meter.terms(map.size)`. */
  terms(count: number, what = 'terms'): void {
    if (count > this.maxTerms) {
      throw new BudgetExceededError('terms', `computation too large: more than ${this.maxTerms} ${what}`)
    }
  }
}

/** Build a meter from a Budget or reuse a meter passed down by a caller. */
export function toMeter(budget?: Budget | BudgetMeter): BudgetMeter {
  return budget instanceof BudgetMeter ? budget : new BudgetMeter(budget)
}
