import { eq } from 'drizzle-orm'
import { accountUpdateInput, defaultPreferences } from '#shared/schemas/preferences'

// Own name and unit preferences.
export default defineEventHandler(async (event) => {
  const { user, workshopId } = await requireUser(event)
  const input = await bodyOf(event, accountUpdateInput)
  const db = useDb()
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(schema.users).where(eq(schema.users.id, user.id)).for('update')
    if (!row) throw createError({ statusCode: 401, statusMessage: 'Sign in first' })
    await tx.update(schema.users).set({
      name: input.name ?? row.name,
      preferences: { ...defaultPreferences, ...row.preferences, ...input.preferences },
      updatedAt: new Date(),
    }).where(eq(schema.users.id, user.id))
  })
  if (input.name) await replaceUserSession(event, { ...(await getUserSession(event)), user: { ...user, name: input.name } })
  return await sessionSummary(user.id, workshopId)
})
