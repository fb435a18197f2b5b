import { z } from 'zod'
import { email, trimmed } from './common'

export const roles = ['owner', 'fabricator', 'reviewer', 'technician'] as const
export const role = z.enum(roles, { message: 'Choose a role' })
export type Role = z.infer<typeof role>

export const memberAddInput = z.object({
  email,
  name: trimmed('Name', 100).optional(),
  role,
})
export type MemberAddInput = z.infer<typeof memberAddInput>

export const memberUpdateInput = z.object({ role })
export type MemberUpdateInput = z.infer<typeof memberUpdateInput>
