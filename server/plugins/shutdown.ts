import { stopMailWorker } from '../mail/worker'
import { writeLog } from '../utils/log'
import { requestsInFlight } from './requestLog'

// Graceful stop on SIGTERM/SIGINT. Nitro's node server (NITRO_SHUTDOWN_TIMEOUT, default 30 s) closes
// the listener at once, lets running requests finish up to the timeout, then calls the `close` hook:
// here the mail worker finishes its current mail and hands back the rest, and only then is the
// request pool closed, because a mail's attachment may still read the database.
export default defineNitroPlugin((nitroApp) => {
  let signalledAt = 0
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    process.once(signal, () => {
      signalledAt = Date.now()
      writeLog('info', 'shutdown started', { signal, requestsInFlight: requestsInFlight(), timeoutMs: Number(process.env.NITRO_SHUTDOWN_TIMEOUT) || 30_000 })
    })
  }
  nitroApp.hooks.hook('close', async () => {
    const closingAt = Date.now()
    const unfinished = requestsInFlight()
    if (unfinished > 0) writeLog('warn', 'shutdown: requests still running at the timeout are cut off', { requestsInFlight: unfinished })
    await stopMailWorker()
    writeLog('info', 'shutdown: mail worker stopped')
    await closeDb()
    writeLog('info', 'shutdown complete', {
      drainMs: signalledAt ? closingAt - signalledAt : null,
      totalMs: signalledAt ? Date.now() - signalledAt : null,
    })
  })
})
