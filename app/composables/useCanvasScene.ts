import type KonvaCore from 'konva/lib/Core'
import type { Layer } from 'konva/lib/Layer'
import type { Shape } from 'konva/lib/Shape'
import type { Stage } from 'konva/lib/Stage'
import { flowMarks, ViewScene, VIEWS, visibleRect, type FlowMark, type PartGeom, type PlaneRect, type ViewName, type Viewport } from '#shared/drawing'
import type { PaintState } from './useCanvasPainter'
import type { ViewportApi } from './useViewport'

export interface KonvaKit {
  Konva: typeof KonvaCore
  Shape: typeof Shape
}

/** Transient marks of a gesture in progress, drawn over everything. */
export interface InteractionMarks {
  box: PlaneRect | null
  /** a hose being drawn: flat u, v pairs */
  rubber: number[] | null
  snap: { u: number; v: number } | null
}

/**
 * One view's Konva stage. Three layers, none listening (hit tests are ours): the grid in screen px;
 * a static layer with everything at rest; a live layer with whatever a drag is changing, the
 * selection and the flow arrows. During a drag only the live layer redraws, so a 1 000-part drawing
 * stays smooth: elements move to it when a preview changes them and go back when the drag ends.
 */
export function useCanvasScene(view: ViewName, vp: ViewportApi) {
  const store = useEditorStore()
  const theme = useDrawingTheme()
  const painter = useCanvasPainter(theme)
  const decor = useCanvasDecor(theme)
  const scene = new ViewScene(view)
  const staticParts = new Set<string>()
  const staticHoses = new Set<string>()
  const liveParts = new Set<string>()
  const liveHoses = new Set<string>()
  let staticOrder: PartGeom[] | null = null
  let liveOrder: PartGeom[] | null = null
  let flow: FlowMark[] = []
  const paint: PaintState = {
    scale: 1, visible: { minU: 0, minV: 0, maxU: 0, maxV: 0 }, marks: new Map(), selected: new Set(), hover: null, routePoint: null, plain: false,
  }
  const marks: InteractionMarks = { box: null, rubber: null, snap: null }
  /** how long the last draw of each layer took, ms (shown in the view's summary for benchmarks) */
  const drawMs = { static: 0, live: 0, staticDraws: 0, liveDraws: 0 }
  let stage: Stage | null = null
  let gridLayer: Layer | null = null
  let staticLayer: Layer | null = null
  let liveLayer: Layer | null = null

  const bySize = (ids: Set<string>) =>
    [...ids].flatMap((id) => scene.parts.get(id) ?? []).sort((a, b) => b.outline.w * b.outline.h - a.outline.w * a.outline.h)
  const hosesOf = (ids: Set<string>) => [...ids].flatMap((id) => scene.hoses.get(id) ?? [])

  function drawLive(ctx: CanvasRenderingContext2D) {
    const t0 = performance.now()
    liveOrder ??= bySize(liveParts)
    painter.elements(ctx, liveOrder, hosesOf(liveHoses), paint)
    painter.selection(ctx, scene.parts, scene.hoses, scene.ports, paint)
    if (flow.length && !store.previewing) decor.flow(ctx, flow, paint)
    if (paint.plain) {
      const info = VIEWS[view]
      decor.annotate(ctx, vp.viewport.value, vp.size.value.height, `${info.title} · ${info.horizontalLabel} → · ${info.verticalLabel} ↑ · ${store.document?.circuit.title ?? ''}`)
    }
    const px = 1 / paint.scale
    ctx.strokeStyle = theme.selection
    ctx.lineWidth = 1.5 * px
    if (marks.box) {
      const b = marks.box
      ctx.setLineDash([5 * px, 4 * px])
      ctx.fillStyle = theme.colours.copper.light
      ctx.globalAlpha = 0.35
      ctx.fillRect(b.minU, b.minV, b.maxU - b.minU, b.maxV - b.minV)
      ctx.globalAlpha = 1
      ctx.strokeRect(b.minU, b.minV, b.maxU - b.minU, b.maxV - b.minV)
      ctx.setLineDash([])
    }
    if (marks.rubber) {
      const f = marks.rubber
      ctx.beginPath()
      ctx.moveTo(f[0]!, f[1]!)
      for (let i = 2; i < f.length; i += 2) ctx.lineTo(f[i]!, f[i + 1]!)
      ctx.lineWidth = 3 * px
      ctx.setLineDash([8 * px, 4 * px])
      ctx.stroke()
      ctx.setLineDash([])
    }
    if (marks.snap) {
      ctx.beginPath()
      ctx.arc(marks.snap.u, marks.snap.v, 13 * px, 0, Math.PI * 2)
      ctx.lineWidth = 2.5 * px
      ctx.stroke()
    }
    drawMs.live = performance.now() - t0
    drawMs.liveDraws++
  }

  function mount(container: HTMLDivElement, kit: KonvaKit) {
    const { Konva, Shape: KShape } = kit
    const { width, height } = vp.size.value
    stage = new Konva.Stage({ container, width: Math.max(1, width), height: Math.max(1, height), listening: false })
    const layer = () => new Konva.Layer({ listening: false, imageSmoothingEnabled: true })
    const shape = (draw: (ctx: CanvasRenderingContext2D) => void) =>
      new KShape({ listening: false, perfectDrawEnabled: false, sceneFunc: (c) => draw(c._context) })
    gridLayer = layer()
    gridLayer.add(shape((ctx) => decor.grid(ctx, vp.viewport.value, vp.size.value.width, vp.size.value.height)))
    staticLayer = layer()
    staticLayer.add(shape((ctx) => {
      const t0 = performance.now()
      staticOrder ??= bySize(staticParts)
      painter.elements(ctx, staticOrder, hosesOf(staticHoses), paint)
      drawMs.static = performance.now() - t0
      drawMs.staticDraws++
    }))
    liveLayer = layer()
    liveLayer.add(shape(drawLive))
    stage.add(gridLayer, staticLayer, liveLayer)
    sync()
    applyViewport()
  }

  // Panning and zooming move the static layer's picture with a CSS transform at once and redraw it
  // properly once the view holds still (~90 ms): redrawing thousands of elements on every frame of
  // a pan would not keep up on a slow machine.
  let drawnAt: Viewport | null = null
  let settleTimer: ReturnType<typeof setTimeout> | undefined

  function staticCanvas(): HTMLCanvasElement | null {
    return (staticLayer?.getCanvas() as unknown as { _canvas?: HTMLCanvasElement } | undefined)?._canvas ?? null
  }

  /** Draws the static layer now for the current viewport and drops any interim CSS transform. */
  function settle() {
    clearTimeout(settleTimer)
    if (!staticLayer) return
    const v = vp.viewport.value
    staticLayer.scale({ x: v.scale, y: v.scale })
    staticLayer.position({ x: v.panX, y: v.panY })
    const el = staticCanvas()
    if (el) el.style.transform = ''
    drawnAt = v
    staticLayer.draw()
  }

  function drawStatic() {
    if (drawnAt !== vp.viewport.value) settle()
    else staticLayer?.batchDraw()
  }

  function redraw(all: boolean, live = true) {
    if (all) { gridLayer?.batchDraw(); drawStatic() }
    if (live || all) liveLayer?.batchDraw()
  }

  function applyViewport() {
    const v = vp.viewport.value
    const { width, height } = vp.size.value
    paint.scale = v.scale
    const r = visibleRect(v, width, height)
    const pad = 40 / v.scale
    paint.visible = { minU: r.minU - pad, minV: r.minV - pad, maxU: r.maxU + pad, maxV: r.maxV + pad }
    liveLayer?.scale({ x: v.scale, y: v.scale })
    liveLayer?.position({ x: v.panX, y: v.panY })
    gridLayer?.batchDraw()
    liveLayer?.batchDraw()
    const el = staticCanvas()
    if (!drawnAt || !el) return settle()
    const k = v.scale / drawnAt.scale
    el.style.transformOrigin = '0 0'
    el.style.transform = `matrix(${k}, 0, 0, ${k}, ${v.panX - drawnAt.panX * k}, ${v.panY - drawnAt.panY * k})`
    clearTimeout(settleTimer)
    settleTimer = setTimeout(settle, 90)
  }

  function resize(width: number, height: number) {
    stage?.size({ width: Math.max(1, width), height: Math.max(1, height) })
    applyViewport()
    settle()
  }

  /** Brings the geometry up to the store's document and decides which layer each change goes to. */
  function sync() {
    const doc = store.document
    if (!doc) return
    const ch = scene.update(doc)
    let staticDirty = false
    let liveDirty = false
    for (const id of ch.removed) {
      if (staticParts.delete(id) || staticHoses.delete(id)) staticDirty = true
      if (liveParts.delete(id) || liveHoses.delete(id)) liveDirty = true
    }
    if (store.previewing) {
      for (const [ids, from, to] of [[ch.parts, staticParts, liveParts], [ch.hoses, staticHoses, liveHoses]] as const) {
        for (const id of ids) {
          if (from.delete(id)) staticDirty = true
          if (!to.has(id)) to.add(id)
          liveDirty = true
        }
      }
    } else {
      if (liveParts.size || liveHoses.size) {
        for (const id of liveParts) staticParts.add(id)
        for (const id of liveHoses) staticHoses.add(id)
        liveParts.clear()
        liveHoses.clear()
        staticDirty = liveDirty = true
      }
      for (const id of ch.parts) staticParts.add(id)
      for (const id of ch.hoses) staticHoses.add(id)
      if (ch.parts.size || ch.hoses.size) staticDirty = true
      refreshFlow()
    }
    if (staticDirty) staticOrder = null
    if (liveDirty) liveOrder = null
    if (staticDirty) drawStatic()
    if (liveDirty || staticDirty) liveLayer?.batchDraw()
  }

  function refreshFlow() {
    const state = store.flowOverlay
    const f = state !== 'off' ? store.report?.flow[state] : undefined
    flow = f ? flowMarks(scene, f) : []
  }

  watch(() => [store.document, store.previewing] as const, sync)
  watch(() => [store.selectedSet, store.hoverId, store.selectedRoutePoint] as const, () => {
    paint.selected = store.selectedSet
    paint.hover = store.hoverId
    paint.routePoint = store.selectedRoutePoint
    liveLayer?.batchDraw()
  }, { immediate: true })
  watch(() => store.findingMarks, (m) => {
    paint.marks = m
    redraw(true)
  }, { immediate: true })
  watch(() => [store.report, store.flowOverlay] as const, () => {
    refreshFlow()
    liveLayer?.batchDraw()
  })
  watch(vp.viewport, applyViewport)

  /** The view as PNG at twice the screen resolution, without selection marks. */
  function toPng(): string | null {
    if (!stage) return null
    paint.plain = true
    settle()
    stage.draw()
    const url = stage.toDataURL({ pixelRatio: 2, mimeType: 'image/png' })
    paint.plain = false
    stage.batchDraw()
    return url
  }

  function destroy() {
    clearTimeout(settleTimer)
    stage?.destroy()
    stage = gridLayer = staticLayer = liveLayer = null
  }

  const redrawLive = () => liveLayer?.batchDraw()

  return { scene, marks, drawMs, mount, resize, destroy, toPng, redrawLive, sync }
}

export type CanvasSceneApi = ReturnType<typeof useCanvasScene>
