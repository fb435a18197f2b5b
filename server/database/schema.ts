// Drizzle schema: the one description of Hosewright's tables. Migrations in drizzle/ are generated
// from this file with `npm run db:generate`; never edit them by hand.
import { sql } from 'drizzle-orm'
import {
  pgTable, uuid, boolean, doublePrecision, foreignKey, text, timestamp, integer, date, jsonb, primaryKey, index, uniqueIndex, pgEnum,
} from 'drizzle-orm/pg-core'

export const roleEnum = pgEnum('member_role', ['owner', 'fabricator', 'reviewer', 'technician'])
export const projectStatusEnum = pgEnum('project_status', ['planning', 'fabrication', 'review', 'filled', 'archived'])
export const circuitKindEnum = pgEnum('circuit_kind', ['coolant', 'fuel'])

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  // stored lower-cased; the unique index makes "one account per address" hold under races
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  /** set when an owner created the account with a one-time password: the user must choose a new one */
  mustChangePassword: boolean('must_change_password').notNull().default(false),
  preferences: jsonb('preferences').$type<Record<string, string>>().notNull().default({}),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('users_email_unique').on(t.email)])

export const workshops = pgTable('workshops', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  settings: jsonb('settings').$type<Record<string, unknown>>().notNull().default({}),
  createdAt: createdAt(),
})

export const memberships = pgTable('memberships', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: roleEnum('role').notNull(),
  createdAt: createdAt(),
}, t => [uniqueIndex('memberships_workshop_user').on(t.workshopId, t.userId)])

/** Server-side record of each signed-in session, so sign-out and expiry really end it. */
export const authSessions = pgTable('auth_sessions', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  createdAt: createdAt(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
}, t => [index('auth_sessions_user').on(t.userId)])

/** Failed sign-in counters, per e-mail and per client address, shared by every app instance. */
export const signInAttempts = pgTable('sign_in_attempts', {
  key: text('key').notNull(),
  windowStart: timestamp('window_start', { withTimezone: true }).notNull(),
  failures: integer('failures').notNull().default(0),
}, t => [primaryKey({ columns: [t.key] })])

export const projects = pgTable('projects', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  title: text('title').notNull(),
  vehicle: text('vehicle').notNull().default(''),
  engine: text('engine').notNull().default(''),
  notes: text('notes').notNull().default(''),
  dueDate: date('due_date'),
  status: projectStatusEnum('status').notNull().default('planning'),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('projects_workshop').on(t.workshopId, t.updatedAt)])

export const circuits = pgTable('circuits', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  kind: circuitKindEnum('kind').notNull(),
  title: text('title').notNull(),
  /** optimistic concurrency: every save names the version it started from */
  version: integer('version').notNull().default(1),
  /** the circuit's settings block of the exchange document (coolant, cap, pump, allowance …) */
  settings: jsonb('settings').$type<Record<string, unknown>>(),
  notes: text('notes'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('circuits_project').on(t.projectId)])

export type UserRow = typeof users.$inferSelect
export type WorkshopRow = typeof workshops.$inferSelect
export type MembershipRow = typeof memberships.$inferSelect
export type ProjectRow = typeof projects.$inferSelect
export type NewProjectRow = typeof projects.$inferInsert
export type CircuitRow = typeof circuits.$inferSelect
export type NewCircuitRow = typeof circuits.$inferInsert

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

// ── The workshop's part library and photos of drawn parts.

/**
 * A part the workshop reuses: the body is a drawn part without its id and position
 * (shared/schemas/template.ts); its port ids are local and renamed when the part is placed.
 */
export const partTemplates = pgTable('part_templates', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  /** the body's part type, as a column so lists can filter without reading the JSON */
  type: text('type').notNull(),
  body: jsonb('body').$type<Record<string, unknown>>().notNull(),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  // "Top hose tee" and "top hose tee" are the same part to the people picking it
  uniqueIndex('part_templates_workshop_name').on(t.workshopId, sql`lower(${t.name})`),
])

/**
 * A photo of a drawn part. The image and its thumbnail live in object storage under
 * workshop/circuit/photo-id keys; the uploaded file name is kept only as a label to show.
 */
export const partPhotos = pgTable('part_photos', {
  id: uuid('id').primaryKey(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  /** the part's id in the circuit document (a part may be drawn before its first save, so no foreign key) */
  componentId: text('component_id').notNull(),
  objectKey: text('object_key').notNull(),
  thumbnailKey: text('thumbnail_key').notNull(),
  contentType: text('content_type').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  width: integer('width'),
  height: integer('height'),
  label: text('label').notNull(),
  uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
}, t => [index('part_photos_circuit_component').on(t.circuitId, t.componentId, t.createdAt)])

export type PartTemplateRow = typeof partTemplates.$inferSelect
export type PartPhotoRow = typeof partPhotos.$inferSelect
