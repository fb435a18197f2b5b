// Where each circuit stands in review: its latest approved version (who, when), the open review and
// the current version. Returned beside every circuit the app shows.
import { and, desc, eq, inArray } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { ReviewState, ReviewStatus } from '#shared/schemas/review'
import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export async function reviewStatusFor(db: Executor, workshopId: string, circuits: ReadonlyArray<{ id: string; version: number }>): Promise<Map<string, ReviewStatus>> {
  const out = new Map<string, ReviewStatus>()
  for (const c of circuits) out.set(c.id, { currentVersion: c.version, approved: null, open: null, latest: null, draftAfterApproval: false })
  if (circuits.length === 0) return out
  const r = schema.reviews
  const submitter = alias(schema.users, 'submitter')
  const decider = alias(schema.users, 'decider')
  const rows = await db.select({
    id: r.id, circuitId: r.circuitId, version: r.version, state: r.state, submittedAt: r.submittedAt, decidedAt: r.decidedAt,
    submitterId: submitter.id, submitterName: submitter.name, deciderId: decider.id, deciderName: decider.name,
  }).from(r)
    .leftJoin(submitter, eq(submitter.id, r.submittedBy))
    .leftJoin(decider, eq(decider.id, r.decidedBy))
    .where(and(eq(r.workshopId, workshopId), inArray(r.circuitId, circuits.map((c) => c.id))))
    .orderBy(desc(r.submittedAt), desc(r.version))
  for (const row of rows) {
    const status = out.get(row.circuitId)
    if (!status) continue
    status.latest ??= { reviewId: row.id, version: row.version, state: row.state as ReviewState, at: (row.decidedAt ?? row.submittedAt).toISOString() }
    if (row.state === 'in-review' && !status.open) {
      status.open = { reviewId: row.id, version: row.version, by: person(row.submitterId, row.submitterName), at: row.submittedAt.toISOString() }
    }
    if (row.state === 'approved' && (!status.approved || row.version > status.approved.version)) {
      status.approved = { reviewId: row.id, version: row.version, by: person(row.deciderId, row.deciderName), at: (row.decidedAt ?? row.submittedAt).toISOString() }
    }
  }
  for (const status of out.values()) status.draftAfterApproval = status.approved !== null && status.currentVersion > status.approved.version
  return out
}

export async function reviewStatusOf(db: Executor, workshopId: string, circuit: { id: string; version: number }): Promise<ReviewStatus> {
  return (await reviewStatusFor(db, workshopId, [circuit])).get(circuit.id)!
}

function person(id: string | null, name: string | null) {
  return id ? { id, name: name ?? '' } : null
}
