import { sql } from 'drizzle-orm'
import { pgTable, uuid, text, timestamp, integer, jsonb, index, uniqueIndex } from 'drizzle-orm/pg-core'

import { circuits, users, workshops } from './core'

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()

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

