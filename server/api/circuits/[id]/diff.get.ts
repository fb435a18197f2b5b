import { and, eq, inArray } from 'drizzle-orm'
import { diffCircuits, diffCounts, type CircuitDocument } from '#shared/circuit'
import { analyzeCircuit } from '#shared/engine'
import { quantityChanges } from '#shared/review'
import { idParam } from '#shared/schemas/common'
import { diffQuery } from '#shared/schemas/review'

// What changed between two saved versions: parts, hoses and settings (the same diff as the editor's
// conflict dialog), and what that does to the cut lengths, hose to buy, coolant volume and findings.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const { from, to } = await queryOf(event, diffQuery)
  const db = useDb()
  await findCircuit(db, workshopId, id)
  const rv = schema.circuitRevisions
  const rows = await db.select({ version: rv.version, document: rv.document, savedAt: rv.savedAt, savedBy: schema.users.name })
    .from(rv).leftJoin(schema.users, eq(schema.users.id, rv.savedBy))
    .where(and(eq(rv.circuitId, id), eq(rv.workshopId, workshopId), inArray(rv.version, [from, to])))
  const before = rows.find((r) => r.version === from)
  const after = rows.find((r) => r.version === to)
  if (!before || !after) notFound(`No saved version ${!before ? from : to}`)
  const docBefore = before.document as unknown as CircuitDocument
  const docAfter = after.document as unknown as CircuitDocument
  const diff = diffCircuits(docBefore, docAfter)
  const meta = (r: typeof before) => ({ version: r.version, savedAt: r.savedAt, savedBy: r.savedBy })
  return {
    from: meta(before),
    to: meta(after),
    diff,
    counts: diffCounts(diff),
    quantities: quantityChanges(analyzeCircuit(docBefore), analyzeCircuit(docAfter)),
  }
})
