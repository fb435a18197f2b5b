import { randomUUID } from 'node:crypto'
import { idParam } from '#shared/schemas/common'
import { photoUploadFields } from '#shared/schemas/photo'

// Upload a photo of a part (multipart: componentId, file). The bytes decide whether it is an image;
// the file name is only a label. The objects are stored first and the row last, so a storage outage
// (503) leaves no row pointing at nothing.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const circuit = await findCircuit(db, workshopId, id)

  const { fields, file } = await readPhotoForm(event)
  const issues: Array<{ path: string; message: string }> = []
  const parsedFields = photoUploadFields.safeParse(fields)
  if (!parsedFields.success) issues.push(...issuesOf(parsedFields.error))
  if (!file || file.data.length === 0) issues.push({ path: 'file', message: 'Choose a photo to upload' })
  if (issues.length > 0 || !file || !parsedFields.success) invalidInput(issues)

  const contentType = await sniffPhotoType(file.data)
  const { thumbnail, width, height } = await makeThumbnail(file.data)
  const photoId = randomUUID()
  const { objectKey, thumbnailKey } = photoKeys(workshopId, id, photoId)

  await putStoredObject(objectKey, file.data, contentType)
  try {
    await putStoredObject(thumbnailKey, thumbnail.data, thumbnail.contentType)
  } catch (error) {
    await discardStoredObjects([objectKey])
    throw error
  }
  try {
    const [row] = await db.insert(schema.partPhotos).values({
      id: photoId, workshopId, circuitId: id, componentId: parsedFields.data.componentId,
      objectKey, thumbnailKey, contentType, sizeBytes: file.data.length, width, height,
      label: photoLabel(file.filename), uploadedBy: user.id,
    }).returning()
    await logActivity(db, { workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'photo.uploaded', details: { photoId, componentId: row!.componentId, label: row!.label } })
    setResponseStatus(event, 201)
    return photoItem(row!, { id: user.id, name: user.name })
  } catch (error) {
    await discardStoredObjects([objectKey, thumbnailKey])
    throw error
  }
})

/** The uploaded name as people typed it (path-like names included); only control characters go. */
function photoLabel(filename: string): string {
  const cleaned = filename.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, 200)
  return cleaned || 'photo'
}
