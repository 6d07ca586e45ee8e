/**
 * The report in the two forms CI systems already read:
 * - JUnit XML (`--format junit`): one test case per claim, grouped by file; a mismatch is a
 *   failure, an error claim an error, an unsupported or skipped claim a skipped case.
 * - Workflow annotations (`--format annotations`): one `::error file=…,line=…::message` line per
 *   failing claim (and `::warning` for a mismatch that holds under another convention), the
 *   line format that CI services render beside the diff.
 *
 * File paths are made relative to where the command was pointed: for a folder, the folder is
 * put in front of each manuscript path, so that an annotation names the file in the repository.
 */
import { markOf } from '../../shared/check/marks'
import type { ClaimDiff, Report, ReportClaim } from '../../shared/types/report'
import type { SourceFiles } from './sources'

/**
 * Where a manuscript path lives in the caller's tree: a single .tex file is named as given, a
 * folder's files get the folder in front, an archive's files keep their path inside it.
 * e.g. `prefixer('paper/', { files, skipped: [] })('main.tex') === 'paper/main.tex'`.
 */
export function prefixer(source: string, read: Pick<SourceFiles, 'main' | 'origin'>): (path: string) => string {
  if (read.origin === 'file') return path => (path === read.main ? source : path)
  if (read.origin === 'archive') return path => path
  const folder = source.replace(/\/+$/, '')
  return path => (folder === '' || folder === '.' ? path : `${folder}/${path}`)
}

/** The report as JUnit XML; e.g. `renderJunit(report, p => p)` starts with `<?xml`. */
export function renderJunit(report: Report, locate: (path: string) => string): string {
  const byFile = new Map<string, ReportClaim[]>()
  for (const claim of report.claims) {
    const list = byFile.get(claim.file) ?? []
    list.push(claim)
    byFile.set(claim.file, list)
  }
  const seconds = (report.summary.durationMs / 1000).toFixed(3)
  const out = ['<?xml version="1.0" encoding="UTF-8"?>']
  out.push(`<testsuites name="scholium" tests="${report.claims.length}" failures="${report.summary.mismatch}" errors="${report.summary.error}" time="${seconds}">`)
  for (const [file, claims] of byFile) {
    const count = (pick: (c: ReportClaim) => boolean) => claims.filter(pick).length
    out.push(`  <testsuite name="${xml(locate(file))}" tests="${claims.length}" failures="${count(c => c.verdict === 'mismatch')}" errors="${count(c => c.verdict === 'error')}" skipped="${count(c => c.verdict === 'unsupported')}">`)
    for (const claim of claims) {
      const name = `line ${claim.line}: ${oneLine(claim.source)}`
      const head = `    <testcase classname="${xml(locate(file))}" name="${xml(name)}" file="${xml(locate(file))}" line="${claim.line}"`
      switch (claim.verdict) {
        case 'verified':
          out.push(`${head}/>`)
          break
        case 'mismatch':
          out.push(`${head}>`, `      <failure message="${xml(claim.message)}" type="${markOf(claim)}">${xml(diffText(claim))}</failure>`, '    </testcase>')
          break
        case 'error':
          out.push(`${head}>`, `      <error message="${xml(claim.message)}" type="error"/>`, '    </testcase>')
          break
        case 'unsupported':
          out.push(`${head}>`, `      <skipped message="${xml(claim.message)}"/>`, '    </testcase>')
          break
      }
    }
    out.push('  </testsuite>')
  }
  out.push('</testsuites>')
  return out.join('\n') + '\n'
}

/** One annotation line per mismatch or error claim; e.g. `::error file=paper.tex,line=8,title=Scholium mismatch::…`. */
export function renderAnnotations(report: Report, locate: (path: string) => string): string {
  const lines: string[] = []
  for (const claim of report.claims) {
    const mark = markOf(claim)
    if (mark !== 'mismatch' && mark !== 'error' && mark !== 'otherConvention') continue
    const level = mark === 'otherConvention' ? 'warning' : 'error'
    const title = mark === 'otherConvention' ? 'Scholium: holds only under another convention' : `Scholium ${mark}`
    const properties = [`file=${property(locate(claim.file))}`, `line=${claim.line}`]
    if (claim.endLine > claim.line) properties.push(`endLine=${claim.endLine}`)
    properties.push(`title=${property(title)}`)
    const detail = claim.verdict === 'mismatch' ? diffText(claim) : ''
    lines.push(`::${level} ${properties.join(',')}::${message([claim.message, detail].filter(Boolean).join('\n'))}`)
  }
  return lines.length > 0 ? lines.join('\n') + '\n' : ''
}

/** The difference as plain text, a line per part, cut at a few terms a part. */
function diffText(claim: ReportClaim): string {
  const diff: ClaimDiff | null = claim.diff
  if (!diff) return claim.computed !== null ? `computed: ${claim.computed}` : ''
  switch (diff.basis) {
    case 'number': return `written ${diff.claimed}, computed ${diff.computed}`
    case 'invariant': return `${diff.invariant}: written ${diff.claimed}, computed ${diff.computed}`
    case 'property': return `${diff.property} fails: ${diff.computed}`
    default: {
      const terms = (list: { coefficient: string, term: string }[], total: number | undefined) => {
        const shown = list.slice(0, 8).map(t => `${t.coefficient}·${t.term}`).join(', ')
        const cut = Math.max(total ?? list.length, list.length) - Math.min(list.length, 8)
        return cut > 0 ? `${shown} (and ${cut} more)` : shown
      }
      const parts: string[] = []
      if (diff.missing.length > 0) parts.push(`missing: ${terms(diff.missing, diff.truncated?.missing)}`)
      if (diff.extra.length > 0) parts.push(`extra: ${terms(diff.extra, diff.truncated?.extra)}`)
      if (diff.wrongCoefficient.length > 0) parts.push(`wrong coefficients: ${diff.wrongCoefficient.slice(0, 8).map(w => `${w.term} written ${w.claimed}, computed ${w.computed}`).join('; ')}`)
      for (const note of diff.notes ?? []) parts.push(note)
      return parts.join('\n')
    }
  }
}

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim()
}

/** XML text and attribute escaping; control characters XML 1.0 forbids are dropped. */
function xml(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '')
    .replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')
}

/** The escaping of an annotation's message: %, CR and LF. */
function message(text: string): string {
  return text.replace(/%/g, '%25').replace(/\r/g, '%0D').replace(/\n/g, '%0A')
}

/** The escaping of an annotation's properties: the message escapes plus `:` and `,`. */
function property(text: string): string {
  return message(text).replace(/:/g, '%3A').replace(/,/g, '%2C')
}
