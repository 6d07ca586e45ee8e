/**
 * The worker-thread side of a check run (run by piscina): read the manuscript,
 * evaluate every claim with the engine, assemble the report. Progress goes back
 * through a MessagePort. The time budget is a deadline checked between claims
 * (a busy thread never sees a timer fire); the pool also aborts the thread
 * outright if it overruns by far.
 */
import type { MessagePort } from 'node:worker_threads'
import { readManuscript } from '../../shared/latex'
import { assembleReport, evaluateClaims, withCorrections } from '../../shared/check'
import type { ConventionSet } from '../../shared/types/conventions'
import type { Report } from '../../shared/types/report'

export interface CheckTask {
  files: Record<string, Uint8Array>
  main?: string
  hashes: Record<string, string>
  fixed: Partial<ConventionSet>
  /** Milliseconds the whole run may take; claims not reached by then are reported as over budget. */
  runBudgetMs: number
  progress?: MessagePort
}

export interface CheckThreadResult { report: Report, timings: { readMs: number, checkMs: number } }

export default function checkInThread(task: CheckTask): CheckThreadResult {
  const started = performance.now()
  const read = readManuscript({ files: task.files, main: task.main })
  const readMs = performance.now() - started
  let lastPost = 0
  task.progress?.postMessage({ done: 0, total: read.claims.length })
  const evaluations = evaluateClaims(read, {
    fixed: task.fixed,
    deadline: started + task.runBudgetMs,
    onProgress(done, total) {
      const now = performance.now()
      if (done === total || now - lastPost > 200) {
        lastPost = now
        task.progress?.postMessage({ done, total })
      }
    },
  })
  const checkMs = performance.now() - started - readMs
  const report = withCorrections(
    assembleReport(read, evaluations, { fixed: task.fixed, durationMs: performance.now() - started, hashes: task.hashes }),
    read, task.files, { main: task.main },
  )
  task.progress?.close()
  return { report, timings: { readMs: Math.round(readMs), checkMs: Math.round(checkMs) } }
}
