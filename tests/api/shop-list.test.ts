import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import Papa from 'papaparse'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'
import { benchDocument } from './shopFixtures'

// The shopping list of a saved version through the API, against figures worked out by hand for the
// bench piece in shopFixtures.ts (a straight 500 mm heater hose and a straight 1000 mm radiator hose).
afterAll(() => sql.end())

let owner: Client
let tech: Client
let circuitId: string
let base: string

beforeAll(async () => {
  const o = await signUp('shoplist', 'Shop list workshop')
  owner = o.client
  tech = (await addMember(owner, 'technician', 'shoplisttech')).client
  const projectId = (await owner.post('/api/projects', { title: 'Bench build' })).body.id
  const imported = await owner.post(`/api/projects/${projectId}/circuits/import`, { document: benchDocument() })
  expect(imported.status, JSON.stringify(imported.body)).toBe(201)
  circuitId = imported.body.circuit.id
  base = `/api/circuits/${circuitId}/versions/1/shop`
})

const view = async (client: Client = tech) => {
  const res = await client.get(base)
  expect(res.status).toBe(200)
  return res.body
}
const line = (v: any, id: string) => {
  const l = v.list.lines.find((x: any) => x.id === id)
  if (!l) throw new Error(`no line ${id} in ${v.list.lines.map((x: any) => x.id).join(', ')}`)
  return l
}

describe('hose to buy and to cut, worked by hand', () => {
  it('heater hose: cut = ⌈500 × 1.05 + 2 × 25⌉ = 575 mm = 22-3/4 in (575 / 25.4 = 22.64, up to the next 1/8 in); buy 1 m (next 0.5 m)', async () => {
    const v = await view()
    const cut = line(v, 'cut/heater')
    // the cut-length rule is the engine's: length × (1 + percent) + both ends, rounded up to the mm
    expect(cut.sizes).toEqual({ metric: 'cut 575 mm', imperial: 'cut 22-3/4 in' })
    expect(cut.parentId).toBe('hose/j20-r3-heater/15.88')
    // both ends named, part › port
    expect(cut.description).toContain('A › a-heater to B › b-heater')
    const buy = line(v, 'hose/j20-r3-heater/15.88')
    // heater hose is sold off the roll by the half metre (common practice): 575 mm → 1 m; 1000 / 304.8 = 3.28 ft
    expect(buy).toMatchObject({ quantity: 1, unit: 'm', quantityText: { metric: '1 m', imperial: '3.28 ft' } })
    // 15.88 mm is 5/8 in exactly (15.875, within 0.01 mm)
    expect(buy.sizes).toEqual({ metric: '15.88 mm bore', imperial: '5/8 in bore' })
  })

  it('radiator hose: cut = ⌈1000 × 1.05 + 50⌉ = 1100 mm = 43-3/8 in, 3 ft 7-3/8 in (1100 / 25.4 = 43.31); buy 2 m (next whole metre)', async () => {
    const v = await view()
    expect(line(v, 'cut/radiator').sizes).toEqual({ metric: 'cut 1100 mm', imperial: 'cut 43-3/8 in (3 ft 7-3/8 in)' })
    // straight radiator hose is sold by the metre (common practice): 1100 mm → 2 m = 6.56 ft
    expect(line(v, 'hose/j20-r4-radiator/31.75')).toMatchObject({ quantity: 2, unit: 'm', quantityText: { metric: '2 m', imperial: '6.56 ft' } })
  })
})

describe('clamps by the assembled OD, aiming for mid-range (check-values §5: SAE J1508 ranges from memory, sizing common practice)', () => {
  it('heater: 16 mm spigot + 2 × 4 mm wall = 24 mm → SAE 12 (17–32 mm, mid 24.5); 2 clamps', async () => {
    const v = await view()
    expect(line(v, 'clamp/worm-drive-clamp/sae-12')).toMatchObject({ quantity: 2, sizes: { metric: 'SAE 12, 17–32 mm' } })
  })
  it('radiator: 32 mm spigot + 2 × 4 mm wall = 40 mm → SAE 24 (27–51 mm, mid 39; SAE 28 mid 45 is further); 2 clamps', async () => {
    const v = await view()
    expect(line(v, 'clamp/worm-drive-clamp/sae-24')).toMatchObject({ quantity: 2, sizes: { metric: 'SAE 24, 27–51 mm' } })
    expect(v.list.lines.filter((l: any) => l.section === 'clamps')).toHaveLength(2)
  })
})

describe('coolant volume and what to buy for it', () => {
  // bore volume π/4 · d² · L over the drawn length, plus the parts' own volumes
  const heaterL = (Math.PI / 4) * 15.88 ** 2 * 500 / 1e6 // 0.09903 L
  const radiatorL = (Math.PI / 4) * 31.75 ** 2 * 1000 / 1e6 // 0.79173 L
  const totalL = 1.0 + 0.5 + heaterL + radiatorL // 2.39076 L

  it('system volume = 1.0 + 0.5 + π/4 · 15.88² · 500 + π/4 · 31.75² · 1000 mm³ = 2.3908 L', async () => {
    const v = await view()
    expect(totalL).toBeCloseTo(2.3908, 4)
    expect(v.estimateL).toBeCloseTo(totalL, 6)
    // the chart's parts add up to the same total
    expect(v.charts.volumeByPart.reduce((s: number, d: any) => s + d.value, 0)).toBeCloseTo(totalL, 6)
  })

  it('50 % mix + 10 % top-up reserve = 1.3150 L each; least total volume that covers it (common practice): 2 × 1 L concentrate, 1 US gal water (3.785 L < 4 L)', async () => {
    const v = await view()
    const need = (totalL / 2) * 1.1
    expect(need).toBeCloseTo(1.315, 3)
    expect(line(v, 'coolant/concentrate/1l')).toMatchObject({ quantity: 2, unit: 'container' })
    expect(line(v, 'coolant/water/1gal')).toMatchObject({ quantity: 1, unit: 'container' })
    expect(v.list.lines.filter((l: any) => l.section === 'coolant').map((l: any) => l.id).sort()).toEqual(['coolant/concentrate/1l', 'coolant/water/1gal'])
  })
})

describe('the workshop\'s own lines and prices', () => {
  it('a technician adds a line and prices lines; the list and its totals are kept per version', async () => {
    const added = await tech.post(`${base}/lines`, { description: 'Heat sleeve, 25 mm inside', quantity: 2, unit: 'm', sizeMetric: '25 mm inside', sizeImperial: '1 in inside', price: 4.5, supplier: 'Counter A' })
    expect(added.status).toBe(201)
    expect(added.body.lineId).toMatch(/^custom\//)
    const priced = await tech.patch(`${base}/lines`, { lineId: 'hose/j20-r3-heater/15.88', price: 3.2, supplier: 'Counter B' })
    expect(priced.status).toBe(200)
    expect(priced.body.changed).toEqual(['shop.line-priced'])
    const v = await view(owner)
    const sleeve = line(v, added.body.lineId)
    expect(sleeve).toMatchObject({ section: 'sundries', source: 'custom', quantity: 2, price: 4.5, supplier: 'Counter A', sizes: { metric: '25 mm inside', imperial: '1 in inside' } })
    // Σ price × quantity: 2 × 4.50 + 1 × 3.20 = 12.20; two of the lines priced, so not complete
    expect(v.list.total).toMatchObject({ priceTotal: 12.2, pricedLines: 2, complete: false })
    expect(v.list.sections.find((s: any) => s.section === 'hoses')).toMatchObject({ priceTotal: 3.2, pricedLines: 1 })
    // stored per circuit + version + line id
    const rows = await sql`select line_id, price, supplier from shop_lines where circuit_id = ${circuitId} and version = 1 order by line_id`
    expect(rows.map((r) => [r.line_id, r.price, r.supplier])).toEqual([[added.body.lineId, 4.5, 'Counter A'], ['hose/j20-r3-heater/15.88', 3.2, 'Counter B']].sort())
  })

  it('refuses what does not fit: a negative price, an unknown line, a price on a cut piece, rewording or removing an engine line', async () => {
    const negative = await tech.patch(`${base}/lines`, { lineId: 'hose/j20-r3-heater/15.88', price: -1 })
    expect(negative.status).toBe(400)
    expect(negative.body.data.fields.price).toBeTruthy()
    const unknown = await tech.patch(`${base}/lines`, { lineId: 'hose/nothing/1.00', bought: true })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fields.lineId).toMatch(/Not a line/)
    const cut = await tech.patch(`${base}/lines`, { lineId: 'cut/heater', price: 2 })
    expect(cut.status).toBe(400)
    expect(cut.body.data.fields.price).toMatch(/cut piece/)
    const reword = await tech.patch(`${base}/lines`, { lineId: 'hose/j20-r3-heater/15.88', description: 'Something else' })
    expect(reword.status).toBe(400)
    expect(reword.body.data.fields.description).toBeTruthy()
    expect((await tech.delete(`${base}/lines?lineId=${encodeURIComponent('hose/j20-r3-heater/15.88')}`)).status).toBe(400)
    const blank = await tech.post(`${base}/lines`, { description: ' ', quantity: 'two', unit: 'm' })
    expect(blank.status).toBe(400)
    expect(Object.keys(blank.body.data.fields).sort()).toEqual(['description', 'quantity'])
  })
})

describe('CSV download', () => {
  it('is an attachment, and papaparse reads back every line with its quantities, prices and both unit systems', async () => {
    const res = await tech.get(`${base}/shopping-list.csv`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="bench-loop-v1-shopping-list\.csv"$/)
    const parsed = Papa.parse<Record<string, string>>(String(res.body), { header: true, skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    const v = await view()
    expect(parsed.data.map((r) => r.id)).toEqual(v.list.lines.map((l: any) => l.id))
    const heater = parsed.data.find((r) => r.id === 'hose/j20-r3-heater/15.88')!
    expect(heater).toMatchObject({ quantity: '1', unit: 'm', price: '3.2', supplier: 'Counter B', sizeMetric: '15.88 mm bore', sizeImperial: '5/8 in bore' })
    expect(parsed.data.find((r) => r.id === 'cut/heater')).toMatchObject({ parentId: 'hose/j20-r3-heater/15.88', sizeMetric: 'cut 575 mm', sizeImperial: 'cut 22-3/4 in', price: '' })
    const custom = parsed.data.find((r) => r.source === 'custom')!
    expect(custom).toMatchObject({ description: 'Heat sleeve, 25 mm inside', quantity: '2', price: '4.5', section: 'sundries' })
  })
})
