// Photo intake: a size-capped upload body, the file's real type from its bytes, and a thumbnail.
import type { H3Event } from 'h3'
import { fileTypeFromBuffer } from 'file-type'
import sharp from 'sharp'
import { DEFAULT_PHOTO_MAX_MB, THUMBNAIL_SIZE_PX, formatBytes, photoImageTypes, photoParams, type PartPhoto, type PhotoImageType } from '#shared/schemas/photo'
import { and, eq } from 'drizzle-orm'
import type { PartPhotoRow } from '../database/schema'

/** Upload limit in bytes (HOSEWRIGHT_PHOTO_MAX_MB, default 10). */
export function photoMaxBytes(): number {
  const mb = Number(process.env.HOSEWRIGHT_PHOTO_MAX_MB)
  return Math.round((Number.isFinite(mb) && mb > 0 ? mb : DEFAULT_PHOTO_MAX_MB) * 1024 * 1024)
}

// room for the multipart framing and the small text fields around the file
const FORM_OVERHEAD_BYTES = 64 * 1024

function tooLargeError(maxBytes: number) {
  return createError({
    statusCode: 413,
    statusMessage: 'Photo too large',
    message: `The photo is larger than ${formatBytes(maxBytes)}. Take it at a lower resolution or shrink it, then upload again.`,
  })
}
function tooLarge(maxBytes: number): never {
  throw tooLargeError(maxBytes)
}

/** Reads the request body, refusing (413) as soon as it outgrows the limit, so a huge upload is never held in memory. */
export async function readCappedBody(event: H3Event, maxFileBytes: number): Promise<Buffer> {
  const cap = maxFileBytes + FORM_OVERHEAD_BYTES
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (Number.isFinite(declared) && declared > cap) tooLarge(maxFileBytes)
  const chunks: Buffer[] = []
  let total = 0
  const req = event.node.req
  await new Promise<void>((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      total += chunk.length
      if (total > cap) {
        req.off('data', onData)
        req.resume() // drain the rest so the 413 still reaches the client
        reject(tooLargeError(maxFileBytes))
        return
      }
      chunks.push(chunk)
    }
    req.on('data', onData).once('end', () => resolve()).once('error', reject)
  })
  return Buffer.concat(chunks)
}

export interface UploadedFile { data: Buffer; filename: string }

/**
 * The `file` part and the text fields of a multipart upload. Parsed by the platform's own form
 * reader, which copes with any file name a browser sends (quotes, semicolons, slashes, non-ASCII).
 */
export async function readPhotoForm(event: H3Event): Promise<{ fields: Record<string, string>; file: UploadedFile | null }> {
  const contentType = getRequestHeader(event, 'content-type') ?? ''
  if (!contentType.startsWith('multipart/form-data')) {
    throw createError({ statusCode: 415, statusMessage: 'Unsupported media type', message: 'Send the photo as a multipart form (fields componentId and file).' })
  }
  const maxBytes = photoMaxBytes()
  const body = await readCappedBody(event, maxBytes)
  let form: FormData
  try {
    form = await new Request('http://upload.invalid/', { method: 'POST', headers: { 'content-type': contentType }, body: new Uint8Array(body.buffer as ArrayBuffer, body.byteOffset, body.length) }).formData()
  } catch {
    throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: 'The upload could not be read as a form. Try again.' })
  }
  const fields: Record<string, string> = {}
  let file: UploadedFile | null = null
  for (const [name, value] of form) {
    if (typeof value === 'string') fields[name] ??= value
    else if (name === 'file' && !file) file = { data: Buffer.from(await value.arrayBuffer()), filename: value.name }
  }
  if (file && file.data.length > maxBytes) tooLarge(maxBytes)
  return { fields, file }
}

const acceptedNames = 'JPEG, PNG and WebP'

/** The image type read from the bytes themselves; the file name and the browser's claim are ignored. */
export async function sniffPhotoType(data: Buffer): Promise<PhotoImageType> {
  const found = await fileTypeFromBuffer(data)
  if (found && (photoImageTypes as readonly string[]).includes(found.mime)) return found.mime as PhotoImageType
  const what = found ? `a ${found.ext.toUpperCase()} file (${found.mime})` : 'not a picture'
  throw createError({
    statusCode: 415,
    statusMessage: 'Unsupported media type',
    message: `Hosewright stores ${acceptedNames} photos only. This file is ${what}, whatever its name says; save it as JPEG and upload again.`,
  })
}

export interface Thumbnail { data: Buffer; contentType: 'image/webp'; width: number; height: number }

/**
 * A small WebP of the photo, turned upright by its orientation tag, for lists on a phone. Also the
 * proof that the whole file decodes: a damaged image is refused here with 415.
 */
export async function makeThumbnail(data: Buffer): Promise<{ thumbnail: Thumbnail; width: number; height: number }> {
  try {
    // a modern phone camera is ~50 MP; anything far beyond is a decompression bomb, not a photo
    const image = sharp(data, { limitInputPixels: 120_000_000, failOn: 'error' })
    const meta = await image.metadata()
    // orientations 5–8 are quarter turns: the picture as seen is the stored one on its side
    const quarterTurn = (meta.orientation ?? 1) >= 5
    const width = (quarterTurn ? meta.height : meta.width) ?? null
    const height = (quarterTurn ? meta.width : meta.height) ?? null
    const out = await image.rotate()
      .resize({ width: THUMBNAIL_SIZE_PX, height: THUMBNAIL_SIZE_PX, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 78 })
      .toBuffer({ resolveWithObject: true })
    return {
      thumbnail: { data: out.data, contentType: 'image/webp', width: out.info.width, height: out.info.height },
      width: width ?? out.info.width,
      height: height ?? out.info.height,
    }
  } catch {
    throw createError({
      statusCode: 415,
      statusMessage: 'Unsupported media type',
      message: 'This image could not be read: the file looks damaged or incomplete. Export it again and upload the new copy.',
    })
  }
}

/** A photo row as the API shows it, with the addresses of its image and thumbnail. */
export function photoItem(row: PartPhotoRow, uploader: { id: string; name: string } | null): PartPhoto {
  const base = `/api/circuits/${row.circuitId}/photos/${row.id}`
  return {
    id: row.id,
    circuitId: row.circuitId,
    componentId: row.componentId,
    label: row.label,
    contentType: row.contentType as PhotoImageType,
    sizeBytes: row.sizeBytes,
    width: row.width,
    height: row.height,
    uploadedBy: uploader,
    createdAt: row.createdAt.toISOString(),
    imageUrl: `${base}/image`,
    thumbnailUrl: `${base}/thumbnail`,
  }
}

/** Object keys are built from ids only, never from anything the uploader typed. */
export function photoKeys(workshopId: string, circuitId: string, photoId: string) {
  const base = `${workshopId}/${circuitId}/${photoId}`
  return { objectKey: base, thumbnailKey: `${base}-thumb` }
}

/**
 * Streams a photo's image or thumbnail from storage. Signed-in members only, so never cached by
 * shared caches; nosniff so a browser never treats the bytes as anything but the stored image type.
 */
export async function sendPhoto(event: H3Event, which: 'image' | 'thumbnail') {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id, photoId } = await paramsOf(event, photoParams)
  const p = schema.partPhotos
  const [photo] = await useDb().select().from(p)
    .where(and(eq(p.id, photoId), eq(p.circuitId, id), eq(p.workshopId, workshopId)))
  if (!photo) notFound('No such photo')
  const stored = await getStoredObject(which === 'image' ? photo.objectKey : photo.thumbnailKey)
  if (!stored) notFound('The photo file is missing from storage')
  setResponseHeaders(event, {
    'content-type': which === 'image' ? photo.contentType : 'image/webp',
    'cache-control': 'private, max-age=86400',
    'x-content-type-options': 'nosniff',
    // the label is what the uploader called it; encoded, it cannot break out of the header
    'content-disposition': `inline; filename*=UTF-8''${encodeURIComponent(photo.label)}`,
  })
  if (stored.contentLength !== undefined) setResponseHeader(event, 'content-length', stored.contentLength)
  // a viewer that goes away mid-picture should not keep the storage connection open
  event.node.res.once('close', () => stored.body.destroy())
  return sendStream(event, stored.body)
}
