import { z } from 'zod'
import { email, trimmed } from './common'

/** Password rule for every place a password is chosen. Length matters more than symbols. */
export const newPassword = z.string({ message: 'Password is required' })
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters')
  .refine(p => p.trim().length === p.length, 'The password must not start or end with a space')
  .refine(p => new Set(p).size >= 4, 'The password is too repetitive')

export const signUpInput = z.object({
  name: trimmed('Your name', 100),
  email,
  password: newPassword,
  workshopName: trimmed('Workshop name', 120),
})
export type SignUpInput = z.infer<typeof signUpInput>

export const signInInput = z.object({
  email,
  password: z.string({ message: 'Password is required' }).min(1, 'Password is required').max(200),
})
export type SignInInput = z.infer<typeof signInInput>

export const changePasswordInput = z.object({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword,
}).refine(v => v.currentPassword !== v.newPassword, { path: ['newPassword'], message: 'Choose a password different from the current one' })
export type ChangePasswordInput = z.infer<typeof changePasswordInput>

export const switchWorkshopInput = z.object({ workshopId: z.uuid({ message: 'Not a valid workshop' }) })
