import { z } from 'zod'

/** Display units per user. Values are stored and computed in mm, L, °C and kPa regardless. */
export const unitPreferences = z.object({
  length: z.enum(['mm', 'in']).default('mm'),
  volume: z.enum(['L', 'qt']).default('L'),
  temperature: z.enum(['C', 'F']).default('C'),
  pressure: z.enum(['kPa', 'bar', 'psi']).default('bar'),
})
export type UnitPreferences = z.infer<typeof unitPreferences>
export const defaultPreferences: UnitPreferences = unitPreferences.parse({})

export const accountUpdateInput = z.object({
  name: z.string().trim().min(1, 'Your name is required').max(100, 'At most 100 characters').optional(),
  preferences: unitPreferences.partial().optional(),
})
export type AccountUpdateInput = z.infer<typeof accountUpdateInput>
