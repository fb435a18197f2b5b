import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { circuitRenameInput } from '#shared/schemas/circuitRecord'

// Rename a circuit.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitRenameInput)
  const [row] = await useDb().update(schema.circuits).set({ title: input.title, updatedAt: new Date() })
    .where(and(eq(schema.circuits.id, id), eq(schema.circuits.workshopId, workshopId)))
    .returning()
  if (!row) notFound('No such circuit')
  return row
})
