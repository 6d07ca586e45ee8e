// Test helpers for the LaTeX reader: load fixture folders and read single snippets.
import { readFileSync, readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { readManuscript } from '../../../shared/latex/index'
import type { Claim, ReadResult } from '../../../shared/types/claims'

export const FIXTURES = join(__dirname, '../../fixtures/latex')

/** All files under a fixture folder, as the bundle map the reader takes. */
export function loadBundle(folder: string): Record<string, string> {
  const root = join(FIXTURES, folder)
  const files: Record<string, string> = {}
  const walk = (d: string) => {
    for (const f of readdirSync(d)) {
      const p = join(d, f)
      if (statSync(p).isDirectory()) walk(p)
      else files[relative(root, p)] = readFileSync(p, 'utf8')
    }
  }
  walk(root)
  return files
}

/** Read one snippet as a single file called snippet.tex. */
export function readSnippet(tex: string): ReadResult {
  return readManuscript({ files: { 'snippet.tex': tex } })
}

/** The claims that are ready to check. */
export function ready(r: ReadResult): Claim[] {
  return r.claims.filter(c => c.status === 'ready')
}

/** The question of the only claim, failing loudly if there is not exactly one. */
export function onlyQuestion(tex: string) {
  const r = readSnippet(tex)
  if (r.claims.length !== 1) throw new Error(`expected one claim in ${JSON.stringify(tex)}, got ${r.claims.length}: ${JSON.stringify(r.claims.map(c => [c.source, c.status, c.reason]))}`)
  const c = r.claims[0]!
  if (c.status !== 'ready') throw new Error(`claim not ready: ${c.reason}`)
  return c.question!
}

export const x = (index: number) => ({ type: 'variable', name: 'x', index }) as const
export const y = (index: number) => ({ type: 'variable', name: 'y', index }) as const
export const int = (value: number) => ({ type: 'integer', value: String(value) }) as const
export const oneLine = (...entries: number[]) => ({ form: 'oneLine', entries }) as const
