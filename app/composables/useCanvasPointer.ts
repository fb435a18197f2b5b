import { removeRoutePoint } from '#shared/circuit'
import { hitTest, type Hit, type ViewName } from '#shared/drawing'
import type { CanvasSceneApi } from './useCanvasScene'
import type { ViewportApi } from './useViewport'

/**
 * Pointer, touch and wheel input for one view: hover, press-and-drag (useCanvasGestures), two-finger
 * pinch and pan, long-press on a hose for a bend point (touch), double-click to add or remove one,
 * wheel zoom about the cursor, and Space+drag or the middle button to pan.
 */
export function useCanvasPointer(view: ViewName, el: Ref<HTMLElement | null>, vp: ViewportApi, canvas: CanvasSceneApi, onActive: () => void) {
  const store = useEditorStore()
  const g = useCanvasGestures(view, vp, canvas)
  const hover = shallowRef<{ hit: Hit; x: number; y: number } | null>(null)
  const pointers = new Map<number, { x: number; y: number; touch: boolean }>()
  let pinch: { distance: number; mid: { x: number; y: number } } | null = null
  let spaceHeld = false
  let longPress: ReturnType<typeof setTimeout> | undefined
  /** time spent handling pointer moves, ms (shown in the view's summary for the benchmark) */
  const moveMs = { last: 0, total: 0, count: 0 }

  const local = (e: { clientX: number; clientY: number }) => {
    const r = el.value!.getBoundingClientRect()
    return { x: e.clientX - r.left, y: e.clientY - r.top }
  }
  const twoFingers = () => {
    const [a, b] = [...pointers.values()]
    return { distance: Math.hypot(a!.x - b!.x, a!.y - b!.y), mid: { x: (a!.x + b!.x) / 2, y: (a!.y + b!.y) / 2 } }
  }

  function onPointerDown(e: PointerEvent) {
    if (!el.value) return
    onActive()
    el.value.focus({ preventScroll: true })
    const p = local(e)
    const touch = e.pointerType === 'touch'
    pointers.set(e.pointerId, { ...p, touch })
    el.value.setPointerCapture?.(e.pointerId)
    if (pointers.size === 2) {
      g.cancel()
      clearTimeout(longPress)
      pinch = twoFingers()
      return
    }
    if (pointers.size > 2) return
    if (e.button === 1 || e.button === 2 || spaceHeld) {
      g.current = { kind: 'pan', ...p }
      e.preventDefault()
      return
    }
    const hit = hitTest(canvas.scene, vp.planeAt(p.x, p.y), g.tolerance(touch))
    g.current = { kind: 'pending', ...p, hit, shift: e.shiftKey, touch }
    clearTimeout(longPress)
    if (touch && hit?.kind === 'hose') {
      longPress = setTimeout(() => {
        if (g.current.kind !== 'pending') return
        g.addBendAt(hit.id, p.x, p.y)
        g.current = { kind: 'none' }
      }, 550)
    }
  }

  function onPointerMove(e: PointerEvent) {
    const t0 = performance.now()
    handleMove(e)
    moveMs.last = performance.now() - t0
    moveMs.total += moveMs.last
    moveMs.count++
  }

  function handleMove(e: PointerEvent) {
    const p = local(e)
    const known = pointers.get(e.pointerId)
    if (known) pointers.set(e.pointerId, { ...p, touch: known.touch })
    if (pinch) {
      if (pointers.size < 2) return
      const now = twoFingers()
      vp.panBy(now.mid.x - pinch.mid.x, now.mid.y - pinch.mid.y)
      if (pinch.distance > 0) vp.zoomAt(now.mid.x, now.mid.y, now.distance / pinch.distance)
      pinch = now
      return
    }
    const q = vp.planeAt(p.x, p.y)
    const current = g.current
    if (current.kind === 'none') {
      const hit = hitTest(canvas.scene, q, g.tolerance(e.pointerType === 'touch'))
      hover.value = hit ? { hit, x: p.x, y: p.y } : null
      store.hoverId = g.idOf(hit)
      if (el.value) el.value.style.cursor = cursorFor(hit)
      return
    }
    if (current.kind === 'pending') {
      if (Math.hypot(p.x - current.x, p.y - current.y) < (current.touch ? 8 : 4)) return
      clearTimeout(longPress)
      hover.value = null
      g.startDrag(current, vp.planeAt(current.x, current.y))
    }
    g.moveDrag(q, p.x, p.y, e.pointerType === 'touch')
  }

  function onPointerUp(e: PointerEvent) {
    pointers.delete(e.pointerId)
    clearTimeout(longPress)
    if (pinch) {
      if (pointers.size === 0) pinch = null
      return
    }
    const p = local(e)
    const current = g.current
    if (current.kind === 'pending') g.click(current)
    else if (current.kind !== 'none') g.finishDrag(vp.planeAt(p.x, p.y), e.pointerType === 'touch')
    g.current = { kind: 'none' }
  }

  function onPointerCancel(e: PointerEvent) {
    pointers.delete(e.pointerId)
    if (pointers.size < 2) pinch = null
    g.cancel()
  }

  function onDoubleClick(e: MouseEvent) {
    if (store.readOnly) return
    const p = local(e)
    const hit = hitTest(canvas.scene, vp.planeAt(p.x, p.y), g.tolerance(false))
    if (hit?.kind === 'hose') g.addBendAt(hit.id, p.x, p.y)
    else if (hit?.kind === 'route-point') {
      store.commit(removeRoutePoint(store.document, hit.hoseId, hit.index), 'Remove bend point')
      store.select([hit.hoseId])
    }
  }

  function onWheel(e: WheelEvent) {
    e.preventDefault()
    onActive()
    const p = local(e)
    // trackpad pinches arrive as wheel events with ctrlKey and small deltas
    const speed = e.ctrlKey ? 0.01 : e.deltaMode === 1 ? 0.05 : 0.0015
    vp.zoomAt(p.x, p.y, Math.exp(-e.deltaY * speed))
  }

  function onLeave() {
    if (g.current.kind === 'none') { hover.value = null; store.hoverId = null }
  }

  const onKeyDown = (e: KeyboardEvent) => {
    if (e.code === 'Space' && !e.repeat && e.target === el.value) { spaceHeld = true; e.preventDefault() }
    if (e.key === 'Escape' && g.current.kind !== 'none') { g.cancel(); e.stopPropagation() }
  }
  const onKeyUp = (e: KeyboardEvent) => { if (e.code === 'Space') spaceHeld = false }
  const noMenu = (e: Event) => e.preventDefault()

  onMounted(() => {
    const node = el.value!
    node.addEventListener('pointerdown', onPointerDown)
    node.addEventListener('pointermove', onPointerMove)
    node.addEventListener('pointerup', onPointerUp)
    node.addEventListener('pointercancel', onPointerCancel)
    node.addEventListener('pointerleave', onLeave)
    node.addEventListener('dblclick', onDoubleClick)
    node.addEventListener('wheel', onWheel, { passive: false })
    node.addEventListener('contextmenu', noMenu)
    node.addEventListener('keydown', onKeyDown)
    window.addEventListener('keyup', onKeyUp)
  })
  onBeforeUnmount(() => {
    clearTimeout(longPress)
    window.removeEventListener('keyup', onKeyUp)
  })

  return { hover, cancel: g.cancel, moveMs }
}

function cursorFor(hit: Hit | null): string {
  if (!hit) return 'default'
  if (hit.kind === 'port') return 'crosshair'
  if (hit.kind === 'part') return 'move'
  if (hit.kind === 'hose') return 'pointer'
  return 'grab'
}
