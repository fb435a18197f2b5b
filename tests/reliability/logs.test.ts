import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import sharp from 'sharp'
import { freePort, startApp, stopApp, type App } from './lib/app'
import { AppClient, ownerWithCircuit, password } from './lib/client'
import { freshDatabase } from './lib/database'
import { mailFor, startFakeSmtp, type FakeSmtp } from './lib/fakes'

// What the server writes: JSON lines only, one per request with the fields an operator filters by,
// server errors with their stack, and never a password, a session cookie or a link token. Photo
// storage points at a port nobody listens on, so uploads fail (503) and health reports it.

let smtp: FakeSmtp
let app: App | undefined

beforeAll(async () => {
  smtp = await startFakeSmtp()
  app = await startApp({
    DATABASE_URL: await freshDatabase('logs'), ...smtp.env,
    S3_ENDPOINT: `http://127.0.0.1:${await freePort()}`, S3_BUCKET: 'nowhere', S3_FORCE_PATH_STYLE: '1', S3_ACCESS_KEY_ID: 'x', S3_SECRET_ACCESS_KEY: 'y',
  })
})

afterAll(async () => {
  await stopApp(app, 'SIGKILL')
  await smtp?.stop()
})

describe('structured logs and health', () => {
  it('health answers 200 with the database up and storage down reported beside it', async () => {
    const res = await fetch(`${app!.url}/api/health`)
    expect(res.status).toBe(200)
    expect(await res.json()).toMatchObject({ ok: true, database: 'up', storage: 'down', mail: { worker: 'running', overdue: 0 } })
  })

  it('one JSON line per request, a stack for server errors, no secrets anywhere', async () => {
    const { client, email, circuitId } = await ownerWithCircuit(app!.url, 'logs')
    const signIn = new AppClient(app!.url)
    expect((await signIn.post('/api/session', { email, password })).status).toBe(200)
    const cookie = [...signIn.cookies.values()][0]!
    expect((await new AppClient(app!.url).post('/api/password-resets', { email })).status).toBe(202)
    let mail
    for (let i = 0; i < 100 && !mail; i++) {
      mail = (await mailFor(smtp, email))[0]
      if (!mail) await new Promise(r => setTimeout(r, 100))
    }
    const token = /\/reset-password\/([A-Za-z0-9_-]{43})/.exec(mail!.text)![1]!
    expect((await signIn.get(`/api/password-resets/${token}?token=${token}`)).status).toBe(200)
    const form = new FormData()
    form.append('componentId', 'radiator')
    form.append('file', new Blob([new Uint8Array(await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } }).png().toBuffer())], { type: 'image/png' }), 'x.png')
    expect((await client.request('POST', `/api/circuits/${circuitId}/photos`, form)).status).toBe(503)
    await new Promise(r => setTimeout(r, 200))

    const lines = app!.out
    for (const line of lines) expect(() => JSON.parse(line), line).not.toThrow()
    const records = app!.records()
    for (const r of records) expect(typeof r.time === 'string' && typeof r.level === 'string' && typeof r.msg === 'string').toBe(true)
    const requests = records.filter(r => r.msg === 'request')
    for (const r of requests) {
      expect(Object.keys(r)).toEqual(expect.arrayContaining(['time', 'requestId', 'method', 'path', 'status', 'ms']))
      expect(r.path).not.toContain(token)
    }
    const session = requests.find(r => r.method === 'POST' && r.path === '/api/session')!
    expect(session.status).toBe(200)
    expect(session.userId).toMatch(/^[0-9a-f-]{36}$/)
    expect(requests.some(r => r.path === '/api/password-resets/:token?token=[redacted]')).toBe(true)
    const failed = requests.find(r => r.path === `/api/circuits/${circuitId}/photos`)!
    expect(failed).toMatchObject({ level: 'error', status: 503, error: { statusCode: 503 } })
    expect(failed.error.stack).toMatch(/\n\s+at /)

    const everything = [...app!.out, ...app!.err].join('\n')
    for (const secret of [password, token, cookie, 'reliability-session-password']) expect(everything).not.toContain(secret)
  })
})
