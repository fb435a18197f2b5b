import type { Severity } from '#shared/engine'
import {
  hoseStrokePx, outlineStub, portMarker, pointAlong, symbolPrimitives, type DrawingTheme, type HoseGeom, type PartGeom, type PlaneRect, type Primitive,
} from '#shared/drawing'

/** What a paint pass needs besides the geometry; kept in a plain object so drawing never touches Vue. */
export interface PaintState {
  scale: number
  /** the plane area on screen, with a margin: anything outside is skipped */
  visible: PlaneRect
  marks: Map<string, Severity>
  selected: Set<string>
  hover: string | null
  routePoint: { hoseId: string; index: number } | null
  /** hide selection and hover, e.g. for a PNG export */
  plain: boolean
}

type Ctx = CanvasRenderingContext2D
const BADGE: Record<Severity, string> = { error: '!', warning: '▲', note: 'i' }

/** below this size on screen, px, a part is drawn as a plain box */
const DETAIL_PX = 10

const outside = (b: PlaneRect, v: PlaneRect) => b.maxU < v.minU || b.minU > v.maxU || b.maxV < v.minV || b.minV > v.maxV

/** Canvas drawing of the editor's views: symbols, hoses, ports, finding marks and the selection. */
export function useCanvasPainter(theme: DrawingTheme) {
  const fillFor = (f: Primitive['fill']) => (f === 'body' ? theme.body : f === 'accent' ? theme.accent : f === 'ink' ? theme.stroke : null)

  function primitives(ctx: Ctx, prims: readonly Primitive[], lineWidth: number) {
    ctx.lineWidth = lineWidth
    ctx.strokeStyle = theme.stroke
    for (const p of prims) {
      ctx.beginPath()
      if (p.kind === 'rect') {
        if (p.r) ctx.roundRect(p.x, p.y, p.w, p.h, Math.min(p.r, p.w / 2, p.h / 2))
        else ctx.rect(p.x, p.y, p.w, p.h)
      } else if (p.kind === 'circle') ctx.arc(p.cx, p.cy, p.r, 0, Math.PI * 2)
      else {
        ctx.moveTo(p.points[0]!, p.points[1]!)
        for (let i = 2; i < p.points.length; i += 2) ctx.lineTo(p.points[i]!, p.points[i + 1]!)
        if (p.closed) ctx.closePath()
      }
      const fill = fillFor(p.fill)
      if (fill) { ctx.fillStyle = fill; ctx.fill() }
      ctx.setLineDash(p.kind === 'path' && p.dash ? [lineWidth * 4, lineWidth * 3] : [])
      ctx.stroke()
    }
    ctx.setLineDash([])
  }

  function badge(ctx: Ctx, u: number, v: number, severity: Severity, px: number) {
    ctx.beginPath()
    ctx.arc(u, v, 7 * px, 0, Math.PI * 2)
    ctx.fillStyle = theme.severity[severity]
    ctx.fill()
    ctx.fillStyle = theme.background
    ctx.font = `bold ${9 * px}px sans-serif`
    ctx.textAlign = 'center'
    ctx.textBaseline = 'middle'
    ctx.fillText(BADGE[severity], u, v + 0.5 * px)
  }

  /** The four corners of a part's outline on the plane, turned with it. */
  function corners(g: PartGeom, grow = 0): number[] {
    const a = (g.outline.rotation * Math.PI) / 180
    const c = Math.cos(a)
    const sn = Math.sin(a)
    const hw = g.outline.w / 2 + grow
    const hh = g.outline.h / 2 + grow
    return [[-hw, -hh], [hw, -hh], [hw, hh], [-hw, hh]].flatMap(([x, y]) => [g.u + x! * c - y! * sn, g.v + x! * sn + y! * c])
  }
  function polygon(ctx: Ctx, pts: number[]) {
    ctx.moveTo(pts[0]!, pts[1]!)
    for (let i = 2; i < pts.length; i += 2) ctx.lineTo(pts[i]!, pts[i + 1]!)
    ctx.closePath()
  }

  function partBody(ctx: Ctx, g: PartGeom, st: PaintState) {
    const o = g.outline
    ctx.save()
    ctx.translate(g.u, g.v)
    if (o.rotation) ctx.rotate((o.rotation * Math.PI) / 180)
    primitives(ctx, symbolPrimitives(g.comp.type, o.w, o.h), 1.25 / st.scale)
    ctx.restore()
  }

  function trace(ctx: Ctx, f: readonly number[]) {
    ctx.moveTo(f[0]!, f[1]!)
    for (let i = 2; i < f.length; i += 2) ctx.lineTo(f[i]!, f[i + 1]!)
  }

  /**
   * Hoses in as few strokes as possible: one path per material and on-screen width (a canvas stroke
   * of one long path costs far less than many short ones), then the marks and red dashes of the few.
   */
  function hoses(ctx: Ctx, list: readonly HoseGeom[], st: PaintState) {
    const px = 1 / st.scale
    const groups = new Map<string, { width: number; material: HoseGeom['hose']['material']; items: HoseGeom[] }>()
    for (const h of list) {
      const widthPx = Math.round(hoseStrokePx(h.hose.insideDiameterMm, st.scale) * 2) / 2
      const key = `${h.hose.material}|${widthPx}`
      let g = groups.get(key)
      if (!g) groups.set(key, (g = { width: widthPx, material: h.hose.material, items: [] }))
      g.items.push(h)
    }
    ctx.lineJoin = 'round'
    ctx.lineCap = 'round'
    for (const h of list) {
      const mark = st.marks.get(h.id)
      if (!mark) continue
      ctx.beginPath()
      trace(ctx, h.flat)
      ctx.strokeStyle = theme.severity[mark]
      ctx.globalAlpha = 0.35
      ctx.lineWidth = (hoseStrokePx(h.hose.insideDiameterMm, st.scale) + 8) * px
      ctx.stroke()
    }
    for (const g of groups.values()) {
      const style = theme.materials[g.material]
      ctx.beginPath()
      for (const h of g.items) trace(ctx, h.flat)
      ctx.globalAlpha = 0.62
      ctx.strokeStyle = style.colour
      ctx.lineWidth = g.width * px
      ctx.stroke()
      ctx.globalAlpha = 1
      if (style.centreDash.length && g.width >= 4) {
        ctx.strokeStyle = theme.background
        ctx.lineWidth = px
        ctx.setLineDash(style.centreDash.map((d) => d * px))
        ctx.stroke()
        ctx.setLineDash([])
      }
    }
    ctx.globalAlpha = 1
    for (const h of list) {
      if (h.crosses || h.tooShort) {
        ctx.beginPath()
        trace(ctx, h.flat)
        ctx.strokeStyle = theme.severity.error
        ctx.lineWidth = 2 * px
        ctx.setLineDash([8 * px, 5 * px])
        ctx.stroke()
        ctx.setLineDash([])
      }
      const mark = st.marks.get(h.id)
      const mid = mark ? pointAlong(h.flat, 0.5) : null
      if (mark && mid) badge(ctx, mid.u, mid.v - (hoseStrokePx(h.hose.insideDiameterMm, st.scale) / 2 + 8) * px, mark, px)
    }
  }

  function partDetails(ctx: Ctx, g: PartGeom, st: PaintState) {
    const px = 1 / st.scale
    for (const p of g.ports) {
      const stub = outlineStub(g, g.outline, p)
      if (stub) {
        ctx.beginPath()
        ctx.moveTo(stub[0], stub[1])
        ctx.lineTo(stub[2], stub[3])
        ctx.strokeStyle = theme.stroke
        ctx.lineWidth = 1.25 * px
        ctx.stroke()
      }
      const size = Math.max(10, Math.min(40, p.port.spigotOdMm * st.scale))
      const mark = st.marks.get(p.id)
      ctx.save()
      ctx.translate(p.u, p.v)
      ctx.scale(px, px)
      if (mark) {
        ctx.beginPath()
        ctx.arc(0, 0, size / 2 + 6, 0, Math.PI * 2)
        ctx.strokeStyle = theme.severity[mark]
        ctx.lineWidth = 3
        ctx.stroke()
      }
      primitives(ctx, portMarker(p.port.role, p.outward, size, p.port.blocked), 1.25)
      ctx.restore()
    }
    const mark = st.marks.get(g.id)
    const o = g.outline
    if (mark) badge(ctx, g.u + o.w / 2 + 4 * px, g.v - o.h / 2 - 4 * px, mark, px)
    if (Math.max(o.w, o.h) * st.scale >= 28) {
      ctx.fillStyle = theme.stroke
      ctx.font = `${11 * px}px "Atkinson Hyperlegible", sans-serif`
      ctx.textAlign = 'center'
      ctx.textBaseline = 'top'
      ctx.fillText(g.comp.label, g.u, g.bounds.maxV + 4 * px)
    }
  }

  /**
   * Parts, then the hoses over them, then ports and labels on top, skipping what is off screen. A
   * part smaller than DETAIL_PX on screen is a plain box (its symbol and ports would be a smudge),
   * all such boxes in one path.
   */
  function elements(ctx: Ctx, parts: readonly PartGeom[], hoseList: Iterable<HoseGeom>, st: PaintState) {
    const px = 1 / st.scale
    const small: PartGeom[] = []
    const big: PartGeom[] = []
    for (const g of parts) {
      if (outside(g.bounds, st.visible)) continue
      ;(Math.max(g.outline.w, g.outline.h) * st.scale < DETAIL_PX ? small : big).push(g)
    }
    for (const g of [...small, ...big]) {
      const mark = st.marks.get(g.id)
      if (!mark) continue
      ctx.beginPath()
      polygon(ctx, corners(g, 6 * px))
      ctx.strokeStyle = theme.severity[mark]
      ctx.lineWidth = 3 * px
      ctx.stroke()
    }
    if (small.length) {
      ctx.beginPath()
      for (const g of small) polygon(ctx, corners(g))
      ctx.fillStyle = theme.body
      ctx.fill()
      ctx.strokeStyle = theme.stroke
      ctx.lineWidth = px
      ctx.stroke()
    }
    for (const g of big) partBody(ctx, g, st)
    hoses(ctx, [...hoseList].filter((h) => !outside(h.bounds, st.visible)), st)
    for (const g of big) partDetails(ctx, g, st)
    for (const g of small) {
      const mark = st.marks.get(g.id)
      if (mark) badge(ctx, g.u + g.outline.w / 2 + 4 * px, g.v - g.outline.h / 2 - 4 * px, mark, px)
    }
  }

  /** Selection halos, bend-point handles of selected or hovered hoses, the hovered element. */
  function selection(ctx: Ctx, parts: Map<string, PartGeom>, hoses: Map<string, HoseGeom>, ports: Map<string, { u: number; v: number }>, st: PaintState) {
    if (st.plain) return
    const px = 1 / st.scale
    ctx.strokeStyle = theme.selection
    for (const id of st.hover && !st.selected.has(st.hover) ? [...st.selected, st.hover] : st.selected) {
      const hovered = id === st.hover && !st.selected.has(id)
      ctx.globalAlpha = hovered ? 0.45 : 1
      ctx.setLineDash(hovered ? [] : [6 * px, 3 * px])
      ctx.lineWidth = 2 * px
      const g = parts.get(id)
      if (g) {
        ctx.save()
        ctx.translate(g.u, g.v)
        if (g.outline.rotation) ctx.rotate((g.outline.rotation * Math.PI) / 180)
        ctx.strokeRect(-g.outline.w / 2 - 3 * px, -g.outline.h / 2 - 3 * px, g.outline.w + 6 * px, g.outline.h + 6 * px)
        ctx.restore()
      }
      const p = ports.get(id)
      if (p) {
        ctx.beginPath()
        ctx.arc(p.u, p.v, 11 * px, 0, Math.PI * 2)
        ctx.stroke()
      }
      const h = hoses.get(id)
      if (h) {
        // a dashed line along the hose: unlike the finding marks, which are wide bands
        const f = h.flat
        ctx.beginPath()
        ctx.moveTo(f[0]!, f[1]!)
        for (let i = 2; i < f.length; i += 2) ctx.lineTo(f[i]!, f[i + 1]!)
        ctx.lineWidth = 2.5 * px
        ctx.setLineDash(hovered ? [] : [7 * px, 4 * px])
        ctx.stroke()
        ctx.setLineDash([])
        ctx.globalAlpha = 1
        for (let i = 2; i < f.length - 2; i += 2) {
          const picked = st.routePoint?.hoseId === id && st.routePoint.index === i / 2 - 1
          ctx.beginPath()
          ctx.rect(f[i]! - 5 * px, f[i + 1]! - 5 * px, 10 * px, 10 * px)
          ctx.fillStyle = picked ? theme.selection : theme.background
          ctx.fill()
          ctx.lineWidth = 1.5 * px
          ctx.stroke()
        }
        for (const end of [0, f.length - 2]) {
          if ((end === 0 ? h.hose.from : h.hose.to).portId !== null) continue
          ctx.beginPath()
          ctx.arc(f[end]!, f[end + 1]!, 6 * px, 0, Math.PI * 2)
          ctx.fillStyle = theme.severity.error
          ctx.fill()
        }
      }
    }
    ctx.globalAlpha = 1
    ctx.setLineDash([])
  }

  return { elements, selection }
}
