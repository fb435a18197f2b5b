import { randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'
import { errorFields, redactPath, writeLog } from '../utils/log'

// One JSON line per request when its response has been sent (or the client went away): time,
// method, path (tokens masked), status, duration, the signed-in user's id when the request read the
// session, and for a server error its stack. Each response carries the line's id in X-Request-Id.
let inFlight = 0

/** Requests that have started and not yet ended (for shutdown logs). */
export function requestsInFlight(): number {
  return inFlight
}

function sessionUserId(event: H3Event): string | undefined {
  // nuxt-auth-utils keeps the unsealed session on the event once a route has read it
  const sessions = event.context.sessions as Record<string, { data?: { user?: { id?: unknown } } }> | undefined
  const id = sessions?.['nuxt-session']?.data?.user?.id
  return typeof id === 'string' ? id : undefined
}

function serverError(event: H3Event): unknown {
  const errors = (event.context.nitro as { errors?: Array<{ error: unknown }> } | undefined)?.errors ?? []
  return errors.find(e => ((e.error as { statusCode?: number }).statusCode ?? 500) >= 500)?.error
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('request', (event) => {
    const started = process.hrtime.bigint()
    const requestId = randomUUID()
    event.context.requestId = requestId
    event.node.res.setHeader('x-request-id', requestId)
    inFlight++
    let done = false
    const finish = () => {
      if (done) return
      done = true
      inFlight--
      const res = event.node.res
      const status = res.writableFinished || res.headersSent ? res.statusCode : 499 // 499: the client gave up first
      const failure = status >= 500 ? serverError(event) : undefined
      writeLog(status >= 500 ? 'error' : 'info', 'request', {
        requestId,
        method: event.method,
        path: redactPath(event.node.req.url ?? event.path),
        status,
        ms: Math.round(Number(process.hrtime.bigint() - started) / 1e5) / 10,
        ...(sessionUserId(event) ? { userId: sessionUserId(event) } : {}),
        ...(failure ? errorFields(failure) : {}),
      })
    }
    event.node.res.once('finish', finish)
    event.node.res.once('close', finish)
  })
})
