// The scene's incremental update must give exactly what a fresh build of the same document gives,
// whatever sequence of edits led there (fast-check).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { addHose, deleteElements, moveComponents, moveRoutePoint, placeComponent, updatePort, type CircuitDocument } from '#shared/circuit'
import { randomCircuit } from '#shared/demo'
import { ViewScene, type ViewName } from '#shared/drawing'

type Op = (d: CircuitDocument) => CircuitDocument
const pick = fc.nat({ max: 5000 })
const coord = fc.integer({ min: -3000, max: 3000 })
const partIds = (d: CircuitDocument) => d.circuit.components.map((c) => c.id)
const portIds = (d: CircuitDocument) => d.circuit.components.flatMap((c) => c.ports.map((p) => p.id))
const at = <T>(list: T[], n: number) => list[n % Math.max(1, list.length)]
const ops: fc.Arbitrary<Op> = fc.oneof(
  fc.tuple(pick, coord, coord).map(([n, dx, dz]): Op => (d) => moveComponents(d, [at(partIds(d), n) ?? ''], { x: dx, z: dz })),
  fc.tuple(pick, coord).map(([n, dy]): Op => (d) => moveComponents(d, [at(partIds(d), n) ?? '', at(partIds(d), n + 1) ?? ''], { y: dy })),
  fc.tuple(pick, fc.nat({ max: 3 }), coord).map(([n, i, z]): Op => (d) => moveRoutePoint(d, at(d.circuit.hoses, n)?.id ?? '', i, { z })),
  fc.tuple(pick, pick).map(([a, b]): Op => (d) => addHose(d, at(portIds(d), a) ?? '', at(portIds(d), b) ?? '').doc),
  pick.map((n): Op => (d) => deleteElements(d, [at(partIds(d), n) ?? ''])),
  fc.tuple(pick, fc.boolean()).map(([n, blocked]): Op => (d) => updatePort(d, at(portIds(d), n) ?? '', { blocked })),
  fc.tuple(coord, coord).map(([x, z]): Op => (d) => placeComponent(d, 'tee', { x, y: 0, z }).doc),
)

function snapshot(scene: ViewScene) {
  const parts = [...scene.parts.values()].map((p) => [p.id, p.u, p.v, p.outline, p.ports.map((q) => [q.id, q.u, q.v])]).sort()
  const hoses = [...scene.hoses.values()].map((h) => [h.id, h.flat, h.crosses, h.tooShort]).sort()
  const byPart = [...scene.hosesByPart].map(([k, v]) => [k, [...v].sort()]).sort()
  return { parts, hoses, ports: [...scene.ports.keys()].sort(), occupied: [...scene.occupied].sort(), byPart }
}

describe('incremental scene', () => {
  for (const view of ['side', 'top'] as ViewName[]) {
    it(`matches a fresh build after any edits (${view} view)`, () => {
      fc.assert(fc.property(fc.array(ops, { minLength: 1, maxLength: 15 }), (sequence) => {
        let doc = randomCircuit({ seed: 11, rungs: 3 })
        const live = new ViewScene(view)
        live.update(doc)
        for (const op of sequence) {
          doc = op(doc)
          live.update(doc)
          const fresh = new ViewScene(view)
          fresh.update(doc)
          expect(snapshot(live)).toEqual(snapshot(fresh))
        }
      }), { numRuns: 80, seed: 7 })
    })
  }
})
