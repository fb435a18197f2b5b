import { eq, asc } from 'drizzle-orm'
import { signInInput } from '#shared/schemas/auth'

// Sign in. Public route: it authenticates by the password itself.
export default defineEventHandler(async (event) => {
  const input = await bodyOf(event, signInInput)
  await assertSignInAllowed(event, input.email)
  const db = useDb()
  const [user] = await db.select().from(schema.users).where(eq(schema.users.email, input.email))
  // verify against a real hash even when the e-mail is unknown, so timing does not tell
  const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await verifyPassword(await dummyHash(), input.password), false)
  if (!user || !ok) {
    await recordSignInFailure(event, input.email)
    throw createError({ statusCode: 401, statusMessage: 'Sign-in failed', message: 'The e-mail or password is wrong.' })
  }
  await clearSignInFailures(event, input.email)
  const [first] = await db.select({ workshopId: schema.memberships.workshopId }).from(schema.memberships)
    .where(eq(schema.memberships.userId, user.id)).orderBy(asc(schema.memberships.createdAt)).limit(1)
  await startSession(event, { id: user.id, email: user.email, name: user.name }, first?.workshopId ?? null)
  return { ok: true, mustChangePassword: user.mustChangePassword }
})

let dummy: Promise<string> | undefined
function dummyHash() {
  dummy ??= hashPassword('not-a-real-password-just-for-timing')
  return dummy
}
