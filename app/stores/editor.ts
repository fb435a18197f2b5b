// The circuit editor's state: one document, its undo history, the selection, the engine's report.
//
// For the panels (inspector, findings, save state, conflict dialog, shortcut sheet, autosave):
// - `document` is immutable. Never change it in place: build the new one with the pure edits of
//   '#shared/circuit' (updateComponent, updatePort, updateHose, updateSettings, updateCircuitText …)
//   and hand it to `commit(newDoc, 'Label for undo')`. Values must be valid for the zod schemas
//   (validate forms with them); the edits keep ids and hose ends consistent.
// - `dirty` is true while `document !== savedDocument`. Autosave: after a save answers, call
//   `markSaved(version, docThatWasSent)`; after "take theirs", `replaceDocument(theirDoc, theirVersion)`.
//   `loadSeq` goes up on every load, `commitSeq` on every change that counts (not drag previews),
//   so watch those rather than `document`, which also changes on every pointer move of a drag
//   (`previewing` is true then). Anything computed from `document` in a panel re-runs during drags;
//   keep it cheap, or skip the work while `previewing`.
// - Findings: `report` (the engine's; `reportCommit === commitSeq` when it is for the current
//   document), `findingMarks` (element → worst severity, what the views mark), `applyFix(action)`
//   for one-click fixes, `select(ids)` + `requestFrame(ids)` to show a finding's elements on both views.
// - `readOnly` is set from the session at load; when true every editing action does nothing.
// - `selectedPort` / `selectedComponents` / `selectedHoses` for the inspector; `selectedRoutePoint`
//   when a bend point is picked. Actions the keyboard and toolbar share: deleteSelection,
//   duplicateSelection, rotateSelection, nudgeSelection, toggleBlockSelectedPort,
//   addBendToSelectedHose, joinSelectedPorts, copySelection, paste, placePart.
import { defineStore } from 'pinia'
import { computed, ref, shallowRef, toRaw } from 'vue'
import { useDocumentHistory } from '../composables/useDocumentHistory'
import { useEditorClipboard } from '../composables/useEditorClipboard'
import {
  addHose, addRoutePoint, applyFix as applyFixEdit, deleteElements, duplicateElements, middleBend, moveComponents, moveRoutePoint,
  placeComponent, removeRoutePoint, rotateComponent, updatePort,
  type CircuitDocument, type CircuitIssue, type Component, type ComponentType, type Hose, type Point3, type Port,
} from '#shared/circuit'
import type { FixAction, Report, Severity } from '#shared/engine'
import type { TemplateBody } from '#shared/schemas/template'

export type FlowOverlay = 'off' | 'open' | 'closed'
export type ElementKind = 'component' | 'port' | 'hose'
export type SelectMode = 'replace' | 'add' | 'toggle'

const UNDO_LIMIT = 200
const SEVERITY_RANK: Record<Severity, number> = { error: 0, warning: 1, note: 2 }

export const useEditorStore = defineStore('editor', () => {
  const circuitId = ref<string | null>(null)
  const projectId = ref<string | null>(null)
  const kind = ref<'coolant' | 'fuel'>('coolant')
  const document = shallowRef<CircuitDocument>(null as unknown as CircuitDocument)
  const savedDocument = shallowRef<CircuitDocument | null>(null)
  const serverVersion = ref(0)
  const selection = shallowRef<string[]>([])
  const selectedRoutePoint = shallowRef<{ hoseId: string; index: number } | null>(null)
  const readOnly = ref(true)
  const report = shallowRef<Report | null>(null)
  const reportSeq = ref(0)
  /** the commitSeq of the document the report is for: equal to commitSeq when it is up to date */
  const reportCommit = ref(0)
  /** port → part of the document the report is for (not of every drag preview, so marks stay put) */
  const reportPortOwners = shallowRef(new Map<string, string>())
  const portOwnersOf = (doc: CircuitDocument) => new Map(doc.circuit.components.flatMap((c) => c.ports.map((p) => [p.id, c.id] as const)))
  const documentIssues = shallowRef<CircuitIssue[]>([])
  const analysing = ref(false)
  const flowOverlay = ref<FlowOverlay>('off')
  const hoverId = ref<string | null>(null)
  const frameRequest = shallowRef<{ ids: string[]; seq: number } | null>(null)
  const snapToGrid = ref(true)
  /** drag on empty canvas draws a selection box (as Shift+drag does) instead of panning */
  const boxTool = ref(false)
  const loadSeq = ref(0)
  const commitSeq = ref(0)
  /** what the last change, undo or redo did, for a polite status line */
  const lastAction = ref('')
  const { history, previewing, commit, preview, endPreview, cancelPreview, undo, redo, reset } = useDocumentHistory(document, readOnly, (label) => {
    lastAction.value = label
    pruneSelection()
    commitSeq.value++
  }, UNDO_LIMIT)

  const loaded = computed(() => document.value !== null && circuitId.value !== null)
  const canUndo = computed(() => !readOnly.value && history.value.past.length > 0)
  const canRedo = computed(() => !readOnly.value && history.value.future.length > 0)
  const dirty = computed(() => document.value !== savedDocument.value)

  const elementIndex = computed(() => {
    const index = new Map<string, ElementKind>()
    const doc = document.value
    if (!doc) return index
    for (const c of doc.circuit.components) {
      index.set(c.id, 'component')
      for (const p of c.ports) index.set(p.id, 'port')
    }
    for (const h of doc.circuit.hoses) index.set(h.id, 'hose')
    return index
  })
  const selectedSet = computed(() => new Set(selection.value))
  const selectedComponents = computed<Component[]>(() => document.value?.circuit.components.filter((c) => selectedSet.value.has(c.id)) ?? [])
  const selectedHoses = computed<Hose[]>(() => document.value?.circuit.hoses.filter((h) => selectedSet.value.has(h.id)) ?? [])
  const selectedPort = computed<{ component: Component; port: Port } | null>(() => {
    if (selection.value.length !== 1) return null
    for (const c of document.value?.circuit.components ?? []) {
      const port = c.ports.find((p) => p.id === selection.value[0])
      if (port) return { component: c, port }
    }
    return null
  })
  /**
   * The worst severity of any finding on each element: what the views mark. A finding about a port
   * marks the port, not also its part, so an open spigot does not light up the whole engine.
   */
  const findingMarks = computed(() => {
    const marks = new Map<string, Severity>()
    const owner = reportPortOwners.value
    for (const f of report.value?.findings ?? []) {
      const covered = new Set(f.elementIds.flatMap((id) => owner.get(id) ?? []))
      for (const id of f.elementIds) {
        if (covered.has(id)) continue
        const was = marks.get(id)
        if (!was || SEVERITY_RANK[f.severity] < SEVERITY_RANK[was]) marks.set(id, f.severity)
      }
    }
    return marks
  })

  function load(id: string, data: { document: CircuitDocument; version: number; readOnly: boolean; report?: Report | null; projectId?: string | null }) {
    circuitId.value = id
    projectId.value = data.projectId ?? null
    kind.value = data.document.circuit.kind
    document.value = data.document
    savedDocument.value = data.document
    serverVersion.value = data.version
    readOnly.value = data.readOnly
    report.value = data.report ?? null
    reportPortOwners.value = portOwnersOf(data.document)
    documentIssues.value = []
    reset()
    selection.value = []
    selectedRoutePoint.value = null
    loadSeq.value++
    commitSeq.value++
    reportCommit.value = data.report ? commitSeq.value : -1
  }

  /** Keeps only selected ids that still exist, e.g. after a delete or an undo. */
  function pruneSelection() {
    const index = elementIndex.value
    const kept = selection.value.filter((id) => index.has(id))
    if (kept.length !== selection.value.length) selection.value = kept
    const rp = selectedRoutePoint.value
    if (rp && !(document.value.circuit.hoses.find((h) => h.id === rp.hoseId)?.params.route[rp.index])) selectedRoutePoint.value = null
  }

  function select(ids: readonly string[], mode: SelectMode = 'replace') {
    selectedRoutePoint.value = null
    if (mode === 'replace') selection.value = [...new Set(ids)]
    else if (mode === 'add') selection.value = [...new Set([...selection.value, ...ids])]
    else {
      const next = new Set(selection.value)
      for (const id of ids) if (next.has(id)) next.delete(id); else next.add(id)
      selection.value = [...next]
    }
  }

  function selectRoutePoint(hoseId: string, index: number) {
    selection.value = [hoseId]
    selectedRoutePoint.value = { hoseId, index }
  }

  function clearSelection() {
    selection.value = []
    selectedRoutePoint.value = null
  }

  /** Parts and hoses of the selection (a selected port stands for nothing to copy or move). */
  const movableIds = () => selection.value.filter((id) => elementIndex.value.get(id) !== 'port')

  const { copySelection, bundleFromText, paste } = useEditorClipboard({ document, readOnly, lastAction, movableIds, commit, select })

  function deleteSelection() {
    if (readOnly.value) return
    const rp = selectedRoutePoint.value
    if (rp) {
      commit(removeRoutePoint(document.value, rp.hoseId, rp.index), 'Remove bend point')
      selectedRoutePoint.value = null
      return
    }
    if (selection.value.length === 0) return
    commit(deleteElements(document.value, selection.value), `Delete ${selection.value.length} element${selection.value.length === 1 ? '' : 's'}`)
  }

  function duplicateSelection() {
    const ids = movableIds()
    if (readOnly.value || ids.length === 0) return
    const result = duplicateElements(document.value, ids, { x: 100, y: 100 })
    commit(result.doc, 'Duplicate')
    select(ids.flatMap((id) => result.idMap.get(id) ?? []))
  }

  function rotateSelection(deg = 90) {
    const parts = selectedComponents.value
    if (readOnly.value || parts.length === 0) return
    commit(parts.reduce((d, c) => rotateComponent(d, c.id, deg), document.value), `Turn ${parts.length === 1 ? parts[0]!.label : `${parts.length} parts`}`)
  }

  /** Moves the selection (or the picked bend point) by a small step, e.g. from the arrow keys. */
  function nudgeSelection(delta: Partial<Point3>) {
    if (readOnly.value) return
    const rp = selectedRoutePoint.value
    if (rp) {
      const p = document.value.circuit.hoses.find((h) => h.id === rp.hoseId)?.params.route[rp.index]
      if (p) commit(moveRoutePoint(document.value, rp.hoseId, rp.index, { x: p.x + (delta.x ?? 0), y: p.y + (delta.y ?? 0), z: p.z + (delta.z ?? 0) }), 'Nudge bend point', 'nudge')
      return
    }
    const ids = movableIds()
    if (ids.length) commit(moveComponents(document.value, ids, delta), 'Nudge', 'nudge')
  }

  /** A bend point in the middle of the selected hose's longest run, picked so the arrow keys move it. */
  function addBendToSelectedHose() {
    const hose = selectedHoses.value.length === 1 && selection.value.length === 1 ? selectedHoses.value[0]! : null
    const bend = hose && !readOnly.value ? middleBend(document.value, hose.id) : null
    if (!hose || !bend) return
    commit(addRoutePoint(document.value, hose.id, bend.index, bend.point), 'Add bend point')
    selectRoutePoint(hose.id, bend.index)
  }

  /** A hose between the two selected ports (the keyboard and touch way to draw one). */
  function joinSelectedPorts() {
    const ports = selection.value.filter((id) => elementIndex.value.get(id) === 'port')
    if (readOnly.value || ports.length !== 2 || selection.value.length !== 2) return
    const added = addHose(document.value, ports[0]!, ports[1]!)
    commit(added.doc, 'Draw hose')
    select([added.hoseId])
  }

  /** Caps the selected port, or takes the cap off again. */
  function toggleBlockSelectedPort() {
    const sel = selectedPort.value
    if (readOnly.value || !sel) return
    const blocked = !sel.port.blocked
    commit(updatePort(document.value, sel.port.id, { blocked }), `${blocked ? 'Blank' : 'Open'} ${sel.port.name}`)
  }

  function applyFix(action: FixAction) {
    if (readOnly.value) return
    const result = applyFixEdit(document.value, action)
    commit(result.doc, `Fix: ${action.type.replace(/-/g, ' ')}`)
    if (result.selectIds.length) {
      select(result.selectIds)
      requestFrame(result.selectIds)
    }
  }

  /** Places a new part (typical figures, or a workshop template) and selects it. */
  function placePart(type: ComponentType, at: Point3, template?: TemplateBody): string | null {
    if (readOnly.value) return null
    const placed = placeComponent(document.value, type, at, template)
    commit(placed.doc, `Place ${template ? 'template' : type.replace(/-/g, ' ')}`)
    select([placed.componentId])
    return placed.componentId
  }

  function markSaved(version: number, doc: CircuitDocument) {
    serverVersion.value = version
    savedDocument.value = doc
  }

  /** Takes a document from the server in place of ours (after "take theirs"); the history starts afresh. */
  function replaceDocument(doc: CircuitDocument, version: number) {
    cancelPreview()
    document.value = doc
    savedDocument.value = doc
    serverVersion.value = version
    reset()
    pruneSelection()
    commitSeq.value++
  }

  /** Asks both views to pan and zoom to these elements (all of the drawing when empty). */
  function requestFrame(ids: readonly string[] = []) {
    frameRequest.value = { ids: [...ids], seq: (frameRequest.value?.seq ?? 0) + 1 }
  }

  function setReport(next: Report | null, issues: CircuitIssue[] = [], forCommit = commitSeq.value) {
    report.value = next
    reportPortOwners.value = portOwnersOf(document.value)
    documentIssues.value = issues
    reportCommit.value = forCommit
    reportSeq.value++
  }

  /** The document as a plain object (no reactive wrapper), e.g. for a worker or JSON. */
  const rawDocument = () => toRaw(document.value)

  return {
    circuitId, projectId, kind, document, savedDocument, serverVersion, selection, selectedRoutePoint, readOnly, report, reportSeq, reportCommit,
    documentIssues, analysing, flowOverlay, hoverId, frameRequest, snapToGrid, boxTool, previewing, loadSeq, commitSeq, lastAction, history,
    loaded, canUndo, canRedo, dirty, elementIndex, selectedSet, selectedComponents, selectedHoses, selectedPort, findingMarks,
    load, commit, preview, endPreview, cancelPreview, undo, redo, select, selectRoutePoint, clearSelection, copySelection,
    bundleFromText, paste, deleteSelection, duplicateSelection, rotateSelection, nudgeSelection, toggleBlockSelectedPort, addBendToSelectedHose,
    joinSelectedPorts, applyFix,
    placePart, markSaved, replaceDocument, requestFrame, setReport, rawDocument,
  }
})
