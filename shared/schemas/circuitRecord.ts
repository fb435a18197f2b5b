import { z } from 'zod'
import { trimmed } from './common'

/** A circuit as a record of a project (its drawing lives in shared/circuit). */
export const circuitKinds = ['coolant', 'fuel'] as const
export const circuitKind = z.enum(circuitKinds, { message: 'Choose coolant or fuel' })
export type CircuitKind = z.infer<typeof circuitKind>

export const circuitCreateInput = z.object({
  kind: circuitKind,
  title: trimmed('Title', 160),
})
export type CircuitCreateInput = z.infer<typeof circuitCreateInput>

export const circuitRenameInput = z.object({ title: trimmed('Title', 160) })

/** Deleting a circuit needs its exact title typed again. */
export const circuitDeleteInput = z.object({ confirmTitle: z.string({ message: 'Type the circuit title to confirm' }).max(160) })
