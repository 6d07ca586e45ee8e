/**
 * Stored source bytes as the report page shows them: text files decoded (UTF-8, Latin-1 when
 * that fails), anything else (images, PDF) as null.
 */
const TEXT_FILE = /\.(tex|sty|cls|bib|bbl|txt|md|cfg|def|clo|bst|tikz|csv|dat)$/i

/** Whether the page shows `path` as text; e.g. `isTextPath('fig.pdf') === false`. */
export function isTextPath(path: string): boolean {
  return TEXT_FILE.test(path)
}

/** The bytes as text: UTF-8, or Latin-1 when they are not valid UTF-8. */
export function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes)
  }
  catch {
    return new TextDecoder('latin1').decode(bytes)
  }
}
