// The editor store: undo steps, drag previews, selection, clipboard, read-only.
import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { addHose, addRoutePoint, CLIPBOARD_FORMAT, extractElements, moveComponents, placeComponent, type CircuitDocument } from '#shared/circuit'
import { useEditorStore } from '../../../app/stores/editor'
import { emptyDoc, expectValid } from './helpers'

const at = (x: number, y: number, z: number) => ({ x, y, z })

function loaded(readOnly = false) {
  const store = useEditorStore()
  let doc: CircuitDocument = emptyDoc()
  doc = placeComponent(doc, 'engine', at(3000, 0, 300)).doc
  doc = placeComponent(doc, 'radiator', at(100, 0, 250)).doc
  store.load('c1', { document: doc, version: 3, readOnly })
  return { store, doc }
}

beforeEach(() => setActivePinia(createPinia()))

describe('editor store', () => {
  it('undoes to the very document it started from, and is clean again there', () => {
    const { store, doc } = loaded()
    expect(store.dirty).toBe(false)
    store.placePart('tee', at(1500, 0, 0))
    store.placePart('thermostat', at(2000, 0, 500))
    expect(store.dirty).toBe(true)
    expect(store.selection).toEqual(['thermostat-1'])
    store.undo()
    store.undo()
    expect(store.document).toBe(doc)
    expect(store.dirty).toBe(false)
    expect(store.canUndo).toBe(false)
    store.redo()
    expect(store.document.circuit.components.map((c) => c.type)).toEqual(['engine', 'radiator', 'tee'])
  })

  it('turns a drag of many previews into one undo step, without analysis triggers', () => {
    const { store, doc } = loaded()
    const seq = store.commitSeq
    for (let i = 1; i <= 30; i++) store.preview(moveComponents(doc, ['engine-1'], { x: i * 10 }))
    expect(store.previewing).toBe(true)
    expect(store.commitSeq).toBe(seq)
    expect(store.history.past).toHaveLength(0)
    store.endPreview('Move engine')
    expect(store.history.past).toHaveLength(1)
    expect(store.commitSeq).toBe(seq + 1)
    expect(store.document.circuit.components[0]!.position.x).toBe(3300)
    store.undo()
    expect(store.document).toBe(doc)
  })

  it('cancels a preview back to where it was', () => {
    const { store, doc } = loaded()
    store.preview(moveComponents(doc, ['engine-1'], { z: 99 }))
    store.cancelPreview()
    expect(store.document).toBe(doc)
    expect(store.previewing).toBe(false)
  })

  it('keeps at most 200 undo steps', () => {
    const { store } = loaded()
    for (let i = 0; i < 210; i++) store.commit(moveComponents(store.document, ['engine-1'], { x: 1 }), `step ${i}`)
    expect(store.history.past).toHaveLength(200)
    expect(store.history.past[0]!.label).toBe('step 10')
  })

  it('joins a run of nudges into one step', () => {
    const { store, doc } = loaded()
    store.select(['engine-1'])
    for (let i = 0; i < 5; i++) store.nudgeSelection({ x: 1 })
    expect(store.document.circuit.components[0]!.position.x).toBe(3005)
    expect(store.history.past).toHaveLength(1)
    store.undo()
    expect(store.document).toBe(doc)
  })

  it('selects, toggles and drops deleted ids from the selection', () => {
    const { store } = loaded()
    store.select(['engine-1'])
    store.select(['radiator-1'], 'add')
    store.select(['engine-1'], 'toggle')
    expect(store.selection).toEqual(['radiator-1'])
    store.deleteSelection()
    expect(store.selection).toEqual([])
    expect(store.document.circuit.components).toHaveLength(1)
  })

  it('removes a picked bend point with delete', () => {
    const { store, doc } = loaded()
    const h = addHose(doc, 'engine-1-head-outlet', 'radiator-1-top-inlet')
    store.commit(addRoutePoint(h.doc, h.hoseId, 0, at(1500, 0, 900)), 'bend')
    store.selectRoutePoint(h.hoseId, 0)
    store.deleteSelection()
    expect(store.document.circuit.hoses[0]!.params.route).toEqual([])
    expect(store.document.circuit.hoses).toHaveLength(1)
  })

  it('copies and pastes with fresh ids, also from clipboard text', () => {
    const { store } = loaded()
    store.select(['engine-1'])
    store.copySelection()
    store.paste(at(0, 0, 0))
    expect(store.document.circuit.components).toHaveLength(3)
    expect(store.selection).toEqual(['engine-2'])
    expect(store.document.circuit.components[2]!.position).toEqual(at(0, 0, 0))
    const text = JSON.stringify({ format: CLIPBOARD_FORMAT, ...extractElements(store.document, ['radiator-1']) })
    store.paste(undefined, store.bundleFromText(text))
    expect(store.document.circuit.components.map((c) => c.id)).toContain('radiator-2')
    expect(store.bundleFromText('{"not":"ours"}')).toBeNull()
    expectValid(store.document)
  })

  it('applies a fix, selects what changed and asks the views to show it', () => {
    const { store } = loaded()
    store.applyFix({ type: 'block-port', portId: 'engine-1-heater-outlet' })
    expect(store.document.circuit.components[0]!.ports.find((p) => p.id === 'engine-1-heater-outlet')!.blocked).toBe(true)
    expect(store.selection).toEqual(['engine-1-heater-outlet'])
    expect(store.frameRequest?.ids).toEqual(['engine-1-heater-outlet'])
    store.toggleBlockSelectedPort()
    expect(store.document.circuit.components[0]!.ports.find((p) => p.id === 'engine-1-heater-outlet')!.blocked).toBe(false)
  })

  it('joins two selected ports and bends the new hose in the middle of its run', () => {
    const { store } = loaded()
    store.select(['engine-1-head-outlet', 'radiator-1-top-inlet'])
    store.joinSelectedPorts()
    const hose = store.document.circuit.hoses[0]!
    expect([hose.from.portId, hose.to.portId]).toEqual(['engine-1-head-outlet', 'radiator-1-top-inlet'])
    expect(store.selection).toEqual([hose.id])
    store.addBendToSelectedHose()
    expect(store.selectedRoutePoint).toEqual({ hoseId: hose.id, index: 0 })
    const bend = store.document.circuit.hoses[0]!.params.route[0]!
    // halfway between the engine's head outlet (3000-300, 0-120, 300+230) and the radiator's top inlet (100+30, 0+325, 250+180)
    expect(bend).toEqual({ x: 1415, y: 102.5, z: 480 })
    store.nudgeSelection({ z: 10 })
    expect(store.document.circuit.hoses[0]!.params.route[0]!.z).toBe(490)
  })

  it('changes nothing when read-only', () => {
    const { store, doc } = loaded(true)
    store.placePart('tee', at(0, 0, 0))
    store.preview(moveComponents(doc, ['engine-1'], { x: 5 }))
    store.select(['engine-1'])
    store.deleteSelection()
    store.nudgeSelection({ x: 1 })
    expect(store.document).toBe(doc)
    expect(store.canUndo).toBe(false)
  })

  it('is clean after markSaved with the document sent', () => {
    const { store } = loaded()
    store.placePart('tee', at(0, 0, 0))
    const sent = store.document
    store.markSaved(4, sent)
    expect(store.dirty).toBe(false)
    expect(store.serverVersion).toBe(4)
  })
})
