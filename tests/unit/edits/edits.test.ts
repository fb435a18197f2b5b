// The pure document edits, one behaviour at a time. Every result must pass the server's parse, and no
// edit may change its input (inputs are deep-frozen).
import { describe, expect, it } from 'vitest'
import {
  addHose, addRoutePoint, componentTypes, deleteElements, duplicateElements, moveComponents, moveRoutePoint, newId,
  placeComponent, portWorldPosition, removePort, removeRoutePoint, rotateComponent, setHoseEnd, updateCircuitText,
  updateComponent, updateHose, updatePort, updateSettings, clipboardBundle, CLIPBOARD_FORMAT, extractElements,
} from '#shared/circuit'
import { hoseFit } from '#shared/engine'
import { deepFreeze, emptyDoc, expectValid, hoseById, portById } from './helpers'

const at = (x: number, y: number, z: number) => ({ x, y, z })
// the engine's default fit rule (docs/engine.md: 0.25 mm loose, 8 % stretch; common practice)
const RULE = { looseMm: 0.25, stretchPercent: 8 }

function drawing() {
  let doc = deepFreeze(emptyDoc())
  const engine = placeComponent(doc, 'engine', at(3000, 0, 300))
  doc = deepFreeze(engine.doc)
  const radiator = placeComponent(doc, 'radiator', at(100, 0, 250))
  doc = deepFreeze(radiator.doc)
  return { doc, engineId: engine.componentId, radiatorId: radiator.componentId }
}

describe('ids', () => {
  it('gives short readable ids, one above the highest number in use', () => {
    const ids = new Set(['hose-1', 'hose-7', 'radiator-2'])
    expect(newId('hose', ids)).toBe('hose-8')
    expect(newId('hose', ids)).toBe('hose-9')
    expect(newId('expansion-tank', ids)).toBe('expansion-tank-1')
  })
})

describe('placing parts', () => {
  it('places every type with valid, readable ids and leaves the input alone', () => {
    let doc = deepFreeze(emptyDoc())
    for (const type of componentTypes) {
      const placed = placeComponent(doc, type, at(100, 200, 300))
      expectValid(placed.doc)
      expect(placed.componentId).toBe(`${type}-1`)
      const comp = placed.doc.circuit.components.at(-1)!
      expect(comp.position).toEqual(at(100, 200, 300))
      for (const p of comp.ports) expect(p.id.startsWith(`${type}-1-`)).toBe(true)
      doc = deepFreeze(placed.doc)
    }
    expect(doc.circuit.components).toHaveLength(componentTypes.length)
  })

  it('numbers a second part of a type in its id and label', () => {
    const { doc } = drawing()
    const second = placeComponent(doc, 'radiator', at(0, 0, 0))
    expect(second.componentId).toBe('radiator-2')
    expect(second.doc.circuit.components.at(-1)!.label).toBe('Radiator 2')
  })
})

describe('hoses', () => {
  it('sizes a new hose to fit both spigots (the engine’s own fit rule decides)', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`)
    expectValid(added.doc)
    const h = hoseById(added.doc, added.hoseId)
    expect(hoseFit(h.insideDiameterMm, portById(added.doc, `${engineId}-head-outlet`).port.spigotOdMm, RULE)).toBe('fits')
    expect(hoseFit(h.insideDiameterMm, portById(added.doc, `${radiatorId}-top-inlet`).port.spigotOdMm, RULE)).toBe('fits')
    expect(h.material).toBe('j20-r4-radiator') // SAE J20 R4 is radiator hose (check-values §5)
  })

  it('leaves a free end at a port that already has a hose', () => {
    const { doc, engineId, radiatorId } = drawing()
    const first = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`)
    const second = addHose(deepFreeze(first.doc), `${engineId}-head-outlet`, { point: at(2000, 0, 0) })
    expectValid(second.doc)
    const h = hoseById(second.doc, second.hoseId)
    const { comp, port } = portById(second.doc, `${engineId}-head-outlet`)
    expect(h.from.portId).toBeNull()
    expect(h.from.point).toEqual(portWorldPosition(comp, port))
  })

  it('moves ends, and adds, moves and removes route points', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, { point: at(500, 0, 0) })
    let d = deepFreeze(setHoseEnd(added.doc, added.hoseId, 'to', `${radiatorId}-top-inlet`))
    expect(hoseById(d, added.hoseId).to).toEqual({ portId: `${radiatorId}-top-inlet`, clamp: 'worm-drive' })
    d = deepFreeze(addRoutePoint(d, added.hoseId, 0, at(1500, 0, -80)))
    d = deepFreeze(addRoutePoint(d, added.hoseId, 1, at(600, 0, -80)))
    d = deepFreeze(moveRoutePoint(d, added.hoseId, 1, { z: 900 }))
    expect(hoseById(d, added.hoseId).params.route).toEqual([at(1500, 0, -80), at(600, 0, 900)])
    d = deepFreeze(removeRoutePoint(d, added.hoseId, 0))
    expect(hoseById(d, added.hoseId).params.route).toEqual([at(600, 0, 900)])
    expectValid(d)
  })

  it('removes optional hose fields given as undefined', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`, { label: 'Top hose' })
    let d = deepFreeze(updateHose(added.doc, added.hoseId, { measuredLengthMm: 1200, fromClamp: 'spring' }))
    expect(hoseById(d, added.hoseId).measuredLengthMm).toBe(1200)
    d = updateHose(d, added.hoseId, { measuredLengthMm: undefined, label: undefined })
    expect(hoseById(d, added.hoseId)).not.toHaveProperty('measuredLengthMm')
    expect(hoseById(d, added.hoseId).params).not.toHaveProperty('label')
    expect(hoseById(d, added.hoseId).from.clamp).toBe('spring')
    expectValid(d)
  })
})

describe('moving, turning, deleting', () => {
  it('moves only the axes given and carries the route of a hose between two moved parts', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`, { route: [at(1500, 0, 100)] })
    const moved = moveComponents(deepFreeze(added.doc), [engineId, radiatorId], { z: 50 })
    expect(moved.circuit.components.map((c) => c.position)).toEqual([at(3000, 0, 350), at(100, 0, 300)])
    expect(hoseById(moved, added.hoseId).params.route).toEqual([at(1500, 0, 150)])
    const one = moveComponents(added.doc, [engineId], { x: -10 })
    expect(hoseById(one, added.hoseId).params.route).toEqual([at(1500, 0, 100)]) // one end stays: route stays
    expectValid(one)
  })

  it('keeps the rotation within 0–360', () => {
    const { doc, engineId } = drawing()
    const turned = rotateComponent(rotateComponent(doc, engineId, 350), engineId, 20)
    expect(turned.circuit.components[0]!.rotationDeg).toBe(10)
  })

  it('frees hose ends where the port was when a part is deleted', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`)
    const before = portById(added.doc, `${radiatorId}-top-inlet`)
    const after = deleteElements(deepFreeze(added.doc), [radiatorId])
    expectValid(after)
    expect(after.circuit.components.map((c) => c.id)).toEqual([engineId])
    expect(hoseById(after, added.hoseId).to).toEqual({ portId: null, point: portWorldPosition(before.comp, before.port), clamp: 'worm-drive' })
  })

  it('keeps a thermostat’s valved port', () => {
    const placed = placeComponent(emptyDoc(), 'thermostat', at(0, 0, 0))
    const valved = `${placed.componentId}-radiator-side`
    expect(removePort(deepFreeze(placed.doc), valved)).toBe(placed.doc)
    expect(portById(deleteElements(placed.doc, [valved]), valved).port.id).toBe(valved)
  })

  it('frees the hose when a joined port is capped', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`)
    const capped = updatePort(deepFreeze(added.doc), `${engineId}-head-outlet`, { blocked: true })
    expectValid(capped)
    expect(hoseById(capped, added.hoseId).from.portId).toBeNull()
  })
})

describe('copies and settings', () => {
  it('duplicates parts with the hose between them joined to the copies', () => {
    const { doc, engineId, radiatorId } = drawing()
    const added = addHose(doc, `${engineId}-head-outlet`, `${radiatorId}-top-inlet`)
    const dup = duplicateElements(deepFreeze(added.doc), [engineId, radiatorId], { y: 1000 })
    expectValid(dup.doc)
    expect(dup.doc.circuit.components).toHaveLength(4)
    const copy = hoseById(dup.doc, dup.idMap.get(added.hoseId)!)
    expect(copy.from.portId).toBe(dup.idMap.get(`${engineId}-head-outlet`))
    expect(copy.to.portId).toBe(dup.idMap.get(`${radiatorId}-top-inlet`))
    expect(dup.doc.circuit.components[2]!.position).toEqual(at(3000, 1000, 300))
  })

  it('puts a bundle on the clipboard that reads back with the clipboard schema', () => {
    const { doc, engineId } = drawing()
    const bundle = extractElements(doc, [engineId])
    expect(clipboardBundle.safeParse(JSON.parse(JSON.stringify({ format: CLIPBOARD_FORMAT, ...bundle }))).success).toBe(true)
  })

  it('updates a part’s params by merging, removing keys given as undefined', () => {
    const placed = placeComponent(emptyDoc(), 'expansion-tank', at(0, 0, 900))
    const d = updateComponent(deepFreeze(placed.doc), placed.componentId, { label: 'Header tank', params: { capRatingKpa: undefined } })
    expectValid(d)
    const tank = d.circuit.components[0]!
    expect(tank.label).toBe('Header tank')
    expect(tank.params).toEqual({ capacityL: 2 })
  })

  it('changes settings, title and notes', () => {
    const d0 = deepFreeze(emptyDoc())
    const d = updateCircuitText(updateSettings(d0, { datum: 'top of the rails', thresholds: { airTrapToleranceMm: 40 } }), { title: 'Bay', notes: 'n' })
    expectValid(d)
    expect(d.circuit.settings.datum).toBe('top of the rails')
    expect(d.circuit.title).toBe('Bay')
    expect(updateCircuitText(d, { notes: '' }).circuit).not.toHaveProperty('notes')
  })
})
