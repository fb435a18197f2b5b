import { and, eq } from 'drizzle-orm'
import { invitationAcceptExistingInput, invitationAcceptNewInput } from '#shared/schemas/invitation'

// Accept an invitation (public: the token is the credential).
//   signed in as the invited address → the membership is linked;
//   signed out, the address has an account → its password signs in and links;
//   signed out, a new address → name and password create the account.
// Everything written happens in one transaction that locks the invitation, so a token works once.
export default defineEventHandler(async (event) => {
  const { token } = await paramsOf(event, tokenParam)
  const db = useDb()
  const signedIn = await signedInUserOrNull(event)
  const { invitation: seen } = await invitationByToken(db, token)
  const closed = invitationClosedReason(seen)
  if (closed) invitationGone(closed)

  // decide what the request must carry, and do the slow password work before the transaction
  const [account] = await db.select().from(schema.users).where(eq(schema.users.email, seen.email))
  let newAccount: { name: string; passwordHash: string } | null = null
  if (signedIn) {
    if (signedIn.user.email !== seen.email) {
      throw createError({
        statusCode: 403, statusMessage: 'Other account', data: { reason: 'other-account' },
        message: `This invitation is for ${seen.email}, but you are signed in as ${signedIn.user.email}. Sign out, then open the link again.`,
      })
    }
  } else if (account) {
    const input = await bodyOf(event, invitationAcceptExistingInput)
    await assertSignInAllowed(event, account.email)
    if (!(await verifyPassword(account.passwordHash, input.password))) {
      await recordSignInFailure(event, account.email)
      invalidInput([{ path: 'password', message: 'The password is wrong' }], 'The password is wrong.')
    }
    await clearSignInFailures(event, account.email)
  } else {
    const input = await bodyOf(event, invitationAcceptNewInput)
    newAccount = { name: input.name, passwordHash: await hashPassword(input.password) }
  }

  const joined = await db.transaction(async (tx) => {
    const { invitation } = await invitationByToken(tx, token, true)
    const reason = invitationClosedReason(invitation)
    if (reason) invitationGone(reason)
    let user: { id: string; email: string; name: string } | undefined = account ?? signedIn?.user
    if (newAccount) {
      [user] = await tx.insert(schema.users).values({ email: invitation.email, ...newAccount })
        .onConflictDoNothing({ target: schema.users.email }).returning()
      if (!user) throw createError({ statusCode: 409, statusMessage: 'Account exists', message: 'An account with this address exists now. Reload the page and sign in to accept.' })
    }
    // already a member (a second invitation, accepted in another tab): keep that membership
    await tx.insert(schema.memberships).values({ workshopId: invitation.workshopId, userId: user!.id, role: invitation.role })
      .onConflictDoNothing({ target: [schema.memberships.workshopId, schema.memberships.userId] })
    const [membership] = await tx.select().from(schema.memberships)
      .where(and(eq(schema.memberships.workshopId, invitation.workshopId), eq(schema.memberships.userId, user!.id)))
    await tx.update(schema.invitations).set({ acceptedAt: new Date() }).where(eq(schema.invitations.id, invitation.id))
    await logActivity(tx, {
      workshopId: invitation.workshopId, projectId: null, actorId: user!.id, action: 'member.joined',
      details: { role: membership!.role, invitationId: invitation.id },
    })
    return { user: user!, membership: membership! }
  })

  const sessionUser = { id: joined.user.id, email: joined.user.email, name: joined.user.name }
  if (signedIn) await replaceUserSession(event, { ...(await getUserSession(event)), workshopId: joined.membership.workshopId })
  else await startSession(event, sessionUser, joined.membership.workshopId)
  return { ...(await sessionSummary(joined.user.id, joined.membership.workshopId)), membershipId: joined.membership.id }
})
