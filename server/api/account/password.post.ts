import { eq } from 'drizzle-orm'
import { changePasswordInput } from '#shared/schemas/auth'

// Change own password (also how a one-time password from an owner is replaced).
export default defineEventHandler(async (event) => {
  const { user } = await requireUser(event)
  const input = await bodyOf(event, changePasswordInput)
  const db = useDb()
  const [row] = await db.select().from(schema.users).where(eq(schema.users.id, user.id))
  if (!row || !(await verifyPassword(row.passwordHash, input.currentPassword))) {
    invalidInput([{ path: 'currentPassword', message: 'The current password is wrong' }])
  }
  await db.update(schema.users).set({
    passwordHash: await hashPassword(input.newPassword), mustChangePassword: false, updatedAt: new Date(),
  }).where(eq(schema.users.id, user.id))
  return { ok: true }
})
