import { and, desc, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Saved versions of a circuit, newest first, with who saved them and their finding counts.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  await findCircuit(db, workshopId, id)
  const r = schema.circuitRevisions
  return await db.select({ version: r.version, savedAt: r.savedAt, summary: r.summary, savedBy: schema.users.name })
    .from(r).leftJoin(schema.users, eq(schema.users.id, r.savedBy))
    .where(and(eq(r.circuitId, id), eq(r.workshopId, workshopId)))
    .orderBy(desc(r.version))
    .limit(500)
})
