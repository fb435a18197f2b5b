import { z } from 'zod'
import { optionalText, trimmed } from './common'

export const projectStatuses = ['planning', 'fabrication', 'review', 'filled', 'archived'] as const
export const projectStatus = z.enum(projectStatuses, { message: 'Choose a status' })
export type ProjectStatus = z.infer<typeof projectStatus>

const isoDateText = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-31')
  .refine(s => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Not a real date')
/** A due date: ISO yyyy-mm-dd, or empty for none (a cleared date input sends ''). */
const dueDate = z.preprocess(v => (v === '' ? null : v), isoDateText.nullable())

export const projectInput = z.object({
  title: trimmed('Title', 160),
  vehicle: optionalText('Vehicle', 400).default(''),
  engine: optionalText('Engine', 400).default(''),
  notes: optionalText('Notes', 8000).default(''),
  dueDate: dueDate.default(null),
  status: projectStatus.exclude(['archived']).default('planning'),
})
export type ProjectInput = z.infer<typeof projectInput>

/** Partial update; archiving has its own action so it is never done by a stray field. */
export const projectUpdateInput = z.object({
  title: trimmed('Title', 160),
  vehicle: optionalText('Vehicle', 400),
  engine: optionalText('Engine', 400),
  notes: optionalText('Notes', 8000),
  dueDate,
  status: projectStatus.exclude(['archived']),
}).partial().refine(v => Object.keys(v).length > 0, 'Nothing to change')
export type ProjectUpdateInput = z.infer<typeof projectUpdateInput>

export const projectSorts = ['updatedAt', 'title', 'dueDate', 'status', 'createdAt'] as const

export const projectListQuery = z.object({
  q: z.string().trim().max(200).optional(),
  status: z.union([projectStatus, z.literal('active'), z.literal('all')]).default('active'),
  sort: z.enum(projectSorts).default('updatedAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).max(100000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
})
export type ProjectListQuery = z.infer<typeof projectListQuery>
