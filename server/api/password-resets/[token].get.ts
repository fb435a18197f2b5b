import { eq } from 'drizzle-orm'

// Whether a reset link still works, and for which address (public: the token is the credential).
export default defineEventHandler(async (event) => {
  const { token } = await paramsOf(event, tokenParam)
  setResponseHeader(event, 'Cache-Control', 'no-store')
  const reset = await openResetByToken(useDb(), token)
  const [user] = await useDb().select({ email: schema.users.email }).from(schema.users).where(eq(schema.users.id, reset.userId))
  return { email: user?.email ?? null, expiresAt: reset.expiresAt }
})
