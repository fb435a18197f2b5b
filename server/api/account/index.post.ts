import { signUpInput } from '#shared/schemas/auth'

// Sign up: a new account and a new workshop with that account as its owner, in one transaction.
export default defineEventHandler(async (event) => {
  const input = await bodyOf(event, signUpInput)
  const db = useDb()
  const passwordHash = await hashPassword(input.password)
  const created = await db.transaction(async (tx) => {
    const [user] = await tx.insert(schema.users)
      .values({ email: input.email, name: input.name, passwordHash })
      .onConflictDoNothing({ target: schema.users.email })
      .returning()
    if (!user) return null
    const [workshop] = await tx.insert(schema.workshops).values({ name: input.workshopName }).returning()
    await tx.insert(schema.memberships).values({ workshopId: workshop!.id, userId: user.id, role: 'owner' })
    return { user, workshop: workshop! }
  })
  if (!created) {
    invalidInput([{ path: 'email', message: 'An account with this e-mail already exists. Sign in instead.' }], 'That e-mail is already registered.')
  }
  await startSession(event, { id: created.user.id, email: created.user.email, name: created.user.name }, created.workshop.id)
  setResponseStatus(event, 201)
  return await sessionSummary(created.user.id, created.workshop.id)
})
