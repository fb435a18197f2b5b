import type { H3Event } from 'h3'

// Cross-site request forgery guard for every state-changing request (anything but GET, HEAD and
// OPTIONS). The session cookie is SameSite=Lax already; on top of that:
//  1. A browser that sends Fetch Metadata must say `Sec-Fetch-Site: same-origin` (or `none`, a
//     request the user started); otherwise the Origin header, when present, must be this site's.
//     No Origin and no Fetch Metadata is a non-browser client (curl, scripts): allowed, it has
//     no ambient cookies to abuse.
//  2. API bodies must be JSON (multipart only where files are uploaded), so a plain HTML form
//     (urlencoded, text/plain, multipart elsewhere) can never reach a handler.
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])
const MULTIPART_ROUTES = [/^\/api\/circuits\/[0-9a-f-]{36}\/photos\/?$/i]

function allowedOrigins(event: H3Event): Set<string> {
  const trustProxy = isFlagOn(process.env.HOSEWRIGHT_TRUST_PROXY)
  const own = getRequestURL(event, { xForwardedHost: trustProxy, xForwardedProto: trustProxy }).origin
  const origins = new Set([own])
  const appUrl = process.env.HOSEWRIGHT_APP_URL
  if (appUrl && URL.canParse(appUrl)) origins.add(new URL(appUrl).origin)
  return origins
}

function refuse(statusCode: 403 | 415, message: string): never {
  throw createError({ statusCode, statusMessage: statusCode === 403 ? 'Cross-site request refused' : 'Unsupported media type', message })
}

function assertSameOrigin(event: H3Event) {
  const fetchSite = getRequestHeader(event, 'sec-fetch-site')
  if (fetchSite) {
    if (fetchSite === 'same-origin' || fetchSite === 'none') return
    refuse(403, 'This request came from another site and was refused.')
  }
  const origin = getRequestHeader(event, 'origin')
  if (origin === undefined) return
  if (!allowedOrigins(event).has(origin)) refuse(403, 'This request came from another site and was refused.')
}

function hasBody(event: H3Event): boolean {
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  return length > 0 || getRequestHeader(event, 'transfer-encoding') !== undefined
}

function assertApiBodyType(event: H3Event, path: string) {
  if (!hasBody(event)) return
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  if (type === 'application/json' || /^application\/[a-z0-9.+-]+\+json$/.test(type)) return
  if (type === 'multipart/form-data' && MULTIPART_ROUTES.some(r => r.test(path))) return
  refuse(415, 'Send the request body as JSON (Content-Type: application/json).')
}

export default defineEventHandler((event) => {
  if (SAFE_METHODS.has(event.method)) return
  assertSameOrigin(event)
  const path = event.path.split('?', 1)[0]!
  if (path.startsWith('/api/')) assertApiBodyType(event, path)
})
