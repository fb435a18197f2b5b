// World (plane, mm) ↔ screen (px) for one view: screen = plane × scale + pan.
import type { PlanePoint } from './projection'

export interface Viewport {
  /** px per mm */
  scale: number
  panX: number
  panY: number
}

export interface PlaneRect {
  minU: number
  minV: number
  maxU: number
  maxV: number
}

/** 1 px = 500 mm at the widest, 40 px per mm at the closest. */
export const ZOOM_LIMITS = { min: 0.002, max: 40 } as const

export const clampScale = (s: number) => Math.min(ZOOM_LIMITS.max, Math.max(ZOOM_LIMITS.min, s))

export function toScreen(vp: Viewport, q: PlanePoint): { x: number; y: number } {
  return { x: q.u * vp.scale + vp.panX, y: q.v * vp.scale + vp.panY }
}

export function toPlane(vp: Viewport, x: number, y: number): PlanePoint {
  return { u: (x - vp.panX) / vp.scale, v: (y - vp.panY) / vp.scale }
}

/** Zooms by `factor` keeping the plane point under the screen point (x, y) where it is. */
export function zoomAbout(vp: Viewport, x: number, y: number, factor: number): Viewport {
  const scale = clampScale(vp.scale * factor)
  const q = toPlane(vp, x, y)
  return { scale, panX: x - q.u * scale, panY: y - q.v * scale }
}

/** The viewport that shows `rect` whole and centred in a width × height screen, with a margin. */
export function fitRect(rect: PlaneRect, width: number, height: number, marginPx = 40): Viewport {
  const w = Math.max(rect.maxU - rect.minU, 1)
  const h = Math.max(rect.maxV - rect.minV, 1)
  const scale = clampScale(Math.min(Math.max(width - 2 * marginPx, 20) / w, Math.max(height - 2 * marginPx, 20) / h))
  const cu = (rect.minU + rect.maxU) / 2
  const cv = (rect.minV + rect.maxV) / 2
  return { scale, panX: width / 2 - cu * scale, panY: height / 2 - cv * scale }
}

/** The part of the plane a width × height screen shows. */
export function visibleRect(vp: Viewport, width: number, height: number): PlaneRect {
  const a = toPlane(vp, 0, 0)
  const b = toPlane(vp, width, height)
  return { minU: a.u, minV: a.v, maxU: b.u, maxV: b.v }
}

export function unionRect(a: PlaneRect | null, b: PlaneRect): PlaneRect {
  if (!a) return { ...b }
  return { minU: Math.min(a.minU, b.minU), minV: Math.min(a.minV, b.minV), maxU: Math.max(a.maxU, b.maxU), maxV: Math.max(a.maxV, b.maxV) }
}

export function rectsOverlap(a: PlaneRect, b: PlaneRect): boolean {
  return a.minU <= b.maxU && b.minU <= a.maxU && a.minV <= b.maxV && b.minV <= a.maxV
}

/** Rectangle spanned by two corners in any order. */
export function rectFrom(a: PlanePoint, b: PlanePoint): PlaneRect {
  return { minU: Math.min(a.u, b.u), minV: Math.min(a.v, b.v), maxU: Math.max(a.u, b.u), maxV: Math.max(a.v, b.v) }
}
