import { eq } from 'drizzle-orm'
import { resolveMentions } from '#shared/review'
import { idParam } from '#shared/schemas/common'
import { commentUpdateInput } from '#shared/schemas/comment'
import { wakeMailWorker } from '../../mail/worker'

// Edit one's own comment. People newly mentioned by the edit get the e-mail; the others already had it.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'comment:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, commentUpdateInput)
  const db = useDb()
  const row = await db.transaction(async (tx) => {
    const comment = await findComment(tx, workshopId, id)
    if (comment.authorId !== user.id) throw createError({ statusCode: 403, statusMessage: 'Not allowed', message: 'Only its author can edit a comment.' })
    if (comment.deletedAt) notFound('This comment was deleted')
    const mentions = resolveMentions(input.body, await mentionableMembers(tx, workshopId))
    const [updated] = await tx.update(schema.comments).set({ body: input.body, mentions, editedAt: new Date() })
      .where(eq(schema.comments.id, comment.id)).returning()
    const circuit = await findCircuit(tx, workshopId, comment.circuitId)
    await queueMentionMails(tx, updated!, circuit, { id: user.id, name: user.name }, mentions.filter((m) => !comment.mentions.includes(m)))
    return updated!
  })
  wakeMailWorker()
  return await commentItem(db, row)
})
