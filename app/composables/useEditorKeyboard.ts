import type { ViewName } from '#shared/drawing'
import { isTypingTarget, matchShortcut } from '~/components/editor/editorShortcuts'
import type { EditorViews } from './useEditorViews'

/**
 * Editor keys on the workbench element, matched against the shortcut list the shortcut sheet prints
 * (components/editor/editorShortcuts.ts); nothing fires while typing in a field. Arrow keys act in
 * the view that has focus: in the side view up is +z, in the top view up is +y; 1 mm a press,
 * 10 mm with Shift. With nothing selected they pan that view. Besides the list: Shift+R turns the
 * other way, + and − zoom the focused view, [ and ] step through the parts.
 */
export function useEditorKeyboard(root: Ref<HTMLElement | null>, views: EditorViews) {
  const store = useEditorStore()
  const saving = useCircuitAutosave()

  function focusedView(target: EventTarget | null): ViewName | null {
    const el = (target as HTMLElement | null)?.closest?.('[data-editor-view]') as HTMLElement | null
    return (el?.dataset.editorView as ViewName | undefined) ?? null
  }

  function stepSelection(dir: 1 | -1) {
    const parts = store.document.circuit.components
    if (parts.length === 0) return
    const at = parts.findIndex((c) => c.id === store.selection[0])
    const next = parts[(at + dir + parts.length) % parts.length]!
    store.select([next.id])
    store.requestFrame([next.id])
  }

  function nudge(view: ViewName | null, key: string, step: number): boolean {
    if (!view) return false
    const right = key === 'ArrowRight' ? 1 : key === 'ArrowLeft' ? -1 : 0
    const up = key === 'ArrowUp' ? 1 : key === 'ArrowDown' ? -1 : 0
    if (store.selection.length === 0 && !store.selectedRoutePoint) {
      views.handles.get(view)?.pan(-right * 60, up * 60)
      return true
    }
    store.nudgeSelection(view === 'side' ? { x: right * step, z: up * step } : { x: right * step, y: up * step })
    return true
  }

  function onKeyDown(e: KeyboardEvent) {
    // keys inside a dialog belong to the dialog (Esc closes it natively)
    if ((e.target as Element | null)?.closest?.('dialog')) return
    if (isTypingTarget(e.target) || !store.loaded || e.defaultPrevented) return
    const view = focusedView(e.target)
    const shortcut = matchShortcut(e)
    let handled = true
    switch (shortcut?.id) {
      case 'undo': store.undo(); break
      case 'redo': store.redo(); break
      case 'copy': handled = store.copySelection() !== null; break
      case 'paste': handled = false; break // the paste event below reads the system clipboard
      case 'duplicate': store.duplicateSelection(); break
      case 'delete': store.deleteSelection(); break
      case 'toggle-plug': store.toggleBlockSelectedPort(); break
      case 'save': void saving.saveNow(); break
      case 'select-all': store.select([...store.document.circuit.components.map((c) => c.id), ...store.document.circuit.hoses.map((h) => h.id)]); break
      case 'clear-selection': store.clearSelection(); break
      case 'rotate': store.rotateSelection(90); break
      case 'nudge': handled = nudge(view, e.key, 1); break
      case 'nudge-far': handled = nudge(view, e.key, 10); break
      case 'nudge-up': store.nudgeSelection({ z: 10 }); break
      case 'nudge-down': store.nudgeSelection({ z: -10 }); break
      case 'frame-all': store.requestFrame([]); break
      case 'shortcuts': handled = false; break // the sheet listens for itself
      default: handled = extraKey(e, view)
    }
    if (handled) e.preventDefault()
  }

  function extraKey(e: KeyboardEvent, view: ViewName | null): boolean {
    if (e.ctrlKey || e.metaKey || e.altKey) return false
    if (e.key === 'R') { store.rotateSelection(-90); return true }
    if (e.key === ']' || e.key === '[') { stepSelection(e.key === ']' ? 1 : -1); return true }
    if (view && (e.key === '+' || e.key === '=' || e.key === '-')) {
      views.handles.get(view)?.zoom(e.key === '-' ? 1 / 1.25 : 1.25)
      return true
    }
    return false
  }

  /** Paste reads the system clipboard's text (a copy from another tab), else the in-app copy. */
  function onPaste(e: ClipboardEvent) {
    if (isTypingTarget(e.target) || !root.value?.contains(document.activeElement) || store.readOnly) return
    const text = e.clipboardData?.getData('text/plain') ?? ''
    store.paste(undefined, text ? store.bundleFromText(text) : null)
    e.preventDefault()
  }

  onMounted(() => {
    root.value?.addEventListener('keydown', onKeyDown)
    document.addEventListener('paste', onPaste)
  })
  onBeforeUnmount(() => {
    root.value?.removeEventListener('keydown', onKeyDown)
    document.removeEventListener('paste', onPaste)
  })
}
