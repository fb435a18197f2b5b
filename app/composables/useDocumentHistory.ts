import { ref, shallowRef, type Ref, type ShallowRef } from 'vue'
import { emptyHistory, recordStep, redoStep, undoStep, type CircuitDocument, type UndoHistory } from '#shared/circuit'

/**
 * Undo and redo over document snapshots, with drag previews that become one step. Used by the
 * editor store; `changed(label)` runs after every change that counts (a commit, undo or redo).
 * Imports are explicit so the store works in unit tests outside Nuxt too.
 */
export function useDocumentHistory(document: ShallowRef<CircuitDocument>, readOnly: Ref<boolean>, changed: (label: string) => void, limit = 200) {
  const history = shallowRef<UndoHistory>(emptyHistory())
  const previewing = ref(false)
  let previewBase: CircuitDocument | null = null
  let coalesce: { key: string; at: number } | null = null

  /**
   * Makes `next` the document as one undo step. With `coalesceKey`, a change of the same kind
   * within a second joins the previous step (a run of arrow-key nudges undoes in one go).
   */
  function commit(next: CircuitDocument, label: string, coalesceKey?: string) {
    if (readOnly.value) return
    const base = previewBase ?? document.value
    previewBase = null
    previewing.value = false
    if (next === base) {
      document.value = base
      return
    }
    const now = Date.now()
    const joins = coalesceKey !== undefined && coalesce?.key === coalesceKey && now - coalesce.at < 1000 && history.value.past.length > 0
    if (!joins) history.value = recordStep(history.value, base, label, limit)
    coalesce = coalesceKey ? { key: coalesceKey, at: now } : null
    document.value = next
    changed(label)
  }

  /** Shows a document during a drag without an undo step or an analysis. */
  function preview(next: CircuitDocument) {
    if (readOnly.value) return
    if (previewBase === null) previewBase = document.value
    document.value = next
    previewing.value = true
  }

  /** Turns the drag's last preview into one undo step. */
  function endPreview(label: string) {
    if (previewBase !== null) commit(document.value, label)
  }

  function cancelPreview() {
    if (previewBase === null) return
    document.value = previewBase
    previewBase = null
    previewing.value = false
  }

  function step(direction: 'undo' | 'redo') {
    if (readOnly.value) return
    cancelPreview()
    const result = (direction === 'undo' ? undoStep : redoStep)(history.value, document.value)
    if (!result) return
    history.value = result.history
    document.value = result.doc
    coalesce = null
    changed(`${direction === 'undo' ? 'Undone' : 'Redone'}: ${result.label}`)
  }

  /** Forgets every step, e.g. on loading another circuit. */
  function reset() {
    history.value = emptyHistory()
    previewBase = null
    previewing.value = false
    coalesce = null
  }

  return { history, previewing, commit, preview, endPreview, cancelPreview, undo: () => step('undo'), redo: () => step('redo'), reset }
}
