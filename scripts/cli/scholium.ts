/**
 * Entry point of the `scholium` command from the checkout (bin/scholium.mjs loads it through tsx).
 * The installed command runs the same runProcess from a bundle (scripts/build-cli.mjs).
 */
import { runProcess } from './process-main'

await runProcess(process.argv.slice(2))
