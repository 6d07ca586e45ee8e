/**
 * Runs `scholium` for this process: the development launcher (scripts/cli/scholium.ts) and the
 * bundled command (scripts/cli/launcher.mjs) both end here.
 * Sets the exit code instead of calling process.exit, so that a large JSON report piped
 * to another program is written out completely.
 */
import { EXIT, runCli } from './main'

export async function runProcess(argv: readonly string[]): Promise<void> {
  try {
    process.exitCode = await runCli(argv, {
      out: text => process.stdout.write(text),
      err: text => process.stderr.write(text),
      colour: process.stdout.isTTY === true && !process.env.NO_COLOR,
    })
  }
  catch (error) {
    process.stderr.write(`scholium: internal error: ${(error as Error)?.stack ?? String(error)}\n`)
    process.exitCode = EXIT.internal
  }
}
