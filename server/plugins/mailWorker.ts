import { databaseReady } from './0.database'
import { startMailWorker } from '../mail/worker'

// Sends the mail outbox once migrations are done. Every instance may run a worker: rows are
// claimed with FOR UPDATE SKIP LOCKED. HOSEWRIGHT_MAIL_WORKER=0 keeps this instance from sending.
export default defineNitroPlugin(() => {
  if (process.env.HOSEWRIGHT_MAIL_WORKER === '0') return
  if (!mailConfigured()) {
    console.warn('[hosewright] SMTP_HOST is not set: e-mail is queued in mail_outbox but not sent')
    return
  }
  databaseReady().then(() => startMailWorker(databaseUrl()), () => {
    // 0.database.ts has logged why; without a database there is nothing to send
  })
  // stopped by shutdown.ts, before the request pool closes
})
