import { and, asc, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  await findProject(db, workshopId, id)
  return await db.select().from(schema.circuits)
    .where(and(eq(schema.circuits.projectId, id), eq(schema.circuits.workshopId, workshopId)))
    .orderBy(asc(schema.circuits.kind), asc(schema.circuits.title))
})
