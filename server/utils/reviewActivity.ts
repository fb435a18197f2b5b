// Activity lines that need more than one insert: saves are folded into one 'circuit.edited' line per
// person and circuit per quarter hour, carrying the latest version.
import { and, desc, eq, gt, sql } from 'drizzle-orm'

export const EDIT_FOLD_MINUTES = 15

/** Logs a save of `version`; within the window the person's last line for the circuit is updated instead. */
export async function logCircuitEdited(workshopId: string, projectId: string, circuitId: string, actorId: string, version: number) {
  await useDb().transaction(async (tx) => {
    // one writer per person and circuit at a time, so two quick saves cannot both start a new line
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`activity-edit:${actorId}:${circuitId}`}))`)
    const a = schema.activity
    const since = new Date(Date.now() - EDIT_FOLD_MINUTES * 60_000)
    const [recent] = await tx.select().from(a)
      .where(and(eq(a.workshopId, workshopId), eq(a.circuitId, circuitId), eq(a.actorId, actorId), eq(a.action, 'circuit.edited'), gt(a.createdAt, since)))
      .orderBy(desc(a.createdAt)).limit(1)
    const now = new Date().toISOString()
    if (recent) {
      const d = recent.details as { fromVersion?: number; saves?: number }
      await tx.update(a).set({ details: { fromVersion: d.fromVersion ?? version, version, saves: (d.saves ?? 1) + 1, lastAt: now } }).where(eq(a.id, recent.id))
    } else {
      await logActivity(tx, { workshopId, projectId, circuitId, actorId, action: 'circuit.edited', details: { fromVersion: version, version, saves: 1, lastAt: now } })
    }
  })
}
