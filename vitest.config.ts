import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('.', import.meta.url))
const alias = { '#shared': `${root}shared`, '~~': root.replace(/\/$/, '') }

// Three suites: unit (pure code), api (HTTP against the built server on a test database),
// e2e (headless Chromium against the same server). scripts/test.sh runs them in that order.
// A fourth, reliability, starts (and kills) built servers of its own; it runs last.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      { resolve: { alias }, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      {
        resolve: { alias },
        test: {
          name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node',
          testTimeout: 30_000, hookTimeout: 60_000, fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node',
          testTimeout: 90_000, hookTimeout: 90_000, fileParallelism: false,
        },
      },
      // ── reliability: crash, shutdown, start-up and log checks (how to run them: docs/reliability.md)
      {
        resolve: { alias },
        test: {
          name: 'reliability', include: ['tests/reliability/**/*.test.ts'], environment: 'node',
          testTimeout: 240_000, hookTimeout: 120_000, fileParallelism: false,
        },
      },
    ],
  },
})
