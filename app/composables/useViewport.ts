import { fitRect, toPlane, toScreen, zoomAbout, type PlanePoint, type PlaneRect, type Viewport } from '#shared/drawing'

/** One view's zoom and pan (screen = plane × scale + pan) and its size on screen. */
export function useViewport() {
  const viewport = shallowRef<Viewport>({ scale: 0.15, panX: 40, panY: 300 })
  const size = shallowRef({ width: 0, height: 0 })
  /** set once the view has been fitted to a drawing, so a resize keeps the user's zoom */
  const fitted = ref(false)

  function zoomAt(x: number, y: number, factor: number) {
    viewport.value = zoomAbout(viewport.value, x, y, factor)
  }
  function zoomCentre(factor: number) {
    zoomAt(size.value.width / 2, size.value.height / 2, factor)
  }
  function panBy(dx: number, dy: number) {
    const v = viewport.value
    viewport.value = { ...v, panX: v.panX + dx, panY: v.panY + dy }
  }
  /** Shows `rect` whole; `maxScale` keeps a frame on one small part from zooming in absurdly far. */
  function fit(rect: PlaneRect | null, maxScale = 2) {
    const { width, height } = size.value
    if (!rect || width < 10 || height < 10) return
    const next = fitRect(rect, width, height, 48)
    if (next.scale > maxScale) {
      const cu = (rect.minU + rect.maxU) / 2
      const cv = (rect.minV + rect.maxV) / 2
      viewport.value = { scale: maxScale, panX: width / 2 - cu * maxScale, panY: height / 2 - cv * maxScale }
    } else viewport.value = next
    fitted.value = true
  }
  /** Keeps the plane point at the middle of the view in the middle when the view changes size. */
  function resize(width: number, height: number) {
    if (width < 2 || height < 2) return // hidden (a maximised neighbour, a collapsed panel): keep the last size
    const before = size.value
    if (before.width > 0 && before.height > 0) panBy((width - before.width) / 2, (height - before.height) / 2)
    size.value = { width, height }
  }
  const centre = (): PlanePoint => toPlane(viewport.value, size.value.width / 2, size.value.height / 2)
  const planeAt = (x: number, y: number): PlanePoint => toPlane(viewport.value, x, y)
  const screenAt = (q: PlanePoint) => toScreen(viewport.value, q)

  return { viewport, size, fitted, zoomAt, zoomCentre, panBy, fit, resize, centre, planeAt, screenAt }
}

export type ViewportApi = ReturnType<typeof useViewport>
