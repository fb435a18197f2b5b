import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import sharp from 'sharp'
import { demoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { templateFromComponent } from '#shared/schemas/template'
import { baseUrl, Client, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// Many requests at the same moment on one thing. Related races tested elsewhere: review decisions
// (tests/api/review-concurrency.test.ts: one approval of many, one open review per version) and
// invitation accepts (tests/api/invitations.test.ts).
afterAll(() => sql.end())

const PARALLEL_SAVES = 50

let owner: Client
let projectId: string
beforeAll(async () => {
  owner = (await signUp('race')).client
  projectId = (await owner.post('/api/projects', { title: 'Race host' })).body.id
})

const newCircuit = async (title: string) => (await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title })).body.id as string

/** The demo drawing with its own title, labels and positions, so every writer's rows differ. */
function writerDocument(i: number): CircuitDocument {
  const doc = demoDocument()
  doc.circuit.title = `Writer ${i}`
  for (const c of doc.circuit.components) {
    c.label = `${c.label} (writer ${i})`
    c.position = { ...c.position, y: c.position.y + i }
  }
  // some writers drop a hose, so even the row counts tell them apart
  if (i % 3 === 0) doc.circuit.hoses = doc.circuit.hoses.slice(1)
  return doc
}

describe('saves racing on one version', () => {
  it(`${PARALLEL_SAVES} saves from the same version: exactly one 200, the rest 409, rows exactly the winner's`, async () => {
    const circuitId = await newCircuit('Raced cooling')
    const docs = Array.from({ length: PARALLEL_SAVES }, (_, i) => writerDocument(i))
    const started = Date.now()
    const answers = await Promise.all(docs.map(document => owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document })))
    const elapsedMs = Date.now() - started
    const statuses = answers.map(a => a.status)
    expect(statuses.filter(s => s === 200)).toHaveLength(1)
    expect(statuses.filter(s => s === 409)).toHaveLength(PARALLEL_SAVES - 1)
    const winner = docs[statuses.indexOf(200)]!
    expect(answers[statuses.indexOf(200)]!.body.version).toBe(2)
    for (const lost of answers.filter(a => a.status === 409)) expect(lost.body.data.currentVersion).toBe(2)

    const components = await sql`select id, label, y from circuit_components where circuit_id = ${circuitId} order by position`
    expect(components.map(c => [c.id, c.label, c.y])).toEqual(winner.circuit.components.map(c => [c.id, c.label, c.position.y]))
    const ports = await sql`select id from circuit_ports where circuit_id = ${circuitId} order by position`
    expect(ports.map(p => p.id)).toEqual(winner.circuit.components.flatMap(c => c.ports.map(p => p.id)))
    const hoses = await sql`select id from circuit_hoses where circuit_id = ${circuitId} order by position`
    expect(hoses.map(h => h.id)).toEqual(winner.circuit.hoses.map(h => h.id))
    const revisions = await sql`select version, document from circuit_revisions where circuit_id = ${circuitId} order by version`
    expect(revisions.map(r => r.version)).toEqual([1, 2])
    expect(revisions[1]!.document).toEqual(winner)
    expect((await owner.get(`/api/circuits/${circuitId}/graph`)).body.document).toEqual(winner)
    const [logged] = await sql`select count(*)::int as n from activity where action = 'circuit.edited' and circuit_id = ${circuitId}`
    expect(logged!.n).toBe(1)
    console.info(`[concurrency] ${PARALLEL_SAVES} parallel saves answered in ${elapsedMs} ms`)
  })

  it('a rename racing with saves: no update is lost, every success is its own version', async () => {
    const circuitId = await newCircuit('Renamed in a race')
    const answers = await Promise.all([
      owner.patch(`/api/circuits/${circuitId}`, { title: 'Renamed' }),
      ...Array.from({ length: 5 }, (_, i) => owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: writerDocument(i) })),
    ])
    // a rename saves on top of whatever version it read, so it may win or lose like a save
    for (const a of answers) expect([200, 409]).toContain(a.status)
    const saves = answers.slice(1).filter(a => a.status === 200)
    expect(saves.length).toBeLessThanOrEqual(1)
    const successes = answers.filter(a => a.status === 200).length
    expect(successes).toBeGreaterThanOrEqual(1)
    const graph = (await owner.get(`/api/circuits/${circuitId}/graph`)).body
    expect(graph.circuit.version).toBe(1 + successes)
    const revisions = await sql`select version, document from circuit_revisions where circuit_id = ${circuitId} order by version`
    expect(revisions.map(r => r.version)).toEqual(Array.from({ length: 1 + successes }, (_, i) => i + 1))
    expect(graph.document).toEqual(revisions.at(-1)!.document)
  })
})

describe('other writes racing', () => {
  it('the same template name created 10 times at once: one 201, the rest 400 with the field, never a 500', async () => {
    const body = templateFromComponent(demoDocument().circuit.components.find(c => c.id === 'thermostat')!)
    const answers = await Promise.all(Array.from({ length: 10 }, (_, i) => owner.post('/api/templates', { name: i % 2 ? 'Raced tee' : 'RACED TEE', body })))
    expect(answers.filter(a => a.status === 201)).toHaveLength(1)
    const refused = answers.filter(a => a.status !== 201)
    for (const a of refused) expect(a.status).toBe(400)
    expect(refused.every(a => a.body.data?.fields?.name)).toBe(true)
  })

  // parallel deletes of one photo: the DELETE … RETURNING decides which one removed the row
  it('one photo deleted 8 times at once: one 200, the rest 404, one log line', async () => {
    const circuitId = await newCircuit('Photo race')
    const form = new FormData()
    form.append('componentId', 'radiator')
    const png = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#222' } }).png().toBuffer()
    form.append('file', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'race.png')
    const cookie = [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    const created = await (await fetch(`${baseUrl}/api/circuits/${circuitId}/photos`, { method: 'POST', body: form, headers: { cookie } })).json() as { id: string }
    const answers = await Promise.all(Array.from({ length: 8 }, () => owner.delete(`/api/circuits/${circuitId}/photos/${created.id}`)))
    expect(answers.filter(a => a.status === 200)).toHaveLength(1)
    expect(answers.filter(a => a.status === 404)).toHaveLength(7)
    const [logged] = await sql`select count(*)::int as n from activity where action = 'photo.deleted' and details->>'photoId' = ${created.id}`
    expect(logged!.n).toBe(1)
  })
})
