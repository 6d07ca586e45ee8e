import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

// Three projects so that each layer can be run on its own:
//   unit    — the engine and the reader, plus checks against outside references (no services)
//   server  — API tests against the real PostgreSQL, s3rver and the mail fake (scripts/test.sh starts them)
//   e2e     — browser tests through playwright-core and Debian's chromium against the built server
export default defineConfig({
  // The app's alias for shared/, so tests can import the app's utils/ as Nuxt builds them.
  resolve: { alias: { '#shared': fileURLToPath(new URL('./shared', import.meta.url)) } },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts'],
          testTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
})
