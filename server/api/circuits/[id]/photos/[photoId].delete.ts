import { and, eq } from 'drizzle-orm'
import { photoParams } from '#shared/schemas/photo'

// Delete a photo: its objects first, then the row, so a storage outage (503) keeps the photo listed
// and a retry finishes the job (deleting an object that is already gone succeeds).
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:write')
  const { id, photoId } = await paramsOf(event, photoParams)
  const db = useDb()
  const p = schema.partPhotos
  const scope = and(eq(p.id, photoId), eq(p.circuitId, id), eq(p.workshopId, workshopId))
  const [photo] = await db.select().from(p).where(scope)
  if (!photo) notFound('No such photo')
  await deleteStoredObjects([photo.objectKey, photo.thumbnailKey])
  await db.delete(p).where(scope)
  return { ok: true }
})
