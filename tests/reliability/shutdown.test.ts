import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import postgres from 'postgres'
import { demoDocument } from '#shared/demo'
import { startApp, stopApp, type App, type AppEnv } from './lib/app'
import { ownerWithCircuit } from './lib/client'
import { freshDatabase } from './lib/database'
import { startFakeS3, startFakeSmtp, type FakeS3, type FakeSmtp } from './lib/fakes'
import { recordFigures } from './lib/figures'

// SIGTERM while a save is running. The save is made slow on purpose: the test holds the circuit's
// row lock from its own connection, so the save waits inside its transaction until released.

let s3: FakeS3
let smtp: FakeSmtp
let sql: postgres.Sql
let env: AppEnv
let databaseName = ''
let app: App | undefined

beforeAll(async () => {
  const databaseUrl = await freshDatabase('shutdown')
  databaseName = new URL(databaseUrl).pathname.slice(1)
  ;[s3, smtp] = await Promise.all([startFakeS3(), startFakeSmtp()])
  // two connections: one holds the lock while the other watches
  sql = postgres(databaseUrl, { max: 2, onnotice: () => {}, connection: { application_name: 'reliability-test' } })
  env = { DATABASE_URL: databaseUrl, ...s3.env, ...smtp.env }
})

afterAll(async () => {
  await stopApp(app, 'SIGKILL')
  await sql?.end()
  await Promise.all([s3?.stop(), smtp?.stop()])
})

/** Holds the circuit row locked until `release()` is called. */
function lockCircuit(circuitId: string) {
  let release!: () => void
  const released = new Promise<void>(resolve => { release = resolve })
  let locked!: () => void
  const isLocked = new Promise<void>(resolve => { locked = resolve })
  const done = sql.begin(async (tx) => {
    await tx`select 1 from circuits where id = ${circuitId} for update`
    locked()
    await released
  })
  return { isLocked, release, done }
}

async function waitUntilSaveIsBlocked() {
  for (let i = 0; i < 100; i++) {
    const [row] = await sql`select count(*)::int as n from pg_stat_activity
      where datname = ${databaseName} and wait_event_type = 'Lock' and query ilike 'update "circuits"%'`
    if (row!.n > 0) return
    await new Promise(r => setTimeout(r, 50))
  }
  throw new Error('the save never reached the locked row')
}

const appConnections = async () => (await sql`select count(*)::int as n from pg_stat_activity
  where datname = ${databaseName} and application_name <> 'reliability-test'`)[0]!.n as number

const messages = (a: App) => a.records().map(r => r.msg as string)

describe('graceful shutdown on SIGTERM', () => {
  it('stops accepting at once, lets the running save finish, stops the mail worker and the pool, exits 0', async () => {
    app = await startApp(env)
    const { client, circuitId } = await ownerWithCircuit(app.url, 'drain')
    const lock = lockCircuit(circuitId)
    await lock.isLocked
    const saving = client.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: demoDocument() })
    await waitUntilSaveIsBlocked()

    const signalled = Date.now()
    app.proc.kill('SIGTERM')
    await new Promise(r => setTimeout(r, 300))
    // the listener is closed: a new connection is refused while the old request still runs
    const newcomer = await fetch(`${app.url}/api/health`).then(r => r.status, (e: Error) => String((e.cause as Error)?.message ?? e))
    expect(String(newcomer)).toMatch(/ECONNREFUSED/)
    expect(app.proc.exitCode).toBeNull()

    lock.release()
    await lock.done
    const saved = await saving
    const answeredMs = Date.now() - signalled
    expect(saved.status).toBe(200)
    expect(saved.body.version).toBe(2)
    const exit = await app.exited
    const exitedMs = Date.now() - signalled
    expect(exit).toEqual({ code: 0, signal: null })

    const said = messages(app)
    const order = ['shutdown started', 'shutdown: mail worker stopped', 'shutdown complete'].map(m => said.indexOf(m))
    expect(order.every(i => i >= 0)).toBe(true)
    expect([...order].sort((a, b) => a - b)).toEqual(order)
    expect(app.records().find(r => r.msg === 'shutdown started')!.requestsInFlight).toBeGreaterThanOrEqual(1)
    expect(app.records().find(r => r.msg === 'request' && r.method === 'PUT')?.status).toBe(200)
    expect(await appConnections()).toBe(0)
    const [row] = await sql`select version from circuits where id = ${circuitId}`
    expect(row!.version).toBe(2)
    recordFigures('shutdown-drain', { lockReleasedAfterSignalMs: 300, msToAnswer: answeredMs, msToExit: exitedMs, exit })
  })

  it('cuts off a request still running at NITRO_SHUTDOWN_TIMEOUT; its transaction leaves nothing behind', async () => {
    const timeoutMs = 1500
    app = await startApp({ ...env, NITRO_SHUTDOWN_TIMEOUT: String(timeoutMs) })
    const { client, circuitId } = await ownerWithCircuit(app.url, 'cutoff')
    const lock = lockCircuit(circuitId)
    await lock.isLocked
    const saving = client.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: demoDocument() })
      .then(r => r.status, () => 'connection closed')
    await waitUntilSaveIsBlocked()

    const signalled = Date.now()
    app.proc.kill('SIGTERM')
    const exit = await app.exited
    const exitedMs = Date.now() - signalled
    expect(exit).toEqual({ code: 0, signal: null })
    expect(await saving).toBe('connection closed')
    // drain wait plus the close hooks' own wait, each bounded by the timeout
    expect(exitedMs).toBeLessThan(2 * timeoutMs + 2000)
    expect(messages(app)).toContain('shutdown: requests still running at the timeout are cut off')

    lock.release()
    await lock.done
    const [row] = await sql`select version from circuits where id = ${circuitId}`
    expect(row!.version).toBe(1)
    expect((await sql`select count(*)::int as n from circuit_revisions where circuit_id = ${circuitId}`)[0]!.n).toBe(1)
    recordFigures('shutdown-timeout', { timeoutMs, msToExit: exitedMs, exit })
  })
})
