import { diffCircuits, isEmptyDiff, parseCircuitDocument, type CircuitDocument } from '#shared/circuit'

/** What the browser keeps of a circuit's unsaved work: the document and the server version it was based on. */
export interface CircuitDraft {
  circuitId: string
  baseVersion: number
  document: CircuitDocument
  /** ISO time of the commit that wrote it */
  savedAt: string
}

/** The user's own version, put aside after "take theirs" so it can still be downloaded. */
export interface SetAsideDraft {
  circuitId: string
  document: CircuitDocument
  /** the version that was taken instead */
  theirVersion: number
  setAsideAt: string
}

export const draftKey = (circuitId: string) => `hosewright:draft:${circuitId}`
export const setAsideKey = (circuitId: string) => `${draftKey(circuitId)}:set-aside`

// localStorage holds about 5 M characters per site; a bigger document goes to IndexedDB and
// localStorage keeps a small pointer, so reading always starts from one place.
const LOCAL_LIMIT_CHARS = 4_000_000
interface Pointer { inIndexedDb: true; savedAt: string }

function openDb(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open('hosewright', 1)
    req.onupgradeneeded = () => req.result.createObjectStore('drafts')
    req.onsuccess = () => resolve(req.result)
    req.onerror = () => reject(req.error)
  })
}

async function idb<T>(mode: IDBTransactionMode, run: (s: IDBObjectStore) => IDBRequest): Promise<T> {
  const db = await openDb()
  try {
    return await new Promise<T>((resolve, reject) => {
      const req = run(db.transaction('drafts', mode).objectStore('drafts'))
      req.onsuccess = () => resolve(req.result as T)
      req.onerror = () => reject(req.error)
    })
  } finally {
    db.close()
  }
}

function writeEntry(key: string, value: { savedAt?: string; setAsideAt?: string }): void {
  const text = JSON.stringify(value)
  if (text.length <= LOCAL_LIMIT_CHARS) {
    try {
      localStorage.setItem(key, text)
      void idb('readwrite', (s) => s.delete(key)).catch(() => undefined)
      return
    } catch {
      // quota reached: fall through to IndexedDB
    }
  }
  const pointer: Pointer = { inIndexedDb: true, savedAt: value.savedAt ?? value.setAsideAt ?? new Date().toISOString() }
  localStorage.setItem(key, JSON.stringify(pointer))
  void idb('readwrite', (s) => s.put(text, key))
}

async function readEntry<T>(key: string): Promise<T | null> {
  const text = localStorage.getItem(key)
  if (text === null) return null
  try {
    const value = JSON.parse(text) as T | Pointer
    if ((value as Pointer).inIndexedDb) {
      const stored = await idb<string | undefined>('readonly', (s) => s.get(key))
      return stored ? (JSON.parse(stored) as T) : null
    }
    return value as T
  } catch {
    return null
  }
}

function removeEntry(key: string): void {
  const had = localStorage.getItem(key)
  localStorage.removeItem(key)
  if (had?.includes('"inIndexedDb"')) void idb('readwrite', (s) => s.delete(key)).catch(() => undefined)
}

/**
 * The local copy of a circuit's unsaved work, written on every commit and removed once the server has
 * that document. A draft that no longer reads as a valid document is ignored but not deleted.
 */
export function useCircuitDraft(circuitId: () => string) {
  function write(baseVersion: number, document: CircuitDocument): void {
    const id = circuitId()
    const draft: CircuitDraft = { circuitId: id, baseVersion, document, savedAt: new Date().toISOString() }
    try {
      writeEntry(draftKey(id), draft)
    } catch {
      // storage switched off (private window): the server save is then the only copy
    }
  }

  async function read(): Promise<CircuitDraft | null> {
    const draft = await readEntry<CircuitDraft>(draftKey(circuitId()))
    if (!draft || draft.circuitId !== circuitId() || typeof draft.baseVersion !== 'number') return null
    const parsed = parseCircuitDocument(draft.document)
    return parsed.ok ? { ...draft, document: parsed.document } : null
  }

  function clear(): void {
    removeEntry(draftKey(circuitId()))
  }

  function setAside(document: CircuitDocument, theirVersion: number): SetAsideDraft {
    const entry: SetAsideDraft = { circuitId: circuitId(), document, theirVersion, setAsideAt: new Date().toISOString() }
    try {
      writeEntry(setAsideKey(circuitId()), entry)
    } catch {
      // kept in memory by the caller for the download
    }
    return entry
  }

  async function readSetAside(): Promise<SetAsideDraft | null> {
    return await readEntry<SetAsideDraft>(setAsideKey(circuitId()))
  }

  function dismissSetAside(): void {
    removeEntry(setAsideKey(circuitId()))
  }

  return { write, read, clear, setAside, readSetAside, dismissSetAside }
}

/** Offers a document as a JSON file in the exchange format, e.g. "my version" after a conflict. */
export function downloadDocument(document: CircuitDocument, fileName: string): void {
  const blob = new Blob([JSON.stringify(document, null, 2)], { type: 'application/json' })
  const url = URL.createObjectURL(blob)
  const a = Object.assign(window.document.createElement('a'), { href: url, download: fileName })
  window.document.body.append(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 10_000)
}

export type CircuitDraftStore = ReturnType<typeof useCircuitDraft>

/** The parts of the editor store the draft restore needs. */
interface DraftHost {
  circuitId: string | null
  readOnly: boolean
  serverVersion: number
  savedDocument: CircuitDocument | null
  /** goes up on every load */
  loadSeq: number
  commit: (doc: CircuitDocument, label: string) => void
}

/** A draft based on an older server version than the one loaded: mine and theirs to choose from. */
export interface DraftConflict {
  mine: CircuitDocument
  theirs: CircuitDocument
  theirVersion: number
  origin: 'draft'
}

/**
 * Looks for a draft each time a circuit is loaded. A draft on the loaded version is restored as one
 * undo step; one on an older version goes to the conflict dialog; one equal to the server copy is removed.
 */
export function watchDraftOnLoad(store: DraftHost, draft: CircuitDraftStore, onConflict: (c: DraftConflict) => void) {
  const checked = ref(false)
  const restored = ref<{ savedAt: Date } | null>(null)
  let run = 0

  async function check() {
    const mine = ++run
    checked.value = false
    restored.value = null
    const saved = store.savedDocument
    if (!store.circuitId || !saved) return
    const found = store.readOnly ? null : await draft.read()
    if (mine !== run) return
    if (found && isEmptyDiff(diffCircuits(saved, found.document))) draft.clear()
    else if (found && found.baseVersion === store.serverVersion) {
      store.commit(found.document, 'Restore unsaved changes')
      restored.value = { savedAt: new Date(found.savedAt) }
    } else if (found) onConflict({ mine: found.document, theirs: saved, theirVersion: store.serverVersion, origin: 'draft' })
    checked.value = true
  }

  watch(() => store.loadSeq, () => void check(), { immediate: true })

  return {
    checked,
    restored,
    /** back to the server copy; the restored changes stay one undo step away */
    discard: () => {
      if (store.savedDocument) store.commit(store.savedDocument, 'Discard restored changes')
      restored.value = null
    },
    dismiss: () => { restored.value = null },
  }
}
