/**
 * Paths inside a manuscript bundle.
 *
 * Conventions: bundle paths are relative, use "/" and never contain "." or ".." segments
 * after normalisation. A path that would leave the bundle normalises to `undefined`.
 */

/** Normalise a relative path; `undefined` if it is absolute or leaves the bundle: `normalizeBundlePath('a/../b.tex') === 'b.tex'`. */
export function normalizeBundlePath(path: string): string | undefined {
  const p = path.replace(/\\/g, '/').trim()
  if (p.startsWith('/') || /^[A-Za-z]:/.test(p) || p.startsWith('~')) return undefined
  const out: string[] = []
  for (const seg of p.split('/')) {
    if (seg === '' || seg === '.') continue
    if (seg === '..') {
      if (out.length === 0) return undefined
      out.pop()
    }
    else out.push(seg)
  }
  return out.length ? out.join('/') : undefined
}

/** Folder part of a bundle path: `dirname('sec/a.tex') === 'sec'`, `dirname('a.tex') === ''`. */
export function dirname(path: string): string {
  const i = path.lastIndexOf('/')
  return i < 0 ? '' : path.slice(0, i)
}

export type ResolveResult = { path: string } | { escapes: true } | { missing: string[] }

/**
 * Resolve an \input argument against the bundle: relative to the including file's folder first,
 * then to the bundle root (as TeX run from the main folder does), with and without ".tex".
 */
export function resolveInclude(
  target: string,
  fromFile: string,
  mainFile: string,
  exists: (p: string) => boolean,
): ResolveResult {
  const raw = target.trim().replace(/^"(.*)"$/, '$1')
  if (raw.startsWith('/') || /^[A-Za-z]:/.test(raw) || raw.startsWith('~')) return { escapes: true }
  const bases = [dirname(mainFile), dirname(fromFile)]
  const tried: string[] = []
  let escaped = false
  for (const base of [...new Set(bases)]) {
    const joined = base ? `${base}/${raw}` : raw
    for (const candidate of [joined, `${joined}.tex`]) {
      const norm = normalizeBundlePath(candidate)
      if (norm === undefined) {
        escaped = true
        continue
      }
      tried.push(norm)
      if (exists(norm)) return { path: norm }
    }
  }
  if (escaped && tried.length === 0) return { escapes: true }
  if (escaped) return { escapes: true }
  return { missing: [...new Set(tried)] }
}
