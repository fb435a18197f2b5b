import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Make another of the user's workshops the current one.
export default defineEventHandler(async (event) => {
  const { user } = await requireUser(event)
  const { id } = await paramsOf(event, idParam)
  const [membership] = await useDb().select().from(schema.memberships)
    .where(and(eq(schema.memberships.userId, user.id), eq(schema.memberships.workshopId, id)))
  if (!membership) notFound('No such workshop')
  await replaceUserSession(event, { ...(await getUserSession(event)), workshopId: id })
  return await sessionSummary(user.id, id)
})
