/**
 * Finished reports, serialised, kept in this process. A finished run's report never
 * changes (its claims are written once, in the transaction that finishes it), so the JSON
 * for a run id is the same for every reader and every request: it is loaded and serialised
 * once instead of on each request. Bounded by SCHOLIUM_REPORT_CACHE_ENTRIES (default 200,
 * 0 turns the cache off, e.g. to measure it: scripts/bench-load.ts); least recently used out first.
 */
const limit = Math.max(0, Number(process.env.SCHOLIUM_REPORT_CACHE_ENTRIES ?? 200) || 0)
const entries = new Map<string, string>()

/** The report of a finished run as JSON text, from the cache or from `load` (null: no report). */
export async function finishedReportJson(runId: string, load: () => Promise<unknown | null>): Promise<string | null> {
  const hit = entries.get(runId)
  if (hit !== undefined) {
    entries.delete(runId)
    entries.set(runId, hit)
    return hit
  }
  const report = await load()
  if (report === null) return null
  const json = JSON.stringify(report)
  if (limit > 0) {
    entries.set(runId, json)
    if (entries.size > limit) entries.delete(entries.keys().next().value!)
  }
  return json
}
