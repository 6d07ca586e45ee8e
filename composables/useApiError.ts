import type { ApiErrorData } from '#shared/types/api'

/** The message and field reasons of a failed $fetch, for forms. */
export function describeApiError(error: unknown): { message: string, code: string | null, fields: Record<string, string>, entry: string | null } {
  const e = error as { data?: { statusMessage?: string, message?: string, data?: ApiErrorData }, statusMessage?: string }
  const data = e?.data?.data
  return {
    message: e?.data?.statusMessage ?? e?.data?.message ?? e?.statusMessage ?? 'The request failed',
    code: data?.code ?? null,
    fields: data?.fields ?? {},
    entry: data?.entry ?? null,
  }
}
