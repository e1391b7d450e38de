import { existsSync } from 'node:fs'
import { cp, writeFile } from 'node:fs/promises'
import { resolve } from 'node:path'
import { buildStampFile, sourceHash } from './scripts/source-hash'

// Nuxt and unhead each install the same hookable 6 under their own folder, so the browser got it twice;
// nitropack keeps the hoisted hookable 5. Nuxt's copy serves both in the app's bundle when it is there.
const nuxtHookable = resolve(import.meta.dirname, 'node_modules/nuxt/node_modules/hookable')

export default defineNuxtConfig({
  // Root-level layout: keep Nuxt from switching to an `app/` folder if one ever appears.
  modules: ['@nuxt/eslint', '@nuxtjs/tailwindcss', '@pinia/nuxt', '@vueuse/nuxt', 'nuxt-auth-utils', '@vite-pwa/nuxt', 'nuxt-security'],
  imports: { dirs: ['stores', 'composables'] },
  devtools: { enabled: false },
  app: {
    head: {
      htmlAttrs: { lang: 'en' },
      title: 'Switchback',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1, viewport-fit=cover' },
        { name: 'description', content: 'Strength, hill and drill routines for running coaches and their athletes.' },
        { name: 'theme-color', content: '#1f4d3a' },
      ],
      link: [
        { rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' },
        { rel: 'manifest', href: '/manifest.webmanifest' },
        { rel: 'apple-touch-icon', href: '/icons/apple-touch-icon-180.png' },
      ],
    },
  },
  css: ['~/assets/css/main.css'],
  runtimeConfig: {
    session: { maxAge: 60 * 60 * 24 * 30, password: '' },
    // NUXT_PUBLIC_PLAYER_SPEED_PARAM=true lets `?speed=` run the session player faster (tests, demos).
    public: { playerSpeedParam: false },
  },
  srcDir: '.',
  serverDir: 'server',
  routeRules: {
    // The app shell the service worker opens athlete pages from when there is no network: rendered in
    // the browser, so it carries no one's data and reads everything from the worker's cache.
    '/offline-shell': { ssr: false },
    // Private answers are never stored by browsers or proxies.
    // JSON answers carry no markup, so they need no CSP nonce (nuxt-security makes one per request otherwise).
    '/api/**': { headers: { 'cache-control': 'no-store', 'content-security-policy': 'default-src \'none\'; frame-ancestors \'none\'' }, security: { nonce: false } },
    '/exports/**': { headers: { 'cache-control': 'no-store' } },
  },
  // Speed (docs/performance.md): links fetch their page's code when touched or focused, not as soon as
  // they scroll into view, so a phone opening one page does not download the whole navigation's pages;
  // and shared modules smaller than ~20 KB are merged into their neighbours instead of each being a request.
  // No app manifest and no payload files: nothing here reads route rules in the browser, reloads on a new
  // deployment (the service worker prompts for updates) or prerenders pages, so that code leaves the first load.
  experimental: { appManifest: false, payloadExtraction: false, defaults: { nuxtLink: { prefetchOn: { visibility: false, interaction: true } } } },
  compatibilityDate: '2026-01-01',
  nitro: {
    // Scripts, styles and fonts go out pre-compressed (brotli and gzip), chosen by Accept-Encoding.
    compressPublicAssets: { brotli: true, gzip: true },
    experimental: { tasks: false },
    hooks: {
      // The built server migrates its database at start, so it ships the migrations beside itself.
      async compiled(nitro) {
        await cp(resolve(nitro.options.rootDir, 'server/db/migrations'), resolve(nitro.options.output.serverDir, 'migrations'), { recursive: true })
        // The tests compare this with the sources before they run the built server (tests/setup/fresh-build.ts).
        if (!nitro.options.dev) {
          await writeFile(resolve(nitro.options.rootDir, buildStampFile), JSON.stringify({ sourceHash: sourceHash(nitro.options.rootDir), builtAt: new Date().toISOString() }))
        }
      },
    },
  },
  vite: {
    // Every component here is written with <script setup>: Vue's options API (data, methods, mixins) is left
    // out of the bundle.
    vue: { features: { optionsAPI: false } },
    // nuxt-auth-utils' client plugin brings its own unctx 3 for one helper the app's unctx 2 has too.
    resolve: { dedupe: ['unctx'], alias: existsSync(nuxtHookable) ? { hookable: nuxtHookable } : {} },
    build: { rollupOptions: { output: { experimentalMinChunkSize: 20_000 } } },
    // Terser rather than esbuild for the browser's scripts: about 4 % smaller gzipped (the session player's cold
    // open 109.9 → 105.6 KB, docs/performance.md) for a few more seconds of build. The server's code stays as is.
    $client: { build: { minify: 'terser' } },
  },
  typescript: { strict: true },
  telemetry: false,
  hooks: {
    // No prefetch links in the HTML for code the page may load later (runner, finish form, other pages):
    // on a phone they competed with the page's own first paint, and the service worker keeps every chunk
    // for offline use once installed anyway.
    'build:manifest'(manifest) {
      for (const chunk of Object.values(manifest)) chunk.prefetch = false
    },
    // Our error handler runs first and only reshapes errors (database faults → 503, request ids);
    // Nuxt's and Nitro's own handlers still render them.
    'nitro:config'(nitroConfig) {
      nitroConfig.errorHandler = [resolve(import.meta.dirname, 'server/error-handler.ts'), ...[nitroConfig.errorHandler ?? []].flat()]
    },
  },
  eslint: { config: { stylistic: true } },
  // Installable app and service worker (production builds only; see docs/offline.md).
  pwa: {
    strategies: 'injectManifest',
    srcDir: 'service-worker',
    filename: 'sw.ts',
    registerType: 'prompt',
    injectRegister: false,
    registerWebManifestInRouteRules: true,
    client: { registerPlugin: true, installPrompt: false, periodicSyncForUpdates: 3600 },
    devOptions: { enabled: false },
    manifest: {
      id: '/',
      name: 'Switchback — strength, hills and drills',
      short_name: 'Switchback',
      description: 'Strength, hill and drill routines for running coaches and their athletes; sessions run with no signal.',
      start_url: '/',
      scope: '/',
      display: 'standalone',
      orientation: 'any',
      // pine-800 and granite-50 from tailwind.config.ts
      theme_color: '#1f4d3a',
      background_color: '#f6f6f4',
      icons: [
        { src: '/icons/icon-64.png', sizes: '64x64', type: 'image/png' },
        { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
        { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
        { src: '/icons/maskable-192.png', sizes: '192x192', type: 'image/png', purpose: 'maskable' },
        { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      ],
    },
    injectManifest: {
      globPatterns: ['_nuxt/**/*.{js,css,woff2}', 'icons/*.png', 'favicon.svg', 'offline.htm'],
      // Rendered by the server at install time, so it carries this server's runtime settings.
      additionalManifestEntries: [{ url: '/offline-shell', revision: String(Date.now()) }],
      rollupFormat: 'iife',
    },
  },
  // Security headers from nuxt-security. The object store's origin, HSTS and upgrade-insecure-requests
  // depend on the deployment, so server/plugins/security-headers.ts adds them at run time from the config.
  // The module's own rate limiter, size limiter, XSS filter and CORS handler are off on purpose: the
  // limits live in the database (server/utils/rate-limit.ts, throttle.ts) so they hold across replicas,
  // the body cap counts bytes while reading (server/middleware/01.body-limit.ts), zod checks input, and
  // no other origin may call the API. See docs/security.md.
  security: {
    nonce: true,
    removeLoggers: false,
    rateLimiter: false,
    requestSizeLimiter: false,
    xssValidator: false,
    corsHandler: false,
    allowedMethodsRestricter: false,
    hidePoweredBy: true,
    headers: {
      // Clips and posters come from the object store's origin; cross-origin isolation is not needed.
      crossOriginEmbedderPolicy: false,
      crossOriginOpenerPolicy: 'same-origin',
      crossOriginResourcePolicy: 'same-origin',
      contentSecurityPolicy: {
        'default-src': ['\'self\''],
        'base-uri': ['\'none\''],
        'object-src': ['\'none\''],
        'frame-ancestors': ['\'none\''],
        'form-action': ['\'self\''],
        'script-src': ['\'self\'', '\'strict-dynamic\'', '\'nonce-{{nonce}}\''],
        'script-src-attr': ['\'none\''],
        // Vue binds inline style attributes (progress bars, the timeline), which need 'unsafe-inline'.
        'style-src': ['\'self\'', '\'unsafe-inline\''],
        'img-src': ['\'self\'', 'data:', 'blob:'],
        'media-src': ['\'self\'', 'blob:'],
        'connect-src': ['\'self\''],
        'font-src': ['\'self\'', 'data:'],
        'worker-src': ['\'self\''],
        'manifest-src': ['\'self\''],
        'upgrade-insecure-requests': false,
      },
      referrerPolicy: 'no-referrer',
      strictTransportSecurity: false,
      xContentTypeOptions: 'nosniff',
      xFrameOptions: 'DENY',
      // Camera and microphone for this origin only: form-review clips are recorded in the page. Not per
      // route: after a client-side navigation the policy of the first page loaded still applies.
      permissionsPolicy: {
        'camera': ['self'],
        'display-capture': [],
        'fullscreen': ['self'],
        'geolocation': [],
        'microphone': ['self'],
      },
    },
  },
})
