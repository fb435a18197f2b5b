import { describe, expect, it } from 'vitest'
import { startApp } from './lib/app'
import { freshDatabase } from './lib/database'

// A wrong setting stops the server before it listens: exit code 78 (EX_CONFIG, BSD sysexits.h) and
// one line per bad variable on stderr, without echoing any value (several are secrets).

async function failedStart(env: Record<string, string | undefined>) {
  const app = await startApp(env, { waitUntilHealthy: false })
  const timer = setTimeout(() => app.proc.kill('SIGKILL'), 20_000)
  const exit = await app.exited
  clearTimeout(timer)
  return { exit, stderr: app.err.join('\n'), stdout: app.out.join('\n') }
}

describe('configuration checked at start', () => {
  it('lists every bad variable and exits 78', async () => {
    const secret = 'short-secret'
    const { exit, stderr } = await failedStart({
      DATABASE_URL: 'mysql://db.example.test/hosewright',
      NUXT_SESSION_PASSWORD: secret,
      HOSEWRIGHT_PHOTO_MAX_MB: 'ten',
      HOSEWRIGHT_MAIL_POLL_MS: '-5',
      SMTP_PORT: '70000',
      S3_ENDPOINT: 'not an address',
      S3_ACCESS_KEY_ID: 'only-the-id',
      HOSEWRIGHT_TRUST_PROXY: 'maybe',
    })
    expect(exit).toEqual({ code: 78, signal: null })
    expect(stderr).toMatch(/Hosewright cannot start: 8 settings are wrong/)
    const problems = Object.fromEntries(stderr.split('\n').filter(l => l.startsWith('  - ')).map(l => l.slice(4).split(/: (.*)/s, 2) as [string, string]))
    expect(Object.keys(problems).sort()).toEqual(['DATABASE_URL', 'HOSEWRIGHT_MAIL_POLL_MS', 'HOSEWRIGHT_PHOTO_MAX_MB', 'HOSEWRIGHT_TRUST_PROXY',
      'NUXT_SESSION_PASSWORD', 'S3_ENDPOINT', 'S3_SECRET_ACCESS_KEY', 'SMTP_PORT'])
    expect(problems.NUXT_SESSION_PASSWORD).toMatch(/at least 32 characters/)
    expect(problems.DATABASE_URL).toMatch(/postgres/)
    expect(problems.SMTP_PORT).toMatch(/65535/)
    expect(problems.HOSEWRIGHT_PHOTO_MAX_MB).toMatch(/number/)
    expect(stderr).not.toContain(secret)
    expect(stderr).not.toContain('db.example.test')
  })

  it('names the required variables when they are missing', async () => {
    const { exit, stderr } = await failedStart({ DATABASE_URL: undefined, NUXT_SESSION_PASSWORD: undefined })
    expect(exit.code).toBe(78)
    expect(stderr).toMatch(/ {2}- DATABASE_URL: required/)
    expect(stderr).toMatch(/ {2}- NUXT_SESSION_PASSWORD: required/)
  })
})

describe('a port already in use', () => {
  it('stops the second server with exit code 1 and says why, instead of running without listening', async () => {
    const databaseUrl = await freshDatabase('port')
    const first = await startApp({ DATABASE_URL: databaseUrl })
    try {
      const second = await startApp({ DATABASE_URL: databaseUrl, HOSEWRIGHT_SKIP_MIGRATE: '1' }, { port: first.port, waitUntilHealthy: false })
      const timer = setTimeout(() => second.proc.kill('SIGKILL'), 20_000)
      const exit = await second.exited
      clearTimeout(timer)
      expect(exit).toEqual({ code: 1, signal: null })
      expect(second.err.join('\n')).toMatch(new RegExp(`cannot listen on 127\\.0\\.0\\.1:${first.port}: the address is already in use \\(EADDRINUSE\\)`))
    } finally {
      first.proc.kill('SIGKILL')
      await first.exited
    }
  })
})
