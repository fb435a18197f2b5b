import { asc, eq } from 'drizzle-orm'
import { defaultPreferences, unitPreferences } from '#shared/schemas/preferences'

/** What the client store needs after sign-in or a workshop switch. */
export async function sessionSummary(userId: string, workshopId: string | null) {
  const db = useDb()
  const [user] = await db.select().from(schema.users).where(eq(schema.users.id, userId))
  if (!user) throw createError({ statusCode: 401, statusMessage: 'Sign in first' })
  const workshops = await db.select({
    id: schema.workshops.id, name: schema.workshops.name, role: schema.memberships.role,
  }).from(schema.memberships)
    .innerJoin(schema.workshops, eq(schema.workshops.id, schema.memberships.workshopId))
    .where(eq(schema.memberships.userId, userId))
    .orderBy(asc(schema.workshops.name))
  const current = workshops.find(w => w.id === workshopId) ?? null
  const prefs = unitPreferences.safeParse({ ...defaultPreferences, ...user.preferences })
  return {
    user: { id: user.id, email: user.email, name: user.name, mustChangePassword: user.mustChangePassword },
    preferences: prefs.success ? prefs.data : defaultPreferences,
    workshops,
    workshop: current,
    role: current?.role ?? null,
  }
}
