import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import postgres from 'postgres'
import sharp from 'sharp'
import { demoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { startApp, stopApp, type App, type AppEnv } from './lib/app'
import { ownerWithCircuit, type AppClient } from './lib/client'
import { checkCircuit, checkPhotos, type Acknowledged } from './lib/consistency'
import { freshDatabase } from './lib/database'
import { startFakeS3, startFakeSmtp, type FakeS3, type FakeSmtp } from './lib/fakes'
import { recordFigures } from './lib/figures'

// kill -9 in the middle of a stream of circuit saves and photo uploads, again and again. After each
// restart the database must agree with itself (rows = the current version's document, nothing
// dangling, rows ↔ stored objects) and with the client (every acknowledged write is there).

// a different moment in the write stream each round (ms after the writers start)
const KILL_AFTER_MS = [350, 800, 1300, 500, 1700, 650, 1100, 2000, 250, 1500]

let s3: FakeS3
let smtp: FakeSmtp
let sql: postgres.Sql
let env: AppEnv
let app: App | undefined
let png: Buffer

beforeAll(async () => {
  const databaseUrl = await freshDatabase('crash')
  ;[s3, smtp] = await Promise.all([startFakeS3(), startFakeSmtp()])
  sql = postgres(databaseUrl, { max: 2, onnotice: () => {} })
  env = { DATABASE_URL: databaseUrl, ...s3.env, ...smtp.env }
  png = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#3a6e8f' } }).png().toBuffer()
})

afterAll(async () => {
  await stopApp(app, 'SIGKILL')
  await sql?.end()
  await Promise.all([s3?.stop(), smtp?.stop()])
})

/** The demo circuit, made distinguishable: its title, labels and positions carry the save number. */
function variant(n: number): CircuitDocument {
  const doc = demoDocument()
  doc.circuit.title = `Crash save ${n}`
  for (const c of doc.circuit.components) {
    c.label = `${c.label} #${n}`
    c.position = { ...c.position, x: c.position.x + (n % 97) }
  }
  return doc
}

interface Round { saves: number; uploads: number; lastError: string }

async function saveLoop(client: AppClient, circuitId: string, from: number, acked: Acknowledged, counter: { n: number }, round: Round) {
  let base = from
  for (;;) {
    const doc = variant(++counter.n)
    let res
    try {
      res = await client.put(`/api/circuits/${circuitId}/graph`, { baseVersion: base, document: doc })
    } catch (error) {
      round.lastError = String((error as Error).cause ?? error)
      return
    }
    if (res.status === 200) {
      acked.saves.set(res.body.version, doc)
      base = res.body.version
      round.saves++
    } else if (res.status === 409) {
      base = res.body.data.currentVersion
    } else {
      throw new Error(`save answered ${res.status}: ${JSON.stringify(res.body)}`)
    }
  }
}

async function uploadLoop(client: AppClient, circuitId: string, acked: Acknowledged, round: Round) {
  for (;;) {
    const form = new FormData()
    form.append('componentId', 'radiator')
    form.append('file', new Blob([new Uint8Array(png)], { type: 'image/png' }), `crash-${round.uploads}.png`)
    let res
    try {
      res = await client.request('POST', `/api/circuits/${circuitId}/photos`, form)
    } catch {
      return
    }
    if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${JSON.stringify(res.body)}`)
    acked.photoIds.add(res.body.id)
    round.uploads++
  }
}

describe('crash recovery: kill -9 during saves and uploads', () => {
  it(`keeps the database consistent and every acknowledged write, over ${KILL_AFTER_MS.length} kills`, async () => {
    app = await startApp(env)
    const { client, circuitId } = await ownerWithCircuit(app.url, 'crash')
    const acked: Acknowledged = { saves: new Map(), photoIds: new Set() }
    const counter = { n: 0 }
    const rounds: Array<Round & { killAfterMs: number; restartMs: number; version: number; unacknowledgedCommitted: number; unreferencedObjects: number }> = []

    for (const killAfterMs of KILL_AFTER_MS) {
      client.base = app.url
      const [row] = await sql`select version from circuits where id = ${circuitId}`
      const from = Number(row!.version)
      const round: Round = { saves: 0, uploads: 0, lastError: '' }
      const writers = Promise.all([saveLoop(client, circuitId, from, acked, counter, round), uploadLoop(client, circuitId, acked, round)])
      await new Promise(r => setTimeout(r, killAfterMs))
      app.proc.kill('SIGKILL')
      expect((await app.exited).signal).toBe('SIGKILL')
      await writers

      const restarting = Date.now()
      app = await startApp(env)
      const restartMs = Date.now() - restarting
      client.base = app.url
      const circuit = await checkCircuit(sql, client, circuitId, acked)
      const photos = await checkPhotos(sql, s3, circuitId, acked)
      // a kill interrupts at most the one upload in flight: its two objects may stay unreferenced
      expect(photos.unreferencedObjects).toBeLessThanOrEqual(2 * (rounds.length + 1))
      rounds.push({ ...round, killAfterMs, restartMs, ...circuit, unreferencedObjects: photos.unreferencedObjects })
    }

    // the stream really ran: writes were acknowledged in every round, so each kill hit a busy server
    for (const r of rounds) expect(r.saves + r.uploads).toBeGreaterThan(0)
    recordFigures('crash', {
      kills: rounds.length,
      acknowledgedSaves: acked.saves.size,
      acknowledgedUploads: acked.photoIds.size,
      savesCommittedButNotAcknowledged: rounds.reduce((n, r) => n + r.unacknowledgedCommitted, 0),
      unreferencedObjectsAtEnd: rounds.at(-1)!.unreferencedObjects,
      restartMsMedian: [...rounds.map(r => r.restartMs)].sort((a, b) => a - b)[Math.floor(rounds.length / 2)],
      rounds: rounds.map(({ lastError: _e, ...r }) => r),
    })
  })
})
