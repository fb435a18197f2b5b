import type { Ref, ShallowRef } from 'vue'
import { clipboardBundle, CLIPBOARD_FORMAT, extractElements, insertElements, type CircuitDocument, type Component, type ElementBundle, type Point3 } from '#shared/circuit'

interface ClipboardHost {
  document: ShallowRef<CircuitDocument>
  readOnly: Ref<boolean>
  lastAction: Ref<string>
  movableIds: () => string[]
  commit: (next: CircuitDocument, label: string) => void
  select: (ids: readonly string[]) => void
}

/**
 * Copy and paste of parts and hoses for the editor store: an in-app copy, and the same bundle as
 * JSON on the system clipboard when the browser allows, so a copy can go to another tab. Imports
 * are explicit so the store works in unit tests outside Nuxt.
 */
export function useEditorClipboard(host: ClipboardHost) {
  let clipboard: ElementBundle | null = null
  let pasteCount = 0

  function copySelection(): ElementBundle | null {
    const ids = host.movableIds()
    if (ids.length === 0) return null
    clipboard = extractElements(host.document.value, ids)
    pasteCount = 0
    const text = JSON.stringify({ format: CLIPBOARD_FORMAT, ...clipboard })
    if (typeof navigator !== 'undefined' && navigator.clipboard?.writeText) navigator.clipboard.writeText(text).catch(() => { /* the in-app copy still works */ })
    host.lastAction.value = `Copied ${ids.length} element${ids.length === 1 ? '' : 's'}`
    return clipboard
  }

  /** Reads a bundle copied from Hosewright (possibly another tab); null when the text is something else. */
  function bundleFromText(text: string): ElementBundle | null {
    try {
      const parsed = clipboardBundle.safeParse(JSON.parse(text))
      return parsed.success ? { components: parsed.data.components as Component[], hoses: parsed.data.hoses } : null
    } catch {
      return null
    }
  }

  /** Pastes the clipboard (or a given bundle) next to the originals, or centred on `at`. */
  function paste(at?: Point3, bundle?: ElementBundle | null) {
    const source = bundle ?? clipboard
    if (host.readOnly.value || !source || (source.components.length === 0 && source.hoses.length === 0)) return
    let offset: Partial<Point3>
    if (at && source.components.length > 0) {
      const n = source.components.length
      const c = source.components.reduce((s, p) => ({ x: s.x + p.position.x / n, y: s.y + p.position.y / n, z: s.z + p.position.z / n }), { x: 0, y: 0, z: 0 })
      offset = { x: at.x - c.x, y: at.y - c.y, z: at.z - c.z }
    } else {
      pasteCount++
      offset = { x: 100 * pasteCount, y: 100 * pasteCount }
    }
    const result = insertElements(host.document.value, source, offset)
    host.commit(result.doc, 'Paste')
    host.select([...source.components.map((c) => result.idMap.get(c.id)!), ...source.hoses.flatMap((h) => result.idMap.get(h.id) ?? [])])
  }

  return { copySelection, bundleFromText, paste }
}
