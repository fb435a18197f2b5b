import { sql } from 'drizzle-orm'
import { HeadBucketCommand, S3Client } from '@aws-sdk/client-s3'
import { mailWorkerCounts } from '../mail/worker'

// Liveness for scripts and monitors: 200 while the database answers, 503 when it does not. Mail
// and photo storage are reported beside it but never fail the check: without them the app still
// works (mail waits in the outbox, photos answer 503). No data and no error texts are returned.
const STORAGE_TIMEOUT_MS = 2000
const STORAGE_CACHE_MS = 5000

let storageClient: S3Client | undefined
let storageSeen: { at: number; state: 'up' | 'down' } | undefined

async function storageState(): Promise<'up' | 'down'> {
  const config = storageConfig()
  if (storageSeen && Date.now() - storageSeen.at < STORAGE_CACHE_MS) return storageSeen.state
  storageClient ??= new S3Client({
    endpoint: config.endpoint, region: config.region, forcePathStyle: config.forcePathStyle, credentials: config.credentials,
    maxAttempts: 1, requestHandler: { connectionTimeout: STORAGE_TIMEOUT_MS, requestTimeout: STORAGE_TIMEOUT_MS },
  })
  let state: 'up' | 'down' = 'down'
  try {
    await storageClient.send(new HeadBucketCommand({ Bucket: config.bucket }), { abortSignal: AbortSignal.timeout(STORAGE_TIMEOUT_MS) })
    state = 'up'
  } catch {
    // unreachable, bucket missing or credentials refused: all mean photos cannot be stored now
  }
  storageSeen = { at: Date.now(), state }
  return state
}

async function mailState() {
  const worker = process.env.HOSEWRIGHT_MAIL_WORKER === '0' ? 'off' : mailConfigured() ? 'running' : 'not configured'
  // mail due for more than five minutes means nobody is sending it (or every attempt fails)
  const [row] = await useDb().execute<{ overdue: number }>(sql`select count(*)::int as overdue from mail_outbox
    where status in ('pending', 'sending') and next_attempt_at < now() - interval '5 minutes'`)
  return { worker, overdue: Number(row?.overdue ?? 0), delivered: mailWorkerCounts.delivered, failedAttempts: mailWorkerCounts.failedAttempts }
}

export default defineEventHandler(async (event) => {
  try {
    await useDb().execute(sql`select 1`)
  } catch {
    setResponseStatus(event, 503)
    return { ok: false, database: 'down' }
  }
  const [mail, storage] = await Promise.all([mailState().catch(() => null), storageState()])
  return { ok: true, database: 'up', mail, storage }
})
