// Each record on a version's shop outputs is a line of the project's activity log, in the same
// transaction as the record itself.
import type { ShopActivityAction } from '#shared/schemas/shop'
import type { Database } from './db'
import type { MemberContext } from './auth'
import type { ShopVersion } from './shopVersion'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

export async function logShopActivity(tx: Tx, member: MemberContext, v: ShopVersion, action: ShopActivityAction, details: Record<string, unknown>) {
  await logActivity(tx, {
    workshopId: member.workshopId, projectId: v.circuit.projectId, circuitId: v.circuit.id, actorId: member.user.id,
    action, details: { version: v.version, title: v.circuit.title, ...details },
  })
}

/** A file name part from a title: lower case letters, digits and dashes. */
export function fileSlug(title: string): string {
  return title.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'circuit'
}
