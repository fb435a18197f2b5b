import { and, eq, inArray } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { reviewSubmitInput } from '#shared/schemas/review'
import type { CircuitDocument } from '#shared/circuit'
import { analyzeCircuit } from '#shared/engine'
import { wakeMailWorker } from '../../../../mail/worker'

// Put the circuit's current saved version up for review. That version is frozen (reviews point at
// revision rows, which never change); an open review of an older version is superseded.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'review:submit')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, reviewSubmitInput)
  const db = useDb()
  const review = await db.transaction(async (tx) => {
    // the circuit row lock orders this against saves and other submissions of the same circuit
    const [circuit] = await tx.select().from(schema.circuits)
      .where(and(eq(schema.circuits.id, id), eq(schema.circuits.workshopId, workshopId))).for('update')
    if (!circuit) notFound('No such circuit')
    if (input.version !== circuit.version) {
      const newer = input.version < circuit.version
      throw createError({
        statusCode: 409, statusMessage: newer ? 'A newer version exists' : 'Save first',
        message: newer
          ? `Version ${circuit.version} has been saved since version ${input.version}; submit the current version.`
          : `Version ${input.version} is not saved yet (the circuit is at version ${circuit.version}); save first, then submit.`,
        data: { currentVersion: circuit.version },
      })
    }
    const project = await findProject(tx, workshopId, circuit.projectId)
    const r = schema.reviews
    const [existing] = await tx.select().from(r)
      .where(and(eq(r.circuitId, id), eq(r.version, circuit.version), inArray(r.state, ['in-review', 'approved'])))
    if (existing) {
      const approved = existing.state === 'approved'
      throw createError({
        statusCode: 409, statusMessage: approved ? 'Already approved' : 'Already in review',
        message: approved ? `Version ${circuit.version} is already approved.` : `Version ${circuit.version} is already waiting for review.`,
        data: { reviewId: existing.id },
      })
    }
    const [revision] = await tx.select({ document: schema.circuitRevisions.document }).from(schema.circuitRevisions)
      .where(and(eq(schema.circuitRevisions.circuitId, id), eq(schema.circuitRevisions.version, circuit.version)))
    if (!revision) notFound('The current version has no saved revision')
    const summary = analyzeCircuit(revision.document as unknown as CircuitDocument).counts

    const superseded = await tx.update(r).set({ state: 'superseded', decidedAt: new Date() })
      .where(and(eq(r.circuitId, id), eq(r.workshopId, workshopId), eq(r.state, 'in-review'))).returning({ id: r.id, version: r.version })
    for (const old of superseded) {
      await logActivity(tx, { workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'review.superseded', details: { reviewId: old.id, version: old.version, byVersion: circuit.version } })
    }
    const [row] = await tx.insert(r).values({
      workshopId, circuitId: id, version: circuit.version, submittedBy: user.id, submitNote: input.note, summary,
    }).returning()
    await logActivity(tx, { workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'review.submitted', details: { reviewId: row!.id, version: circuit.version, title: circuit.title, counts: summary } })
    await queueReviewRequested(tx, row!, { id, title: circuit.title, projectTitle: project.title }, { id: user.id, name: user.name })
    return row!
  })
  wakeMailWorker()
  setResponseStatus(event, 201)
  return review
})
