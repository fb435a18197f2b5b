import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import { polylineLengthMm, portWorldPosition, type CircuitDocument, type Hose } from '#shared/circuit'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// The history page's diff between two known saved versions: which parts and hoses were added,
// removed and changed, and what that does to the cut lengths, hose to buy, coolant and findings.
afterAll(() => sql.end())

let owner: Client
let tech: Client
let circuitId: string
const v2Doc = demoDocument()
const v3Doc = correctedDemoDocument()
// version 4: the vent hose from the thermostat to the tank taken out, leaving both its ports open
const v4Doc: CircuitDocument = { ...v3Doc, circuit: { ...v3Doc.circuit, hoses: v3Doc.circuit.hoses.filter(h => h.id !== 'hose-vent') } }

beforeAll(async () => {
  owner = (await signUp('diffowner')).client
  tech = (await addMember(owner, 'technician', 'difftech')).client
  const projectId = (await owner.post('/api/projects', { title: 'Diff build' })).body.id
  circuitId = (await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Diff cooling' })).body.id
  let base = 1
  for (const doc of [v2Doc, v3Doc, v4Doc]) {
    const res = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: base, document: doc })
    expect(res.status).toBe(200)
    base = res.body.version
  }
})

// cut length and bore volume straight from the geometry (docs/engine.md, Quantities; the demo's
// allowance is 5 % + 25 mm per end), independent of the engine's quantity code
function drawnLength(doc: CircuitDocument, hose: Hose) {
  const at = (portId: string) => {
    const comp = doc.circuit.components.find(c => c.ports.some(p => p.id === portId))!
    return portWorldPosition(comp, comp.ports.find(p => p.id === portId)!)
  }
  return polylineLengthMm([at(hose.from.portId!), ...hose.params.route, at(hose.to.portId!)])
}
const cut = (doc: CircuitDocument, id: string) => Math.ceil(drawnLength(doc, doc.circuit.hoses.find(h => h.id === id)!) * 1.05 + 50)
// π/4 · d² · L in dm³ = L (check-values §4: 1.5 in bore × 1 m = 1.1401 L)
const boreL = (doc: CircuitDocument, id: string) => {
  const h = doc.circuit.hoses.find(x => x.id === id)!
  return (Math.PI / 4) * (h.insideDiameterMm / 100) ** 2 * (drawnLength(doc, h) / 100)
}

describe('diff of two saved versions', () => {
  it('demo → corrected: the bleed valve and its hose added, the engine and heater return changed', async () => {
    const res = await tech.get(`/api/circuits/${circuitId}/diff?from=2&to=3`)
    expect(res.status).toBe(200)
    const { diff, quantities: q, counts } = res.body
    expect(diff.parts.added.map((e: any) => e.id)).toEqual(['heater-bleed'])
    expect(diff.parts.removed).toEqual([])
    expect(diff.parts.changed.map((e: any) => e.id)).toEqual(['engine'])
    expect(diff.parts.changed[0].changes).toEqual([{ path: 'ports[engine-third].blocked', before: false, after: true }])
    expect(diff.hoses.added.map((e: any) => e.id)).toEqual(['hose-heater-bleed'])
    expect(diff.hoses.removed).toEqual([])
    expect(diff.hoses.changed.map((e: any) => e.id)).toEqual(['hose-heater-return'])
    expect(diff.circuit.map((c: any) => c.path).sort()).toEqual(['notes', 'title'])
    expect(counts).toEqual({ added: 2, removed: 0, changed: 4, settings: 0 })

    const byId = (a: { hoseId: string }, b: { hoseId: string }) => a.hoseId.localeCompare(b.hoseId)
    expect([...q.hoseCuts].sort(byId)).toEqual([
      { hoseId: 'hose-heater-bleed', tag: expect.any(String), beforeMm: null, afterMm: cut(v3Doc, 'hose-heater-bleed') },
      { hoseId: 'hose-heater-return', tag: expect.any(String), beforeMm: cut(v2Doc, 'hose-heater-return'), afterMm: cut(v3Doc, 'hose-heater-return') },
    ])
    const heaterHose = (doc: CircuitDocument) => doc.circuit.hoses.filter(h => h.material === 'j20-r3-heater' && h.insideDiameterMm === 15.88).reduce((n, h) => n + cut(doc, h.id), 0)
    expect(q.hoseTotals).toEqual([expect.objectContaining({ material: 'j20-r3-heater', insideDiameterMm: 15.88, beforeMm: heaterHose(v2Doc), afterMm: heaterHose(v3Doc) })])
    // the bleed valve holds 0.02 L (demo data); the rest is the bore of the re-routed hoses
    expect(q.volume.deltaL).toBeCloseTo(0.02 + boreL(v3Doc, 'hose-heater-return') + boreL(v3Doc, 'hose-heater-bleed') - boreL(v2Doc, 'hose-heater-return'), 4)
    expect(q.findings.removed.map((f: any) => f.key).sort()).toEqual(['air-trap|heater,heater-inlet,heater-outlet', 'open-port|engine,engine-third'])
    expect(q.findings.added).toEqual([])
    expect(q.codes).toEqual({ added: [], removed: ['air-trap', 'open-port'] })
  })

  it('corrected → vent hose removed: one hose gone, its two ports now open', async () => {
    const res = await owner.get(`/api/circuits/${circuitId}/diff?from=3&to=4`)
    const { diff, quantities: q } = res.body
    expect(diff.hoses).toEqual({ added: [], removed: [{ id: 'hose-vent', label: 'Vent: thermostat bleed to tank' }], changed: [] })
    expect(diff.parts).toEqual({ added: [], removed: [], changed: [] })
    expect(q.hoseCuts).toEqual([{ hoseId: 'hose-vent', tag: null, beforeMm: cut(v3Doc, 'hose-vent'), afterMm: null }])
    expect(q.volume.deltaL).toBeCloseTo(-boreL(v3Doc, 'hose-vent'), 4)
    const added = q.findings.added.map((f: any) => f.key)
    expect(added).toEqual(expect.arrayContaining(['open-port|thermostat,thermostat-vent', 'open-port|tank,tank-vent']))
    expect(q.codes.added).toContain('open-port')
    // the vent hose was the only 7.94 mm heater hose: its size drops to nothing to buy
    expect(q.hoseTotals).toEqual([expect.objectContaining({ insideDiameterMm: 7.94, beforeMm: cut(v3Doc, 'hose-vent'), afterMm: 0, buyAfter: null })])
  })

  it('reads either way round and refuses unknown versions and bad input', async () => {
    const back = (await owner.get(`/api/circuits/${circuitId}/diff?from=3&to=2`)).body
    expect(back.diff.parts.removed.map((e: any) => e.id)).toEqual(['heater-bleed'])
    expect((await owner.get(`/api/circuits/${circuitId}/diff?from=2&to=99`)).status).toBe(404)
    const bad = await owner.get(`/api/circuits/${circuitId}/diff?from=two&to=3`)
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.from).toBeTruthy()
    expect((await owner.get(`/api/circuits/${circuitId}/diff?to=3`)).status).toBe(400)
  })
})
