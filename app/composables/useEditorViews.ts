import type { InjectionKey } from 'vue'
import type { Point3 } from '#shared/circuit'
import type { PlanePoint, ViewName } from '#shared/drawing'

/** What a mounted view offers the rest of the editor (toolbar exports, palette placing, fit). */
export interface EditorViewHandle {
  view: ViewName
  /** the view as a PNG data URL at twice its screen resolution */
  toPng: () => string | null
  fit: () => void
  zoom: (factor: number) => void
  pan: (dx: number, dy: number) => void
  centre: () => PlanePoint
  focus: () => void
}

export interface EditorViews {
  handles: Map<ViewName, EditorViewHandle>
  /** the view the user worked in last (keyboard nudges and placing use its axes) */
  active: Ref<ViewName>
  /** bumps when a view mounts or unmounts */
  version: Ref<number>
  /** the middle of what the active view shows, in vehicle axes (the hidden axis from the other view) */
  centreWorld: () => Point3
}

const KEY: InjectionKey<EditorViews> = Symbol('editor-views')

/**
 * The registry of the editor's two views. The workbench creates it (`provide = true`); the views
 * register themselves, the toolbar and palette look them up.
 */
export function useEditorViews(provideIt = false): EditorViews {
  if (provideIt) {
    const handles = new Map<ViewName, EditorViewHandle>()
    const active = ref<ViewName>('side')
    const centreWorld = (): Point3 => {
      const side = handles.get('side')?.centre()
      const top = handles.get('top')?.centre()
      const x = (active.value === 'side' ? side?.u : top?.u) ?? side?.u ?? top?.u ?? 0
      return { x: Math.round(x), y: Math.round(top ? -top.v : 0), z: Math.round(side ? -side.v : 0) }
    }
    const views: EditorViews = { handles, active, version: ref(0), centreWorld }
    provide(KEY, views)
    return views
  }
  const views = inject(KEY, null)
  if (!views) throw new Error('useEditorViews() outside the editor workbench')
  return views
}
