import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// The project's activity log: what is recorded, how saves are folded, and the filters.
afterAll(() => sql.end())

let owner: Client
let fab: Client
let tech: Client
let ownerId: string
let fabId: string
let projectId: string
let circuitId: string

beforeAll(async () => {
  const o = await signUp('actowner', 'Activity shop')
  owner = o.client
  ownerId = o.summary.user.id
  const [f, t] = await Promise.all([addMember(owner, 'fabricator', 'actfab'), addMember(owner, 'technician', 'acttech')])
  fab = f.client; tech = t.client
  fabId = (await fab.get('/api/session')).body.user.id
  projectId = (await fab.post('/api/projects', { title: 'Activity build' })).body.id
  circuitId = (await fab.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Logged cooling' })).body.id
})

const titled = (doc: CircuitDocument, title: string) => ({ ...doc, circuit: { ...doc.circuit, title } })
async function save(client: Client, doc: CircuitDocument) {
  const base = (await client.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version
  const res = await client.put(`/api/circuits/${circuitId}/graph`, { baseVersion: base, document: doc })
  expect(res.status).toBe(200)
  return res.body.version as number
}
const log = async (query = '') => (await tech.get(`/api/projects/${projectId}/activity${query}`)).body

describe('activity log', () => {
  it('folds a person’s saves of a circuit into one line per quarter hour, carrying the latest version', async () => {
    const first = await save(fab, titled(demoDocument(), 'Logged cooling'))
    await save(fab, titled(correctedDemoDocument(), 'Logged cooling'))
    const last = await save(fab, titled(demoDocument(), 'Logged cooling'))
    let edited = (await log('?action=circuit.edited')).items
    expect(edited).toHaveLength(1)
    expect(edited[0]).toMatchObject({ actor: { id: fabId }, circuit: { id: circuitId }, details: { fromVersion: first, version: last, saves: 3 } })
    // someone else's save is their own line
    const ownerVersion = await save(owner, titled(correctedDemoDocument(), 'Logged cooling'))
    edited = (await log('?action=circuit.edited')).items
    expect(edited.map((e: any) => [e.actor.id, e.details.version])).toEqual([[ownerId, ownerVersion], [fabId, last]])
    // a quarter of an hour later the fabricator's next save starts a new line
    await sql`update activity set created_at = now() - interval '16 minutes' where action = 'circuit.edited' and actor_id = ${fabId} and circuit_id = ${circuitId}`
    const later = await save(fab, titled(demoDocument(), 'Logged cooling'))
    edited = (await log(`?action=circuit.edited&actorId=${fabId}`)).items
    expect(edited.map((e: any) => e.details.version)).toEqual([later, last])
  })

  it('records circuits created, renamed, imported and deleted, and review steps', async () => {
    expect((await fab.patch(`/api/circuits/${circuitId}`, { title: 'Logged cooling loop' })).status).toBe(200)
    const imported = await fab.post(`/api/projects/${projectId}/circuits/import`, { document: demoDocument(), title: 'Imported copy' })
    expect(imported.status).toBe(201)
    const importedId = imported.body.circuit.id
    const version = (await fab.get(`/api/circuits/${importedId}/graph`)).body.circuit.version
    expect((await fab.post(`/api/circuits/${importedId}/reviews`, { version })).status).toBe(201)
    expect((await fab.delete(`/api/circuits/${importedId}`, { confirmTitle: 'Imported copy' })).status).toBe(200)
    const items = (await log()).items
    const actions = items.map((e: any) => e.action)
    expect(actions.slice(0, 4)).toEqual(['circuit.deleted', 'review.submitted', 'circuit.imported', 'circuit.renamed'])
    expect(actions).toContain('circuit.created')
    // a deleted circuit keeps its title in the line; its link is gone
    expect(items[0]).toMatchObject({ circuit: null, details: { title: 'Imported copy' } })
    expect(items.find((e: any) => e.action === 'circuit.renamed').details).toMatchObject({ from: 'Logged cooling', to: 'Logged cooling loop' })
  })

  it('filters by action, person and circuit, newest first, a page at a time', async () => {
    const all = await log('?pageSize=100')
    const times = all.items.map((e: any) => Date.parse(e.createdAt))
    expect(times).toEqual([...times].sort((a, b) => b - a))
    const byOwner = await log(`?actorId=${ownerId}`)
    expect(byOwner.items.length).toBeGreaterThan(0)
    expect(byOwner.items.every((e: any) => e.actor.id === ownerId)).toBe(true)
    const byCircuit = await log(`?circuitId=${circuitId}&pageSize=100`)
    expect(byCircuit.items.every((e: any) => e.circuit?.id === circuitId)).toBe(true)
    expect(byCircuit.total).toBe(all.items.filter((e: any) => e.circuit?.id === circuitId).length)
    const p1 = await log('?pageSize=2&page=1')
    const p2 = await log('?pageSize=2&page=2')
    expect(p1.total).toBe(all.total)
    expect(p1.items.map((e: any) => e.id)).toEqual(all.items.slice(0, 2).map((e: any) => e.id))
    expect(p2.items.map((e: any) => e.id)).toEqual(all.items.slice(2, 4).map((e: any) => e.id))
    expect(all.filters.actors.map((a: any) => a.id).sort()).toEqual([ownerId, fabId].sort())
    const bad = await tech.get(`/api/projects/${projectId}/activity?action=circuit.exploded`)
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.action).toBeTruthy()
    const other = (await signUp('actother')).client
    expect((await other.get(`/api/projects/${projectId}/activity`)).status).toBe(404)
  })

  it('templates belong to the workshop: logged without a project, not on the project page', async () => {
    const body = { type: 'tee', label: 'Logged tee', rotationDeg: 0, volumeL: 0.05, params: {}, ports: [
      { id: 'a', name: 'run a', role: 'either', spigotOdMm: 16, offset: { x: -40, y: 0, z: 0 }, blocked: false },
      { id: 'b', name: 'run b', role: 'either', spigotOdMm: 16, offset: { x: 40, y: 0, z: 0 }, blocked: false },
      { id: 'c', name: 'branch', role: 'either', spigotOdMm: 16, offset: { x: 0, y: 0, z: 30 }, blocked: false },
    ] }
    const made = await fab.post('/api/templates', { name: `Logged tee ${Date.now()}`, body })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const rows = await sql`select project_id, action from activity where details->>'templateId' = ${made.body.id}`
    expect(rows).toEqual([{ project_id: null, action: 'template.created' }])
    expect((await log('?pageSize=100')).items.some((e: any) => e.action.startsWith('template.'))).toBe(false)
  })
})
