import { and, asc, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { photoImageTypes, photoListQuery, type PhotoList } from '#shared/schemas/photo'

// Photos of a circuit's parts (one part with ?componentId=), oldest first, with the upload limits.
export default defineEventHandler(async (event): Promise<PhotoList> => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const query = await queryOf(event, photoListQuery)
  const db = useDb()
  await findCircuit(db, workshopId, id)
  const p = schema.partPhotos
  const conditions = [eq(p.circuitId, id), eq(p.workshopId, workshopId)]
  if (query.componentId) conditions.push(eq(p.componentId, query.componentId))
  const rows = await db.select({ photo: p, uploaderId: schema.users.id, uploaderName: schema.users.name })
    .from(p).leftJoin(schema.users, eq(schema.users.id, p.uploadedBy))
    .where(and(...conditions)).orderBy(asc(p.createdAt), asc(p.id))
  return {
    photos: rows.map(r => photoItem(r.photo, r.uploaderId ? { id: r.uploaderId, name: r.uploaderName ?? '' } : null)),
    limits: { maxBytes: photoMaxBytes(), types: photoImageTypes },
  }
})
