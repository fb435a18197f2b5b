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
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils', 'nuxt-security'],
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
      // zod 4 probes `new Function` when it builds object schemas, to compile fast parsers. The
      // content security policy below forbids eval, so the probe can only fail and report a
      // violation; jitless (read from this global) skips it and parses exactly as it would anyway.
      script: [{ innerHTML: 'globalThis.__zod_globalConfig={jitless:true}', tagPosition: 'head' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    // the session cookie: not readable by scripts, not sent on cross-site sub-requests or POSTs,
    // https only (browsers accept Secure cookies from http://127.0.0.1 and localhost too)
    session: { maxAge: 60 * 60 * 12, cookie: { httpOnly: true, secure: true, sameSite: 'lax' } },
  },
  // ── Security (nuxt-security). Pages get a per-request nonce on every script tag Nuxt renders;
  // scripts those load are trusted through 'strict-dynamic' (no 'unsafe-eval', no inline handlers).
  // Styles may be inline: Vue and Konva set style attributes, and pages add <style> through useHead
  // after client-side navigation, where no nonce exists (style injection cannot run code). The
  // analysis worker is a module under /_nuxt (worker-src 'self'); previews are blob:/data: images. Headers
  // that concern every resource (nosniff, referrer policy, frame options) go on API answers too.
  // Off here, done elsewhere: rate limits (PostgreSQL, server/utils/signInLimit.ts), body size
  // (server/middleware/3.bodyGuard.ts: covers PATCH and chunked bodies too), CSRF
  // (server/middleware/2.requestGuard.ts), HSTS (server/middleware/1.hsts.ts: only over https).
  // Its XSS filter would refuse text people legitimately type ("<", quotes): output is escaped instead.
  security: {
    nonce: true,
    sri: true,
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'script-src-attr': ["'none'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'blob:', 'data:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'worker-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        // http://127.0.0.1 in development and tests must keep working; HSTS covers https sites
        'upgrade-insecure-requests': false,
      },
      crossOriginOpenerPolicy: 'same-origin',
      crossOriginResourcePolicy: 'same-origin',
      crossOriginEmbedderPolicy: false,
      // not no-referrer: with it browsers send `Origin: null` on same-origin POSTs (Fetch standard)
      referrerPolicy: 'same-origin',
      strictTransportSecurity: false,
      xContentTypeOptions: 'nosniff',
      xFrameOptions: 'DENY',
      permissionsPolicy: { 'camera': [], 'microphone': [], 'geolocation': [], 'display-capture': [], 'fullscreen': [], 'payment': [], 'usb': [] },
    },
    rateLimiter: false,
    requestSizeLimiter: false,
    xssValidator: false,
    corsHandler: false,
    allowedMethodsRestricter: false,
    csrf: false,
    removeLoggers: false,
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
