import { z } from 'zod'
import { email } from './common'
import { newPassword } from './auth'

export const passwordResetRequestInput = z.object({ email })
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestInput>

export const passwordResetCompleteInput = z.object({ password: newPassword })
export type PasswordResetCompleteInput = z.infer<typeof passwordResetCompleteInput>
