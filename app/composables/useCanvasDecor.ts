import { gridSteps, gridValues, scaleBar, type DrawingTheme, type FlowMark, type Viewport } from '#shared/drawing'
import type { PaintState } from './useCanvasPainter'

type Ctx = CanvasRenderingContext2D

/** The grid under a view and the flow arrows over it. */
export function useCanvasDecor(theme: DrawingTheme) {
  /** Flow arrows, and labels where they do not collide with one already drawn (a screen-space grid keeps that quick). */
  function flow(ctx: Ctx, marks: readonly FlowMark[], st: PaintState) {
    const px = 1 / st.scale
    ctx.font = `${10 * px}px "Atkinson Hyperlegible", sans-serif`
    ctx.textAlign = 'center'
    ctx.textBaseline = 'bottom'
    const cell = 80
    const taken = new Map<string, Array<[number, number, number, number]>>()
    const free = (x0: number, y0: number, x1: number, y1: number) => {
      for (let cx = Math.floor(x0 / cell); cx <= Math.floor(x1 / cell); cx++) {
        for (let cy = Math.floor(y0 / cell); cy <= Math.floor(y1 / cell); cy++) {
          for (const r of taken.get(`${cx},${cy}`) ?? []) if (x0 < r[2] && r[0] < x1 && y0 < r[3] && r[1] < y1) return false
        }
      }
      for (let cx = Math.floor(x0 / cell); cx <= Math.floor(x1 / cell); cx++) {
        for (let cy = Math.floor(y0 / cell); cy <= Math.floor(y1 / cell); cy++) {
          const k = `${cx},${cy}`
          if (!taken.has(k)) taken.set(k, [])
          taken.get(k)!.push([x0, y0, x1, y1])
        }
      }
      return true
    }
    for (const m of marks) {
      if (m.u < st.visible.minU || m.u > st.visible.maxU || m.v < st.visible.minV || m.v > st.visible.maxV) continue
      ctx.save()
      ctx.translate(m.u, m.v)
      if (m.moving) {
        ctx.save()
        ctx.rotate(m.angle)
        ctx.beginPath()
        ctx.moveTo(-8 * px, -7 * px)
        ctx.lineTo(9 * px, 0)
        ctx.lineTo(-8 * px, 7 * px)
        ctx.closePath()
        ctx.fillStyle = theme.colours.ink.DEFAULT
        ctx.fill()
        ctx.restore()
      }
      const w = ctx.measureText(m.label).width
      const sx = m.u * st.scale
      const sy = m.v * st.scale
      if (free(sx - w * st.scale / 2 - 3, sy - 23, sx + w * st.scale / 2 + 3, sy - 10)) {
        ctx.fillStyle = theme.background
        ctx.globalAlpha = 0.85
        ctx.fillRect(-w / 2 - 3 * px, -23 * px, w + 6 * px, 13 * px)
        ctx.globalAlpha = 1
        ctx.fillStyle = m.moving ? theme.colours.ink.soft : theme.colours.ink.muted
        ctx.fillText(m.label, 0, -10 * px)
      }
      ctx.restore()
    }
  }

  /** The grid in screen px: minor and major lines adapting to the zoom, and the datum axes. */
  function grid(ctx: Ctx, vp: Viewport, width: number, height: number) {
    ctx.fillStyle = theme.background
    ctx.fillRect(0, 0, width, height)
    const { minor, major } = gridSteps(vp.scale, 14)
    const u0 = -vp.panX / vp.scale
    const v0 = -vp.panY / vp.scale
    const u1 = u0 + width / vp.scale
    const v1 = v0 + height / vp.scale
    for (const [step, colour] of [[minor, theme.gridMinor], [major, theme.gridMajor]] as const) {
      ctx.beginPath()
      for (const u of gridValues(u0, u1, step, 600)) { const x = Math.round(u * vp.scale + vp.panX) + 0.5; ctx.moveTo(x, 0); ctx.lineTo(x, height) }
      for (const v of gridValues(v0, v1, step, 600)) { const y = Math.round(v * vp.scale + vp.panY) + 0.5; ctx.moveTo(0, y); ctx.lineTo(width, y) }
      ctx.strokeStyle = colour
      ctx.lineWidth = 1
      ctx.stroke()
    }
    ctx.beginPath()
    const ax = Math.round(vp.panX) + 0.5
    const ay = Math.round(vp.panY) + 0.5
    ctx.moveTo(ax, 0); ctx.lineTo(ax, height); ctx.moveTo(0, ay); ctx.lineTo(width, ay)
    ctx.strokeStyle = theme.axis
    ctx.setLineDash([10, 4, 2, 4])
    ctx.stroke()
    ctx.setLineDash([])
  }

  /**
   * A scale bar and the view's name, drawn into the picture itself for exports (on screen they are
   * HTML over the canvas). `ctx` is in plane coordinates; positions are worked out from screen px.
   */
  function annotate(ctx: Ctx, vp: Viewport, height: number, text: string) {
    const px = 1 / vp.scale
    const at = (x: number, y: number) => [(x - vp.panX) * px, (y - vp.panY) * px] as const
    const bar = scaleBar(vp.scale, 140)
    const [x0, y0] = at(16, height - 18)
    ctx.fillStyle = theme.background
    ctx.globalAlpha = 0.9
    ctx.fillRect(x0 - 6 * px, y0 - 26 * px, bar.lengthMm + 12 * px, 34 * px)
    ctx.globalAlpha = 1
    ctx.strokeStyle = theme.stroke
    ctx.lineWidth = 2 * px
    ctx.beginPath()
    ctx.moveTo(x0, y0 - 6 * px); ctx.lineTo(x0, y0); ctx.lineTo(x0 + bar.lengthMm, y0); ctx.lineTo(x0 + bar.lengthMm, y0 - 6 * px)
    ctx.stroke()
    ctx.fillStyle = theme.stroke
    ctx.font = `${12 * px}px "Atkinson Hyperlegible", sans-serif`
    ctx.textAlign = 'left'
    ctx.textBaseline = 'bottom'
    ctx.fillText(bar.label, x0, y0 - 9 * px)
    ctx.fillText(text, x0 + bar.lengthMm + 16 * px, y0)
  }

  return { grid, flow, annotate }
}
