import { z } from 'zod'

/** Route parameter `id` of any row: a UUID. Anything else can match nothing, so it answers 404. */
export const idParam = z.object({ id: z.uuid({ message: 'Not a valid id' }) })

export const trimmed = (label: string, max: number) =>
  z.string({ message: `${label} is required` }).trim().min(1, `${label} is required`).max(max, `${label} is at most ${max} characters`)

export const optionalText = (label: string, max: number) =>
  z.string().trim().max(max, `${label} is at most ${max} characters`)

export const email = z.string({ message: 'E-mail is required' }).trim().toLowerCase()
  .max(254, 'E-mail is too long').pipe(z.email({ message: 'Enter a valid e-mail address' }))
