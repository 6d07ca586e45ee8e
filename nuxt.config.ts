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
  // Security headers on every response (issue 11). Hand-written here: nuxt-security 2.6 needs
  // Node 24, and 2.5.1 reshuffled much of the lockfile and brings its own request-size and rate
  // limiters. 'unsafe-inline' for styles: KaTeX sets inline styles on every formula and Vue
  // binds style attributes; for scripts: Nuxt's SSR pages carry an inline bootstrap script.
  routeRules: {
    '/**': {
      headers: {
        'content-security-policy': [
          'default-src \'self\'', 'script-src \'self\' \'unsafe-inline\'', 'style-src \'self\' \'unsafe-inline\'',
          'font-src \'self\' data:', 'img-src \'self\' data:', 'connect-src \'self\'', 'object-src \'none\'',
          'base-uri \'self\'', 'form-action \'self\'', 'frame-ancestors \'none\'',
        ].join('; '),
        'x-content-type-options': 'nosniff',
        'x-frame-options': 'DENY',
        // Reset and invitation links carry their token in the path: never send it onwards.
        'referrer-policy': 'no-referrer',
        'permissions-policy': 'camera=(), microphone=(), geolocation=()',
      },
    },
  },
  // Runtime values come from NUXT_* environment variables at start-up; the
  // defaults here are the local fakes on loopback (see README "Configuration").
  runtimeConfig: {
    ...LOCAL_DEFAULTS,
    // Secure is decided at start-up from NUXT_PUBLIC_BASE_URL (server/middleware/01.session.ts).
    session: { password: '', maxAge: 60 * 60 * 24 * 7, cookie: { httpOnly: true, sameSite: 'lax', secure: false, path: '/' } },
  },
  typescript: {
    strict: true,
    tsConfig: { exclude: ['../scripts/**', '../tests/**', '../migrations/**', '../bin/**', '../vitest.config.ts', '../eslint.config.mjs'] },
  },
})
