import type { ClampKind, CoolantMixSetting, HoseMaterial } from '../../circuit'
import type { FuelQuantities } from '../fuel/types'

export interface HoseLine {
  hoseId: string
  tag: string
  label: string | null
  fromText: string
  toText: string
  insideDiameterMm: number
  wallMm: number
  material: HoseMaterial
  /** through the route from port to port */
  drawnLengthMm: number
  measuredLengthMm: number | null
  /** measured when given, else drawn */
  baseLengthMm: number
  /** base + percent allowance + allowance per end, rounded up to the whole mm */
  cutLengthMm: number
}

export interface HoseTotal {
  material: HoseMaterial
  insideDiameterMm: number
  pieces: number
  tags: string[]
  cutTotalMm: number
  /** what to buy, rounded up by how that hose is sold */
  buy: { quantity: number; unit: 'm' | 'piece' }
  rule: string
}

export interface ClampLine {
  hoseId: string
  tag: string
  end: 'from' | 'to'
  kind: ClampKind
  /** spigot OD + 2 × hose wall (hose bore + 2 × wall for a free end) */
  assembledOdMm: number
  /** e.g. "SAE 24 (27–51 mm)" for worm-drive; "for 45 mm OD" otherwise; null when none fits */
  size: string | null
}

export interface CountLine {
  item: string
  size: string
  count: number
  elementIds: string[]
}

export interface VolumeShare {
  elementId: string
  name: string
  volumeL: number
  /** fraction of the system volume, 0–1 */
  share: number
}

export interface CoolantQuantities {
  mix: CoolantMixSetting
  concentrateL: number
  waterL: number
  freezePointC: number
  freezePointSource: string
  boilingPointC: number
  boilingPointSource: string
  capRatingKpa: number
  /** growth of the fill from 20 °C to the hottest coolant allowed */
  expansionL: number
}

export interface Quantities {
  hoses: HoseLine[]
  hoseTotals: HoseTotal[]
  clamps: ClampLine[]
  clampCounts: CountLine[]
  fittings: CountLine[]
  thermostats: Array<{ componentId: string; label: string; openingTempC: number; fullOpenTempC: number; hasBypass: boolean }>
  caps: Array<{ componentId: string; label: string; ratingKpa: number }>
  volume: { totalL: number; parts: VolumeShare[] }
  coolant: CoolantQuantities | null
  /** fuel circuits only: demand, pump, injectors and line flows; absent on a coolant circuit */
  fuel?: FuelQuantities
}
