import { eq } from 'drizzle-orm'

// What an invitation link offers (public: the token is the credential). Closed links answer 410
// with the reason, unknown ones 404.
export default defineEventHandler(async (event) => {
  const { token } = await paramsOf(event, tokenParam)
  setResponseHeader(event, 'Cache-Control', 'no-store')
  const db = useDb()
  const { invitation, workshopName } = await invitationByToken(db, token)
  const reason = invitationClosedReason(invitation)
  if (reason) invitationGone(reason)
  const [account] = await db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, invitation.email))
  const [inviter] = invitation.invitedBy
    ? await db.select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, invitation.invitedBy))
    : []
  const signedIn = await signedInUserOrNull(event)
  return {
    workshop: { name: workshopName },
    role: invitation.role,
    email: invitation.email,
    name: invitation.name,
    invitedBy: inviter?.name ?? null,
    expiresAt: invitation.expiresAt,
    /** 'existing': the address has an account, which signs in to accept */
    account: account ? 'existing' as const : 'new' as const,
    signedInAs: signedIn?.user.email ?? null,
  }
})
