// Adding the fuel parts, checks and outputs must leave a coolant circuit's report, shopping list and
// procedure exactly as they were. The fixture was recorded from the engine before fuel parts existed;
// it changes only when a coolant rule is meant to change (then record it again and say why).
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { correctedDemoDocument, demoDocument, randomCircuit } from '#shared/demo'
import { analyzeCircuit } from '#shared/engine'
import { procedureFor, shoppingList } from '#shared/shop'
import type { CircuitDocument } from '#shared/circuit'

const baseline = JSON.parse(readFileSync(new URL('./fixtures/coolant-baseline.json', import.meta.url), 'utf8')) as Record<string, { report: unknown; list: unknown; procedure: unknown }>

const circuits: Record<string, () => CircuitDocument> = {
  demo: demoDocument,
  corrected: correctedDemoDocument,
  random2: () => randomCircuit({ seed: 7, rungs: 5, faults: true }),
  random3: () => randomCircuit({ seed: 42, rungs: 4, tidy: true }),
}

describe('coolant outputs are unchanged by the fuel work', () => {
  for (const [name, make] of Object.entries(circuits)) {
    it(`${name}: report, shopping list and procedure as recorded`, () => {
      const doc = make()
      const report = analyzeCircuit(doc)
      const recorded = baseline[name]!
      expect(JSON.parse(JSON.stringify(report))).toEqual(recorded.report)
      expect(report.quantities.fuel).toBeUndefined()
      expect(JSON.parse(JSON.stringify(shoppingList(doc, report)))).toEqual(recorded.list)
      expect(JSON.parse(JSON.stringify(procedureFor(doc, report)))).toEqual(recorded.procedure)
    })
  }
})
