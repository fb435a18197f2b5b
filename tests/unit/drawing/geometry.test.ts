// Hose geometry on a view, the incremental scene, hit tests and box selection.
import { describe, expect, it } from 'vitest'
import { addHose, moveComponents, placeComponent, portWorldPosition } from '#shared/circuit'
import { boxSelect, crossesItself, hitTest, measuredTooShort, nearestFreePort, pointAlong, project, routeInsertion, ViewScene } from '#shared/drawing'
import { emptyDoc } from '../edits/helpers'

const at = (x: number, y: number, z: number) => ({ x, y, z })

describe('hose geometry', () => {
  it('finds a hose crossing itself, but not one doubling back on its own line', () => {
    expect(crossesItself([0, 0, 100, 100, 100, 0, 0, 100])).toBe(true) // a figure of eight
    expect(crossesItself([0, 0, 0, 100, 100, 100, 100, 0])).toBe(false) // a U
    expect(crossesItself([0, 0, 0, -300, 0, -100])).toBe(false) // straight up and part way down again
  })

  it('flags a measured length shorter than the straight line between the ends', () => {
    expect(measuredTooShort(900, [at(0, 0, 0), at(600, 800, 0)])).toBe(true) // 3-4-5: the ends are 1 000 mm apart
    expect(measuredTooShort(1000, [at(0, 0, 0), at(600, 800, 0)])).toBe(false)
    expect(measuredTooShort(undefined, [at(0, 0, 0), at(600, 800, 0)])).toBe(false)
  })

  it('finds the middle of a polyline and where a new bend point goes', () => {
    expect(pointAlong([0, 0, 100, 0, 100, 100], 0.5)).toMatchObject({ u: 100, v: 0 })
    const points = [at(0, 50, 0), at(1000, 150, 0)]
    const ins = routeInsertion('side', points, { u: 500, v: -400 })
    expect(ins).toEqual({ index: 0, point: at(500, 100, 400) }) // y (hidden in the side view) interpolated along the hose
  })
})

describe('scene', () => {
  function drawing() {
    let doc = emptyDoc()
    const e = placeComponent(doc, 'engine', at(3000, 0, 300)); doc = e.doc
    const r = placeComponent(doc, 'radiator', at(100, 0, 250)); doc = r.doc
    const t = placeComponent(doc, 'tee', at(1500, 600, 0)); doc = t.doc
    const h = addHose(doc, `${e.componentId}-head-outlet`, `${r.componentId}-top-inlet`); doc = h.doc
    return { doc, engine: e.componentId, radiator: r.componentId, tee: t.componentId, hose: h.hoseId }
  }

  it('redoes only the moved part and the hoses on it', () => {
    const d = drawing()
    const scene = new ViewScene('side')
    const first = scene.update(d.doc)
    expect(first.parts.size).toBe(3)
    const moved = moveComponents(d.doc, [d.engine], { z: 100 })
    const changes = scene.update(moved)
    expect([...changes.parts]).toEqual([d.engine])
    expect([...changes.hoses]).toEqual([d.hose])
    expect(scene.update(moved).parts.size).toBe(0)
    const port = moved.circuit.components[0]!.ports[0]!
    const q = project('side', portWorldPosition(moved.circuit.components[0]!, port))
    expect(scene.hoses.get(d.hose)!.flat.slice(0, 2)).toEqual([q.u, q.v])
  })

  it('hits a port before its part, the part inside its outline, nothing far away', () => {
    const d = drawing()
    const scene = new ViewScene('side')
    scene.update(d.doc)
    const port = scene.ports.get(`${d.engine}-heater-outlet`)!
    expect(hitTest(scene, { u: port.u + 3, v: port.v }, 8)).toEqual({ kind: 'port', id: port.id, componentId: d.engine })
    expect(hitTest(scene, { u: 3000 + 100, v: -300 + 100 }, 8)).toEqual({ kind: 'part', id: d.engine })
    expect(hitTest(scene, { u: -5000, v: -5000 }, 8)).toBeNull()
    // the head outlet has a hose: no room for another end there; the heater outlet is free
    expect(nearestFreePort(scene, { u: port.u, v: port.v }, 8)).toBe(port.id)
    const taken = scene.ports.get(`${d.engine}-head-outlet`)!
    expect(nearestFreePort(scene, { u: taken.u, v: taken.v }, 8)).toBeNull()
  })

  it('box-selects parts by their centre and hoses lying wholly inside', () => {
    const d = drawing()
    const scene = new ViewScene('top')
    scene.update(d.doc)
    expect(boxSelect(scene, { minU: 1000, minV: -700, maxU: 2000, maxV: -500 })).toEqual([d.tee])
    expect(boxSelect(scene, { minU: -1000, minV: -1000, maxU: 4000, maxV: 1000 }).sort()).toEqual([d.engine, d.radiator, d.tee, d.hose].sort())
  })
})
