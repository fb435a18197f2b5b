// Strict-Transport-Security only on answers that went out over https (TLS in this process, or a
// trusted proxy saying so): over plain http the header is meaningless and would only confuse a
// later https set-up. HOSEWRIGHT_HSTS_MAX_AGE=0 switches it off (default 180 days).
const DEFAULT_MAX_AGE_S = 15_552_000

export default defineEventHandler((event) => {
  const maxAge = appConfig().HOSEWRIGHT_HSTS_MAX_AGE ?? DEFAULT_MAX_AGE_S
  if (maxAge === 0) return
  const trustProxy = isFlagOn(process.env.HOSEWRIGHT_TRUST_PROXY)
  const encrypted = Boolean((event.node.req.socket as { encrypted?: boolean }).encrypted)
  const forwardedHttps = trustProxy && getRequestHeader(event, 'x-forwarded-proto')?.split(',')[0]?.trim() === 'https'
  if (encrypted || forwardedHttps) setResponseHeader(event, 'strict-transport-security', `max-age=${maxAge}; includeSubDomains`)
})
