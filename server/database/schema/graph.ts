import { pgTable, uuid, boolean, doublePrecision, foreignKey, text, timestamp, integer, jsonb, primaryKey, index } from 'drizzle-orm/pg-core'

import { circuits, users, workshops } from './core'

// ── The drawn graph of a circuit. Ids are the document's own (text), unique within a circuit.
// Rows are replaced as a whole on every save, inside one transaction guarded by circuits.version.

export const circuitComponents = pgTable('circuit_components', {
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  id: text('id').notNull(),
  /** order in the document, so a saved document reads back exactly as it was written */
  position: integer('position').notNull(),
  type: text('type').notNull(),
  label: text('label').notNull(),
  x: doublePrecision('x').notNull(),
  y: doublePrecision('y').notNull(),
  z: doublePrecision('z').notNull(),
  rotationDeg: doublePrecision('rotation_deg').notNull(),
  volumeL: doublePrecision('volume_l').notNull(),
  params: jsonb('params').$type<Record<string, unknown>>().notNull(),
}, t => [primaryKey({ columns: [t.circuitId, t.id] }), index('circuit_components_workshop').on(t.workshopId)])

export const circuitPorts = pgTable('circuit_ports', {
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  id: text('id').notNull(),
  componentId: text('component_id').notNull(),
  position: integer('position').notNull(),
  name: text('name').notNull(),
  role: text('role').notNull(),
  spigotOdMm: doublePrecision('spigot_od_mm').notNull(),
  offsetX: doublePrecision('offset_x').notNull(),
  offsetY: doublePrecision('offset_y').notNull(),
  offsetZ: doublePrecision('offset_z').notNull(),
  blocked: boolean('blocked').notNull(),
}, t => [
  primaryKey({ columns: [t.circuitId, t.id] }),
  foreignKey({ columns: [t.circuitId, t.componentId], foreignColumns: [circuitComponents.circuitId, circuitComponents.id] }).onDelete('cascade'),
])

export const circuitHoses = pgTable('circuit_hoses', {
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  id: text('id').notNull(),
  position: integer('position').notNull(),
  fromPortId: text('from_port_id'),
  fromPoint: jsonb('from_point').$type<{ x: number; y: number; z: number }>(),
  fromClamp: text('from_clamp').notNull(),
  toPortId: text('to_port_id'),
  toPoint: jsonb('to_point').$type<{ x: number; y: number; z: number }>(),
  toClamp: text('to_clamp').notNull(),
  insideDiameterMm: doublePrecision('inside_diameter_mm').notNull(),
  wallMm: doublePrecision('wall_mm').notNull(),
  material: text('material').notNull(),
  measuredLengthMm: doublePrecision('measured_length_mm'),
  params: jsonb('params').$type<Record<string, unknown>>().notNull(),
}, t => [
  primaryKey({ columns: [t.circuitId, t.id] }),
  foreignKey({ columns: [t.circuitId, t.fromPortId], foreignColumns: [circuitPorts.circuitId, circuitPorts.id] }),
  foreignKey({ columns: [t.circuitId, t.toPortId], foreignColumns: [circuitPorts.circuitId, circuitPorts.id] }),
])

/** Every saved version's exchange document, kept for history, diff and review. */
export const circuitRevisions = pgTable('circuit_revisions', {
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  document: jsonb('document').$type<Record<string, unknown>>().notNull(),
  /** finding counts at save time, for lists that should not re-run the engine */
  summary: jsonb('summary').$type<{ error: number; warning: number; note: number }>().notNull(),
  savedBy: uuid('saved_by').references(() => users.id, { onDelete: 'set null' }),
  savedAt: timestamp('saved_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [primaryKey({ columns: [t.circuitId, t.version] })])

export type CircuitComponentRow = typeof circuitComponents.$inferSelect
export type NewCircuitComponentRow = typeof circuitComponents.$inferInsert
export type CircuitPortRow = typeof circuitPorts.$inferSelect
export type NewCircuitPortRow = typeof circuitPorts.$inferInsert
export type CircuitHoseRow = typeof circuitHoses.$inferSelect
export type NewCircuitHoseRow = typeof circuitHoses.$inferInsert
export type CircuitRevisionRow = typeof circuitRevisions.$inferSelect

