import type { H3Event } from 'h3'
import { eq, inArray, sql } from 'drizzle-orm'

// Failed sign-ins are counted per e-mail and per client address in PostgreSQL, so several
// app instances share one limit. A success clears the e-mail's counter.
const windowMinutes = () => Number(process.env.HOSEWRIGHT_SIGNIN_WINDOW_MINUTES ?? 15)
const maxPerEmail = () => Number(process.env.HOSEWRIGHT_SIGNIN_MAX_PER_EMAIL ?? 5)
const maxPerAddress = () => Number(process.env.HOSEWRIGHT_SIGNIN_MAX_PER_IP ?? 30)

export function clientAddress(event: H3Event): string {
  const trustProxy = process.env.HOSEWRIGHT_TRUST_PROXY === '1'
  return getRequestIP(event, { xForwardedFor: trustProxy }) ?? 'unknown'
}

function keys(event: H3Event, email: string) {
  return { email: `email:${email}`, address: `ip:${clientAddress(event)}` }
}

/** Throws 429 when either counter is at its limit inside the current window. */
export async function assertSignInAllowed(event: H3Event, email: string) {
  const k = keys(event, email)
  const since = new Date(Date.now() - windowMinutes() * 60_000)
  const rows = await useDb().select().from(schema.signInAttempts).where(inArray(schema.signInAttempts.key, [k.email, k.address]))
  for (const row of rows) {
    const limit = row.key === k.email ? maxPerEmail() : maxPerAddress()
    if (row.windowStart > since && row.failures >= limit) {
      const retryAfter = Math.max(1, Math.ceil((row.windowStart.getTime() - since.getTime()) / 1000))
      setResponseHeader(event, 'Retry-After', retryAfter)
      throw createError({ statusCode: 429, statusMessage: 'Too many attempts', message: `Too many failed sign-ins. Try again in ${Math.ceil(retryAfter / 60)} min.` })
    }
  }
}

export async function recordSignInFailure(event: H3Event, email: string) {
  const k = keys(event, email)
  const windowStartSql = sql`now() - make_interval(mins => ${windowMinutes()})`
  for (const key of [k.email, k.address]) {
    // one statement: restart the window when it has expired, else count up
    await useDb().insert(schema.signInAttempts).values({ key, windowStart: new Date(), failures: 1 })
      .onConflictDoUpdate({
        target: schema.signInAttempts.key,
        set: {
          failures: sql`case when ${schema.signInAttempts.windowStart} <= ${windowStartSql} then 1 else ${schema.signInAttempts.failures} + 1 end`,
          windowStart: sql`case when ${schema.signInAttempts.windowStart} <= ${windowStartSql} then now() else ${schema.signInAttempts.windowStart} end`,
        },
      })
  }
}

export async function clearSignInFailures(event: H3Event, email: string) {
  await useDb().delete(schema.signInAttempts).where(eq(schema.signInAttempts.key, keys(event, email).email))
}
