// Hosewright — Nuxt configuration. Nothing here may fetch from the network at build or run time.
import { cpSync, existsSync } from 'node:fs'
import { resolve } from 'node:path'

// HOSEWRIGHT_BUILD_TAG gives a build its own .nuxt-<tag>/.output-<tag> folders, so several
// builds of one checkout (e.g. parallel work, or a benchmark build) do not overwrite each other.
const buildTag = process.env.HOSEWRIGHT_BUILD_TAG

export default defineNuxtConfig({
  ...(buildTag ? { buildDir: `.nuxt-${buildTag}` } : {}),
  compatibilityDate: '2026-01-01',
  telemetry: false,
  devtools: { enabled: false },
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils'],
  css: ['@fontsource/atkinson-hyperlegible/400.css', '@fontsource/atkinson-hyperlegible/700.css'],
  tailwindcss: { cssPath: '~/assets/css/tailwind.css', viewer: false },
  app: {
    head: {
      title: 'Hosewright',
      htmlAttrs: { lang: 'en' },
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Coolant and fuel plumbing for engine swaps: draw, check, sign off, fit.' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    session: { maxAge: 60 * 60 * 12 },
  },
  typescript: { strict: true, typeCheck: false },
  nitro: {
    ...(buildTag ? { output: { dir: `.output-${buildTag}` } } : {}),
    hooks: {
      // The built server applies its own migrations at start; ship them inside .output.
      compiled(nitro) {
        const from = resolve(nitro.options.rootDir, 'drizzle')
        const to = resolve(nitro.options.output.serverDir, 'drizzle')
        if (existsSync(from)) cpSync(from, to, { recursive: true })
      },
    },
  },
})
