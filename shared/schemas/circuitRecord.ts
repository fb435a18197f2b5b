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

/** Saving the drawn graph: the version the editor started from, and the whole exchange document
 *  (checked in depth by parseCircuitDocument, which lists every failing path). */
export const circuitSaveInput = z.object({
  baseVersion: z.number({ message: 'baseVersion is required' }).int().min(1),
  document: z.unknown(),
})
export type CircuitSaveInput = z.infer<typeof circuitSaveInput>

export const circuitImportInput = z.object({
  document: z.unknown(),
  /** title for the new circuit; the document's own title when absent */
  title: trimmed('Title', 160).optional(),
})

export const revisionParams = z.object({
  id: z.uuid(),
  version: z.coerce.number().int().min(1).max(2_000_000_000),
})
