import { z } from 'zod'
import { bounded, elementId, labelText, point3 } from './primitives'

/** `efi-band`: the smooth-band, rolled-edge clamp the trade uses on fuel-injection hose (common practice). */
export const clampKinds = ['worm-drive', 'spring', 'constant-tension', 't-bolt', 'crimp', 'efi-band', 'none'] as const
export type ClampKind = (typeof clampKinds)[number]

/**
 * SAE J20 coolant hose classes, silicone, SAE J30 fuel hose classes (R10 is the submersible in-tank
 * class), PTFE-lined braided fuel hose, and rigid tube.
 */
export const hoseMaterials = [
  'j20-r3-heater', 'j20-r4-radiator', 'silicone', 'j30-r6', 'j30-r7', 'j30-r9', 'j30-r14', 'hard-line', 'j30-r10', 'ptfe-lined',
] as const
export type HoseMaterial = (typeof hoseMaterials)[number]

/** One end of a hose: on a port, or free at a point (not yet joined). */
export const hoseEnd = z.strictObject({
  portId: elementId.nullable(),
  /** where a free end lies; only for an end with no port */
  point: point3.optional(),
  clamp: z.enum(clampKinds),
})
export type HoseEnd = z.infer<typeof hoseEnd>

export const hose = z.strictObject({
  id: elementId,
  from: hoseEnd,
  to: hoseEnd,
  insideDiameterMm: bounded(2, 200, 'mm'),
  wallMm: bounded(0.5, 25, 'mm'),
  material: z.enum(hoseMaterials),
  /** a length taken off the vehicle with a tape; it overrides the drawn length */
  measuredLengthMm: bounded(1, 50_000, 'mm').optional(),
  params: z.strictObject({
    label: labelText('Hose label', 120).optional(),
    /** interior bend points, from the `from` end towards the `to` end */
    route: z.array(point3).max(500, 'A hose route has at most 500 points'),
  }),
})
export type Hose = z.infer<typeof hose>
