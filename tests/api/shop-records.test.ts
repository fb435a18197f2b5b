import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sql } from '../helpers/db'
import { approvedDemoBuild, type ApprovedBuild } from './shopFixtures'

// The technician's records on the approved version: ticks, procedure steps, pressure tests and the
// fill; kept per version, shown to the whole team, and every one a line of the activity log.
afterAll(() => sql.end())

let b: ApprovedBuild
let base: string

beforeAll(async () => {
  b = await approvedDemoBuild('shoprec')
  base = `/api/circuits/${b.circuitId}/versions/${b.version}/shop`
})

// exact unit definitions (check-values §6): 1 psi = 6.894757293168 kPa, 1 bar = 100 kPa, 1 US qt = 3.785411784 / 4 L
const KPA_PER_PSI = 6.894757293168
const LITRES_PER_QUART = 3.785411784 / 4

describe('records on the approved version', () => {
  it('the shop view opens on the approved version with who approved it and when', async () => {
    const v = (await b.tech.get(base)).body
    expect(v.approval).toMatchObject({ reviewId: b.reviewId, by: { name: b.names.rev }, note: 'Good to fill.' })
    expect(v.versions.find((x: any) => x.version === b.version)).toMatchObject({ approved: true })
    expect(v.viewer.mayRecord).toBe(true)
    expect(v.procedure.available).toBe(true)
  })

  it('ticks bought and fitted, with who and when; ticking twice records once; a tick can be taken back', async () => {
    const lineId = 'hose/j20-r3-heater/15.88'
    const bought = await b.tech.patch(`${base}/lines`, { lineId, bought: true })
    expect(bought.body.changed).toEqual(['shop.item-bought'])
    expect((await b.tech.patch(`${base}/lines`, { lineId, bought: true })).body.changed).toEqual([])
    expect((await b.tech.patch(`${base}/lines`, { lineId, fitted: true })).body.changed).toEqual(['shop.item-fitted'])
    const cut = (await b.tech.get(base)).body.list.lines.find((l: any) => l.parentId === lineId)
    expect((await b.tech.patch(`${base}/lines`, { lineId: cut.id, bought: true })).body.changed).toEqual(['shop.item-cut'])
    expect((await b.tech.patch(`${base}/lines`, { lineId: cut.id, bought: false })).body.changed).toEqual(['shop.tick-removed'])
    const v = (await b.fab.get(base)).body
    const l = v.list.lines.find((x: any) => x.id === lineId)
    expect(l.bought).toMatchObject({ by: { name: b.names.tech } })
    expect(l.fitted).toMatchObject({ by: { name: b.names.tech } })
    expect(v.list.lines.find((x: any) => x.id === cut.id).bought).toBeNull()
  })

  it('ticks procedure steps: cautions and steps, who and when; unknown steps are refused', async () => {
    const v = (await b.tech.get(base)).body
    const ids = v.procedure.steps.slice(0, 3).map((s: any) => s.id)
    expect(ids[0]).toBe('caution/hot-cap')
    for (const stepId of ids) expect((await b.tech.post(`${base}/steps`, { stepId, done: true })).body.changed).toBe(true)
    expect((await b.tech.post(`${base}/steps`, { stepId: ids[0], done: true })).body.changed).toBe(false)
    const unknown = await b.tech.post(`${base}/steps`, { stepId: 'fill/nowhere', done: true })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fields.stepId).toBeTruthy()
    const after = (await b.rev.get(base)).body
    expect(Object.keys(after.steps).sort()).toEqual([...ids].sort())
    expect(after.steps[ids[0]]).toMatchObject({ by: { name: b.names.tech } })
  })

  it('records pressure tests read in psi and in bar, stored as gauge kPa; several are kept', async () => {
    // 16 psi × 6.894757 = 110.316 kPa; held 5 minutes, no drop
    const passed = await b.tech.post(`${base}/pressure-tests`, { unit: 'psi', startPressure: 16, endPressure: 16, minutesHeld: 5, passed: true, note: 'Cap held 16 psi on the adapter.' })
    expect(passed.status).toBe(201)
    expect(passed.body.startKpa).toBeCloseTo(16 * KPA_PER_PSI, 9)
    expect(passed.body.startKpa).toBeCloseTo(110.316, 3)
    // 1.1 bar → 110 kPa; 0.9 bar → 90 kPa after 2 minutes: a failed test
    const failed = await b.tech.post(`${base}/pressure-tests`, { unit: 'bar', startPressure: 1.1, endPressure: 0.9, minutesHeld: 2, passed: false, note: 'Weep at the heater bleed.' })
    expect(failed.status).toBe(201)
    const rows = await sql`select start_kpa, end_kpa, passed, entered_unit from shop_pressure_tests where circuit_id = ${b.circuitId} order by created_at`
    expect(rows.map((r) => [Number(r.start_kpa.toFixed(3)), Number(r.end_kpa.toFixed(3)), r.passed, r.entered_unit])).toEqual([[110.316, 110.316, true, 'psi'], [110, 90, false, 'bar']])
    const bad = await b.tech.post(`${base}/pressure-tests`, { unit: 'atm', startPressure: -1, minutesHeld: 0 })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fields).sort()).toEqual(['endPressure', 'minutesHeld', 'passed', 'startPressure', 'unit'])
  })

  it('records the coolant taken against the estimate: 9 US qt = 8.517 L', async () => {
    const estimateL = (await b.tech.get(base)).body.estimateL
    const res = await b.tech.post(`${base}/fills`, { unit: 'qt', volume: 9, note: 'Topped up after the warm-up.' })
    expect(res.status).toBe(201)
    expect(res.body.volumeL).toBeCloseTo(9 * LITRES_PER_QUART, 9)
    expect(res.body.volumeL).toBeCloseTo(8.517, 3)
    expect(res.body.differenceL).toBeCloseTo(9 * LITRES_PER_QUART - estimateL, 9)
    const v = (await b.fab.get(base)).body
    expect(v.fills).toHaveLength(1)
    expect(v.fills[0]).toMatchObject({ enteredUnit: 'qt', estimateL, by: { name: b.names.tech } })
    expect(v.fills[0].differenceL).toBeCloseTo(v.fills[0].volumeL - estimateL, 3)
    expect(v.pressureTests.map((t: any) => t.passed)).toEqual([true, false])
  })

  it('every record is a line of the project\'s activity log', async () => {
    await b.tech.post(`${base}/lines`, { description: 'Cable ties, 200 mm', quantity: 1, unit: 'pack' })
    const log = (await b.fab.get(`/api/projects/${b.projectId}/activity?circuitId=${b.circuitId}&pageSize=100`)).body
    const shop = log.items.filter((i: any) => i.action.startsWith('shop.'))
    const actions = new Set(shop.map((i: any) => i.action))
    for (const a of ['shop.item-bought', 'shop.item-fitted', 'shop.item-cut', 'shop.tick-removed', 'shop.step-done', 'shop.pressure-test', 'shop.fill-recorded', 'shop.line-added']) {
      expect(actions, a).toContain(a)
    }
    expect(shop.every((i: any) => i.actor?.name === b.names.tech && i.details.version === b.version)).toBe(true)
    expect(shop.filter((i: any) => i.action === 'shop.pressure-test').map((i: any) => i.details.passed).sort()).toEqual([false, true])
  })
})
