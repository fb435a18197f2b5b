import {
  addHose, addRoutePoint, moveComponents, moveRoutePoint, setHoseEnd, type CircuitDocument, type Point3,
} from '#shared/circuit'
import {
  boxSelect, gridSteps, nearestFreePort, planeDeltaToWorld, rectFrom, routeInsertion, snapTo, withPlanePoint,
  type Hit, type PlanePoint, type ViewName,
} from '#shared/drawing'
import type { CanvasSceneApi } from './useCanvasScene'
import type { ViewportApi } from './useViewport'

export type Gesture =
  | { kind: 'none' }
  | { kind: 'pending'; x: number; y: number; hit: Hit | null; shift: boolean; touch: boolean }
  | { kind: 'pan'; x: number; y: number }
  | { kind: 'box'; from: PlanePoint; add: boolean }
  | { kind: 'parts'; ids: string[]; base: CircuitDocument; start: PlanePoint; anchor: PlanePoint }
  | { kind: 'route'; hoseId: string; index: number; base: CircuitDocument; origin: Point3 }
  | { kind: 'end'; hoseId: string; end: 'from' | 'to'; base: CircuitDocument; origin: Point3; other: string | null }
  | { kind: 'hose'; fromPortId: string; from: PlanePoint }

export type PendingGesture = Extract<Gesture, { kind: 'pending' }>

/**
 * What a press and drag on a view does, by what is under it: a part moves (with the selection), a
 * free port starts a hose, a port with a hose or a free end moves that end, a bend point moves, a
 * hose grabbed anywhere gets a new bend point there; empty canvas pans, or with Shift (or the box
 * tool) selects with a box. Every move is a preview; the drag ends in one undo step.
 */
export function useCanvasGestures(view: ViewName, vp: ViewportApi, canvas: CanvasSceneApi) {
  const store = useEditorStore()
  let gesture: Gesture = { kind: 'none' }

  const scale = () => vp.viewport.value.scale
  const tolerance = (touch: boolean) => (touch ? 16 : 7) / scale()
  const gridStep = () => gridSteps(scale(), 12).minor
  const snapPoint = (q: PlanePoint): PlanePoint => (store.snapToGrid ? { u: snapTo(q.u, gridStep()), v: snapTo(q.v, gridStep()) } : q)
  const hoseById = (doc: CircuitDocument, id: string) => doc.circuit.hoses.find((h) => h.id === id)
  const idOf = (hit: Hit | null) => !hit ? null : hit.kind === 'route-point' || hit.kind === 'hose-end' ? hit.hoseId : hit.id

  function endWorld(hoseId: string, end: 'from' | 'to'): Point3 {
    const g = canvas.scene.hoses.get(hoseId)!
    return end === 'from' ? g.world[0]! : g.world[g.world.length - 1]!
  }

  function startDrag(g: PendingGesture, q: PlanePoint) {
    const hit = g.hit
    const doc = store.document
    const editable = !store.readOnly
    if (!hit) {
      gesture = g.shift || store.boxTool ? { kind: 'box', from: q, add: g.shift } : { kind: 'pan', x: g.x, y: g.y }
      return
    }
    if (!editable) { gesture = { kind: 'pan', x: g.x, y: g.y }; return }
    if (hit.kind === 'port') {
      const taken = [...doc.circuit.hoses].find((h) => h.from.portId === hit.id || h.to.portId === hit.id)
      const port = canvas.scene.ports.get(hit.id)!
      if (taken) {
        const end = taken.from.portId === hit.id ? 'from' : 'to'
        gesture = { kind: 'end', hoseId: taken.id, end, base: doc, origin: port.world, other: taken[end === 'from' ? 'to' : 'from'].portId }
        store.select([taken.id])
      } else if (!port.port.blocked) {
        gesture = { kind: 'hose', fromPortId: hit.id, from: { u: port.u, v: port.v } }
      } else gesture = partsGesture(hit.componentId, q, g.shift)
      return
    }
    if (hit.kind === 'route-point') {
      store.selectRoutePoint(hit.hoseId, hit.index)
      gesture = { kind: 'route', hoseId: hit.hoseId, index: hit.index, base: doc, origin: hoseById(doc, hit.hoseId)!.params.route[hit.index]! }
      return
    }
    if (hit.kind === 'hose-end') {
      const h = hoseById(doc, hit.hoseId)!
      store.select([hit.hoseId])
      gesture = { kind: 'end', hoseId: hit.hoseId, end: hit.end, base: doc, origin: endWorld(hit.hoseId, hit.end), other: h[hit.end === 'from' ? 'to' : 'from'].portId }
      return
    }
    if (hit.kind === 'hose') {
      // grabbing a hose bends it: a new bend point where it was grabbed, dragged from there
      const geom = canvas.scene.hoses.get(hit.id)!
      const start = { u: g.x, v: g.y }
      const at = vp.planeAt(start.u, start.v)
      const ins = routeInsertion(view, geom.world, at)
      const base = addRoutePoint(doc, hit.id, ins.index, ins.point)
      store.preview(base)
      store.selectRoutePoint(hit.id, ins.index)
      gesture = { kind: 'route', hoseId: hit.id, index: ins.index, base, origin: ins.point }
      return
    }
    gesture = partsGesture(hit.id, q, g.shift)
  }

  function partsGesture(partId: string, q: PlanePoint, shift: boolean): Gesture {
    if (!store.selectedSet.has(partId)) store.select([partId], shift ? 'add' : 'replace')
    const ids = store.selection.filter((id) => store.elementIndex.get(id) !== 'port')
    const part = canvas.scene.parts.get(partId)!
    return { kind: 'parts', ids, base: store.document, start: q, anchor: { u: part.u, v: part.v } }
  }

  function moveDrag(q: PlanePoint, x: number, y: number, touch: boolean) {
    const g = gesture
    if (g.kind === 'pan') {
      vp.panBy(x - g.x, y - g.y)
      gesture = { ...g, x, y }
    } else if (g.kind === 'box') {
      canvas.marks.box = rectFrom(g.from, q)
      canvas.redrawLive()
    } else if (g.kind === 'parts') {
      const target = snapPoint({ u: g.anchor.u + q.u - g.start.u, v: g.anchor.v + q.v - g.start.v })
      store.preview(moveComponents(g.base, g.ids, planeDeltaToWorld(view, target.u - g.anchor.u, target.v - g.anchor.v)))
    } else if (g.kind === 'route') {
      store.preview(moveRoutePoint(g.base, g.hoseId, g.index, withPlanePoint(view, g.origin, snapPoint(q))))
    } else if (g.kind === 'end') {
      const port = nearestFreePort(canvas.scene, q, tolerance(touch) * 1.5, g.other)
      const p = port ? canvas.scene.ports.get(port)! : null
      canvas.marks.snap = p ? { u: p.u, v: p.v } : null
      store.preview(setHoseEnd(g.base, g.hoseId, g.end, port ?? { point: withPlanePoint(view, g.origin, snapPoint(q)) }))
    } else if (g.kind === 'hose') {
      const port = nearestFreePort(canvas.scene, q, tolerance(touch) * 1.5, g.fromPortId)
      const p = port ? canvas.scene.ports.get(port)! : null
      const to = p ? { u: p.u, v: p.v } : snapPoint(q)
      canvas.marks.rubber = [g.from.u, g.from.v, to.u, to.v]
      canvas.marks.snap = p ? { u: p.u, v: p.v } : null
      canvas.redrawLive()
    }
  }

  function finishDrag(q: PlanePoint, touch: boolean) {
    const g = gesture
    if (g.kind === 'box') store.select(boxSelect(canvas.scene, rectFrom(g.from, q)), g.add ? 'add' : 'replace')
    else if (g.kind === 'parts') store.endPreview(g.ids.length === 1 ? 'Move part' : `Move ${g.ids.length} elements`)
    else if (g.kind === 'route') store.endPreview('Move bend point')
    else if (g.kind === 'end') store.endPreview('Move hose end')
    else if (g.kind === 'hose') {
      const port = nearestFreePort(canvas.scene, q, tolerance(touch) * 1.5, g.fromPortId)
      const from = canvas.scene.ports.get(g.fromPortId)!
      const added = addHose(store.document, g.fromPortId, port ?? { point: withPlanePoint(view, from.world, snapPoint(q)) })
      store.commit(added.doc, 'Draw hose')
      store.select([added.hoseId])
    }
    clearMarks()
  }

  function click(g: PendingGesture) {
    const hit = g.hit
    if (!hit) { if (!g.shift) store.clearSelection(); return }
    if (hit.kind === 'route-point') store.selectRoutePoint(hit.hoseId, hit.index)
    else store.select([idOf(hit)!], g.shift ? 'toggle' : 'replace')
  }

  function clearMarks() {
    canvas.marks.box = canvas.marks.rubber = canvas.marks.snap = null
    canvas.redrawLive()
  }

  function cancel() {
    if (gesture.kind !== 'none') store.cancelPreview()
    gesture = { kind: 'none' }
    clearMarks()
  }

  function addBendAt(hoseId: string, x: number, y: number) {
    const geom = canvas.scene.hoses.get(hoseId)
    if (!geom || store.readOnly) return
    const ins = routeInsertion(view, geom.world, vp.planeAt(x, y))
    store.commit(addRoutePoint(store.document, hoseId, ins.index, ins.point), 'Add bend point')
    store.selectRoutePoint(hoseId, ins.index)
  }

  return {
    get current() { return gesture },
    set current(g: Gesture) { gesture = g },
    tolerance, idOf, startDrag, moveDrag, finishDrag, click, cancel, addBendAt,
  }
}
