import { cp, writeFile } from 'node:fs/promises'
import { resolve } from 'node:path'
import { buildStampFile, sourceHash } from './scripts/source-hash'

export default defineNuxtConfig({
  // Root-level layout: keep Nuxt from switching to an `app/` folder if one ever appears.
  modules: ['@nuxt/eslint', '@nuxtjs/tailwindcss', '@pinia/nuxt', '@vueuse/nuxt', 'nuxt-auth-utils'],
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
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
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
  compatibilityDate: '2026-01-01',
  nitro: {
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
  typescript: { strict: true },
  telemetry: false,
  eslint: { config: { stylistic: true } },
})
