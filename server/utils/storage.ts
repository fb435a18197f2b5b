// Object storage (S3 or anything speaking its API) for part photos. Configured from the environment:
// production names its service; `npm start`, `npm run dev` and the test scripts run a local fake and
// export its address (scripts/lib/fakes.sh).
import type { Readable } from 'node:stream'
import { DeleteObjectsCommand, GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3'

export interface StorageConfig {
  endpoint: string | undefined
  region: string
  bucket: string
  forcePathStyle: boolean
  credentials: { accessKeyId: string; secretAccessKey: string } | undefined
}

export function storageConfig(env: NodeJS.ProcessEnv = process.env): StorageConfig {
  const accessKeyId = env.S3_ACCESS_KEY_ID
  const secretAccessKey = env.S3_SECRET_ACCESS_KEY
  return {
    endpoint: env.S3_ENDPOINT || undefined,
    region: env.S3_REGION || 'us-east-1',
    bucket: env.S3_BUCKET || 'hosewright',
    forcePathStyle: /^(1|true|yes)$/i.test(env.S3_FORCE_PATH_STYLE ?? ''),
    // without keys the SDK's own chain applies (instance role, shared config …)
    credentials: accessKeyId && secretAccessKey ? { accessKeyId, secretAccessKey } : undefined,
  }
}

let client: S3Client | undefined
let bucket = ''

function storage(): { client: S3Client; bucket: string } {
  if (!client) {
    const config = storageConfig()
    client = new S3Client({
      endpoint: config.endpoint,
      region: config.region,
      forcePathStyle: config.forcePathStyle,
      credentials: config.credentials,
      // checksums only where the API demands them: S3-compatible services (and the local fake)
      // reject the newer default trailing checksums
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 2,
      // a storage outage should answer the user within seconds, not hang the upload
      requestHandler: { connectionTimeout: 3000, requestTimeout: 30_000 },
    })
    bucket = config.bucket
  }
  return { client, bucket }
}

/** The storage service failed or cannot be reached: 503, and the caller has written nothing. */
export function storageUnavailable(cause?: unknown): never {
  if (cause) console.error('[hosewright] object storage:', (cause as Error)?.message ?? cause)
  throw createError({
    statusCode: 503,
    statusMessage: 'Storage unavailable',
    message: 'Photo storage cannot be reached right now. Nothing was saved; try again in a minute.',
  })
}

function isMissing(error: unknown): boolean {
  return error instanceof S3ServiceException && (error.name === 'NoSuchKey' || error.$metadata.httpStatusCode === 404)
}

export async function putStoredObject(key: string, body: Buffer, contentType: string): Promise<void> {
  const s = storage()
  try {
    await s.client.send(new PutObjectCommand({ Bucket: s.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }))
  } catch (error) {
    storageUnavailable(error)
  }
}

export interface StoredObject { body: Readable; contentType: string | undefined; contentLength: number | undefined }

/** The object's bytes as a stream, or null when there is no such object. */
export async function getStoredObject(key: string): Promise<StoredObject | null> {
  const s = storage()
  try {
    const res = await s.client.send(new GetObjectCommand({ Bucket: s.bucket, Key: key }))
    return { body: res.Body as Readable, contentType: res.ContentType, contentLength: res.ContentLength }
  } catch (error) {
    if (isMissing(error)) return null
    storageUnavailable(error)
  }
}

/** Deletes objects; keys that are already gone count as deleted. */
export async function deleteStoredObjects(keys: string[]): Promise<void> {
  if (keys.length === 0) return
  const s = storage()
  try {
    const res = await s.client.send(new DeleteObjectsCommand({ Bucket: s.bucket, Delete: { Objects: keys.map(Key => ({ Key })), Quiet: true } }))
    const failed = (res.Errors ?? []).filter(e => e.Code !== 'NoSuchKey')
    if (failed.length > 0) storageUnavailable(new Error(`could not delete ${failed.map(e => `${e.Key} (${e.Code})`).join(', ')}`))
  } catch (error) {
    if ((error as { statusCode?: number }).statusCode === 503) throw error
    storageUnavailable(error)
  }
}

/** Best effort, for undoing a half-finished upload: a failure here only leaves an unreferenced object. */
export async function discardStoredObjects(keys: string[]): Promise<void> {
  try {
    await deleteStoredObjects(keys)
  } catch {
    console.error('[hosewright] object storage: could not remove unreferenced objects', keys.join(', '))
  }
}
