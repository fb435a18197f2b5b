import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { correctedDemoDocument } from '#shared/demo'
import { Client, signUp } from '../helpers/http'
import { sql } from '../helpers/db'
import { approvedDemoBuild, getBytes, type ApprovedBuild } from './shopFixtures'

// Who may read and record on a version's shop outputs: everyone in the workshop reads; technicians,
// owners and fabricators record; reviewers only read; another workshop sees nothing; and recording
// never lets a technician change the drawing.
afterAll(() => sql.end())

let b: ApprovedBuild
let base: string
let stranger: Client

beforeAll(async () => {
  b = await approvedDemoBuild('shopperm')
  base = `/api/circuits/${b.circuitId}/versions/${b.version}/shop`
  stranger = (await signUp('shopstranger', 'Another workshop')).client
})

const writes = (stepId: string) => [
  ['PATCH', `${base}/lines`, { lineId: 'hose/j20-r3-heater/15.88', bought: true }],
  ['POST', `${base}/lines`, { description: 'Cable ties', quantity: 1, unit: 'pack' }],
  ['POST', `${base}/steps`, { stepId, done: true }],
  ['POST', `${base}/pressure-tests`, { unit: 'bar', startPressure: 1.1, endPressure: 1.1, minutesHeld: 2, passed: true }],
  ['POST', `${base}/fills`, { unit: 'L', volume: 8 }],
] as const

describe('shop permissions', () => {
  it('a reviewer reads everything but records nothing (403)', async () => {
    const v = await b.rev.get(base)
    expect(v.status).toBe(200)
    expect(v.body.viewer.mayRecord).toBe(false)
    expect((await b.rev.get(`${base}/shopping-list.csv`)).status).toBe(200)
    for (const [method, path, body] of writes('caution/hot-cap')) expect((await b.rev.request(method, path, body)).status, `${method} ${path}`).toBe(403)
    expect((await sql`select count(*)::int as n from shop_lines where circuit_id = ${b.circuitId}`)[0]!.n).toBe(0)
  })

  it('technicians, owners and fabricators record', async () => {
    for (const client of [b.tech, b.owner, b.fab]) {
      expect((await client.get(base)).body.viewer.mayRecord).toBe(true)
      const res = await client.post(`${base}/steps`, { stepId: 'caution/glycol', done: true })
      expect(res.status).toBe(200)
      await client.post(`${base}/steps`, { stepId: 'caution/glycol', done: false })
    }
    for (const [method, path, body] of writes('caution/hot-cap')) expect((await b.tech.request(method, path, body)).status, `${method} ${path}`).toBeLessThan(300)
  })

  it('a technician who records still cannot edit the circuit (graph PUT → 403)', async () => {
    const graph = (await b.tech.get(`/api/circuits/${b.circuitId}/graph`)).body
    const res = await b.tech.put(`/api/circuits/${b.circuitId}/graph`, { baseVersion: graph.circuit.version, document: correctedDemoDocument() })
    expect(res.status).toBe(403)
    expect((await b.tech.get(`/api/circuits/${b.circuitId}/graph`)).body.circuit.version).toBe(graph.circuit.version)
  })

  it('another workshop gets 404 for the view, the CSV, the PDF and every record', async () => {
    expect((await stranger.get(base)).status).toBe(404)
    expect((await stranger.get(`${base}/shopping-list.csv`)).status).toBe(404)
    expect((await getBytes(stranger, `${base}/build-sheet.pdf`)).status).toBe(404)
    for (const [method, path, body] of writes('caution/hot-cap')) expect((await stranger.request(method, path, body)).status, `${method} ${path}`).toBe(404)
  })

  it('an unknown version or a bad one is 404; signed out is 401; a bad paper size is 400', async () => {
    expect((await b.tech.get(`/api/circuits/${b.circuitId}/versions/${b.version + 50}/shop`)).status).toBe(404)
    expect((await b.tech.get(`/api/circuits/${b.circuitId}/versions/two/shop`)).status).toBe(404)
    expect((await new Client().get(base)).status).toBe(401)
    expect((await new Client().post(`${base}/fills`, { unit: 'L', volume: 8 })).status).toBe(401)
    const paper = await b.tech.get(`${base}/build-sheet.pdf?paper=a3`)
    expect(paper.status).toBe(400)
    expect(paper.body.data.fields.paper).toBeTruthy()
  })

  it('a fuel circuit has a shopping list and the leak-and-prime procedure: its steps tick, coolant step ids are refused (400)', async () => {
    const fuel = (await b.fab.post(`/api/projects/${b.projectId}/circuits`, { kind: 'fuel', title: 'Fuel feed' })).body.id
    const v = await b.tech.get(`/api/circuits/${fuel}/versions/1/shop`)
    expect(v.status).toBe(200)
    expect(v.body.procedure).toMatchObject({ available: true, kind: 'fuel-leak-and-prime' })
    expect(v.body.procedure.steps[0].id).toBe('caution/fire')
    const step = await b.tech.post(`/api/circuits/${fuel}/versions/1/shop/steps`, { stepId: 'caution/fire', done: true })
    expect(step.status).toBe(200)
    expect(step.body).toMatchObject({ stepId: 'caution/fire', done: true })
    const coolantStep = await b.tech.post(`/api/circuits/${fuel}/versions/1/shop/steps`, { stepId: 'caution/hot-cap', done: true })
    expect(coolantStep.status).toBe(400)
    expect(coolantStep.body.data.fields.stepId).toMatch(/Not a step/)
  })
})
