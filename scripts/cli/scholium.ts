/**
 * Entry point of the `scholium` command (bin/scholium.mjs loads it through tsx).
 * Sets the exit code instead of calling process.exit, so that a large JSON report piped
 * to another program is written out completely.
 */
import { EXIT, runCli } from './main'

try {
  process.exitCode = await runCli(process.argv.slice(2), {
    out: text => process.stdout.write(text),
    err: text => process.stderr.write(text),
    colour: process.stdout.isTTY === true && !process.env.NO_COLOR,
  })
}
catch (error) {
  process.stderr.write(`scholium: internal error: ${(error as Error)?.stack ?? String(error)}\n`)
  process.exitCode = EXIT.internal
}
