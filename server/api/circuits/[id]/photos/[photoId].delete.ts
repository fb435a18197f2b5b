import { and, eq } from 'drizzle-orm'
import { photoParams } from '#shared/schemas/photo'

// Delete a photo: its objects first, then the row, so a storage outage (503) keeps the photo listed
// and a retry finishes the job (deleting an object that is already gone succeeds). Of parallel
// deletes only the one whose DELETE removed the row answers 200 and logs; the others answer 404.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id, photoId } = await paramsOf(event, photoParams)
  const db = useDb()
  const p = schema.partPhotos
  const scope = and(eq(p.id, photoId), eq(p.circuitId, id), eq(p.workshopId, workshopId))
  const [photo] = await db.select().from(p).where(scope)
  if (!photo) notFound('No such photo')
  await deleteStoredObjects([photo.objectKey, photo.thumbnailKey])
  await db.transaction(async (tx) => {
    const removed = await tx.delete(p).where(scope).returning({ id: p.id })
    if (removed.length === 0) notFound('No such photo')
    const circuit = await findCircuit(tx, workshopId, id)
    await logActivity(tx, { workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'photo.deleted', details: { photoId, componentId: photo.componentId, label: photo.label } })
  })
  return { ok: true }
})
