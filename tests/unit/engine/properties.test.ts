// Properties that must hold for any circuit: checked on random ones (fast-check).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { analyzeCircuit, boreVolumeL, type Report } from '#shared/engine'
import { randomCircuit } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { clone, pt, valid } from './fixtures'

function shuffled<T>(items: readonly T[], seed: number): T[] {
  const out = [...items]
  let s = seed >>> 0
  for (let i = out.length - 1; i > 0; i--) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0
    const j = s % (i + 1)
    ;[out[i], out[j]] = [out[j]!, out[i]!]
  }
  return out
}

/** The same circuit with every array shuffled and every id renamed; returns the map new id → old id. */
function scramble(doc: CircuitDocument, seed: number): { doc: CircuitDocument; back: Map<string, string> } {
  const d = clone(doc)
  const to = new Map<string, string>()
  const back = new Map<string, string>()
  let n = 0
  const rename = (id: string) => {
    const fresh = `z${(seed % 997).toString(36)}-${(n++).toString(36)}-${id.length}`
    to.set(id, fresh)
    back.set(fresh, id)
    return fresh
  }
  for (const c of d.circuit.components) {
    c.id = rename(c.id)
    for (const p of c.ports) p.id = rename(p.id)
  }
  for (const h of d.circuit.hoses) {
    h.id = rename(h.id)
    for (const end of [h.from, h.to]) if (end.portId) end.portId = to.get(end.portId)!
  }
  for (const c of d.circuit.components) {
    if (c.type === 'thermostat') c.params.valvedPortId = to.get(c.params.valvedPortId)!
    c.ports = shuffled(c.ports, seed + 1)
  }
  d.circuit.components = shuffled(d.circuit.components, seed + 2)
  d.circuit.hoses = shuffled(d.circuit.hoses, seed + 3)
  return { doc: d, back }
}

function renameBack(value: unknown, back: Map<string, string>): unknown {
  if (typeof value === 'string') return back.get(value) ?? value
  if (Array.isArray(value)) return value.map((v) => renameBack(v, back))
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, renameBack(v, back)]))
  return value
}

const circuitArb = fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), rungs: fc.integer({ min: 1, max: 6 }), faults: fc.boolean(), tidy: fc.boolean() })

describe('the report does not depend on element order or id names', () => {
  it('shuffling every array and renaming every id gives the same report (ids mapped back)', () => {
    fc.assert(
      fc.property(circuitArb, fc.integer({ min: 0, max: 2 ** 31 }), (opts, seed) => {
        const doc = valid(randomCircuit(opts))
        const { doc: other, back } = scramble(doc, seed)
        const a: Report = analyzeCircuit(doc)
        const b = renameBack(analyzeCircuit(valid(other)), back)
        expect(b).toEqual(a)
      }),
      { numRuns: 40 },
    )
  })
})

describe('volume is additive', () => {
  it('adding a part adds its volume; adding a hose adds π/4·d²·L', () => {
    fc.assert(
      fc.property(circuitArb, fc.double({ min: 0, max: 20, noNaN: true }), fc.double({ min: 4, max: 60, noNaN: true }), fc.double({ min: 10, max: 5000, noNaN: true }),
        (opts, partL, bore, length) => {
          const doc = valid(randomCircuit(opts))
          const before = analyzeCircuit(doc).quantities.volume.totalL
          const more = clone(doc)
          more.circuit.components.push({ id: 'extra', type: 'generic', label: 'Extra', position: pt(0, 0, 0), rotationDeg: 0, volumeL: partL, params: {}, ports: [] })
          more.circuit.hoses.push({
            id: 'extra-hose', from: { portId: null, point: pt(0, 0, 0), clamp: 'none' }, to: { portId: null, point: pt(length, 0, 0), clamp: 'none' },
            insideDiameterMm: bore, wallMm: 3, material: 'silicone', params: { route: [] },
          })
          const after = analyzeCircuit(valid(more)).quantities.volume.totalL
          expect(after - before).toBeCloseTo(partL + boreVolumeL(bore, length), 9)
        }),
      { numRuns: 40 },
    )
  })
})

describe('the flow solve conserves flow at every junction', () => {
  it('what flows into each part through its hoses also flows out (thermostat open and shut)', () => {
    fc.assert(
      fc.property(circuitArb, (opts) => {
        const doc = valid(randomCircuit(opts))
        const report = analyzeCircuit(doc)
        for (const state of [report.flow.open, report.flow.closed]) {
          if (!state.solved) continue
          const flow = new Map(state.hoses.map((h) => [h.hoseId, h.flowLpm]))
          const net = new Map<string, number>()
          const owner = new Map<string, string>()
          for (const c of doc.circuit.components) for (const p of c.ports) owner.set(p.id, c.id)
          for (const h of doc.circuit.hoses) {
            const q = flow.get(h.id) ?? 0
            if (h.from.portId) net.set(owner.get(h.from.portId)!, (net.get(owner.get(h.from.portId)!) ?? 0) - q)
            if (h.to.portId) net.set(owner.get(h.to.portId)!, (net.get(owner.get(h.to.portId)!) ?? 0) + q)
          }
          for (const [, imbalance] of net) expect(Math.abs(imbalance)).toBeLessThan(1e-6 * Math.max(1, state.pumpFlowLpm))
          // and every branch's share is at most the pump's flow
          for (const b of state.branches) expect(b.shareOfPump).toBeLessThanOrEqual(1 + 1e-9)
        }
      }),
      { numRuns: 40 },
    )
  })
})
