import { z } from 'zod'
import { bounded } from './primitives'

/** A lumped flow resistance: K at a reference bore, or a rated pressure drop at a rated flow (drop grows with flow²). */
export const resistance = z.union([
  z.strictObject({ k: bounded(0, 10_000, ''), diameterMm: bounded(1, 500, 'mm') }),
  z.strictObject({ dropKpa: bounded(0, 1000, 'kPa'), atFlowLpm: bounded(0.1, 2000, 'L/min') }),
])
export type Resistance = z.infer<typeof resistance>

/** Every part may carry its own resistance; the flow figures use a typical one where it has none. */
export const withResistance = { resistance: resistance.optional() }
