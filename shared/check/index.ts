/**
 * The check pipeline's pure core: claims from the reader, values from the engine,
 * verdicts and a report. Used by the worker threads, the command line and tests.
 *
 *   const report = checkManuscript({ files: { 'main.tex': source } })
 *
 * The worker splits the same steps (read → evaluate in batches → assemble) to report progress.
 */
import { ENGINE_VERSION } from '../math'
import { readManuscript } from '../latex'
import type { ReadResult } from '../types/claims'
import type { ConventionSet } from '../types/conventions'
import { REFERENCE_CONVENTIONS } from '../types/conventions'
import { REPORT_SCHEMA, type Report, type ReportClaim } from '../types/report'
import { evaluateClaim, type ClaimEvaluation } from './claim'
import { decideClaim, inferConventions } from './decide'
import type { EngineMemo } from './evaluate'
import { reproduceLibrary, reproduceSnippet } from './reproduce'
import { withCorrections } from './correction'

export { evaluateClaim, type ClaimEvaluation } from './claim'
export { inferConventions, decideClaim } from './decide'
export type { EngineMemo } from './evaluate'
export { withCorrections, correctionsPatch } from './correction'

export interface CheckOptions {
  /** Conventions fixed from outside (manuscript setting, command line); tags on a claim still win. */
  fixed?: Partial<ConventionSet>
  /** Stops every claim still running (a run's time budget). */
  signal?: AbortSignal
  /** A `performance.now()` time after which claims are no longer evaluated but reported as over budget. */
  deadline?: number
  onProgress?: (done: number, total: number) => void
}

/** Evaluate claims in order, sharing engine results; one failing claim never stops the others. */
export function evaluateClaims(read: ReadResult, options: CheckOptions & { memo?: EngineMemo } = {}): ClaimEvaluation[] {
  const memo: EngineMemo = options.memo ?? new Map()
  const evaluations: ClaimEvaluation[] = []
  read.claims.forEach((claim, i) => {
    const late = claim.status === 'ready' && options.deadline !== undefined && performance.now() > options.deadline
    evaluations.push(late
      ? { status: 'error', message: 'over budget: the run\'s time budget ran out before this claim', permutations: [] }
      : evaluateClaim(claim, { fixed: options.fixed, memo, budget: { signal: options.signal } }))
    options.onProgress?.(i + 1, read.claims.length)
  })
  return evaluations
}

/** Infer conventions, decide verdicts and build the versioned report. */
export function assembleReport(read: ReadResult, evaluations: readonly ClaimEvaluation[], options: { fixed?: Partial<ConventionSet>, durationMs: number, hashes?: Record<string, string> }): Report {
  const conventions = inferConventions(evaluations, options.fixed ?? {})
  const claims: ReportClaim[] = read.claims.map((claim, i) => {
    const decided = decideClaim(claim, evaluations[i]!, conventions)
    const checked = claim.question !== undefined && (decided.verdict === 'verified' || decided.verdict === 'mismatch')
    const reproduce = checked ? reproduceSnippet(claim.question!, decided.conventions) : null
    const expanded = claim.expandedSource !== claim.source ? { expanded: claim.expandedSource } : {}
    return reproduce !== null ? { ...decided, ...expanded, reproduce } : { ...decided, ...expanded }
  })
  const snippets = claims.map(c => c.reproduce)
  const count = (predicate: (c: ReportClaim) => boolean) => claims.filter(predicate).length
  return {
    schema: REPORT_SCHEMA,
    engine: { version: ENGINE_VERSION },
    conventions,
    summary: {
      claims: claims.length,
      verified: count(c => c.verdict === 'verified'),
      mismatch: count(c => c.verdict === 'mismatch'),
      unsupported: count(c => c.verdict === 'unsupported'),
      error: count(c => c.verdict === 'error'),
      otherConvention: count(c => c.verdict === 'mismatch' && c.holdsUnder.length > 0),
      skipped: read.claims.filter(c => c.status === 'skipped').length,
      notRead: read.notRead.length,
      durationMs: Math.round(options.durationMs),
    },
    files: read.files.map(f => ({ path: f.path, role: f.role, lines: f.lines, ...(options.hashes?.[f.path] ? { sha256: options.hashes[f.path] } : {}) })),
    warnings: read.warnings.map(w => ({ code: w.code, message: w.message, ...(w.file ? { file: w.file } : {}), ...(w.line ? { line: w.line } : {}) })),
    claims,
    notRead: read.notRead.map(n => ({ file: n.file, line: n.line, source: n.source, reason: n.reason })),
    macros: read.macros ?? {},
    ...(snippets.some(Boolean) ? { reproduceLibrary: reproduceLibrary(snippets) } : {}),
  }
}

/** Read, check and report in one call. */
export function checkManuscript(input: { files: Record<string, string | Uint8Array>, main?: string, hashes?: Record<string, string> }, options: CheckOptions = {}): Report {
  const started = performance.now()
  const read = readManuscript({ files: input.files, main: input.main })
  const evaluations = evaluateClaims(read, options)
  const report = assembleReport(read, evaluations, { fixed: options.fixed, durationMs: performance.now() - started, hashes: input.hashes })
  return withCorrections(report, read, input.files, { main: input.main })
}

export { REFERENCE_CONVENTIONS }
