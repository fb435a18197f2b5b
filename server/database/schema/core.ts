// Accounts, workshops, memberships, sessions, projects and circuits.
import { pgTable, uuid, boolean, text, timestamp, integer, date, jsonb, primaryKey, index, uniqueIndex, pgEnum } from 'drizzle-orm/pg-core'

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

