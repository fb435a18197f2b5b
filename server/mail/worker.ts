import postgres from 'postgres'
import { drizzle } from 'drizzle-orm/postgres-js'
import * as schema from '../database/schema'
import { closeMailTransport, deliverMail, PermanentMailError } from '../utils/mailer'
import { envNumber } from '../utils/tokens'
import { claimDueMail, markFailed, markSent, queueSettings, releaseMail, type MailDb } from './queue'

// The outbox worker of this process: polls for due rows, sends them one by one, records the
// outcome. It has its own database connection so it can finish its current round while Nitro
// closes the request pool.

let stopping = false
let running: Promise<void> | undefined
let wake: (() => void) | undefined
let client: ReturnType<typeof postgres> | undefined

/** What this process's worker did since it started (for logs and tests). */
export const mailWorkerCounts = { delivered: 0, failedAttempts: 0 }

/** Ask the worker of this process to look at the outbox now instead of after its poll interval. */
export function wakeMailWorker() {
  wake?.()
}

function pause(ms: number) {
  return new Promise<void>((resolve) => {
    const timer = setTimeout(done, ms)
    function done() {
      clearTimeout(timer)
      wake = undefined
      resolve()
    }
    wake = done
  })
}

function describeError(error: unknown): string {
  if (error instanceof Error) return error.message || error.name
  return String(error)
}

/** One round: claim what is due and send it. Returns how many rows were claimed. */
async function sendDue(db: MailDb): Promise<number> {
  const settings = queueSettings()
  const rows = await claimDueMail(db, settings)
  for (const [index, row] of rows.entries()) {
    if (stopping) {
      await releaseMail(db, rows.slice(index).map(r => r.id))
      break
    }
    try {
      await deliverMail(row)
    } catch (error) {
      mailWorkerCounts.failedAttempts++
      const final = await markFailed(db, row, describeError(error), error instanceof PermanentMailError, settings)
      console.warn(`[hosewright] mail ${row.id} (${row.kind}) attempt ${row.attempts} failed${final ? ' for good' : ''}: ${describeError(error)}`)
      continue
    }
    // if this write fails the lease runs out and the mail goes again: at least once, never lost
    await markSent(db, row.id)
    mailWorkerCounts.delivered++
  }
  return rows.length
}

async function loop(db: MailDb, pollMs: number) {
  let lastProblem = ''
  while (!stopping) {
    let claimed = 0
    try {
      claimed = await sendDue(db)
      lastProblem = ''
    } catch (error) {
      // e.g. the database restarting: say so once, keep polling
      const problem = describeError(error)
      if (problem !== lastProblem) console.error('[hosewright] mail worker:', problem)
      lastProblem = problem
    }
    if (!stopping && claimed < queueSettings().batchSize) await pause(pollMs)
  }
}

export function startMailWorker(databaseUrl: string) {
  if (running) return
  stopping = false
  client = postgres(databaseUrl, { max: 1, onnotice: () => {} })
  const db: MailDb = drizzle(client, { schema })
  running = loop(db, envNumber('HOSEWRIGHT_MAIL_POLL_MS', 5_000))
}

/** Lets the current send finish, then closes the SMTP transport and the worker's connection. */
export async function stopMailWorker() {
  stopping = true
  wake?.()
  await running
  running = undefined
  closeMailTransport()
  await client?.end({ timeout: 5 })
  client = undefined
}
