// The technician's records on a version: ticked steps, pressure tests and fills, oldest first.
import { and, asc, eq } from 'drizzle-orm'
import type { PersonRef } from '#shared/schemas/review'
import type { ShopFill, ShopPressureTest, ShopTick } from '#shared/schemas/shop'
import type { ShopFillRow, ShopPressureTestRow, ShopStepRow } from '../database/schema'
import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export interface ShopRecordRows {
  steps: ShopStepRow[]
  pressureTests: ShopPressureTestRow[]
  fills: ShopFillRow[]
}

export async function shopRecordRows(db: Executor, workshopId: string, circuitId: string, version: number): Promise<ShopRecordRows> {
  const s = schema.shopSteps
  const p = schema.shopPressureTests
  const f = schema.shopFills
  const [steps, pressureTests, fills] = await Promise.all([
    db.select().from(s).where(and(eq(s.workshopId, workshopId), eq(s.circuitId, circuitId), eq(s.version, version))),
    db.select().from(p).where(and(eq(p.workshopId, workshopId), eq(p.circuitId, circuitId), eq(p.version, version))).orderBy(asc(p.createdAt), asc(p.id)),
    db.select().from(f).where(and(eq(f.workshopId, workshopId), eq(f.circuitId, circuitId), eq(f.version, version))).orderBy(asc(f.createdAt), asc(f.id)),
  ])
  return { steps, pressureTests, fills }
}

export function recordPeopleIds(rows: ShopRecordRows): Array<string | null> {
  return [...rows.steps.map((x) => x.doneBy), ...rows.pressureTests.map((x) => x.recordedBy), ...rows.fills.map((x) => x.recordedBy)]
}

/** Readings to 0.001 kPa / 0.001 L: what a gauge or a jug can tell, without float noise from the unit factor. */
const milli = (n: number) => Math.round(n * 1000) / 1000

export function shopRecordsView(rows: ShopRecordRows, people: Map<string, PersonRef>) {
  const person = (id: string | null) => (id ? people.get(id) ?? null : null)
  const steps: Record<string, ShopTick> = {}
  for (const s of rows.steps) steps[s.stepId] = { by: person(s.doneBy), at: s.doneAt.toISOString() }
  const pressureTests: ShopPressureTest[] = rows.pressureTests.map((t) => ({
    id: t.id, startKpa: t.startKpa, endKpa: t.endKpa, minutesHeld: t.minutesHeld, passed: t.passed,
    enteredUnit: t.enteredUnit as ShopPressureTest['enteredUnit'], note: t.note, by: person(t.recordedBy), at: t.createdAt.toISOString(),
  }))
  const fills: ShopFill[] = rows.fills.map((x) => ({
    id: x.id, volumeL: x.volumeL, estimateL: x.estimateL, differenceL: milli(x.volumeL - x.estimateL),
    enteredUnit: x.enteredUnit as ShopFill['enteredUnit'], note: x.note, by: person(x.recordedBy), at: x.createdAt.toISOString(),
  }))
  return { steps, pressureTests, fills }
}
