// The shopping list against hand-worked figures and the demo build.
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { shoppingList, type ShoppingLine } from '#shared/shop'
import { documentOf, hose, part, port, pt, valid } from './fixtures'

const listOf = (doc: CircuitDocument, options = {}) => {
  const d = valid(doc)
  return shoppingList(d, analyzeCircuit(d), options)
}
const byId = (lines: ShoppingLine[], id: string): ShoppingLine => {
  const l = lines.find((x) => x.id === id)
  if (!l) throw new Error(`no line ${id} in ${lines.map((x) => x.id).join(', ')}`)
  return l
}

/** A → B, 300 × 400 mm apart (a 500 mm straight run), one heater hose 15.88 × 4 mm on 16 mm spigots. */
function straightRun(allowance: { percent: number; perEndMm: number }): CircuitDocument {
  return documentOf(
    [part('a', 'generic', pt(0, 0, 0), [port('a1', 'either', 16)]), part('b', 'generic', pt(300, 400, 0), [port('b1', 'either', 16)])],
    [hose('h', 'a1', 'b1', 15.88, 4, 'j20-r3-heater')],
    allowance,
  )
}

describe('hose lines come from the engine quantities', () => {
  it('cut length = drawn × (1 + 5 %) + 2 × 25 mm = 500 × 1.05 + 50 = 575 mm, and 22-3/4 in (575 / 25.4 = 22.64, up to 1/8)', () => {
    const list = listOf(straightRun({ percent: 5, perEndMm: 25 }))
    const cut = byId(list.lines, 'cut/h')
    expect(cut.sizes).toEqual({ metric: 'cut 575 mm', imperial: 'cut 22-3/4 in' })
    expect(cut.parentId).toBe('hose/j20-r3-heater/15.88')
    // both ends named "part › port", with the clamp at each
    expect(cut.description).toContain('A › a1 to B › b1')
    expect(cut.notes).toMatch(/from end: worm-drive clamp SAE \d+.*to end: worm-drive clamp SAE \d+/)
  })
  it('575 mm of heater hose is bought as 1 m: rounded up to the next 0.5 m, the engine\'s rule', () => {
    const buy = byId(listOf(straightRun({ percent: 5, perEndMm: 25 })).lines, 'hose/j20-r3-heater/15.88')
    expect(buy.quantity).toBe(1)
    expect(buy.unit).toBe('m')
    expect(buy.sizes).toEqual({ metric: '15.88 mm bore', imperial: '5/8 in bore' })
    expect(buy.quantityText).toEqual({ metric: '1 m', imperial: '3.28 ft' }) // 1000 / 304.8 = 3.281
  })
  it('heater pieces of 1200 + 300 mm make exactly 1.5 m (not pushed up); 1001 mm of radiator hose is 2 m (next whole metre)', () => {
    const doc = documentOf(
      [
        part('a', 'generic', pt(0, 0, 0), [port('a1', 'either', 16), port('a2', 'either', 16), port('a3', 'either', 32)]),
        part('b', 'generic', pt(1200, 0, 0), [port('b1', 'either', 16), port('b2', 'either', 16, pt(-900, 0, 0)), port('b3', 'either', 32, pt(-199, 0, 0))]),
      ],
      [
        hose('h1', 'a1', 'b1', 15.88, 4, 'j20-r3-heater'),
        hose('h2', 'a2', 'b2', 15.88, 4, 'j20-r3-heater'),
        hose('h3', 'a3', 'b3', 31.75, 5, 'j20-r4-radiator'),
      ],
    )
    const lines = listOf(doc).lines
    expect(byId(lines, 'hose/j20-r3-heater/15.88').quantity).toBe(1.5)
    expect(byId(lines, 'hose/j20-r4-radiator/31.75').quantity).toBe(2)
    expect(lines.filter((l) => l.parentId === 'hose/j20-r3-heater/15.88').map((l) => l.id).sort()).toEqual(['cut/h1', 'cut/h2'])
  })
})

describe('clamps by size range, from the SAE J1508 table (check-values §5, from memory)', () => {
  it('31.75 × 5 mm hose on 32 mm spigots: OD 42 mm → SAE 24 (27–51 mm, mid 39; SAE 28 mid 45 ties, smaller wins), 2 per hose', () => {
    const doc = documentOf(
      [part('a', 'generic', pt(0, 0, 0), [port('a1', 'either', 32)]), part('b', 'generic', pt(1000, 0, 0), [port('b1', 'either', 32)])],
      [hose('h', 'a1', 'b1', 31.75, 5, 'j20-r4-radiator')],
    )
    const clamp = listOf(doc).lines.filter((l) => l.section === 'clamps')
    expect(clamp).toHaveLength(1)
    expect(clamp[0]!.quantity).toBe(2)
    expect(clamp[0]!.sizes).toEqual({ metric: 'SAE 24, 27–51 mm', imperial: '≈ 1-1/16–2 in' })
  })
  it('15.88 × 4 mm hose on 16 mm spigots: OD 24 mm → SAE 12 (17–32 mm, mid 24.5 is nearest)', () => {
    const clamp = listOf(straightRun({ percent: 0, perEndMm: 0 })).lines.find((l) => l.section === 'clamps')!
    expect(clamp.sizes).toEqual({ metric: 'SAE 12, 17–32 mm', imperial: '≈ 11/16–1-1/4 in' })
  })
})

describe('the demo build', () => {
  const doc = correctedDemoDocument()
  const report = analyzeCircuit(doc)
  const list = shoppingList(doc, report)

  it('one plug, screw or cap line per blocked port, with its spigot; the tank filler is the pressure cap itself', () => {
    const blocked = doc.circuit.components.flatMap((c) => c.ports.filter((p) => p.blocked).map((p) => ({ c, p })))
    expect(blocked.length).toBe(6) // engine drain, third outlet; radiator bleed, drain; tank cap; heater bleed screw
    for (const { c, p } of blocked) {
      const lines = list.lines.filter((l) => l.elementIds.includes(p.id))
      if (c.type === 'expansion-tank' && p.role === 'fill') {
        expect(lines).toHaveLength(0)
        expect(byId(list.lines, `cap/${c.id}`).quantity).toBe(1)
        continue
      }
      expect(lines, p.id).toHaveLength(1)
      expect(lines[0]!.quantity).toBe(1)
      expect(lines[0]!.sizes.metric).toBe(`${p.spigotOdMm} mm spigot`)
      expect(['plugs', 'bleed', 'drains']).toContain(lines[0]!.section)
    }
    expect(byId(list.lines, 'fitting/blanking-cap/engine-third').sizes).toEqual({ metric: '16 mm spigot', imperial: '≈ 5/8 in spigot' })
  })
  it('needs no reducer: every hose suits its spigots, so there is no size-mismatch finding and no reducer part', () => {
    expect(report.findings.filter((f) => f.code === 'size-mismatch')).toHaveLength(0)
    expect(list.lines.filter((l) => l.section === 'reducers')).toHaveLength(0)
  })
  it('a 25 mm pump inlet under the 31.75 mm hose needs one 31.75 → 25 mm reducer (a 25 mm bore would not go on the 32 mm tee)', () => {
    const d = correctedDemoDocument()
    d.circuit.components.find((c) => c.id === 'pump')!.ports.find((p) => p.id === 'pump-inlet')!.spigotOdMm = 25
    const reducers = listOf(d).lines.filter((l) => l.section === 'reducers')
    expect(reducers).toHaveLength(1)
    expect(reducers[0]!.quantity).toBe(1)
    expect(reducers[0]!.sizes).toEqual({ metric: 'hose 31.75 mm → spigot 25 mm', imperial: 'hose 1-1/4 in → spigot ≈ 1 in' })
    expect(reducers[0]!.elementIds).toEqual(expect.arrayContaining(['hose-pump-inlet', 'pump-inlet']))
  })
  it('a reducer drawn in the circuit is listed per size step, as the engine counts it', () => {
    const d = documentOf(
      [
        part('a', 'generic', pt(0, 0, 0), [port('a1', 'either', 32)]),
        part('r', 'reducer', pt(500, 0, 0), [port('r1', 'either', 32), port('r2', 'either', 25.4, pt(50, 0, 0))]),
        part('b', 'generic', pt(1000, 0, 0), [port('b1', 'either', 25.4)]),
      ],
      [hose('h1', 'a1', 'r1', 31.75, 5, 'j20-r4-radiator'), hose('h2', 'r2', 'b1', 25.4, 5, 'j20-r4-radiator')],
    )
    const reducers = listOf(d).lines.filter((l) => l.section === 'reducers')
    expect(reducers.map((l) => l.sizes)).toEqual([{ metric: '32 → 25.4 mm', imperial: '≈ 1-1/4 → 1 in' }])
  })
  it('thermostat with its stamped opening temperature and the cap with its rating, in both units', () => {
    expect(byId(list.lines, 'thermostat/thermostat').sizes).toEqual({ metric: 'opens 88 °C, fully open 100 °C', imperial: 'opens 190 °F, fully open 212 °F' })
    expect(byId(list.lines, 'cap/tank').sizes).toEqual({ metric: '1.1 bar (110 kPa)', imperial: '16 psi' })
  })
  it('coolant: 50 % of the system volume as concentrate and as water, each + 10 % reserve, in containers', () => {
    const c = report.quantities.coolant!
    expect(c.concentrateL).toBeCloseTo(report.quantities.volume.totalL / 2, 9)
    // 17.36 L system → 8.68 L each; × 1.1 = 9.55 L → 10 L in litre sizes: 2 × 5 L
    const conc = byId(list.lines, 'coolant/concentrate/5l')
    expect(conc.quantity).toBe(2)
    expect(byId(list.lines, 'coolant/water/5l').quantity).toBe(2)
    expect(conc.notes).toContain('10 % top-up reserve')
    expect(list.lines.filter((l) => l.section === 'coolant')).toHaveLength(2)
  })
  it('with no reserve the same 8.68 L of concentrate is 5 L + 4 L (9 L covers it, whole litres only)', () => {
    const l = shoppingList(doc, report, { topUpReservePercent: 0 })
    expect(l.lines.filter((x) => x.id.startsWith('coolant/concentrate/')).map((x) => `${x.quantity}×${x.id}`))
      .toEqual(['1×coolant/concentrate/5l', '1×coolant/concentrate/4l'])
  })
  it('a plain water fill buys distilled water only: 17.36 L × 1.1 = 19.09 L → 4 × 5 L (20 L; 5 × 4 L is one more container)', () => {
    const d = correctedDemoDocument()
    d.circuit.settings.coolant!.mix = { fluid: 'water', percentByVolume: 0 }
    const coolant = listOf(d).lines.filter((x) => x.section === 'coolant')
    expect(coolant.map((x) => [x.id, x.quantity])).toEqual([['coolant/water/5l', 4]])
  })
  it('the open third outlet of the first demo is named for attention, not bought silently', () => {
    const first = demoDocument()
    const l = shoppingList(first, analyzeCircuit(first))
    expect(l.attention.some((t) => t.includes('third outlet'))).toBe(true)
    expect(l.lines.some((x) => x.elementIds.includes('engine-third'))).toBe(false)
  })
  it('ids are unique and the same for the same circuit with its arrays reversed', () => {
    expect(new Set(list.lines.map((l) => l.id)).size).toBe(list.lines.length)
    const d = correctedDemoDocument()
    d.circuit.components.reverse()
    d.circuit.hoses.reverse()
    expect(shoppingList(d, analyzeCircuit(d)).lines.map((l) => l.id)).toEqual(list.lines.map((l) => l.id))
  })
})

describe('custom lines, prices and totals', () => {
  const doc = correctedDemoDocument()
  const report = analyzeCircuit(doc)

  it('custom lines are merged into their section, after the engine lines, with source custom', () => {
    const list = shoppingList(doc, report, {
      customLines: [
        { id: 'sleeve', description: 'Heat sleeve, 25 mm', quantity: 2, unit: 'm' },
        { id: 'spare-clamp', description: 'Spare clamp', quantity: 2, unit: 'piece', section: 'clamps' },
      ],
    })
    const clamps = list.lines.filter((l) => l.section === 'clamps')
    expect(clamps[clamps.length - 1]!.id).toBe('custom/spare-clamp')
    expect(list.lines[list.lines.length - 1]!.id).toBe('custom/sleeve')
    expect(byId(list.lines, 'custom/sleeve').source).toBe('custom')
    expect(() => shoppingList(doc, report, { customLines: [{ id: 'neg', description: 'a', quantity: -1, unit: 'piece' }] })).toThrow(/quantity/)
    expect(() => shoppingList(doc, report, { customLines: [{ id: 'x', description: 'a', quantity: 1, unit: 'piece' }, { id: 'x', description: 'b', quantity: 1, unit: 'piece' }] })).toThrow(/custom\/x/)
  })
  it('price totals: Σ price × quantity per section and overall; null when nothing is priced', () => {
    expect(shoppingList(doc, report).total.priceTotal).toBeNull()
    const list = shoppingList(doc, report, {
      prices: { 'hose/j20-r4-radiator/31.75': { price: 12.4, supplier: 'counter' }, 'clamp/worm-drive-clamp/sae-24': { price: 0.85 } },
      customLines: [{ id: 'ties', description: 'Cable ties', quantity: 1, unit: 'pack', price: 3.2 }],
    })
    const radiatorHose = byId(list.lines, 'hose/j20-r4-radiator/31.75')
    const clamps = byId(list.lines, 'clamp/worm-drive-clamp/sae-24')
    // 9 m × 12.40 = 111.60; 8 × 0.85 = 6.80; 1 × 3.20
    expect(radiatorHose.quantity).toBe(9)
    expect(clamps.quantity).toBe(8)
    expect(list.sections.find((s) => s.section === 'hoses')!.priceTotal).toBe(111.6)
    expect(list.sections.find((s) => s.section === 'clamps')!.priceTotal).toBe(6.8)
    expect(list.total.priceTotal).toBe(121.6)
    expect(list.total.complete).toBe(false)
    expect(radiatorHose.supplier).toBe('counter')
  })
})
