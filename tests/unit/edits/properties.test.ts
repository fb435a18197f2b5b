// Random edit sequences (fast-check): whatever the fabricator does, in whatever order, the document
// stays valid for the server's parse, no edit changes its input, and undo through the snapshot
// history gives back every earlier document exactly.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  addHose, addPort, addRoutePoint, applyFix, componentTypes, deleteElements, duplicateElements, emptyHistory, extractElements,
  insertElements, moveComponents, moveRoutePoint, placeComponent, recordStep, redoStep, removePort, removeRoutePoint,
  rotateComponent, setComponentPosition, setHoseEnd, undoStep, updateHose, updatePort, type CircuitDocument,
} from '#shared/circuit'
import { randomCircuit } from '#shared/demo'
import { analyzeCircuit } from '#shared/engine'
import { soundLoop } from '../engine/fixtures'
import { deepFreeze, emptyDoc, expectValid } from './helpers'

const coord = fc.integer({ min: -5000, max: 5000 })
const point = fc.record({ x: coord, y: coord, z: coord })
const pick = fc.nat({ max: 10_000 })
const delta = fc.record({ x: fc.option(coord, { nil: undefined }), y: fc.option(coord, { nil: undefined }), z: fc.option(coord, { nil: undefined }) })

type Op = (doc: CircuitDocument) => CircuitDocument

const partIds = (d: CircuitDocument) => d.circuit.components.map((c) => c.id)
const portIds = (d: CircuitDocument) => d.circuit.components.flatMap((c) => c.ports.map((p) => p.id))
const hoseIds = (d: CircuitDocument) => d.circuit.hoses.map((h) => h.id)
const allIds = (d: CircuitDocument) => [...partIds(d), ...portIds(d), ...hoseIds(d)]
/** An id from a list by a random number; sometimes one that does not exist, which must do nothing harmful. */
const choose = (ids: string[], n: number) => (ids.length === 0 || n % 17 === 0 ? `missing-${n}` : ids[n % ids.length]!)
const endTarget = (d: CircuitDocument, n: number, p: { x: number; y: number; z: number }) => (n % 4 === 0 ? { point: p } : choose(portIds(d), n))

const ops: fc.Arbitrary<Op> = fc.oneof(
  fc.tuple(fc.nat({ max: componentTypes.length - 1 }), point).map(([t, p]): Op => (d) => placeComponent(d, componentTypes[t]!, p).doc),
  fc.tuple(fc.array(pick, { maxLength: 4 }), delta).map(([ns, dl]): Op => (d) => moveComponents(d, ns.map((n) => choose(allIds(d), n)), dl)),
  fc.tuple(pick, delta).map(([n, p]): Op => (d) => setComponentPosition(d, choose(partIds(d), n), p)),
  fc.tuple(pick, fc.integer({ min: -720, max: 720 })).map(([n, deg]): Op => (d) => rotateComponent(d, choose(partIds(d), n), deg)),
  fc.tuple(pick, pick, point).map(([a, b, p]): Op => (d) => addHose(d, endTarget(d, a, p), endTarget(d, b, p)).doc),
  fc.tuple(pick, fc.boolean(), pick, point).map(([h, e, t, p]): Op => (d) => setHoseEnd(d, choose(hoseIds(d), h), e ? 'from' : 'to', endTarget(d, t, p))),
  fc.tuple(pick, fc.nat({ max: 6 }), point).map(([h, i, p]): Op => (d) => addRoutePoint(d, choose(hoseIds(d), h), i, p)),
  fc.tuple(pick, fc.nat({ max: 6 }), delta).map(([h, i, p]): Op => (d) => moveRoutePoint(d, choose(hoseIds(d), h), i, p)),
  fc.tuple(pick, fc.nat({ max: 6 })).map(([h, i]): Op => (d) => removeRoutePoint(d, choose(hoseIds(d), h), i)),
  fc.array(pick, { maxLength: 3 }).map((ns): Op => (d) => deleteElements(d, ns.map((n) => choose(allIds(d), n)))),
  fc.tuple(fc.array(pick, { maxLength: 3 }), delta).map(([ns, o]): Op => (d) => duplicateElements(d, ns.map((n) => choose(allIds(d), n)), o).doc),
  fc.tuple(fc.array(pick, { maxLength: 3 }), delta).map(([ns, o]): Op => (d) => {
    // copy out, then paste through JSON as the system clipboard would
    const bundle = JSON.parse(JSON.stringify(extractElements(d, ns.map((n) => choose(allIds(d), n)))))
    return insertElements(d, bundle, o).doc
  }),
  fc.tuple(pick, fc.boolean()).map(([n, blocked]): Op => (d) => updatePort(d, choose(portIds(d), n), { blocked })),
  fc.tuple(pick, fc.constantFrom('inlet', 'outlet', 'either', 'vent') as fc.Arbitrary<'inlet' | 'outlet' | 'either' | 'vent'>, point).map(
    ([n, role, p]): Op => (d) => addPort(d, choose(partIds(d), n), { name: 'extra spigot', role, spigotOdMm: 16, offset: p, blocked: false }).doc),
  pick.map((n): Op => (d) => removePort(d, choose(portIds(d), n))),
  fc.tuple(pick, fc.constantFrom(6.35, 15.88, 19.05, 31.75, 38.1)).map(([n, bore]): Op => (d) => updateHose(d, choose(hoseIds(d), n), { insideDiameterMm: bore, measuredLengthMm: n % 3 ? undefined : 900 })),
  pick.map((n): Op => (d) => {
    // the first fix the engine offers, as the findings list does it
    const actions = analyzeCircuit(d).findings.flatMap((f) => (f.fix.action ? [f.fix.action] : []))
    return actions.length ? applyFix(d, actions[n % actions.length]!).doc : d
  }),
)

const starts: Array<[string, () => CircuitDocument]> = [
  ['an empty drawing', () => emptyDoc()],
  ['a sound loop', soundLoop],
  ['a random circuit', () => randomCircuit({ seed: 7, rungs: 2, faults: true })],
]

describe('random edit sequences', () => {
  for (const [name, start] of starts) {
    it(`keep ${name} valid, leave inputs untouched, and undo exactly`, () => {
      fc.assert(
        fc.property(fc.array(ops, { minLength: 1, maxLength: 20 }), (sequence) => {
          let doc = deepFreeze(start())
          let history = emptyHistory()
          const snapshots = [JSON.stringify(doc)]
          for (const op of sequence) {
            const next = op(doc) // throws if it tries to change the frozen input
            expectValid(next)
            if (next === doc) continue
            history = recordStep(history, doc, 'step')
            doc = deepFreeze(next)
            snapshots.push(JSON.stringify(doc))
          }
          // undo all the way back, checking each earlier document, then redo to the end
          for (let i = snapshots.length - 2; i >= 0; i--) {
            const back = undoStep(history, doc)!
            history = back.history
            doc = back.doc
            expect(JSON.stringify(doc)).toBe(snapshots[i])
          }
          expect(undoStep(history, doc)).toBeNull()
          for (let i = 1; i < snapshots.length; i++) {
            const fwd = redoStep(history, doc)!
            history = fwd.history
            doc = fwd.doc
            expect(JSON.stringify(doc)).toBe(snapshots[i])
          }
          expect(redoStep(history, doc)).toBeNull()
        }),
        { numRuns: 60, seed: 20261202 },
      )
    })
  }

  it('drops the oldest steps past the limit', () => {
    let doc = emptyDoc()
    let history = emptyHistory()
    for (let i = 0; i < 5; i++) {
      const next = placeComponent(doc, 'tee', { x: i, y: 0, z: 0 }).doc
      history = recordStep(history, doc, `place ${i}`, 3)
      doc = next
    }
    expect(history.past.map((e) => e.label)).toEqual(['place 2', 'place 3', 'place 4'])
  })
})
