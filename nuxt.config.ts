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
    databaseUrl: 'postgres://postgres@127.0.0.1:54329/scholium',
    s3: {
      endpoint: 'http://127.0.0.1:4569',
      region: 'us-east-1',
      bucket: 'scholium-sources',
      accessKeyId: 'S3RVER',
      secretAccessKey: 'S3RVER',
      forcePathStyle: true,
    },
    smtp: { host: '127.0.0.1', port: 2525, secure: false, user: '', pass: '', from: 'Scholium <no-reply@scholium.local>' },
    mailInboxUrl: 'http://127.0.0.1:2526',
    publicBaseUrl: 'http://127.0.0.1:3000',
    session: { password: '', maxAge: 60 * 60 * 24 * 7 },
  },
  typescript: {
    strict: true,
    tsConfig: { exclude: ['../scripts/**', '../tests/**', '../migrations/**', '../bin/**', '../vitest.config.ts', '../eslint.config.mjs'] },
  },
})
