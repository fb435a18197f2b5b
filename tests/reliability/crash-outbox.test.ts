import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createServer, type Server, type Socket } from 'node:net'
import postgres from 'postgres'
import { startApp, stopApp, type App, type AppEnv } from './lib/app'
import { AppClient, ownerWithCircuit } from './lib/client'
import { freshDatabase } from './lib/database'
import { mailFor, startFakeS3, startFakeSmtp, type FakeS3, type FakeSmtp } from './lib/fakes'
import { recordFigures } from './lib/figures'

// The outbox survives kill -9: a mail queued by a route is in the same transaction as the action,
// and a mail the killed process had claimed ("sending") is claimed again when its lease runs out.
// HOSEWRIGHT_MAIL_LEASE_MS is short here so the test need not wait the default five minutes.
const LEASE_MS = 2000

let s3: FakeS3
let smtp: FakeSmtp
let sql: postgres.Sql
let env: AppEnv
let app: App | undefined
let owner: AppClient
let silentSmtp: Server
const held: Socket[] = []

beforeAll(async () => {
  const databaseUrl = await freshDatabase('outbox')
  ;[s3, smtp] = await Promise.all([startFakeS3(), startFakeSmtp()])
  sql = postgres(databaseUrl, { max: 2, onnotice: () => {} })
  env = { DATABASE_URL: databaseUrl, ...s3.env, ...smtp.env, HOSEWRIGHT_MAIL_LEASE_MS: String(LEASE_MS), HOSEWRIGHT_MAIL_RETRY_MS: '500' }
  // an SMTP server that accepts the connection and never greets: delivery hangs mid-way
  silentSmtp = createServer(socket => held.push(socket))
  await new Promise<void>(resolve => silentSmtp.listen(0, '127.0.0.1', resolve))
  app = await startApp(env)
  owner = (await ownerWithCircuit(app.url, 'outbox')).client
})

afterAll(async () => {
  await stopApp(app, 'SIGKILL')
  for (const s of held) s.destroy()
  silentSmtp?.close()
  await sql?.end()
  await Promise.all([s3?.stop(), smtp?.stop()])
})

async function restart(extra: AppEnv = {}) {
  await stopApp(app, 'SIGKILL')
  app = await startApp({ ...env, ...extra })
  owner.base = app.url
}

async function invite(tag: string) {
  const email = `${tag}-${Date.now().toString(36)}@example.test`
  const res = await owner.post('/api/members', { email, role: 'technician', name: `Invited ${tag}` })
  expect(res.status).toBe(201)
  return email
}

async function outboxRow(to: string) {
  const [row] = await sql`select status, attempts from mail_outbox where to_address = ${to}`
  return row as { status: string; attempts: number } | undefined
}

async function waitFor<T>(what: string, probe: () => Promise<T | undefined | false>, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const value = await probe()
    if (value) return value
    if (Date.now() > deadline) throw new Error(`${what}: not within ${timeoutMs} ms`)
    await new Promise(r => setTimeout(r, 100))
  }
}

describe('crash recovery: the mail outbox', () => {
  it('a mail queued while no worker runs is sent once a restarted server has one', async () => {
    await restart({ HOSEWRIGHT_MAIL_WORKER: '0' })
    const to = await invite('queued')
    expect(await outboxRow(to)).toMatchObject({ status: 'pending', attempts: 0 })
    await restart()
    const started = Date.now()
    await waitFor('the mail at the fake SMTP server', async () => (await mailFor(smtp, to)).length > 0, 15_000)
    // the worker marks the row sent just after the SMTP server has accepted the mail
    await waitFor('the row marked sent', async () => (await outboxRow(to))?.status === 'sent', 5_000)
    expect(await outboxRow(to)).toMatchObject({ status: 'sent', attempts: 1 })
    recordFigures('outbox-queued', { msFromRestartToDelivery: Date.now() - started })
  })

  it('a mail being delivered when the process is killed is delivered after the restart', async () => {
    await restart({ SMTP_PORT: String((silentSmtp.address() as { port: number }).port) })
    const to = await invite('interrupted')
    // the worker has claimed it and sits in the SMTP conversation that never starts
    await waitFor('the worker to claim the mail', async () => (await outboxRow(to))?.status === 'sending', 10_000)
    await waitFor('the SMTP connection', async () => held.length > 0, 10_000)
    expect(await mailFor(smtp, to)).toHaveLength(0)
    await restart()
    const started = Date.now()
    await waitFor('the mail at the fake SMTP server', async () => (await mailFor(smtp, to)).length > 0, LEASE_MS + 15_000)
    await waitFor('the row marked sent', async () => (await outboxRow(to))?.status === 'sent', 5_000)
    const row = await outboxRow(to)
    // the killed attempt counts: it may have reached the server (delivery is at least once)
    expect(row).toMatchObject({ status: 'sent', attempts: 2 })
    expect(await mailFor(smtp, to)).toHaveLength(1)
    recordFigures('outbox-interrupted', { leaseMs: LEASE_MS, msFromRestartToDelivery: Date.now() - started })
  })

  it('a signed-in session survives the kill (sessions live in PostgreSQL)', async () => {
    const client = new AppClient(app!.url)
    client.cookies = new Map(owner.cookies)
    await restart()
    client.base = app!.url
    expect((await client.get('/api/projects')).status).toBe(200)
  })
})
