/**
 * Command-line arguments of `scholium check`, parsed without a library so that every
 * refusal has its own clear message.
 *
 *   scholium check <source> [--format text|json|junit|annotations] [--json] [--convention <id>]… [--main <file>] [--fix <out.patch>] [--script-for <claim id>]
 *
 * A parse never throws: it gives either the options or a usage problem (exit code 2).
 */
import { ALL_CONVENTION_IDS, axisOfConvention, type ConventionAxis, type ConventionId, type ConventionSet } from '../../shared/types/conventions'

/** How the report is printed: for people, as JSON, as JUnit XML, or as CI annotations. */
export const OUTPUT_FORMATS = ['text', 'json', 'junit', 'annotations'] as const
export type OutputFormat = typeof OUTPUT_FORMATS[number]

export interface CheckCommand {
  command: 'check'
  /** The .tex file, folder or archive, as given. */
  source: string
  format: OutputFormat
  /** Conventions fixed from the command line, one per axis at most. */
  fixed: Partial<ConventionSet>
  /** The main file inside a folder or archive, relative to its root. */
  main?: string
  /** List the math the reader passed over (text output); its count is always printed. */
  showUnread?: boolean
  /** Write the suggested corrections to this file as a unified diff (`git apply` reads it). */
  fix?: string
  /** Print this claim's runnable SymPy script instead of the report. */
  scriptFor?: string
}

export type ParsedArguments
  = | CheckCommand
    | { command: 'help' }
    | { command: 'version' }
    | { command: 'problem', message: string }

export const USAGE = `Usage: scholium check <file.tex | folder | file.zip | file.tar.gz | arxiv:<id>> [options]

Checks the worked examples of a LaTeX manuscript and marks every line that carries a claim.

arxiv:<id> (e.g. arxiv:2401.01234v2, arxiv:math/0601001) fetches the e-print from
NUXT_ARXIV_BASE_URL (default https://arxiv.org).

Options:
  --format <name>        how to print the report: text (default), json (schema scholium.report/2),
                         junit (JUnit XML, one test case per claim) or annotations (one
                         ::error file=…,line=…:: line per failing claim, for CI)
  --json                 the same as --format json
  --convention <ids>     fix conventions instead of inferring them; repeatable, or comma-separated
                         (--convention xy-plus --convention perm-inverse, --convention=xy-plus,perm-inverse)
  --main <file>          the main file inside a folder or archive (default: the one with \\documentclass)
  --fix <out.patch>      write the corrections Scholium is sure of as a unified diff, one hunk
                         per corrected claim, paths relative to here (apply with git apply)
  --show-unread          list the math Scholium did not read (its count is always printed; never
                         part of the verdicts or the exit status)
  --script-for <id>      print the self-contained SymPy script that recomputes one claim (its id
                         from the report, e.g. main.tex:12:1) instead of the report
  -h, --help             show this text
  --version              print the version of the engine

Convention ids: ${ALL_CONVENTION_IDS.join(', ')}

Exit status: 0 every checked claim verified (unsupported and skipped claims do not count),
             1 at least one claim is wrong or could not be computed (mismatch or error),
             2 the command or its input could not be used (no such path, unreadable archive,
               no .tex file, unknown option or convention),
             3 Scholium itself failed (please report it).`

/** Parse `argv` (without node and the script), e.g. `parseArguments(['check', 'paper.tex', '--json'])`. */
export function parseArguments(argv: readonly string[]): ParsedArguments {
  if (argv.length === 0) return { command: 'problem', message: 'no command given; try `scholium check paper.tex`.' }
  if (argv.includes('-h') || argv.includes('--help') || argv[0] === 'help') return { command: 'help' }
  if (argv[0] === '--version') return { command: 'version' }
  if (argv[0] !== 'check') return { command: 'problem', message: `unknown command "${argv[0]}"; the command is \`scholium check <source>\`.` }

  const sources: string[] = []
  const conventionIds: string[] = []
  let format: OutputFormat | undefined
  const chooseFormat = (wanted: OutputFormat): string | null => {
    if (format !== undefined && format !== wanted) return `--format ${format} and --format ${wanted} ask for two outputs; give one.`
    format = wanted
    return null
  }
  let main: string | undefined
  let showUnread = false
  let fix: string | undefined
  let scriptFor: string | undefined
  let onlyPositional = false
  for (let i = 1; i < argv.length; i++) {
    const arg = argv[i]!
    if (onlyPositional || !arg.startsWith('-') || arg === '-') {
      sources.push(arg)
      continue
    }
    if (arg === '--') { onlyPositional = true; continue }
    const eq = arg.indexOf('=')
    const name = eq >= 0 ? arg.slice(0, eq) : arg
    const inlineValue = eq >= 0 ? arg.slice(eq + 1) : undefined
    const takeValue = (): string | null => {
      if (inlineValue !== undefined) return inlineValue
      const next = argv[i + 1]
      if (next === undefined || (next.startsWith('--') && next.length > 2)) return null
      i++
      return next
    }
    switch (name) {
      case '--json':
        if (inlineValue !== undefined) return { command: 'problem', message: '--json takes no value.' }
        {
          const clash = chooseFormat('json')
          if (clash) return { command: 'problem', message: clash }
        }
        break
      case '--format': {
        const value = takeValue()
        if (value === null || !(OUTPUT_FORMATS as readonly string[]).includes(value)) {
          return { command: 'problem', message: `--format needs one of ${OUTPUT_FORMATS.join(', ')}.` }
        }
        const clash = chooseFormat(value as OutputFormat)
        if (clash) return { command: 'problem', message: clash }
        break
      }
      case '--convention': {
        const value = takeValue()
        if (value === null || value.trim() === '') return { command: 'problem', message: `--convention needs an id; valid ids: ${ALL_CONVENTION_IDS.join(', ')}.` }
        conventionIds.push(...value.split(',').map(s => s.trim()).filter(s => s !== ''))
        break
      }
      case '--main': {
        const value = takeValue()
        if (value === null || value === '') return { command: 'problem', message: '--main needs a file name, e.g. --main paper.tex.' }
        main = value
        break
      }
      case '--fix': {
        const value = takeValue()
        if (value === null || value === '') return { command: 'problem', message: '--fix needs a file to write the patch to, e.g. --fix corrections.patch.' }
        fix = value
        break
      }
      case '--show-unread':
        if (inlineValue !== undefined) return { command: 'problem', message: '--show-unread takes no value.' }
        showUnread = true
        break
      case '--script-for': {
        const value = takeValue()
        if (value === null || value === '') return { command: 'problem', message: '--script-for needs a claim id, e.g. --script-for main.tex:12:1.' }
        scriptFor = value
        break
      }
      default:
        return { command: 'problem', message: `unknown option "${name}"; see scholium --help.` }
    }
  }
  if (sources.length === 0) return { command: 'problem', message: 'no source given; name a .tex file, a folder, or a .zip / .tar.gz archive.' }
  if (sources.length > 1) return { command: 'problem', message: `one source at a time (got ${sources.length}: ${sources.join(', ')}); put the files in a folder or an archive.` }

  const fixed: Partial<Record<ConventionAxis, ConventionId>> = {}
  for (const id of conventionIds) {
    const axis = axisOfConvention(id)
    if (!axis) return { command: 'problem', message: `unknown convention "${id}"; valid ids: ${ALL_CONVENTION_IDS.join(', ')}.` }
    const previous = fixed[axis]
    if (previous !== undefined && previous !== id) return { command: 'problem', message: `conventions "${previous}" and "${id}" choose differently on the same axis (${axis}); give one.` }
    fixed[axis] = id as ConventionId
  }
  return { command: 'check', source: sources[0]!, format: format ?? 'text', fixed: fixed as Partial<ConventionSet>, ...(main !== undefined ? { main } : {}), ...(showUnread ? { showUnread } : {}), ...(fix !== undefined ? { fix } : {}), ...(scriptFor !== undefined ? { scriptFor } : {}) }
}
