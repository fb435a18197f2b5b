import type { HoseMaterial, Point3 } from '../circuit'
import type { FlowReport } from './flow/types'
import type { Quantities } from './quantities/types'

export type Severity = 'error' | 'warning' | 'note'

/** A change the editor can apply with one click. Lengths mm, positions in vehicle axes. */
export type FixAction =
  | { type: 'block-port'; portId: string }
  | { type: 'join-hose-end'; hoseId: string; end: 'from' | 'to'; portId: string }
  | { type: 'add-bleed-valve'; hoseId: string; at: Point3 }
  | { type: 'add-vent-port'; componentId: string; at: Point3 }
  | { type: 'add-reducer'; hoseId: string; end: 'from' | 'to'; hoseBoreMm: number; spigotOdMm: number }
  | { type: 'set-hose-bore'; hoseId: string; insideDiameterMm: number }
  | { type: 'raise-component'; componentId: string; z: number }
  | { type: 'set-cap-rating'; capRatingKpa: number }
  | { type: 'set-coolant-percent'; percentByVolume: number }
  /** draw a hose between two open ports (a fuel return line from the regulator to the tank) */
  | { type: 'join-ports'; fromPortId: string; toPortId: string; label?: string }
  /** reference a fuel pressure regulator to the intake manifold, so fuel pressure follows boost 1:1 */
  | { type: 'set-regulator-reference'; componentId: string; reference: 'manifold' }
  | { type: 'set-hose-material'; hoseId: string; material: HoseMaterial }

export interface Finding {
  /** stable kebab-case code; the list with rules is in docs/engine.md */
  code: string
  severity: Severity
  /** plain words for the fabricator, naming the parts and numbers */
  message: string
  /** ids of the parts, ports and hoses concerned, in the report's stable order */
  elementIds: string[]
  fix: { text: string; action?: FixAction }
}

export interface Report {
  engineVersion: string
  findings: Finding[]
  counts: { error: number; warning: number; note: number }
  quantities: Quantities
  flow: { open: FlowReport; closed: FlowReport }
}
