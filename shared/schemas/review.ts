import { z } from 'zod'
import { optionalText, trimmed } from './common'
import { MIN_JUSTIFICATION_LENGTH } from '../review/approval'

export const reviewStates = ['in-review', 'approved', 'changes-requested', 'superseded'] as const
export type ReviewState = (typeof reviewStates)[number]

export const reviewStateLabels: Record<ReviewState, string> = {
  'in-review': 'In review',
  approved: 'Approved',
  'changes-requested': 'Changes requested',
  superseded: 'Superseded',
}

const version = z.coerce.number({ message: 'Version is required' }).int('Version is a whole number').min(1).max(2_000_000_000)

/** Put a saved version up for review; it must be the circuit's current version. */
export const reviewSubmitInput = z.object({
  version,
  note: optionalText('Note', 2000).default(''),
})
export type ReviewSubmitInput = z.infer<typeof reviewSubmitInput>

export const reviewApproveInput = z.object({ note: optionalText('Note', 4000).default('') })
/** Asking for changes without saying which helps nobody: the note is required. */
export const reviewChangesInput = z.object({ note: trimmed('Note to the fabricator', 4000) })
export type ReviewDecisionInput = z.infer<typeof reviewApproveInput>

export const acknowledgementInput = z.object({
  findingKey: z.string({ message: 'Which finding?' }).min(1, 'Which finding?').max(4000),
  justification: z.string({ message: 'Say why this warning is acceptable' }).trim()
    .min(MIN_JUSTIFICATION_LENGTH, `Say why in at least ${MIN_JUSTIFICATION_LENGTH} characters`)
    .max(2000, 'At most 2000 characters'),
})
export type AcknowledgementInput = z.infer<typeof acknowledgementInput>

export const acknowledgementParams = z.object({ id: z.uuid(), ackId: z.uuid() })

export const reviewListQuery = z.object({ state: z.enum(reviewStates).optional() })

/** Review settings of a workshop (kept in workshops.settings.review). */
export const reviewSettings = z.object({ fabricatorMayApproveOwn: z.boolean({ message: 'Choose on or off' }) })
export type ReviewSettings = z.infer<typeof reviewSettings>
export const defaultReviewSettings: ReviewSettings = { fabricatorMayApproveOwn: false }
export const reviewSettingsInput = reviewSettings.partial().refine((v) => Object.keys(v).length > 0, 'Nothing to change')

export function reviewSettingsOf(workshopSettings: Record<string, unknown> | null | undefined): ReviewSettings {
  const parsed = reviewSettings.partial().safeParse(workshopSettings?.review ?? {})
  return { ...defaultReviewSettings, ...(parsed.success ? parsed.data : {}) }
}

export const diffQuery = z.object({ from: version, to: version })

export interface PersonRef { id: string; name: string }

/** Where a circuit stands in review, shown wherever the circuit is. */
export interface ReviewStatus {
  currentVersion: number
  approved: { reviewId: string; version: number; by: PersonRef | null; at: string } | null
  open: { reviewId: string; version: number; by: PersonRef | null; at: string } | null
  /** the latest review of any state, for "changes requested" */
  latest: { reviewId: string; version: number; state: ReviewState; at: string } | null
  /** the current version is newer than the approved one */
  draftAfterApproval: boolean
}

/** What the project's activity log records (templates belong to the workshop, not a project). */
export const activityActions = [
  'circuit.created', 'circuit.renamed', 'circuit.deleted', 'circuit.imported', 'circuit.edited',
  'review.submitted', 'review.approved', 'review.changes-requested', 'review.superseded',
  'comment.added', 'comment.resolved', 'comment.reopened',
  'photo.uploaded', 'photo.deleted',
] as const
export type ActivityAction = (typeof activityActions)[number]

export const activityActionLabels: Record<ActivityAction, string> = {
  'circuit.created': 'created a circuit',
  'circuit.renamed': 'renamed a circuit',
  'circuit.deleted': 'deleted a circuit',
  'circuit.imported': 'imported a circuit',
  'circuit.edited': 'edited the drawing',
  'review.submitted': 'put a version up for review',
  'review.approved': 'approved a version',
  'review.changes-requested': 'asked for changes',
  'review.superseded': 'replaced an open review',
  'comment.added': 'commented',
  'comment.resolved': 'resolved a thread',
  'comment.reopened': 'reopened a thread',
  'photo.uploaded': 'added a photo',
  'photo.deleted': 'removed a photo',
}

export const activityQuery = z.object({
  action: z.enum(activityActions, { message: 'Unknown action' }).optional(),
  actorId: z.uuid({ message: 'Not a valid id' }).optional(),
  circuitId: z.uuid({ message: 'Not a valid id' }).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(50),
})
