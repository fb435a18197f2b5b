import { and, eq, ne, sql } from 'drizzle-orm'
import type { Database } from './db'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

/** The membership row of this workshop, or 404. Membership changes of one workshop are
 *  serialised on the workshop row, so two owners demoting each other cannot both succeed. */
export async function lockMembership(tx: Tx, workshopId: string, membershipId: string) {
  await tx.select({ id: schema.workshops.id }).from(schema.workshops).where(eq(schema.workshops.id, workshopId)).for('update')
  const [row] = await tx.select().from(schema.memberships)
    .where(and(eq(schema.memberships.id, membershipId), eq(schema.memberships.workshopId, workshopId)))
    .for('update')
  if (!row) notFound('No such member')
  return row
}

/** Refuses a change that would leave the workshop without an owner (call after lockMembership). */
export async function assertAnotherOwner(tx: Tx, workshopId: string, membershipId: string) {
  const others = await tx.select({ n: sql<number>`1` }).from(schema.memberships)
    .where(and(eq(schema.memberships.workshopId, workshopId), eq(schema.memberships.role, 'owner'), ne(schema.memberships.id, membershipId)))
  if (others.length === 0) {
    throw createError({ statusCode: 409, statusMessage: 'Last owner', message: 'A workshop needs at least one owner. Make someone else owner first.' })
  }
}
