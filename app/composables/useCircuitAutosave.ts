import { effectScope, toRaw, type EffectScope } from 'vue'
import type { CircuitDocument } from '#shared/circuit'
import type { Report } from '#shared/engine'
import { useCircuitDraft, watchDraftOnLoad, type SetAsideDraft } from './useCircuitDraft'

export type SaveStatus = 'saved' | 'saving' | 'unsaved' | 'offline' | 'conflict' | 'failed' | 'read-only'

/** Mine and theirs after someone else saved first (or a draft older than the server copy). */
export interface SaveConflict {
  mine: CircuitDocument
  theirs: CircuitDocument
  theirVersion: number
  /** 'save': a save answered 409; 'draft': an unsaved draft was based on an older version */
  origin: 'save' | 'draft'
}

const QUIET_MS = 1000
const BACKOFF_MS = [2000, 4000, 8000, 16000, 30000]

interface FetchFailure { status?: number; statusCode?: number; data?: { message?: string; data?: { currentVersion?: number; document?: CircuitDocument | null } } }

function createAutosave() {
  const store = useEditorStore()
  const api = useApi()
  const draft = useCircuitDraft(() => store.circuitId ?? '')

  const saving = ref(false)
  const offline = ref(false)
  const failure = ref('')
  const conflict = ref<SaveConflict | null>(null)
  const lastSavedAt = ref<Date | null>(null)
  const retryAt = ref<Date | null>(null)
  const setAside = ref<SetAsideDraft | null>(null)
  let timer: ReturnType<typeof setTimeout> | undefined
  let attempt = 0
  // the browser's storage exists only in the browser; a server render shows the state as loaded
  const restore = import.meta.client
    ? watchDraftOnLoad(store, draft, (c) => { conflict.value = c })
    : { checked: ref(false), restored: ref(null), discard: () => undefined, dismiss: () => undefined }

  const dirty = computed(() => store.document !== store.savedDocument)
  const status = computed<SaveStatus>(() => {
    if (store.readOnly) return 'read-only'
    if (conflict.value) return 'conflict'
    if (saving.value) return 'saving'
    if (!dirty.value) return 'saved'
    if (offline.value) return 'offline'
    if (failure.value) return 'failed'
    return 'unsaved'
  })

  function schedule(ms: number) {
    clearTimeout(timer)
    timer = setTimeout(() => void saveNow(), ms)
  }

  async function put(baseVersion: number, document: CircuitDocument) {
    return await api<{ version: number; report: Report }>(`/api/circuits/${store.circuitId}/graph`, {
      method: 'PUT', body: { baseVersion, document: toRaw(document) },
    })
  }

  /** Sends the current document. One request at a time; a commit made meanwhile is sent next. */
  async function saveNow(baseVersion = store.serverVersion): Promise<void> {
    clearTimeout(timer)
    if (store.readOnly || saving.value || !store.circuitId || (conflict.value && baseVersion === store.serverVersion)) return
    if (store.previewing) return schedule(QUIET_MS)
    const doc = store.document
    if (doc === store.savedDocument) return
    const circuitId = store.circuitId
    saving.value = true
    try {
      const result = await put(baseVersion, doc)
      if (store.circuitId !== circuitId) return
      store.markSaved(result.version, doc)
      conflict.value = null
      offline.value = false
      failure.value = ''
      retryAt.value = null
      attempt = 0
      lastSavedAt.value = new Date()
      if (store.document === doc) draft.clear()
    } catch (e) {
      if (store.circuitId !== circuitId) return
      onFailure(e as FetchFailure, doc)
    } finally {
      saving.value = false
    }
    if (!conflict.value && !offline.value && !failure.value && store.document !== store.savedDocument) schedule(QUIET_MS)
  }

  function onFailure(e: FetchFailure, doc: CircuitDocument) {
    const status = e.statusCode ?? e.status
    const data = e.data?.data
    if (status === 409 && data?.document && typeof data.currentVersion === 'number') {
      conflict.value = { mine: doc, theirs: data.document, theirVersion: data.currentVersion, origin: 'save' }
      return
    }
    if (!status || status >= 500 || status === 408 || status === 429) {
      // no answer or a server hiccup: try again later, sooner when the browser says it is back online
      offline.value = !status || !navigator.onLine
      failure.value = offline.value ? '' : 'The server had a problem; trying again.'
      const wait = BACKOFF_MS[Math.min(attempt++, BACKOFF_MS.length - 1)]!
      retryAt.value = new Date(Date.now() + wait)
      schedule(wait)
      return
    }
    // refused (signed out, no right to write, invalid): keep the draft and say why; the next commit tries again
    failure.value = e.data?.message || `The save was refused (${status}). Your changes are kept in this browser.`
  }

  /** "Keep mine": my document becomes a new version on top of theirs; theirs stays in the history. */
  async function keepMine() {
    const c = conflict.value
    if (!c) return
    if (c.origin === 'draft') {
      conflict.value = null
      store.commit(c.mine, 'Keep my unsaved changes')
      await saveNow()
      return
    }
    await saveNow(c.theirVersion)
  }

  /** "Take theirs": load their version; mine is kept aside for download until dismissed. */
  function takeTheirs() {
    const c = conflict.value
    if (!c) return
    setAside.value = draft.setAside(toRaw(store.document === store.savedDocument ? c.mine : store.document), c.theirVersion)
    draft.clear()
    conflict.value = null
    store.replaceDocument(c.theirs, c.theirVersion)
  }

  function dismissSetAside() {
    draft.dismissSetAside()
    setAside.value = null
  }

  // every change that counts (commit, undo, redo; not drag previews) is written down and then saved
  watch(() => store.commitSeq, () => {
    const doc = store.document
    if (store.readOnly || !restore.checked.value || !doc) return
    if (doc === store.savedDocument) {
      draft.clear()
      return
    }
    draft.write(store.serverVersion, toRaw(doc))
    failure.value = ''
    if (!offline.value && !conflict.value) schedule(QUIET_MS)
  })
  if (import.meta.client) {
    watch(() => store.circuitId, async (id) => {
      setAside.value = id ? await draft.readSetAside() : null
    }, { immediate: true })
    listenForConnection()
  }

  function listenForConnection() {
    const onOnline = () => {
      offline.value = false
      attempt = 0
      if (dirty.value && !conflict.value) void saveNow()
    }
    const onOffline = () => {
      if (dirty.value || saving.value) offline.value = true
    }
    window.addEventListener('online', onOnline)
    window.addEventListener('offline', onOffline)
    onScopeDispose(() => {
      clearTimeout(timer)
      window.removeEventListener('online', onOnline)
      window.removeEventListener('offline', onOffline)
    })
  }

  return {
    status, saving, dirty, lastSavedAt, retryAt, failure, conflict, setAside,
    restored: restore.restored,
    saveNow: () => saveNow(), keepMine, takeTheirs, dismissSetAside,
    discardRestored: restore.discard, dismissRestored: restore.dismiss,
  }
}

export type CircuitAutosave = ReturnType<typeof createAutosave>

let shared: { scope: EffectScope; api: CircuitAutosave; users: number } | null = null

/**
 * Saving that loses nothing, for the editor store: one instance however many panels ask for it
 * (save state, conflict dialog, draft notice), alive while any of them is mounted.
 */
export function useCircuitAutosave(): CircuitAutosave {
  // module state outlives a server request, so a server render gets its own inert copy
  if (import.meta.server) return createAutosave()
  if (!shared) {
    const scope = effectScope(true)
    const api = scope.run(createAutosave)!
    shared = { scope, api, users: 0 }
  }
  const mine = shared
  mine.users++
  onScopeDispose(() => {
    if (--mine.users === 0 && shared === mine) {
      mine.scope.stop()
      shared = null
    }
  })
  return mine.api
}
