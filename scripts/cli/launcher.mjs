#!/usr/bin/env node
// The installed `scholium` command (copied to dist/cli/scholium.mjs by scripts/build-cli.mjs).
// It compiles the bundled command, scholium.cjs, with the V8 code cache made at build time
// (scholium.code-cache): parsing and compiling the bundle was a third of a small check's time
// past Node's own start. V8 checks the cache against its version, flags and the source, and
// rejects one that does not fit (another Node, a damaged file); the bundle is then compiled
// from source, only more slowly. SCHOLIUM_CODE_CACHE_OUT=<file> writes a fresh cache after the
// run (the build does this with a sample check, so that the functions it uses are in it).
import { readFileSync, writeFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Script } from 'node:vm'

const here = dirname(fileURLToPath(import.meta.url))
const bundle = join(here, 'scholium.cjs')
let cachedData
try {
  cachedData = readFileSync(join(here, 'scholium.code-cache'))
}
catch {
  cachedData = undefined
}
const script = new Script(`(function (exports, require, module, __filename, __dirname) {${readFileSync(bundle, 'utf8')}\n})`, { filename: bundle, cachedData })
const module = { exports: {} }
script.runInThisContext()(module.exports, createRequire(bundle), module, bundle, here)
await module.exports.runProcess(process.argv.slice(2))
if (process.env.SCHOLIUM_CODE_CACHE_OUT) writeFileSync(process.env.SCHOLIUM_CODE_CACHE_OUT, script.createCachedData())
