// Builds the `scholium` command into one ESM file with esbuild, so that it starts without
// compiling TypeScript at run time, and lays out an installable package around it:
//   dist/cli/scholium.mjs    the whole command (engine, reader, check core, archive reading)
//   dist/cli/package.json    name, version, bin; no dependencies (they are inside the bundle)
// `npm run build` runs it after nuxt build; `npm run pack:cli` packs dist/cli into
// scholium-<version>.tgz, which `npm install -g ./scholium-<version>.tgz` installs.
import { build } from 'esbuild'
import { copyFileSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = join(dirname(fileURLToPath(import.meta.url)), '..')
const out = join(root, 'dist/cli')
const app = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'))

mkdirSync(out, { recursive: true })
await build({
  entryPoints: [join(root, 'scripts/cli/scholium.ts')],
  outfile: join(out, 'scholium.mjs'),
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  minify: false,
  legalComments: 'none',
  logLevel: 'warning',
  banner: {
    // Bundled CommonJS dependencies (yauzl, tar-stream) call require() for Node's own modules.
    js: "#!/usr/bin/env node\nimport { createRequire as __scholiumRequire } from 'node:module'\nconst require = __scholiumRequire(import.meta.url)",
  },
})
writeFileSync(join(out, 'package.json'), `${JSON.stringify({
  name: app.name,
  version: app.version,
  description: app.description,
  type: 'module',
  engines: app.engines,
  bin: { scholium: './scholium.mjs' },
  files: ['scholium.mjs', 'README.md'],
  license: 'UNLICENSED',
}, null, 2)}\n`)
copyFileSync(join(root, 'scripts/cli/PACKAGE-README.md'), join(out, 'README.md'))
console.log(`built ${join('dist/cli', 'scholium.mjs')}`)
