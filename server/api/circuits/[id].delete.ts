import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { circuitDeleteInput } from '#shared/schemas/circuitRecord'

// Delete a circuit. The caller must type its title: a drawing is hours of work.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitDeleteInput)
  await useDb().transaction(async (tx) => {
    const circuit = await findCircuit(tx, workshopId, id)
    if (input.confirmTitle.trim() !== circuit.title) {
      invalidInput([{ path: 'confirmTitle', message: `Type “${circuit.title}” exactly to delete this circuit` }])
    }
    // logged first, in the same transaction: the line keeps the title once the circuit is gone
    await logActivity(tx, { workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'circuit.deleted', details: { title: circuit.title, version: circuit.version } })
    await tx.delete(schema.circuits).where(and(eq(schema.circuits.id, id), eq(schema.circuits.workshopId, workshopId)))
  })
  return { ok: true }
})
