import { z } from 'zod'
import { elementId } from '../circuit/primitives'

/** Photos of a drawn part: workshop pictures of the real thing, kept beside the drawing. */
export const photoImageTypes = ['image/jpeg', 'image/png', 'image/webp'] as const
export type PhotoImageType = (typeof photoImageTypes)[number]

/** Default upload limit; the server takes HOSEWRIGHT_PHOTO_MAX_MB when set. */
export const DEFAULT_PHOTO_MAX_MB = 10
/** Longest side of a thumbnail, px. */
export const THUMBNAIL_SIZE_PX = 320

export const photoParams = z.object({ id: z.uuid(), photoId: z.uuid() })

export const photoListQuery = z.object({
  componentId: elementId.optional(),
})

/** The text fields of the upload form (the file travels beside them). */
export const photoUploadFields = z.object({
  componentId: elementId,
})

/** A stored photo as the API lists it. */
export interface PartPhoto {
  id: string
  circuitId: string
  componentId: string
  /** the uploaded file's name, shown to people only */
  label: string
  contentType: PhotoImageType
  sizeBytes: number
  width: number | null
  height: number | null
  uploadedBy: { id: string; name: string } | null
  createdAt: string
  imageUrl: string
  thumbnailUrl: string
}

export interface PhotoList {
  photos: PartPhoto[]
  /** what the server accepts, so the browser can say so before sending */
  limits: { maxBytes: number; types: readonly PhotoImageType[] }
}

/** "2.4 MB", "812 KB": sizes as people read them on an upload form. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} KB`
  return `${bytes} bytes`
}
