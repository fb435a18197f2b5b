// Undo and redo over whole-document snapshots. Documents are immutable and share unchanged parts,
// so keeping a snapshot per step costs little, and undo restores exactly what was there.
import type { CircuitDocument } from './document'

export interface UndoEntry {
  /** the document on the other side of the step */
  doc: CircuitDocument
  /** what the step did, in words ("Move 2 parts") */
  label: string
}

export interface UndoHistory {
  past: readonly UndoEntry[]
  future: readonly UndoEntry[]
}

export const emptyHistory = (): UndoHistory => ({ past: [], future: [] })

/** Notes a change made on top of `before`; the redo list is cleared; the oldest steps drop off past `limit`. */
export function recordStep(history: UndoHistory, before: CircuitDocument, label: string, limit = 200): UndoHistory {
  const past = [...history.past, { doc: before, label }]
  return { past: past.length > limit ? past.slice(past.length - limit) : past, future: [] }
}

/** One step back from `present`: the document to show, or null when there is nothing to undo. */
export function undoStep(history: UndoHistory, present: CircuitDocument): { history: UndoHistory; doc: CircuitDocument; label: string } | null {
  const last = history.past[history.past.length - 1]
  if (!last) return null
  return {
    history: { past: history.past.slice(0, -1), future: [...history.future, { doc: present, label: last.label }] },
    doc: last.doc,
    label: last.label,
  }
}

/** One step forward again, or null. */
export function redoStep(history: UndoHistory, present: CircuitDocument): { history: UndoHistory; doc: CircuitDocument; label: string } | null {
  const next = history.future[history.future.length - 1]
  if (!next) return null
  return {
    history: { past: [...history.past, { doc: present, label: next.label }], future: history.future.slice(0, -1) },
    doc: next.doc,
    label: next.label,
  }
}
