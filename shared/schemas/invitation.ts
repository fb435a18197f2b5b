import { z } from 'zod'
import { trimmed } from './common'
import { newPassword } from './auth'

/** Accepting an invitation with a new account: the invitee chooses their name and password. */
export const invitationAcceptNewInput = z.object({
  name: trimmed('Your name', 100),
  password: newPassword,
})
export type InvitationAcceptNewInput = z.infer<typeof invitationAcceptNewInput>

/** Accepting with an existing account while signed out: its password signs them in. */
export const invitationAcceptExistingInput = z.object({
  password: z.string({ message: 'Password is required' }).min(1, 'Password is required').max(200),
})
export type InvitationAcceptExistingInput = z.infer<typeof invitationAcceptExistingInput>

/** Why an invitation link no longer works. */
export const invitationClosedReasons = ['expired', 'used', 'revoked'] as const
export type InvitationClosedReason = typeof invitationClosedReasons[number]
