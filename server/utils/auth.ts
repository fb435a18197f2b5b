import type { H3Event } from 'h3'
import { and, eq, gt, isNull, asc } from 'drizzle-orm'
import { can, type Capability } from '#shared/permissions'
import type { Role } from '#shared/schemas/membership'

export interface SessionUser { id: string; email: string; name: string }

export interface MemberContext {
  user: SessionUser
  sessionId: string
  workshopId: string
  role: Role
}

const sessionHours = () => Number(process.env.HOSEWRIGHT_SESSION_HOURS ?? 12)

/** Starts a server-recorded session (a new id every sign-in, so an old cookie cannot be reused). */
export async function startSession(event: H3Event, user: SessionUser, workshopId: string | null) {
  const db = useDb()
  const [row] = await db.insert(schema.authSessions).values({
    userId: user.id,
    expiresAt: new Date(Date.now() + sessionHours() * 3600_000),
  }).returning({ id: schema.authSessions.id })
  await replaceUserSession(event, { user, sid: row!.id, workshopId, signedInAt: Date.now() })
}

export async function endSession(event: H3Event) {
  const session = await getUserSession(event)
  if (session.sid) {
    await useDb().update(schema.authSessions).set({ revokedAt: new Date() })
      .where(eq(schema.authSessions.id, session.sid as string))
  }
  await clearUserSession(event)
}

/** The signed-in user with a live server-side session, or 401. */
export async function requireUser(event: H3Event): Promise<{ user: SessionUser; sessionId: string; workshopId: string | null }> {
  const session = await getUserSession(event)
  const user = session.user as SessionUser | undefined
  const sid = session.sid as string | undefined
  if (!user?.id || !sid || !/^[0-9a-f-]{36}$/i.test(sid)) throw createError({ statusCode: 401, statusMessage: 'Sign in first' })
  const [live] = await useDb().select({ id: schema.authSessions.id }).from(schema.authSessions).where(and(
    eq(schema.authSessions.id, sid),
    eq(schema.authSessions.userId, user.id),
    isNull(schema.authSessions.revokedAt),
    gt(schema.authSessions.expiresAt, new Date()),
  ))
  if (!live) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: 'Your session has ended; sign in again' })
  }
  return { user, sessionId: sid, workshopId: (session.workshopId as string | null) ?? null }
}

/**
 * The one place roles are enforced: signed in, a member of the current workshop, and allowed
 * the capability. Every route that touches workshop data starts here.
 */
export async function requireMember(event: H3Event, capability: Capability): Promise<MemberContext> {
  const { user, sessionId, workshopId } = await requireUser(event)
  const db = useDb()
  let membership = workshopId
    ? (await db.select().from(schema.memberships).where(and(
        eq(schema.memberships.userId, user.id), eq(schema.memberships.workshopId, workshopId))))[0]
    : undefined
  if (!membership) {
    // removed from that workshop (or none chosen yet): fall back to the oldest membership left
    membership = (await db.select().from(schema.memberships).where(eq(schema.memberships.userId, user.id))
      .orderBy(asc(schema.memberships.createdAt)).limit(1))[0]
    if (!membership) throw createError({ statusCode: 403, statusMessage: 'You are not a member of any workshop' })
    await replaceUserSession(event, { ...(await getUserSession(event)), workshopId: membership.workshopId })
  }
  if (!can(membership.role, capability)) {
    throw createError({ statusCode: 403, statusMessage: 'Not allowed', message: `Your role (${membership.role}) cannot do this` })
  }
  return { user, sessionId, workshopId: membership.workshopId, role: membership.role }
}
