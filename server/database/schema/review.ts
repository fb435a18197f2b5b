// Review before the first fill, comments, invitations, password resets, the mail outbox and the
// activity log.
import { sql } from 'drizzle-orm'
import { pgTable, uuid, text, timestamp, integer, jsonb, index, uniqueIndex, pgEnum, foreignKey } from 'drizzle-orm/pg-core'
import { circuits, projects, users, workshops, roleEnum } from './core'
import { circuitRevisions } from './graph'

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()

export const reviewStateEnum = pgEnum('review_state', ['in-review', 'approved', 'changes-requested', 'superseded'])

/** A saved version put up for review: frozen, because it points at the revision's document. */
export const reviews = pgTable('reviews', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  state: reviewStateEnum('state').notNull().default('in-review'),
  submittedBy: uuid('submitted_by').references(() => users.id, { onDelete: 'set null' }),
  submittedAt: timestamp('submitted_at', { withTimezone: true }).notNull().defaultNow(),
  submitNote: text('submit_note').notNull().default(''),
  decidedBy: uuid('decided_by').references(() => users.id, { onDelete: 'set null' }),
  decidedAt: timestamp('decided_at', { withTimezone: true }),
  /** the reviewer's overall note to the fabricator */
  decisionNote: text('decision_note').notNull().default(''),
  /** finding counts of the frozen version */
  summary: jsonb('summary').$type<{ error: number; warning: number; note: number }>().notNull(),
}, t => [
  foreignKey({ columns: [t.circuitId, t.version], foreignColumns: [circuitRevisions.circuitId, circuitRevisions.version] }).onDelete('cascade'),
  index('reviews_circuit').on(t.circuitId, t.submittedAt),
  // at most one open review per circuit; approvals of one version cannot be doubled
  uniqueIndex('reviews_one_open').on(t.circuitId).where(sql`state = 'in-review'`),
])

/** A warning signed off with a reason, before approval. `findingKey` identifies the finding in the frozen report. */
export const reviewAcknowledgements = pgTable('review_acknowledgements', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  reviewId: uuid('review_id').notNull().references(() => reviews.id, { onDelete: 'cascade' }),
  findingKey: text('finding_key').notNull(),
  justification: text('justification').notNull(),
  acknowledgedBy: uuid('acknowledged_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
}, t => [uniqueIndex('review_ack_unique').on(t.reviewId, t.findingKey)])

/** A comment pinned to a part, a hose or a free point of a circuit; replies point at their parent. */
export const comments = pgTable('comments', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').notNull().references(() => circuits.id, { onDelete: 'cascade' }),
  parentId: uuid('parent_id'),
  /** the version on screen when the comment was written */
  version: integer('version').notNull(),
  anchor: jsonb('anchor').$type<{ kind: 'component' | 'hose' | 'point'; elementId?: string; point?: { x: number; y: number; z: number }; view?: 'side' | 'top' }>(),
  body: text('body').notNull(),
  mentions: jsonb('mentions').$type<string[]>().notNull().default([]),
  authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  editedAt: timestamp('edited_at', { withTimezone: true }),
  /** a deleted comment with replies stays as a placeholder so the thread still reads */
  deletedAt: timestamp('deleted_at', { withTimezone: true }),
  resolvedAt: timestamp('resolved_at', { withTimezone: true }),
  resolvedBy: uuid('resolved_by').references(() => users.id, { onDelete: 'set null' }),
}, t => [
  foreignKey({ columns: [t.parentId], foreignColumns: [t.id] }).onDelete('cascade'),
  index('comments_circuit').on(t.circuitId, t.createdAt),
])

/** An invitation to join a workshop: only the SHA-256 of the token is stored. */
export const invitations = pgTable('invitations', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  /** the owner's suggestion for a new account's name; the invitee may change it */
  name: text('name'),
  role: roleEnum('role').notNull(),
  tokenHash: text('token_hash').notNull(),
  invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
  /** the latest invitation e-mail, so the members page can show whether it went out */
  mailId: uuid('mail_id').references(() => mailOutbox.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
}, t => [uniqueIndex('invitations_token').on(t.tokenHash), index('invitations_workshop').on(t.workshopId)])

export const passwordResets = pgTable('password_resets', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  createdAt: createdAt(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
}, t => [uniqueIndex('password_resets_token').on(t.tokenHash)])

export const outboxStatusEnum = pgEnum('outbox_status', ['pending', 'sending', 'sent', 'failed'])

/** Every e-mail is written here in the same transaction as the action that causes it, then sent by
 *  the worker with retries: a mail-server outage never loses the action or the message. */
export const mailOutbox = pgTable('mail_outbox', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').references(() => workshops.id, { onDelete: 'cascade' }),
  kind: text('kind').notNull(),
  toAddress: text('to_address').notNull(),
  subject: text('subject').notNull(),
  textBody: text('text_body').notNull(),
  htmlBody: text('html_body'),
  /** attachments produced at send time (e.g. a build-sheet PDF), described, not stored */
  attachments: jsonb('attachments').$type<Array<{ kind: string; ref: string; filename: string }>>().notNull().default([]),
  status: outboxStatusEnum('status').notNull().default('pending'),
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
  lastError: text('last_error'),
  createdAt: createdAt(),
  sentAt: timestamp('sent_at', { withTimezone: true }),
}, t => [index('mail_outbox_due').on(t.status, t.nextAttemptAt)])

/** Who did what and when, per project. */
export const activity = pgTable('activity', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  projectId: uuid('project_id').references(() => projects.id, { onDelete: 'cascade' }),
  circuitId: uuid('circuit_id').references(() => circuits.id, { onDelete: 'set null' }),
  actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
  action: text('action').notNull(),
  details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
  createdAt: createdAt(),
}, t => [index('activity_project').on(t.projectId, t.createdAt), index('activity_workshop').on(t.workshopId, t.createdAt)])

export type ReviewRow = typeof reviews.$inferSelect
export type CommentRow = typeof comments.$inferSelect
export type InvitationRow = typeof invitations.$inferSelect
export type OutboxRow = typeof mailOutbox.$inferSelect
export type ActivityRow = typeof activity.$inferSelect
