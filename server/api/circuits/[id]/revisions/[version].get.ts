import { and, eq } from 'drizzle-orm'
import { revisionParams } from '#shared/schemas/circuitRecord'
import { analyzeCircuit } from '#shared/engine'
import type { CircuitDocument } from '#shared/circuit'

// One saved version: its document exactly as saved, and the report on it.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id, version } = await paramsOf(event, revisionParams)
  const r = schema.circuitRevisions
  const [row] = await useDb().select().from(r)
    .where(and(eq(r.circuitId, id), eq(r.workshopId, workshopId), eq(r.version, version)))
  if (!row) notFound('No such version')
  const document = row.document as unknown as CircuitDocument
  return { version: row.version, savedAt: row.savedAt, document, report: analyzeCircuit(document) }
})
