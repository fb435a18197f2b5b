// Konva for the editor's views, loaded only when a view mounts: pages without a drawing never
// download it. The views draw with a few custom shapes on listening-free layers and do their own
// hit testing (shared/drawing/hitTest.ts), so Konva's event system stays idle.
import type { KonvaKit } from '~/composables/useCanvasScene'

export default defineNuxtPlugin(() => {
  let loading: Promise<KonvaKit> | null = null
  const loadKonva = (): Promise<KonvaKit> => {
    loading ??= Promise.all([import('konva/lib/Core'), import('konva/lib/Shape')]).then(([core, shape]) => {
      const Konva = core.default
      // pointer capture and drag bookkeeping are ours; keep Konva from adding its own work per event
      Konva.capturePointerEventsEnabled = false
      Konva.hitOnDragEnabled = false
      Konva.showWarnings = false
      return { Konva, Shape: shape.Shape }
    })
    return loading
  }
  return { provide: { loadKonva } }
})
