import { eq } from 'drizzle-orm'
import { passwordResetRequestInput } from '#shared/schemas/passwordReset'
import { passwordResetMail } from '../../mail/templates'
import { wakeMailWorker } from '../../mail/worker'

// Ask for a password reset link (public). The answer is the same whether or not the address has
// an account; only an existing account gets an e-mail.
export default defineEventHandler(async (event) => {
  const input = await bodyOf(event, passwordResetRequestInput)
  await countResetRequest(event, input.email)
  const db = useDb()
  const [user] = await db.select().from(schema.users).where(eq(schema.users.email, input.email))
  if (user) {
    const { token, tokenHash } = createLinkToken()
    const minutes = resetMinutes()
    await db.transaction(async (tx) => {
      await tx.insert(schema.passwordResets).values({ userId: user.id, tokenHash, expiresAt: new Date(Date.now() + minutes * 60_000) })
      const mail = passwordResetMail({ name: user.name, email: user.email, link: `${appUrl()}/reset-password/${token}`, minutes })
      await enqueueMail(tx, { workshopId: null, kind: 'password-reset', to: user.email, ...mail })
    })
    wakeMailWorker()
  }
  setResponseStatus(event, 202)
  return { ok: true, message: 'If an account exists for this address, we have sent it a link to choose a new password.' }
})
