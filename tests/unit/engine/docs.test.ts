// The documentation's example is the demo document itself, and every finding code is documented.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { parseCircuitDocument } from '#shared/circuit'
import { demoDocument } from '#shared/demo'

const read = (p: string) => readFileSync(new URL(`../../../${p}`, import.meta.url), 'utf8')

describe('docs/exchange-format.md', () => {
  it('its JSON example parses and equals the demo document', () => {
    const block = /```json\n([\s\S]*?)\n```/.exec(read('docs/exchange-format.md'))
    expect(block).not.toBeNull()
    const parsed = parseCircuitDocument(block![1]!)
    expect(parsed.ok).toBe(true)
    expect(parsed.ok && parsed.document).toEqual(demoDocument())
  })
})

describe('docs/engine.md', () => {
  it('documents every finding code the engine can emit', () => {
    const doc = read('docs/engine.md')
    const sources = [
      'checks/structure.ts', 'checks/deadLegs.ts', 'checks/circulation.ts', 'checks/heights.ts', 'checks/flowChecks.ts', 'checks/fluid.ts',
      'fuel/layoutChecks.ts', 'fuel/sizingChecks.ts',
    ]
      .map((f) => read(`shared/engine/${f}`)).join('\n')
    const codes = new Set([...sources.matchAll(/makeFinding\(\s*ctx,\s*'([a-z-]+)'/g)].map((m) => m[1]!))
    expect(codes.size).toBeGreaterThan(15)
    for (const code of codes) expect(doc, code).toContain(`\`${code}\``)
  })
})
