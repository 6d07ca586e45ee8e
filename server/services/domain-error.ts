import type { ApiErrorCode } from '../../shared/types/api'

/**
 * A refusal from a service, independent of HTTP, so the worker and the CLI can call
 * services too. Routes map it to a response once, in server/utils/fail.ts (`httpStatusOf`).
 * Example: `throw new DomainError('conflict', 'A proposal on this axis is already open')`
 */
export class DomainError extends Error {
  constructor(readonly code: ApiErrorCode, message: string) {
    super(message)
    this.name = 'DomainError'
  }
}
