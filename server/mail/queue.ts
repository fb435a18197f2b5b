import { and, eq, gte, inArray, lte, sql } from 'drizzle-orm'
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js'
import type * as schema from '../database/schema'
import { mailOutbox, type OutboxRow } from '../database/schema'
import { envNumber } from '../utils/tokens'

// The outbox state machine, shared by every app instance through PostgreSQL:
//   pending ──claim──▶ sending ──▶ sent
//                         └─failure─▶ pending (later, with back-off) … ▶ failed after the last attempt
// A claim counts as an attempt and leases the row: `next_attempt_at` becomes the lease's end, so a
// row left in `sending` by a killed process is claimed again once the lease has run out.

/** Any Drizzle handle on the app's schema: the request pool or the worker's own connection. */
export type MailDb = PostgresJsDatabase<typeof schema>

export interface QueueSettings {
  maxAttempts: number
  /** waits after the 1st, 2nd … failed attempt; the last one repeats */
  retryDelaysMs: number[]
  leaseMs: number
  batchSize: number
}

const defaultRetryDelaysMs = [5_000, 30_000, 120_000, 600_000, 1_800_000, 3_600_000]

export function queueSettings(): QueueSettings {
  const listed = (process.env.HOSEWRIGHT_MAIL_RETRY_MS ?? '').split(',').map(Number).filter(n => Number.isFinite(n) && n > 0)
  return {
    maxAttempts: envNumber('HOSEWRIGHT_MAIL_MAX_ATTEMPTS', 8),
    retryDelaysMs: listed.length ? listed : defaultRetryDelaysMs,
    leaseMs: envNumber('HOSEWRIGHT_MAIL_LEASE_MS', 300_000),
    batchSize: 10,
  }
}

/** The wait before the next attempt after `attempts` attempts have failed. */
export function retryDelayMs(settings: QueueSettings, attempts: number): number {
  const delays = settings.retryDelaysMs
  return delays[Math.min(Math.max(attempts, 1), delays.length) - 1]!
}

const msFromNow = (ms: number) => sql`now() + make_interval(secs => ${ms / 1000})`

/** Claims due rows (pending, or sending with an expired lease) that no other instance holds. */
export async function claimDueMail(db: MailDb, settings: QueueSettings): Promise<OutboxRow[]> {
  // a row whose process died on its last allowed attempt is not tried again
  await db.update(mailOutbox).set({
    status: 'failed',
    lastError: sql`coalesce(${mailOutbox.lastError} || ' · ', '') || 'interrupted while sending (the process stopped)'`,
  }).where(and(eq(mailOutbox.status, 'sending'), lte(mailOutbox.nextAttemptAt, sql`now()`), gte(mailOutbox.attempts, settings.maxAttempts)))

  const due = db.select({ id: mailOutbox.id }).from(mailOutbox)
    .where(and(inArray(mailOutbox.status, ['pending', 'sending']), lte(mailOutbox.nextAttemptAt, sql`now()`)))
    .orderBy(mailOutbox.nextAttemptAt)
    .limit(settings.batchSize)
    .for('update', { skipLocked: true })
  return await db.update(mailOutbox).set({
    status: 'sending',
    attempts: sql`${mailOutbox.attempts} + 1`,
    nextAttemptAt: msFromNow(settings.leaseMs),
  }).where(inArray(mailOutbox.id, due)).returning()
}

export async function markSent(db: MailDb, id: string) {
  await db.update(mailOutbox).set({ status: 'sent', sentAt: sql`now()` })
    .where(and(eq(mailOutbox.id, id), eq(mailOutbox.status, 'sending')))
}

/** Records a failed attempt: retried after the back-off, or failed for good. */
export async function markFailed(db: MailDb, row: OutboxRow, message: string, permanent: boolean, settings: QueueSettings) {
  const final = permanent || row.attempts >= settings.maxAttempts
  await db.update(mailOutbox).set({
    status: final ? 'failed' : 'pending',
    lastError: message.slice(0, 2000),
    nextAttemptAt: final ? sql`now()` : msFromNow(retryDelayMs(settings, row.attempts)),
  }).where(and(eq(mailOutbox.id, row.id), eq(mailOutbox.status, 'sending')))
  return final
}

/** Hands claimed rows back untried (the process is stopping), without counting an attempt. */
export async function releaseMail(db: MailDb, ids: string[]) {
  if (ids.length === 0) return
  await db.update(mailOutbox).set({ status: 'pending', attempts: sql`${mailOutbox.attempts} - 1`, nextAttemptAt: sql`now()` })
    .where(and(inArray(mailOutbox.id, ids), eq(mailOutbox.status, 'sending')))
}

/** "Send again now": a failed or waiting row becomes due at once (one more attempt). */
export async function requeueMail(db: MailDb, workshopId: string, id: string) {
  const [row] = await db.update(mailOutbox).set({ status: 'pending', nextAttemptAt: sql`now()` })
    .where(and(eq(mailOutbox.id, id), eq(mailOutbox.workshopId, workshopId), inArray(mailOutbox.status, ['failed', 'pending'])))
    .returning()
  return row
}
