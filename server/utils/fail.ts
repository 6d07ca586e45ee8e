import { createError } from 'h3'
import type { ZodError, ZodType } from 'zod'
import type { ApiErrorCode, ApiErrorData } from '#shared/types/api'

/**
 * Throws an HTTP error with a short message and a machine-readable code.
 * Messages never echo user input. Example: `fail(404, 'not-found', 'No such manuscript')`
 */
export function fail(statusCode: number, code: ApiErrorCode, message: string, fields?: Record<string, string>): never {
  const data: ApiErrorData = fields ? { code, fields } : { code }
  throw createError({ statusCode, statusMessage: message, message, data })
}

/** A validator for h3's readValidatedBody & co. that fails with invalid-input and per-field reasons. */
export function validateWith<T>(schema: ZodType<T>) {
  return (input: unknown): T => {
    const parsed = schema.safeParse(input)
    if (parsed.success) return parsed.data
    fail(400, 'invalid-input', 'The request is not valid', fieldErrors(parsed.error))
  }
}

function fieldErrors(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {}
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_'
    fields[key] ??= issue.message
  }
  return fields
}
