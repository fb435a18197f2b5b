import { and, eq } from 'drizzle-orm'
import { can } from '#shared/permissions'
import { idParam } from '#shared/schemas/common'

// Delete one's own comment (owners may delete anyone's). A comment with replies stays as a
// "deleted" placeholder so the thread still reads; its words go.
export default defineEventHandler(async (event) => {
  const { workshopId, user, role } = await requireMember(event, 'comment:write')
  const { id } = await paramsOf(event, idParam)
  await useDb().transaction(async (tx) => {
    const comment = await findComment(tx, workshopId, id)
    if (comment.authorId !== user.id && !can(role, 'comment:moderate')) {
      throw createError({ statusCode: 403, statusMessage: 'Not allowed', message: 'Only its author (or an owner) can delete a comment.' })
    }
    const c = schema.comments
    const replies = await tx.select({ id: c.id }).from(c).where(and(eq(c.parentId, comment.id), eq(c.workshopId, workshopId))).limit(1)
    if (replies.length > 0) await tx.update(c).set({ body: '', mentions: [], deletedAt: new Date() }).where(eq(c.id, comment.id))
    else await tx.delete(c).where(eq(c.id, comment.id))
    // the last reply of a deleted thread takes the placeholder with it
    if (comment.parentId) {
      const [parent] = await tx.select().from(c).where(eq(c.id, comment.parentId))
      const left = await tx.select({ id: c.id }).from(c).where(eq(c.parentId, comment.parentId)).limit(1)
      if (parent?.deletedAt && left.length === 0) await tx.delete(c).where(eq(c.id, parent.id))
    }
  })
  return { ok: true }
})
