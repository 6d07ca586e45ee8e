/**
 * `scholium check`: reads a manuscript from disk, checks it with the same pipeline as the
 * server (shared/check), and prints the report as text or JSON. No database, no network.
 *
 * Exit codes (also in USAGE): 0 all checked claims verified; 1 a mismatch or an error claim;
 * 2 bad command or input; 3 an internal failure.
 */
import { checkManuscript, correctionsPatch } from '../../shared/check'
import { reproduceScript } from '../../shared/check/reproduce-script'
import { ENGINE_VERSION } from '../../shared/math'
import type { Report } from '../../shared/types/report'
import { parseArguments, USAGE, type CheckCommand } from './args'
import { painter, renderReport } from './render'
import { prefixer, renderAnnotations, renderJunit } from './ci-formats'
import { readSource, SourceProblem, type SourceFiles } from './sources'
import { writeFile } from 'node:fs/promises'

export const EXIT = { ok: 0, failed: 1, badInput: 2, internal: 3 } as const

export interface CliIo {
  out: (text: string) => void
  err: (text: string) => void
  /** Colour the text report (a terminal, NO_COLOR unset). */
  colour: boolean
}

/** Run the command line; returns the exit code. e.g. `await runCli(['check', 'paper.tex'], io)`. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const parsed = parseArguments(argv)
  switch (parsed.command) {
    case 'help': io.out(`${USAGE}\n`); return EXIT.ok
    case 'version': io.out(`scholium engine ${ENGINE_VERSION}\n`); return EXIT.ok
    case 'problem': io.err(`scholium: ${parsed.message}\n`); return EXIT.badInput
    case 'check': return runCheck(parsed, io)
  }
}

async function runCheck(command: CheckCommand, io: CliIo): Promise<number> {
  let source: SourceFiles
  try {
    source = await readSource(command.source)
  }
  catch (error) {
    if (error instanceof SourceProblem) { io.err(`scholium: ${error.message}\n`); return EXIT.badInput }
    const errno = error as NodeJS.ErrnoException
    if (typeof errno?.code === 'string' && typeof errno.path === 'string') {
      io.err(`scholium: ${errno.path}: cannot be read (${errno.code}).\n`)
      return EXIT.badInput
    }
    throw error
  }
  const main = command.main ?? source.main
  if (command.main !== undefined && !source.files.some(f => f.path === command.main)) {
    io.err(`scholium: --main ${command.main}: no such file in ${command.source} (files: ${source.files.map(f => f.path).join(', ')}).\n`)
    return EXIT.badInput
  }
  const report = checkManuscript({
    files: Object.fromEntries(source.files.map(f => [f.path, new Uint8Array(f.bytes.buffer, f.bytes.byteOffset, f.bytes.length)])),
    hashes: Object.fromEntries(source.files.map(f => [f.path, f.sha256])),
    ...(main !== undefined ? { main } : {}),
  }, { fixed: command.fixed })
  withSkippedFiles(report, source.skipped)
  if (source.main !== undefined && report.warnings.some(w => w.code === 'missing-file')) {
    report.warnings.push({ code: 'single-file', message: `${command.source} was read alone; to include the files it inputs, check its folder instead.` })
  }
  if (command.fix !== undefined) {
    const fixed = report.claims.filter(c => c.correction?.fixed).length
    const unfixed = report.claims.filter(c => c.correction && !c.correction.fixed).length
    try {
      await writeFile(command.fix, correctionsPatch(report.claims, prefixer(command.source, source)))
    }
    catch (error) {
      io.err(`scholium: --fix ${command.fix}: cannot be written (${(error as NodeJS.ErrnoException).code ?? (error as Error).message}).\n`)
      return EXIT.badInput
    }
    io.err(`scholium: ${command.fix}: ${fixed} correction${fixed === 1 ? '' : 's'} written${unfixed ? `; ${unfixed} mismatch${unfixed === 1 ? '' : 'es'} with no automatic correction (see the report)` : ''}.\n`)
  }
  if (command.scriptFor !== undefined) return printScript(report, command.scriptFor, io)
  io.out(formatReport(report, command, source, io.colour))
  return report.summary.mismatch > 0 || report.summary.error > 0 ? EXIT.failed : EXIT.ok
}

/** `--script-for <id>`: one claim's runnable SymPy script, joined from its snippet and the report's library. */
function printScript(report: Report, claimId: string, io: CliIo): number {
  const claim = report.claims.find(c => c.id === claimId)
  if (!claim) { io.err(`scholium: --script-for ${claimId}: no claim with that id (ids look like main.tex:12:1).\n`); return EXIT.badInput }
  const script = reproduceScript(report.reproduceLibrary, claim)
  if (script === null) { io.err(`scholium: --script-for ${claimId}: this claim has no SymPy script (only verified or mismatched claims of kinds SymPy can restate do).\n`); return EXIT.badInput }
  io.out(script)
  return EXIT.ok
}

function formatReport(report: Report, command: CheckCommand, source: SourceFiles, colour: boolean): string {
  // A folder's files are named relative to it; CI wants them relative to where it ran.
  const locate = prefixer(command.source, source)
  switch (command.format) {
    case 'json': return `${JSON.stringify(report, null, 2)}\n`
    case 'junit': return renderJunit(report, locate)
    case 'annotations': return renderAnnotations(report, locate)
    case 'text': return renderReport(report, command.source, painter(colour), [], { showUnread: command.showUnread === true })
  }
}

/** Files left out of a folder are reported as warnings, so that the JSON says so too. */
function withSkippedFiles(report: Report, skipped: SourceFiles['skipped']): void {
  for (const s of skipped) report.warnings.push({ code: 'file-left-out', message: `left out: ${s.reason}`, file: s.path })
}
