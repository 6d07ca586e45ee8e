import { LOCAL_DEFAULTS } from './server/config/defaults'

// Scholium's Nuxt configuration. Everything sits at the repo root (srcDir '.'),
// so there is no app/ folder to wonder about.
export default defineNuxtConfig({
  srcDir: '.',
  // Separate build folders let a second build (a helper's, a benchmark's) run beside the main one.
  buildDir: process.env.SCHOLIUM_BUILD_DIR || '.nuxt',
  nitro: { output: { dir: process.env.SCHOLIUM_OUTPUT_DIR || '.output' } },
  compatibilityDate: '2026-11-01',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils'],
  devtools: { enabled: false },
  telemetry: false,
  css: [
    '@fontsource/crimson-pro/400.css',
    '@fontsource/crimson-pro/400-italic.css',
    '@fontsource/crimson-pro/600.css',
    '@fontsource/crimson-pro/700.css',
    'katex/dist/katex.min.css',
    '~/assets/css/main.css',
  ],
  tailwindcss: { cssPath: false, viewer: false },
  app: {
    head: {
      title: 'Scholium',
      htmlAttrs: { lang: 'en' },
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  // Runtime values come from NUXT_* environment variables at start-up; the
  // defaults here are the local fakes on loopback (see README "Configuration").
  runtimeConfig: {
    ...LOCAL_DEFAULTS,
    session: { password: '', maxAge: 60 * 60 * 24 * 7 },
  },
  typescript: {
    strict: true,
    tsConfig: { exclude: ['../scripts/**', '../tests/**', '../migrations/**', '../bin/**', '../vitest.config.ts', '../eslint.config.mjs'] },
  },
})
