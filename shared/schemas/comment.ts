import { z } from 'zod'
import { elementId, point3 } from '../circuit/primitives'
import { trimmed } from './common'

/** What a comment is pinned to: a part, a hose, or a free point on one view. */
export const commentAnchor = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('component'), elementId }),
  z.strictObject({ kind: z.literal('hose'), elementId }),
  z.strictObject({ kind: z.literal('point'), point: point3, view: z.enum(['side', 'top']).optional() }),
])
export type CommentAnchorInput = z.infer<typeof commentAnchor>

const body = trimmed('Comment', 4000)

/** A new thread (with an anchor, or none for the whole circuit) or a reply (parentId; the thread's anchor). */
export const commentCreateInput = z.object({
  body,
  version: z.number({ message: 'Version is required' }).int().min(1),
  anchor: commentAnchor.nullable().optional(),
  parentId: z.uuid().optional(),
})
export type CommentCreateInput = z.infer<typeof commentCreateInput>

export const commentUpdateInput = z.object({ body })

export interface CommentAuthor { id: string; name: string }

export interface CommentItem {
  id: string
  circuitId: string
  parentId: string | null
  version: number
  anchor: CommentAnchorInput | null
  body: string
  mentions: string[]
  author: CommentAuthor | null
  createdAt: string
  editedAt: string | null
  deleted: boolean
  resolvedAt: string | null
  resolvedBy: CommentAuthor | null
}
