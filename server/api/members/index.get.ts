import { asc, eq } from 'drizzle-orm'

// Members of the current workshop (owner only).
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'members:manage')
  return await useDb().select({
    id: schema.memberships.id, role: schema.memberships.role, createdAt: schema.memberships.createdAt,
    userId: schema.users.id, email: schema.users.email, name: schema.users.name,
    mustChangePassword: schema.users.mustChangePassword,
  }).from(schema.memberships)
    .innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(eq(schema.memberships.workshopId, workshopId))
    .orderBy(asc(schema.users.name))
})
