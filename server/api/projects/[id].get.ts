import { asc, eq, and } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// One project with its circuits.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'project:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const project = await findProject(db, workshopId, id)
  const circuits = await db.select().from(schema.circuits)
    .where(and(eq(schema.circuits.projectId, id), eq(schema.circuits.workshopId, workshopId)))
    .orderBy(asc(schema.circuits.kind), asc(schema.circuits.title))
  const status = await reviewStatusFor(db, workshopId, circuits)
  return { ...project, circuits: circuits.map(c => ({ ...c, reviewStatus: status.get(c.id)! })) }
})
