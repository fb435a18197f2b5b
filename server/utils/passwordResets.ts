import type { H3Event } from 'h3'
import { eq, sql } from 'drizzle-orm'
import type { Database } from './db'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

export const resetMinutes = () => envNumber('HOSEWRIGHT_RESET_MINUTES', 60)
const windowMinutes = () => envNumber('HOSEWRIGHT_RESET_WINDOW_MINUTES', 60)
const maxPerEmail = () => envNumber('HOSEWRIGHT_RESET_MAX_PER_EMAIL', 3)
const maxPerAddress = () => envNumber('HOSEWRIGHT_RESET_MAX_PER_IP', 20)

/**
 * Counts a reset request per e-mail and per client address (in sign_in_attempts, under their own
 * key prefix, so every app instance shares the limit) and refuses with 429 past the limit. Every
 * request counts, known address or not, so the limit tells nothing about accounts.
 */
export async function countResetRequest(event: H3Event, email: string) {
  const windowStartSql = sql`now() - make_interval(mins => ${windowMinutes()})`
  const limits = [[`reset-email:${email}`, maxPerEmail()], [`reset-ip:${clientAddress(event)}`, maxPerAddress()]] as const
  for (const [key, limit] of limits) {
    const expired = sql`${schema.signInAttempts.windowStart} <= ${windowStartSql}`
    const [row] = await useDb().insert(schema.signInAttempts).values({ key, windowStart: new Date(), failures: 1 })
      .onConflictDoUpdate({
        target: schema.signInAttempts.key,
        set: {
          failures: sql`case when ${expired} then 1 else ${schema.signInAttempts.failures} + 1 end`,
          windowStart: sql`case when ${expired} then now() else ${schema.signInAttempts.windowStart} end`,
        },
      }).returning()
    if (row!.failures > limit) {
      const retryAfter = Math.max(1, Math.ceil((row!.windowStart.getTime() + windowMinutes() * 60_000 - Date.now()) / 1000))
      setResponseHeader(event, 'Retry-After', retryAfter)
      throw createError({ statusCode: 429, statusMessage: 'Too many requests', message: `Too many reset requests. Try again in ${Math.ceil(retryAfter / 60)} min.` })
    }
  }
}

const closedMessages = {
  used: 'This reset link has already been used. Ask for a new one if you need to change your password again.',
  expired: 'This reset link has expired. Ask for a new one.',
} as const

/** The reset of a link token, or 404; 410 when it was used or has expired. */
export async function openResetByToken(executor: Database | Tx, token: string, lock = false) {
  const query = executor.select().from(schema.passwordResets).where(eq(schema.passwordResets.tokenHash, hashLinkToken(token)))
  const [reset] = lock ? await query.for('update') : await query
  if (!reset) notFound('This reset link is not valid. Check that the whole address from the e-mail was opened.')
  const reason = reset.usedAt ? 'used' : reset.expiresAt.getTime() <= Date.now() ? 'expired' : null
  if (reason) throw createError({ statusCode: 410, statusMessage: 'Link closed', message: closedMessages[reason], data: { reason } })
  return reset
}
