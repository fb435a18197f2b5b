import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { demoDocument } from '#shared/demo'
import { analyzeCircuit, type Finding } from '#shared/engine'
import { findingKey, keyedFindings } from '#shared/review'

const finding = (code: string, elementIds: string[], severity: Finding['severity'] = 'warning'): Finding =>
  ({ code, severity, message: 'm', elementIds, fix: { text: '' } })

describe('finding keys', () => {
  it('do not depend on the order the ids are listed in', () => {
    fc.assert(fc.property(fc.uniqueArray(fc.stringMatching(/^[A-Za-z0-9._:-]{1,12}$/), { minLength: 1, maxLength: 8 }), (ids) => {
      const shuffled = [...ids].reverse()
      expect(findingKey(finding('air-trap', ids))).toBe(findingKey(finding('air-trap', shuffled)))
    }))
  })

  it('differ when the code or any id differs', () => {
    expect(findingKey(finding('air-trap', ['a', 'b']))).not.toBe(findingKey(finding('dead-leg', ['a', 'b'])))
    expect(findingKey(finding('air-trap', ['a', 'b']))).not.toBe(findingKey(finding('air-trap', ['a', 'c'])))
    // ids may hold ":" and "."; the separators cannot occur in them, so these stay apart
    expect(findingKey(finding('x', ['a:b', 'c']))).not.toBe(findingKey(finding('x', ['a', 'b:c'])))
  })

  it('the demo circuit keeps the same keys when its arrays are reordered', () => {
    const doc = demoDocument()
    const reordered = demoDocument()
    reordered.circuit.components.reverse()
    reordered.circuit.hoses.reverse()
    const keys = keyedFindings(analyzeCircuit(doc)).map((f) => f.key).sort()
    expect(keyedFindings(analyzeCircuit(reordered)).map((f) => f.key).sort()).toEqual(keys)
    // the demo's two deliberate faults: the open third outlet and the heater's high point
    expect(keys).toEqual(['air-trap|heater,heater-inlet,heater-outlet', 'open-port|engine,engine-third'])
  })

  it('keeps a fault reported twice once', () => {
    const keyed = keyedFindings({ findings: [finding('direction-conflict', ['h1']), finding('direction-conflict', ['h1']), finding('direction-conflict', ['h2'])] })
    expect(keyed.map((f) => f.key)).toEqual(['direction-conflict|h1', 'direction-conflict|h2'])
  })
})
