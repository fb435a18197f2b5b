// The technician's records for one saved version: prices and ticks on the shopping list, lines the
// workshop adds, ticked procedure steps, pressure tests and the coolant that actually went in.
// Every row is keyed by circuit + version, so records stay with the frozen version they were made on.
import { boolean, doublePrecision, foreignKey, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { circuits, users, workshops } from './core'
import { circuitRevisions } from './graph'

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()

/** What a line the workshop added says (the shopping list's CustomLineInput without price and supplier). */
export interface StoredCustomLine {
  description: string
  quantity: number
  unit: string
  section: string
  sizeMetric: string
  sizeImperial: string
  notes: string
}

/**
 * One line of a version's shopping list as the workshop keeps it: the engine's line ids are stable,
 * so a row follows its line; `custom` is set for a line the workshop added itself.
 */
export const shopLines = pgTable('shop_lines', {
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  lineId: text('line_id').notNull(),
  custom: jsonb('custom').$type<StoredCustomLine>(),
  /** per unit, in the workshop's currency */
  price: doublePrecision('price'),
  supplier: text('supplier'),
  boughtAt: timestamp('bought_at', { withTimezone: true }),
  boughtBy: uuid('bought_by').references(() => users.id, { onDelete: 'set null' }),
  fittedAt: timestamp('fitted_at', { withTimezone: true }),
  fittedBy: uuid('fitted_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  primaryKey({ columns: [t.circuitId, t.version, t.lineId] }),
  foreignKey({ columns: [t.circuitId, t.version], foreignColumns: [circuitRevisions.circuitId, circuitRevisions.version] }).onDelete('cascade'),
  index('shop_lines_workshop').on(t.workshopId),
])

/** A procedure step ticked off: who and when. Unticking deletes the row (the activity log keeps both). */
export const shopSteps = pgTable('shop_steps', {
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  stepId: text('step_id').notNull(),
  doneBy: uuid('done_by').references(() => users.id, { onDelete: 'set null' }),
  doneAt: timestamp('done_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  primaryKey({ columns: [t.circuitId, t.version, t.stepId] }),
  foreignKey({ columns: [t.circuitId, t.version], foreignColumns: [circuitRevisions.circuitId, circuitRevisions.version] }).onDelete('cascade'),
])

/** A pressure test as read off the gauge. Gauge kPa; the unit it was read in is kept to show it back. */
export const shopPressureTests = pgTable('shop_pressure_tests', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  startKpa: doublePrecision('start_kpa').notNull(),
  endKpa: doublePrecision('end_kpa').notNull(),
  minutesHeld: doublePrecision('minutes_held').notNull(),
  passed: boolean('passed').notNull(),
  enteredUnit: text('entered_unit').notNull(),
  note: text('note').notNull().default(''),
  recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
}, t => [
  foreignKey({ columns: [t.circuitId, t.version], foreignColumns: [circuitRevisions.circuitId, circuitRevisions.version] }).onDelete('cascade'),
  index('shop_pressure_tests_version').on(t.circuitId, t.version, t.createdAt),
])

/** Coolant that actually went in at a fill, litres, against the report's estimate. */
export const shopFills = pgTable('shop_fills', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  volumeL: doublePrecision('volume_l').notNull(),
  /** the report's system volume when it was recorded, so the difference reads the same later */
  estimateL: doublePrecision('estimate_l').notNull(),
  enteredUnit: text('entered_unit').notNull(),
  note: text('note').notNull().default(''),
  recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
}, t => [
  foreignKey({ columns: [t.circuitId, t.version], foreignColumns: [circuitRevisions.circuitId, circuitRevisions.version] }).onDelete('cascade'),
  index('shop_fills_version').on(t.circuitId, t.version, t.createdAt),
])

export type ShopLineRow = typeof shopLines.$inferSelect
export type ShopStepRow = typeof shopSteps.$inferSelect
export type ShopPressureTestRow = typeof shopPressureTests.$inferSelect
export type ShopFillRow = typeof shopFills.$inferSelect
