import { createError, getValidatedQuery, getValidatedRouterParams, readValidatedBody, type H3Event } from 'h3'
import { z, type ZodError, type ZodType } from 'zod'
import type { ApiErrorCode, ApiErrorData } from '#shared/types/api'

/**
 * Throws an HTTP error with a short message and a machine-readable code.
 * Messages never echo user input. Example: `fail(404, 'not-found', 'No such manuscript')`
 */
export function fail(statusCode: number, code: ApiErrorCode, message: string, extra: Omit<ApiErrorData, 'code'> = {}): never {
  const data: ApiErrorData = { code, ...extra }
  throw createError({ statusCode, statusMessage: message, message, data })
}

/**
 * Reads and validates a JSON body; failure is 400 invalid-input with a reason per field.
 * Example: `const { title } = await readBodyAs(event, z.object({ title: z.string() }))`
 */
export async function readBodyAs<T>(event: H3Event, schema: ZodType<T>): Promise<T> {
  return orInvalid(await readValidatedBody(event, body => schema.safeParse(body ?? {})))
}

/** The HTTP status a domain error's code stands for (server/plugins/domain-errors.ts applies it). */
export function httpStatusOf(code: ApiErrorCode): number {
  return DOMAIN_STATUS[code] ?? (code.startsWith('upload-') ? 422 : 400)
}

const DOMAIN_STATUS: Partial<Record<ApiErrorCode, number>> = {
  'invalid-input': 400,
  'not-signed-in': 401,
  'forbidden': 403,
  'not-found': 404,
  'conflict': 409,
  'rate-limited': 429,
}

/** Validates the query string the same way. Example: `const { run } = await queryAs(event, z.object({ run: z.string().uuid().optional() }))` */
export async function queryAs<T>(event: H3Event, schema: ZodType<T>): Promise<T> {
  return orInvalid(await getValidatedQuery(event, query => schema.safeParse(query)))
}

/**
 * Reads and validates route parameters (getValidatedRouterParams). A parameter that does not
 * validate names nothing that exists, so the answer is 404 not-found, as for a thing the caller may
 * not see (never 400, which would tell the two apart).
 * Example: `const { id, userId } = await routeParamsAs(event, uuidParams('id', 'userId'))`, or
 * `const { token } = await routeParamsAs(event, z.object({ token: z.string().max(200) }))`.
 */
export async function routeParamsAs<T>(event: H3Event, schema: ZodType<T>): Promise<T> {
  const parsed = await getValidatedRouterParams(event, params => schema.safeParse(params))
  if (!parsed.success) fail(404, 'not-found', 'Nothing is here')
  return parsed.data
}

const uuidSchemas = new Map<string, ZodType>()

/** The schema of route parameters that are all UUIDs (made once per list of names): `uuidParams('id', 'userId')`. */
export function uuidParams<K extends string>(...names: K[]): ZodType<Record<K, string>> {
  const key = names.join(',')
  let schema = uuidSchemas.get(key)
  if (!schema) uuidSchemas.set(key, (schema = z.object(Object.fromEntries(names.map(n => [n, z.string().uuid()])) as Record<K, z.ZodString>)))
  return schema as ZodType<Record<K, string>>
}

function orInvalid<T>(parsed: { success: true, data: T } | { success: false, error: ZodError }): T {
  if (parsed.success) return parsed.data
  fail(400, 'invalid-input', 'The request is not valid', { fields: fieldErrors(parsed.error) })
}

function fieldErrors(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {}
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_'
    fields[key] ??= issue.message
  }
  return fields
}
