// The differences between two documents, as the conflict dialog and the review show them.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { diffCircuits, diffCounts, fieldChanges, isEmptyDiff, type CircuitDocument } from '#shared/circuit'
import { demoDocument, randomCircuit } from '#shared/demo'

const clone = (d: CircuitDocument): CircuitDocument => structuredClone(d)

describe('diffCircuits on a known pair', () => {
  // mine: the demo build; theirs: a colleague capped the third outlet, moved the heater up, relabelled
  // the bottom hose, removed the heater return, added a bleed valve, and raised the cap rating
  function theirs(): CircuitDocument {
    const d = clone(demoDocument())
    const c = d.circuit
    const engine = c.components.find((x) => x.id === 'engine')!
    engine.ports.find((p) => p.id === 'engine-third')!.blocked = true
    c.components.find((x) => x.id === 'heater')!.position.z = 760
    c.hoses.find((h) => h.id === 'hose-bottom')!.params.label = 'Bottom hose, long run'
    c.hoses = c.hoses.filter((h) => h.id !== 'hose-heater-return')
    c.components.push({
      id: 'bleed-1', type: 'bleed-valve', label: 'Heater bleed', position: { x: 620, y: 240, z: 780 }, rotationDeg: 0,
      volumeL: 0.01, params: {}, ports: [],
    })
    c.settings.coolant!.capRatingKpa = 120
    c.title = 'Camper van, rear four'
    return d
  }

  it('lists added, removed and changed parts and hoses with their fields, and the settings', () => {
    const d = diffCircuits(demoDocument(), theirs())
    expect(d).toEqual({
      parts: {
        added: [{ id: 'bleed-1', label: 'Heater bleed' }],
        removed: [],
        changed: [
          { id: 'engine', label: 'Engine (turbo four)', changes: [{ path: 'ports[engine-third].blocked', before: false, after: true }] },
          { id: 'heater', label: 'Cab heater core', changes: [{ path: 'position.z', before: 700, after: 760 }] },
        ],
      },
      hoses: {
        added: [],
        removed: [{ id: 'hose-heater-return', label: 'Heater return' }],
        changed: [{
          id: 'hose-bottom', label: 'Bottom hose, long run',
          changes: [{ path: 'params.label', before: 'Bottom hose: radiator to return tee', after: 'Bottom hose, long run' }],
        }],
      },
      settings: [{ path: 'coolant.capRatingKpa', before: 110, after: 120 }],
      circuit: [{ path: 'title', before: 'Camper van, rear turbo four, front radiator', after: 'Camper van, rear four' }],
    })
    expect(diffCounts(d)).toEqual({ added: 1, removed: 1, changed: 4, settings: 1 })
    expect(isEmptyDiff(d)).toBe(false)
  })

  it('names an unlabelled hose by its two ends', () => {
    const before = demoDocument()
    const after = clone(before)
    const h = after.circuit.hoses.find((x) => x.id === 'hose-vent')!
    delete h.params.label
    h.insideDiameterMm = 9.5
    const d = diffCircuits(before, after)
    expect(d.hoses.changed).toEqual([{
      id: 'hose-vent',
      label: 'Inline thermostat housing › bleed spigot → Expansion tank › vent inlet',
      changes: [
        { path: 'insideDiameterMm', before: 7.94, after: 9.5 },
        { path: 'params.label', before: 'Vent: thermostat bleed to tank', after: undefined },
      ],
    }])
  })

  it('treats a reordered port list as no change but a moved route point as a change of the whole route', () => {
    const before = demoDocument()
    const after = clone(before)
    const engine = after.circuit.components.find((x) => x.id === 'engine')!
    engine.ports.reverse()
    const top = after.circuit.hoses.find((x) => x.id === 'hose-top')!
    top.params.route[1]!.y = -180
    const d = diffCircuits(before, after)
    expect(d.parts.changed).toEqual([])
    expect(d.hoses.changed.map((c) => c.changes.map((f) => f.path))).toEqual([['params.route']])
  })

  it('reports a port added to a part as one field holding the whole port', () => {
    const before = demoDocument()
    const after = clone(before)
    const extra = { id: 'heater-bleed', name: 'bleed', role: 'vent' as const, spigotOdMm: 8, offset: { x: 0, y: 0, z: 60 }, blocked: true }
    after.circuit.components.find((x) => x.id === 'heater')!.ports.push(extra)
    expect(diffCircuits(before, after).parts.changed).toEqual([
      { id: 'heater', label: 'Cab heater core', changes: [{ path: 'ports[heater-bleed]', before: undefined, after: extra }] },
    ])
  })

  it('sees a missing key and an undefined value as equal', () => {
    expect(fieldChanges({ a: 1, b: undefined }, { a: 1 })).toEqual([])
    expect(fieldChanges({ a: 1 }, { a: 2, c: 'x' })).toEqual([
      { path: 'a', before: 1, after: 2 }, { path: 'c', before: undefined, after: 'x' },
    ])
  })
})

// random but schema-valid circuits, with random edits on a copy
const docArb = fc.record({ seed: fc.integer({ min: 1, max: 100_000 }), rungs: fc.integer({ min: 1, max: 4 }), faults: fc.boolean() })
  .map((o) => randomCircuit(o))

const editArb = fc.record({
  dropParts: fc.array(fc.nat(), { maxLength: 3 }),
  dropHoses: fc.array(fc.nat(), { maxLength: 3 }),
  moveParts: fc.array(fc.record({ i: fc.nat(), dz: fc.integer({ min: 1, max: 500 }) }), { maxLength: 3 }),
  boreOf: fc.option(fc.record({ i: fc.nat(), mm: fc.double({ min: 2, max: 60, noNaN: true }) })),
  percent: fc.option(fc.integer({ min: 0, max: 70 })),
})

type Edit = typeof editArb extends fc.Arbitrary<infer T> ? T : never

function edited(doc: CircuitDocument, e: Edit): CircuitDocument {
  const d = clone(doc)
  const c = d.circuit
  for (const m of e.moveParts) {
    const part = c.components[m.i % c.components.length]
    if (part) part.position.z += m.dz
  }
  if (e.boreOf) {
    const h = c.hoses[e.boreOf.i % c.hoses.length]
    if (h) h.insideDiameterMm = e.boreOf.mm
  }
  if (e.percent !== null && c.settings.coolant) c.settings.coolant.mix.percentByVolume = e.percent
  const partIds = new Set(e.dropParts.map((i) => c.components[i % c.components.length]?.id))
  const hoseIds = new Set(e.dropHoses.map((i) => c.hoses[i % c.hoses.length]?.id))
  c.components = c.components.filter((x) => !partIds.has(x.id))
  c.hoses = c.hoses.filter((x) => !hoseIds.has(x.id))
  c.components.push({ id: 'added-part', type: 'drain', label: 'Added drain', position: { x: 1, y: 2, z: 3 }, rotationDeg: 0, volumeL: 0, params: {}, ports: [] })
  return d
}

describe('diffCircuits properties', () => {
  it('finds nothing between a document and itself or a deep copy of it', () => {
    fc.assert(fc.property(docArb, (doc) => {
      expect(isEmptyDiff(diffCircuits(doc, doc))).toBe(true)
      expect(isEmptyDiff(diffCircuits(doc, clone(doc)))).toBe(true)
    }), { numRuns: 40 })
  })

  it('swapping the documents swaps added and removed, and keeps the changed ids and fields', () => {
    fc.assert(fc.property(docArb, editArb, (doc, e) => {
      const other = edited(doc, e)
      const ab = diffCircuits(doc, other)
      const ba = diffCircuits(other, doc)
      expect(ba.parts.added).toEqual(ab.parts.removed)
      expect(ba.parts.removed).toEqual(ab.parts.added)
      expect(ba.hoses.added).toEqual(ab.hoses.removed)
      expect(ba.hoses.removed).toEqual(ab.hoses.added)
      const shape = (d: typeof ab) => [...d.parts.changed, ...d.hoses.changed]
        .map((c) => `${c.id}:${c.changes.map((f) => f.path).sort().join(',')}`).sort()
      expect(shape(ba)).toEqual(shape(ab))
      expect(ba.settings.map((s) => [s.path, s.before, s.after])).toEqual(ab.settings.map((s) => [s.path, s.after, s.before]))
      // the edit always adds one part, so there is always something to show
      expect(ab.parts.added.map((p) => p.id)).toContain('added-part')
    }), { numRuns: 60 })
  })

  it('every changed field names a value that really differs', () => {
    fc.assert(fc.property(docArb, editArb, (doc, e) => {
      const other = edited(doc, e)
      for (const c of diffCircuits(doc, other).parts.changed) {
        for (const f of c.changes) expect(JSON.stringify(f.before)).not.toBe(JSON.stringify(f.after))
      }
    }), { numRuns: 40 })
  })
})
