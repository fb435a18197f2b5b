import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export interface ActivityEntry {
  workshopId: string
  projectId: string | null
  circuitId?: string | null
  actorId: string | null
  /** dotted verb: circuit.edited, review.submitted, review.approved, comment.added, photo.uploaded … */
  action: string
  details?: Record<string, unknown>
}

/** Writes one line of the project's activity log, inside the caller's transaction. */
export async function logActivity(tx: Executor, entry: ActivityEntry) {
  await tx.insert(schema.activity).values({
    workshopId: entry.workshopId, projectId: entry.projectId, circuitId: entry.circuitId ?? null,
    actorId: entry.actorId, action: entry.action, details: entry.details ?? {},
  })
}
