import { z } from 'zod'
import { component, type Component } from './component'
import { hose } from './hose'
import { labelText } from './primitives'
import { circuitSettings } from './settings'

/** Our own exchange format: a name and a version, so later versions can be told apart and migrated. */
export const CIRCUIT_FORMAT = 'hosewright.circuit'
export const CIRCUIT_FORMAT_VERSION = 1

export const circuitKinds = ['coolant', 'fuel'] as const
export type CircuitKindName = (typeof circuitKinds)[number]

export const MAX_ELEMENTS = 50_000

export const circuitBody = z.strictObject({
  kind: z.enum(circuitKinds),
  title: labelText('Title', 160).min(1, 'Title is required'),
  settings: circuitSettings,
  components: z.array(component).max(MAX_ELEMENTS, `At most ${MAX_ELEMENTS} parts`),
  hoses: z.array(hose).max(MAX_ELEMENTS, `At most ${MAX_ELEMENTS} hoses`),
  notes: labelText('Notes', 20_000).optional(),
})

export const circuitDocumentSchema = z.strictObject({
  format: z.literal(CIRCUIT_FORMAT, { message: `Format must be "${CIRCUIT_FORMAT}"` }),
  formatVersion: z.literal(CIRCUIT_FORMAT_VERSION, { message: `Format version must be ${CIRCUIT_FORMAT_VERSION}` }),
  circuit: circuitBody,
})

type InferredDocument = z.infer<typeof circuitDocumentSchema>
export type Circuit = Omit<InferredDocument['circuit'], 'components'> & { components: Component[] }
export type CircuitDocument = Omit<InferredDocument, 'circuit'> & { circuit: Circuit }
