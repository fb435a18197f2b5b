// Every one-click fix, judged by the engine itself: the circuit is bent until the engine offers the
// fix, the fix is applied, and the engine must no longer report that finding. The rules and their
// sources are the engine's (docs/engine.md); here we only check that the edit does what it offers.
import { describe, expect, it } from 'vitest'
import { applyFix, type CircuitDocument } from '#shared/circuit'
import { analyzeCircuit, type Finding, type FixAction } from '#shared/engine'
import { clone, comp, portOf, pt, soundLoop } from '../engine/fixtures'
import { deepFreeze, expectValid } from './helpers'

function offered(doc: CircuitDocument, code: string, type: FixAction['type']): Finding {
  const f = analyzeCircuit(doc).findings.find((x) => x.code === code && x.fix.action?.type === type)
  if (!f) throw new Error(`the engine offers no ${type} for ${code}: ${analyzeCircuit(doc).findings.map((x) => x.code).join(', ')}`)
  return f
}

/** Applies the offered fix and returns the fixed document (checked valid, input untouched). */
function fixed(doc: CircuitDocument, code: string, type: FixAction['type']) {
  const f = offered(deepFreeze(doc), code, type)
  const result = applyFix(doc, f.fix.action!)
  expectValid(result.doc)
  return { ...result, codes: analyzeCircuit(result.doc).findings.map((x) => x.code) }
}

describe('one-click fixes', () => {
  it('the fixture starts clean', () => {
    expect(analyzeCircuit(soundLoop()).findings).toEqual([])
  })

  it('block-port caps an open port', () => {
    const d = clone(soundLoop())
    comp(d, 'engine').ports.push({ id: 'engine-third', name: 'third outlet', role: 'outlet', spigotOdMm: 16, offset: pt(0, 100, 100), blocked: false })
    const r = fixed(d, 'open-port', 'block-port')
    expect(r.codes).not.toContain('open-port')
    expect(r.selectIds).toEqual(['engine-third'])
  })

  it('join-hose-end puts a free end on the port next to it', () => {
    const d = clone(soundLoop())
    d.circuit.hoses.find((h) => h.id === 'h-bottom')!.to = { portId: null, point: pt(-20, 0, 140), clamp: 'worm-drive' }
    const r = fixed(d, 'dangling-hose', 'join-hose-end')
    expect(r.codes).toEqual([])
  })

  it('add-bleed-valve cuts a bleed tee into the hose at its high point', () => {
    const d = clone(soundLoop())
    d.circuit.hoses.find((h) => h.id === 'h-bottom')!.params.route = [pt(1000, 0, 400), pt(600, 0, 0)]
    const r = fixed(d, 'air-trap', 'add-bleed-valve')
    expect(r.codes).not.toContain('air-trap')
    const tee = r.doc.circuit.components.find((c) => c.id === r.selectIds[0])!
    expect(tee.type).toBe('bleed-valve')
    expect(tee.position).toEqual(pt(1000, 0, 400))
    expect(r.doc.circuit.hoses).toHaveLength(d.circuit.hoses.length + 1)
  })

  it('add-vent-port puts a bleed screw on a part that is a high point', () => {
    const d = clone(soundLoop())
    const rad = comp(d, 'rad')
    rad.position.z = 500
    rad.ports = rad.ports.filter((p) => p.id !== 'rad-bleed')
    d.circuit.hoses.find((h) => h.id === 'h-top')!.params.route = [pt(1200, 0, 300)]
    const r = fixed(d, 'air-trap', 'add-vent-port')
    expect(r.codes).not.toContain('air-trap')
    expect(portOf(r.doc, r.selectIds[0]!).role).toBe('vent')
  })

  it('set-hose-bore and add-reducer cure size misfits', () => {
    const loose = clone(soundLoop())
    loose.circuit.hoses.find((h) => h.id === 'h-top')!.insideDiameterMm = 38
    expect(fixed(loose, 'size-mismatch', 'set-hose-bore').codes).not.toContain('size-mismatch')

    const stepped = clone(soundLoop())
    portOf(stepped, 'rad-in').spigotOdMm = 45
    const r = fixed(stepped, 'size-mismatch', 'add-reducer')
    expect(r.codes).not.toContain('size-mismatch')
    expect(r.doc.circuit.components.find((c) => c.id === r.selectIds[0])!.type).toBe('reducer')
  })

  it('raise-component lifts the filler above the rest', () => {
    const d = clone(soundLoop())
    comp(d, 'tank').position.z = 100
    expect(fixed(d, 'fill-not-highest', 'raise-component').codes).not.toContain('fill-not-highest')
  })

  it('set-cap-rating and set-coolant-percent change the settings', () => {
    const cap = clone(soundLoop())
    ;(comp(cap, 'tank').params as { capRatingKpa?: number }).capRatingKpa = 140
    expect(fixed(cap, 'cap-rating-mismatch', 'set-cap-rating').codes).not.toContain('cap-rating-mismatch')

    const cold = clone(soundLoop())
    cold.circuit.settings.coolant!.minAmbientC = -45
    cold.circuit.settings.coolant!.mix.percentByVolume = 30
    expect(fixed(cold, 'freeze-risk', 'set-coolant-percent').codes).not.toContain('freeze-risk')
  })

  it('leaves the document alone for ids it does not know', () => {
    const d = deepFreeze(soundLoop())
    expect(applyFix(d, { type: 'block-port', portId: 'nope' }).doc).toBe(d)
    expect(applyFix(d, { type: 'add-bleed-valve', hoseId: 'nope', at: pt(0, 0, 0) }).doc).toBe(d)
    expect(applyFix(d, { type: 'add-reducer', hoseId: 'nope', end: 'from', hoseBoreMm: 32, spigotOdMm: 40 }).doc).toBe(d)
  })
})
