/**
 * Turning a file's bytes into text the scanner can use.
 *
 * Conventions: line endings become "\n" one for one (CRLF and lone CR each count as one line
 * break), so line numbers in the result are the line numbers an editor shows for the original file.
 * Offsets shift by the removed CRs; nothing downstream uses byte offsets.
 */

export interface DecodedSource {
  text: string
  encoding: 'utf-8' | 'latin-1' | 'binary'
}

/** Share of control characters above which a file is treated as binary, not LaTeX. */
const BINARY_CONTROL_SHARE = 0.05

/** Decode bytes or a string: UTF-8, else Latin-1; e.g. `decodeSource(new Uint8Array([0xe9])).encoding === 'latin-1'`. */
export function decodeSource(input: string | Uint8Array): DecodedSource {
  let text: string
  let encoding: DecodedSource['encoding'] = 'utf-8'
  if (typeof input === 'string') {
    text = input
  }
  else {
    let bytes = input
    if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) bytes = bytes.subarray(3)
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes)
    }
    catch {
      // Latin-1 maps every byte to the code point of the same value, so it never fails.
      text = latin1(bytes)
      encoding = 'latin-1'
    }
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1)
  if (isBinaryLooking(text)) return { text: '', encoding: 'binary' }
  return { text: normalizeLineEndings(text), encoding }
}

function latin1(bytes: Uint8Array): string {
  let out = ''
  const CHUNK = 8192
  for (let i = 0; i < bytes.length; i += CHUNK) {
    out += String.fromCharCode(...bytes.subarray(i, i + CHUNK))
  }
  return out
}

/** CRLF and lone CR become LF, one line break each: `normalizeLineEndings('a\r\nb') === 'a\nb'`. */
export function normalizeLineEndings(text: string): string {
  return text.indexOf('\r') < 0 ? text : text.replace(/\r\n?/g, '\n')
}

function isBinaryLooking(text: string): boolean {
  const sample = text.length > 65536 ? text.slice(0, 65536) : text
  if (sample.length === 0) return false
  let control = 0
  for (let i = 0; i < sample.length; i++) {
    const c = sample.charCodeAt(i)
    if (c === 0) return true
    if (c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13) control++
  }
  return control / sample.length > BINARY_CONTROL_SHARE
}

/** Start offset of every line: `lineStarts('a\nb')` is `[0, 2]`. */
export function lineStarts(text: string): number[] {
  const starts = [0]
  let i = text.indexOf('\n')
  while (i >= 0) {
    starts.push(i + 1)
    i = text.indexOf('\n', i + 1)
  }
  return starts
}

/** 1-based line and column of an offset, given `lineStarts`: `positionAt([0, 2], 3)` is `{ line: 2, column: 2 }`. */
export function positionAt(starts: number[], offset: number): { line: number, column: number } {
  let lo = 0
  let hi = starts.length - 1
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1
    if ((starts[mid] ?? 0) <= offset) lo = mid
    else hi = mid - 1
  }
  return { line: lo + 1, column: offset - (starts[lo] ?? 0) + 1 }
}
