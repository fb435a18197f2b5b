import { and, eq } from 'drizzle-orm'
import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

/** A project of this workshop, or 404 (another workshop's project is indistinguishable from none). */
export async function findProject(db: Executor, workshopId: string, projectId: string) {
  const [row] = await db.select().from(schema.projects)
    .where(and(eq(schema.projects.id, projectId), eq(schema.projects.workshopId, workshopId)))
  if (!row) notFound('No such project')
  return row
}

/** A circuit of this workshop, or 404. */
export async function findCircuit(db: Executor, workshopId: string, circuitId: string) {
  const [row] = await db.select().from(schema.circuits)
    .where(and(eq(schema.circuits.id, circuitId), eq(schema.circuits.workshopId, workshopId)))
  if (!row) notFound('No such circuit')
  return row
}
