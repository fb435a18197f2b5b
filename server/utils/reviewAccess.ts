// Loading a review with its frozen version, and the rule of who may decide it.
import { and, eq } from 'drizzle-orm'
import type { CircuitDocument } from '#shared/circuit'
import { analyzeCircuit, type Report } from '#shared/engine'
import { decisionRefusal, decisionRefusalText, keyedFindings, type KeyedFinding } from '#shared/review'
import { reviewSettingsOf, type ReviewSettings } from '#shared/schemas/review'
import type { ReviewRow } from '../database/schema'
import type { Database } from './db'
import type { MemberContext } from './auth'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]
type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

/** A review of this workshop, or 404. With `lock`, the row is held until the transaction ends, so
 *  decisions and sign-offs on one review happen one after another. */
export async function findReview(db: Executor, workshopId: string, reviewId: string, lock = false): Promise<ReviewRow> {
  const where = and(eq(schema.reviews.id, reviewId), eq(schema.reviews.workshopId, workshopId))
  const [row] = lock
    ? await db.select().from(schema.reviews).where(where).for('update')
    : await db.select().from(schema.reviews).where(where)
  if (!row) notFound('No such review')
  return row
}

export interface FrozenVersion {
  document: CircuitDocument
  report: Report
  findings: KeyedFinding[]
}

/** The reviewed version's document exactly as saved (revisions never change) and the engine's report on it. */
export async function frozenVersion(db: Executor, review: Pick<ReviewRow, 'circuitId' | 'workshopId' | 'version'>): Promise<FrozenVersion> {
  const rv = schema.circuitRevisions
  const [row] = await db.select({ document: rv.document }).from(rv)
    .where(and(eq(rv.circuitId, review.circuitId), eq(rv.workshopId, review.workshopId), eq(rv.version, review.version)))
  if (!row) notFound('The reviewed version is missing')
  const document = row.document as unknown as CircuitDocument
  const report = analyzeCircuit(document)
  return { document, report, findings: keyedFindings(report) }
}

export async function workshopReviewSettings(db: Executor, workshopId: string): Promise<ReviewSettings> {
  const [w] = await db.select({ settings: schema.workshops.settings }).from(schema.workshops).where(eq(schema.workshops.id, workshopId))
  return reviewSettingsOf(w?.settings)
}

/** Why this member may not decide this review, or null when they may. */
export function refusalFor(member: Pick<MemberContext, 'role' | 'user'>, review: Pick<ReviewRow, 'submittedBy'>, settings: ReviewSettings) {
  return decisionRefusal({ role: member.role, isSubmitter: review.submittedBy === member.user.id, fabricatorMayApproveOwn: settings.fabricatorMayApproveOwn })
}

/** 403 unless this member may approve, request changes or sign warnings off on this review. */
export async function assertMayDecide(tx: Tx, member: MemberContext, review: ReviewRow) {
  const refusal = refusalFor(member, review, await workshopReviewSettings(tx, member.workshopId))
  if (refusal) throw createError({ statusCode: 403, statusMessage: 'Not allowed', message: decisionRefusalText[refusal], data: { reason: refusal } })
}

/** 409 unless the review is still waiting for a decision. */
export function assertOpen(review: ReviewRow) {
  if (review.state !== 'in-review') {
    throw createError({ statusCode: 409, statusMessage: 'Review closed', message: `This review is ${review.state.replace('-', ' ')}; nothing more can be signed on it.`, data: { state: review.state } })
  }
}
