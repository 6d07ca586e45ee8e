/**
 * The stored report document (`check_runs.report`) is checked against this schema whenever it is
 * read, so a damaged or foreign document is refused with a clear message instead of being shown.
 * The schema is written against the `Report` type (`satisfies`), so the two cannot drift apart.
 * Counts are read from a report's `summary` through `verdictCountsOf` and nowhere else: the mail,
 * the audit summary and the API all use it.
 */
import { z } from 'zod'
import { CLAIM_KINDS } from './claims'
import { ALL_CONVENTION_IDS, CONVENTION_AXES, type ConventionAxis, type ConventionId, type ConventionSet } from './conventions'
import type { VerdictCounts } from './editorial'
import { REPORT_SCHEMA, VERDICTS, type ClaimCorrection, type Report, type ReportSummary } from './report'

const conventionId = z.enum(ALL_CONVENTION_IDS as [ConventionId, ...ConventionId[]])
const axes = Object.keys(CONVENTION_AXES) as ConventionAxis[]
const choiceOf = <A extends ConventionAxis>(axis: A) =>
  z.enum(Object.keys(CONVENTION_AXES[axis].choices) as [ConventionSet[A], ...ConventionSet[A][]])
const conventionSet = z.object({
  doubleSign: choiceOf('doubleSign'), indexing: choiceOf('indexing'), partition: choiceOf('partition'), beta: choiceOf('beta'), kFactor: choiceOf('kFactor'),
}) satisfies z.ZodType<ConventionSet>
const partialConventions = conventionSet.partial()
const diffTerm = z.object({ term: z.string(), coefficient: z.string() })

const claimDiff = z.union([
  z.object({
    basis: z.enum(['monomial', 'schubert', 'schur', 'class', 'tensor']),
    missing: z.array(diffTerm),
    extra: z.array(diffTerm),
    wrongCoefficient: z.array(z.object({ term: z.string(), claimed: z.string(), computed: z.string() })),
    truncated: z.object({ missing: z.number(), extra: z.number(), wrongCoefficient: z.number() }).optional(),
    notes: z.array(z.string()).optional(),
  }),
  z.object({ basis: z.literal('number'), claimed: z.string(), computed: z.string() }),
  z.object({ basis: z.literal('invariant'), invariant: z.enum(['degree', 'value at ones', 'number of terms']), claimed: z.string(), computed: z.string() }),
])

const claimCorrection = z.discriminatedUnion('fixed', [
  z.object({
    fixed: z.literal(true),
    statement: z.string(),
    note: z.string().optional(),
    file: z.string(),
    line: z.number().int(),
    before: z.string(),
    after: z.string(),
    above: z.array(z.string()),
    below: z.array(z.string()),
    crlf: z.literal(true).optional(),
    noNewlineAtEnd: z.literal(true).optional(),
  }),
  z.object({ fixed: z.literal(false), reason: z.string() }),
]) satisfies z.ZodType<ClaimCorrection>

const reportClaim = z.object({
  id: z.string(),
  file: z.string(),
  line: z.number().int(),
  endLine: z.number().int(),
  kind: z.enum(CLAIM_KINDS as [typeof CLAIM_KINDS[number], ...typeof CLAIM_KINDS[number][]]),
  verdict: z.enum(VERDICTS as [Report['claims'][number]['verdict'], ...Report['claims'][number]['verdict'][]]),
  holdsUnder: z.array(conventionId),
  source: z.string(),
  computed: z.string().nullable(),
  diff: claimDiff.nullable(),
  message: z.string(),
  label: z.string().optional(),
  conventions: conventionSet,
  breaksPaperConvention: z.object({ axis: z.enum(axes as [ConventionAxis, ...ConventionAxis[]]), paper: conventionId, claim: conventionId }).optional(),
  permutations: z.array(z.array(z.number().int())),
  skipped: z.literal(true).optional(),
  reproduce: z.object({ needs: z.array(z.string()), left: z.string(), right: z.string() }).optional(),
  expanded: z.string().optional(),
  correction: claimCorrection.optional(),
})

const reportSummary = z.object({
  claims: z.number().int(),
  verified: z.number().int(),
  mismatch: z.number().int(),
  unsupported: z.number().int(),
  error: z.number().int(),
  otherConvention: z.number().int(),
  skipped: z.number().int(),
  notRead: z.number().int().optional(),
  durationMs: z.number(),
}) satisfies z.ZodType<ReportSummary>

export const ReportDocument = z.object({
  schema: z.literal(REPORT_SCHEMA),
  engine: z.object({ version: z.string() }),
  conventions: z.object({
    inferred: partialConventions,
    fixed: partialConventions,
    used: conventionSet,
    evidence: z.partialRecord(conventionId, z.number()),
  }),
  summary: reportSummary,
  files: z.array(z.object({ path: z.string(), sha256: z.string().optional(), role: z.enum(['main', 'included', 'unused']), lines: z.number().int() })),
  warnings: z.array(z.object({ code: z.string(), message: z.string(), file: z.string().optional(), line: z.number().int().optional() })),
  claims: z.array(reportClaim),
  notRead: z.array(z.object({ file: z.string(), line: z.number().int(), source: z.string(), reason: z.string() })).optional(),
  macros: z.record(z.string(), z.string()).optional(),
  reproduceLibrary: z.object({ imports: z.string(), helpers: z.record(z.string(), z.string()), ending: z.string() }).optional(),
}) satisfies z.ZodType<Report>

/** Thrown when a stored report does not have the report's shape; says where it first differs. */
export class DamagedReportError extends Error {}

/**
 * The stored document as a `Report`, or a `DamagedReportError` naming the first field that is off.
 * e.g. `parseReport(row.report)` where `row.report` is `check_runs.report` of a finished run.
 */
export function parseReport(stored: unknown): Report {
  const parsed = ReportDocument.safeParse(stored)
  if (parsed.success) return parsed.data as Report
  const issue = parsed.error.issues[0]
  throw new DamagedReportError(`the stored report is damaged at ${issue?.path.join('.') || 'its top'}: ${issue?.message ?? 'unknown'}`)
}

/**
 * Counts per verdict from a report, or from any object carrying a report's `summary` (the stored
 * head `check_runs.summary`); null when there is none (a run that has not finished).
 * e.g. `verdictCountsOf({ summary: { claims: 3, verified: 2, mismatch: 1, … } }).mismatch === 1`.
 */
export function verdictCountsOf(report: unknown): VerdictCounts | null {
  const parsed = storedCounts.safeParse(report)
  return parsed.success ? parsed.data.summary : null
}

// A count missing from a stored summary reads as 0; a summary without its claim count is none.
const count = z.number().int().catch(0)
const storedCounts = z.object({
  summary: z.object({ claims: z.number().int(), verified: count, mismatch: count, unsupported: count, error: count })
    .transform(({ claims, verified, mismatch, unsupported, error }) => ({ claims, verified, mismatch, unsupported, error })),
})
