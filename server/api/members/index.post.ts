import { randomBytes } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { memberAddInput } from '#shared/schemas/membership'

// Add a member by e-mail. An unknown address gets an account with a one-time password, shown once
// to the owner to hand over; the new member must choose their own at first sign-in.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'members:manage')
  const input = await bodyOf(event, memberAddInput)
  const oneTimePassword = randomBytes(9).toString('base64url')
  const hash = await hashPassword(oneTimePassword)
  const result = await useDb().transaction(async (tx) => {
    let [user] = await tx.select().from(schema.users).where(eq(schema.users.email, input.email))
    let created = false
    if (!user) {
      [user] = await tx.insert(schema.users).values({
        email: input.email, name: input.name ?? input.email.split('@')[0]!, passwordHash: hash, mustChangePassword: true,
      }).returning()
      created = true
    }
    const [existing] = await tx.select().from(schema.memberships)
      .where(and(eq(schema.memberships.workshopId, workshopId), eq(schema.memberships.userId, user!.id)))
    if (existing) return null
    const [membership] = await tx.insert(schema.memberships).values({ workshopId, userId: user!.id, role: input.role }).returning()
    return { membership: membership!, user: user!, created }
  })
  if (!result) invalidInput([{ path: 'email', message: 'This person is already a member' }])
  setResponseStatus(event, 201)
  return {
    id: result.membership.id, role: result.membership.role,
    userId: result.user.id, email: result.user.email, name: result.user.name,
    oneTimePassword: result.created ? oneTimePassword : null,
  }
})
