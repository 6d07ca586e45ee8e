// Builds the `scholium` command into one file with esbuild, so that it starts without
// compiling TypeScript at run time, and lays out an installable package around it:
//   dist/cli/scholium.mjs         the command: a small launcher (scripts/cli/launcher.mjs)
//   dist/cli/scholium.cjs         the whole command (engine, reader, check core, archive reading)
//   dist/cli/scholium.code-cache  V8's code cache of scholium.cjs after a sample check, which
//                                 the launcher hands to V8 (rejected, harmlessly, by another Node)
//   dist/cli/package.json         name, version, bin; no dependencies (they are inside the bundle)
// `npm run build` runs it after nuxt build; `npm run pack:cli` packs dist/cli into
// scholium-<version>.tgz, which `npm install -g ./scholium-<version>.tgz` installs.
import { build } from 'esbuild'
import { execFileSync } from 'node:child_process'
import { copyFileSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = join(dirname(fileURLToPath(import.meta.url)), '..')
const out = join(root, 'dist/cli')
const app = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'))

mkdirSync(out, { recursive: true })
// CommonJS, because a code cache can only be given to a script (vm.Script), not to an ES module.
await build({
  entryPoints: [join(root, 'scripts/cli/process-main.ts')],
  outfile: join(out, 'scholium.cjs'),
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  minify: false,
  legalComments: 'none',
  logLevel: 'warning',
})
copyFileSync(join(root, 'scripts/cli/launcher.mjs'), join(out, 'scholium.mjs'))
const cache = join(out, 'scholium.code-cache')
rmSync(cache, { force: true })
execFileSync(process.execPath, [join(out, 'scholium.mjs'), 'check', join(root, 'tests/fixtures/cli/all-correct.tex')], {
  env: { ...process.env, NO_COLOR: '1', SCHOLIUM_CODE_CACHE_OUT: cache },
  stdio: 'ignore',
})
writeFileSync(join(out, 'package.json'), `${JSON.stringify({
  name: app.name,
  version: app.version,
  description: app.description,
  type: 'module',
  engines: app.engines,
  bin: { scholium: './scholium.mjs' },
  files: ['scholium.mjs', 'scholium.cjs', 'scholium.code-cache', 'README.md'],
  license: 'UNLICENSED',
}, null, 2)}\n`)
copyFileSync(join(root, 'scripts/cli/PACKAGE-README.md'), join(out, 'README.md'))
console.log(`built ${join('dist/cli', 'scholium.mjs')}`)
