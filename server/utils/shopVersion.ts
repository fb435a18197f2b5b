// One saved version as the shop sees it: the frozen document and the engine's report on it, the
// review that approved it (who, when, the sign-offs) and the other saved versions to choose from.
import { and, desc, eq, inArray } from 'drizzle-orm'
import type { CircuitDocument } from '#shared/circuit'
import { analyzeCircuit, type Report } from '#shared/engine'
import { keyedFindings } from '#shared/review'
import type { PersonRef } from '#shared/schemas/review'
import type { ShopFinding } from '#shared/schemas/shop'
import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export interface ShopVersion {
  circuit: typeof schema.circuits.$inferSelect
  version: number
  savedAt: Date
  savedBy: string | null
  document: CircuitDocument
  report: Report
}

/** The circuit of this workshop and one of its saved versions, or 404. */
export async function loadShopVersion(db: Executor, workshopId: string, circuitId: string, version: number): Promise<ShopVersion> {
  const circuit = await findCircuit(db, workshopId, circuitId)
  const r = schema.circuitRevisions
  const [row] = await db.select({ document: r.document, savedAt: r.savedAt, savedBy: r.savedBy }).from(r)
    .where(and(eq(r.circuitId, circuitId), eq(r.workshopId, workshopId), eq(r.version, version)))
  if (!row) notFound('No such version')
  const document = row.document as unknown as CircuitDocument
  return { circuit, version, savedAt: row.savedAt, savedBy: row.savedBy, document, report: analyzeCircuit(document) }
}

/** Names of the people behind a set of user ids (a removed account simply has no entry). */
export async function peopleByIds(db: Executor, ids: Iterable<string | null>): Promise<Map<string, PersonRef>> {
  const wanted = [...new Set([...ids].filter((x): x is string => x !== null))]
  if (wanted.length === 0) return new Map()
  const rows = await db.select({ id: schema.users.id, name: schema.users.name }).from(schema.users).where(inArray(schema.users.id, wanted))
  return new Map(rows.map((p) => [p.id, p]))
}

export interface VersionReview {
  approval: { reviewId: string; by: PersonRef | null; at: string; note: string } | null
  findings: ShopFinding[]
}

/**
 * The findings of the version with the sign-off each warning got: from the review that approved it,
 * or, for a version never approved, from its latest review (so a sheet printed early still shows
 * what the reviewer has accepted so far).
 */
export async function versionReview(db: Executor, workshopId: string, v: ShopVersion): Promise<VersionReview> {
  const rv = schema.reviews
  const reviews = await db.select().from(rv)
    .where(and(eq(rv.workshopId, workshopId), eq(rv.circuitId, v.circuit.id), eq(rv.version, v.version)))
    .orderBy(desc(rv.submittedAt))
  const approved = reviews.find((r) => r.state === 'approved') ?? null
  const basis = approved ?? reviews[0] ?? null
  const a = schema.reviewAcknowledgements
  const acks = basis ? await db.select().from(a).where(and(eq(a.reviewId, basis.id), eq(a.workshopId, workshopId))) : []
  const people = await peopleByIds(db, [approved?.decidedBy ?? null, ...acks.map((x) => x.acknowledgedBy)])
  const person = (id: string | null) => (id ? people.get(id) ?? null : null)
  const ackByKey = new Map(acks.map((x) => [x.findingKey, x]))
  return {
    approval: approved
      ? { reviewId: approved.id, by: person(approved.decidedBy), at: (approved.decidedAt ?? approved.submittedAt).toISOString(), note: approved.decisionNote }
      : null,
    findings: keyedFindings(v.report).map((f) => {
      const ack = ackByKey.get(f.key)
      return {
        key: f.key, code: f.code, severity: f.severity, message: f.message, fix: f.fix.text,
        signOff: ack ? { justification: ack.justification, by: person(ack.acknowledgedBy), at: ack.createdAt.toISOString() } : null,
      }
    }),
  }
}

/** Every saved version of the circuit, newest first, marking the approved ones. */
export async function shopVersionList(db: Executor, workshopId: string, circuitId: string) {
  const r = schema.circuitRevisions
  const [versions, approved] = await Promise.all([
    db.select({ version: r.version, savedAt: r.savedAt }).from(r)
      .where(and(eq(r.circuitId, circuitId), eq(r.workshopId, workshopId))).orderBy(desc(r.version)).limit(500),
    db.select({ version: schema.reviews.version }).from(schema.reviews)
      .where(and(eq(schema.reviews.circuitId, circuitId), eq(schema.reviews.workshopId, workshopId), eq(schema.reviews.state, 'approved'))),
  ])
  const approvedSet = new Set(approved.map((x) => x.version))
  return versions.map((x) => ({ version: x.version, savedAt: x.savedAt.toISOString(), approved: approvedSet.has(x.version) }))
}
