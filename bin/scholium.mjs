#!/usr/bin/env node
// The `scholium` command: registers tsx so that Node can load the TypeScript sources,
// then runs the command line in scripts/cli/. Usage: scholium check <source> [--json].
import { register } from 'tsx/esm/api'

register()
await import(new URL('../scripts/cli/scholium.ts', import.meta.url).href)
