/**
 * Refusals of an upload: the error type, and the hostile-safe rendering of entry names
 * used in every message (entry names come from the uploader and may be hostile).
 */
import type { UploadRefusalCode } from '../../shared/types/uploads'

/** An upload was refused; `code` says why, `message` is safe to show to the author. */
export class UploadRefusedError extends Error {
  override readonly name = 'UploadRefusedError'
  readonly code: UploadRefusalCode
  /** The offending entry, already sanitised with `describeEntryName`, when there is one. */
  readonly entry: string | null

  constructor(code: UploadRefusalCode, message: string, entry: string | null = null, options?: { cause?: unknown }) {
    super(message, options)
    this.code = code
    this.entry = entry
  }
}

/** True when `error` is an upload refusal, e.g. `if (isUploadRefusedError(e)) fail(422, ...)`. */
export function isUploadRefusedError(error: unknown): error is UploadRefusedError {
  return error instanceof UploadRefusedError
}

const SHOWN_NAME_MAX = 80
// Characters shown as they are; everything else (quotes, angle brackets, ampersands,
// control and non-ASCII characters) is escaped so that a name cannot inject markup or
// fake text into a message.
const PLAIN_NAME_CHAR = /^[A-Za-z0-9 ._\-/+()[\],=~@#%!$^]$/

/**
 * A hostile-safe rendering of an entry name for messages: printable ASCII, escaped, truncated.
 * Example: `describeEntryName('a<b>\u0000.tex')` → `a\x3cb\x3e\x00.tex`.
 */
export function describeEntryName(raw: string): string {
  let shown = ''
  for (const ch of raw) {
    if (PLAIN_NAME_CHAR.test(ch)) {
      shown += ch
    }
    else {
      const code = ch.codePointAt(0) ?? 0
      shown += code <= 0xff ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u{${code.toString(16)}}`
    }
  }
  if (shown.length <= SHOWN_NAME_MAX) return shown
  // Keep both ends: the start locates the entry, the end shows its extension.
  const head = Math.floor((SHOWN_NAME_MAX - 3) / 2)
  const tail = SHOWN_NAME_MAX - 3 - head
  return `${shown.slice(0, head)}...${shown.slice(shown.length - tail)}`
}

/** A refusal naming the offending entry (sanitised), e.g. `throw refuse('file-type', 'not accepted.', name)`. */
export function refuse(code: UploadRefusalCode, message: string, rawName?: string): UploadRefusedError {
  const entry = rawName === undefined ? null : describeEntryName(rawName)
  const text = entry === null ? message : `"${entry}": ${message}`
  return new UploadRefusedError(code, text, entry)
}

const MiB = 1024 * 1024

/** A size for messages, e.g. `formatBytes(1536)` → '1.5 KiB'. */
export function formatBytes(bytes: number): string {
  if (bytes >= MiB) return `${(bytes / MiB).toFixed(bytes % MiB === 0 ? 0 : 1)} MiB`
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(bytes % 1024 === 0 ? 0 : 1)} KiB`
  return `${bytes} bytes`
}
