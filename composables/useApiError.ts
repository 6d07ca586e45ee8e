import type { ApiErrorData } from '#shared/types/api'

/** The message and field reasons of a failed $fetch, for forms. */
export function describeApiError(error: unknown): { message: string, code: string | null, fields: Record<string, string>, entry: string | null, summary: string } {
  const e = error as { data?: { statusMessage?: string, message?: string, data?: ApiErrorData }, statusMessage?: string }
  const data = e?.data?.data
  const message = e?.data?.statusMessage ?? e?.data?.message ?? e?.statusMessage ?? 'The request failed'
  const fields = data?.fields ?? {}
  return {
    message,
    /** One line for a small form: the first field's reason, else the message. */
    summary: Object.values(fields)[0] ?? message,
    code: data?.code ?? null,
    fields,
    entry: data?.entry ?? null,
  }
}
