import { and, eq, isNull } from 'drizzle-orm'
import { passwordResetCompleteInput } from '#shared/schemas/passwordReset'

// Choose the new password (public: the token is the credential). In one transaction: the password
// changes, every open reset link of the account closes and every session of the account ends.
export default defineEventHandler(async (event) => {
  const { token } = await paramsOf(event, tokenParam)
  const input = await bodyOf(event, passwordResetCompleteInput)
  const db = useDb()
  await openResetByToken(db, token)
  const passwordHash = await hashPassword(input.password)
  const email = await db.transaction(async (tx) => {
    const reset = await openResetByToken(tx, token, true)
    const now = new Date()
    const [user] = await tx.update(schema.users).set({ passwordHash, mustChangePassword: false, updatedAt: now })
      .where(eq(schema.users.id, reset.userId)).returning({ email: schema.users.email })
    await tx.update(schema.passwordResets).set({ usedAt: now })
      .where(and(eq(schema.passwordResets.userId, reset.userId), isNull(schema.passwordResets.usedAt)))
    await tx.update(schema.authSessions).set({ revokedAt: now })
      .where(and(eq(schema.authSessions.userId, reset.userId), isNull(schema.authSessions.revokedAt)))
    return user!.email
  })
  // the old password may have been guessed at: its failure count does not outlive the reset
  await clearSignInFailures(event, email)
  await clearUserSession(event)
  return { ok: true, email }
})
