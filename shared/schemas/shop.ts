// The technician's records on a version's shop outputs: inputs of the routes (used by the forms too)
// and the shape of what the shop page and the build sheet read.
import { z } from 'zod'
import type { CircuitDocument } from '../circuit'
import { KPA_PER_BAR, LITRES_PER_US_QUART, psiToKpa } from '../physics/units'
import type { Severity } from '../engine'
import { SHOP_SECTIONS, type ChartDatum, type ProcedureResult, type ShoppingLine, type ShoppingList } from '../shop'
import { optionalText, trimmed } from './common'
import type { PersonRef, ReviewStatus } from './review'

/** A line id as the shopping list writes it ("hose/j20-r3-heater/15.88", "cut/<hose id>", "custom/<id>"). */
const lineId = z.string({ message: 'Which line?' }).min(1, 'Which line?').max(300, 'Not a line of this list')
const stepId = z.string({ message: 'Which step?' }).min(1, 'Which step?').max(300, 'Not a step of this procedure')

const price = z.number({ message: 'Enter a price, e.g. 12.50' }).min(0, 'A price is 0 or more').max(10_000_000, 'That price is too large')
const supplier = optionalText('Supplier', 120)
const quantity = z.number({ message: 'Enter how many' }).min(0, 'At least 0').max(1_000_000, 'That is too many')

/** A line the workshop adds itself (heat sleeve, cable ties, a spare clamp …). */
export const shopCustomLineInput = z.object({
  description: trimmed('Description', 200),
  quantity,
  unit: trimmed('Unit', 30),
  section: z.enum(SHOP_SECTIONS, { message: 'Choose a section' }).default('sundries'),
  sizeMetric: optionalText('Metric size', 100).default(''),
  sizeImperial: optionalText('Imperial size', 100).default(''),
  price: price.nullable().default(null),
  supplier: supplier.nullable().default(null),
  notes: optionalText('Notes', 500).default(''),
})
export type ShopCustomLineInput = z.infer<typeof shopCustomLineInput>

/** Changes to one line: price and supplier on any bought line, ticks on any line, wording on the workshop's own. */
export const shopLinePatchInput = z.object({
  lineId,
  price: price.nullable().optional(),
  supplier: supplier.nullable().optional(),
  bought: z.boolean({ message: 'Bought is yes or no' }).optional(),
  fitted: z.boolean({ message: 'Fitted is yes or no' }).optional(),
  description: trimmed('Description', 200).optional(),
  quantity: quantity.optional(),
  unit: trimmed('Unit', 30).optional(),
  section: z.enum(SHOP_SECTIONS, { message: 'Choose a section' }).optional(),
  sizeMetric: optionalText('Metric size', 100).optional(),
  sizeImperial: optionalText('Imperial size', 100).optional(),
  notes: optionalText('Notes', 500).optional(),
}).refine((v) => Object.keys(v).some((k) => k !== 'lineId'), { message: 'Nothing to change', path: ['lineId'] })
export type ShopLinePatchInput = z.infer<typeof shopLinePatchInput>

/** The fields only a line the workshop added may change. */
export const CUSTOM_ONLY_FIELDS = ['description', 'quantity', 'unit', 'section', 'sizeMetric', 'sizeImperial', 'notes'] as const

export const shopLineDeleteQuery = z.object({ lineId })

export const shopStepInput = z.object({ stepId, done: z.boolean({ message: 'Done is yes or no' }) })

export const pressureUnits = ['kPa', 'bar', 'psi'] as const
export const fillUnits = ['L', 'qt'] as const

/** A gauge reading, as a number in the unit it was read in. */
const gauge = (label: string) =>
  z.number({ message: `Enter the ${label} pressure` }).min(0, `The ${label} pressure is a gauge reading, 0 or more`).max(10_000, `The ${label} pressure is too high for a cooling system`)

/** A pressure test read off the gauge; the route stores gauge kPa. */
export const pressureTestInput = z.object({
  unit: z.enum(pressureUnits, { message: 'Choose kPa, bar or psi' }),
  startPressure: gauge('start'),
  endPressure: gauge('end'),
  minutesHeld: z.number({ message: 'Enter the minutes held' }).gt(0, 'Held for more than 0 minutes').max(24 * 60, 'At most a day'),
  passed: z.boolean({ message: 'Passed or failed?' }),
  note: optionalText('Note', 1000).default(''),
})
export type PressureTestInput = z.infer<typeof pressureTestInput>

/** Coolant that actually went in; the route stores litres. */
export const fillRecordInput = z.object({
  unit: z.enum(fillUnits, { message: 'Choose L or qt' }),
  volume: z.number({ message: 'Enter the volume that went in' }).gt(0, 'More than 0').max(2000, 'That is more than a cooling system holds'),
  note: optionalText('Note', 1000).default(''),
})
export type FillRecordInput = z.infer<typeof fillRecordInput>

/** A gauge reading in kPa, bar or psi → gauge kPa (exact factors of shared/physics/units). */
export function pressureToKpa(value: number, unit: (typeof pressureUnits)[number]): number {
  return unit === 'kPa' ? value : unit === 'bar' ? value * KPA_PER_BAR : psiToKpa(value)
}

/** A volume in litres or US quarts → litres. */
export function volumeToLitres(value: number, unit: (typeof fillUnits)[number]): number {
  return unit === 'L' ? value : value * LITRES_PER_US_QUART
}

/** What the activity log records for the shop, with the words the log shows. */
export const shopActivityLabels = {
  'shop.line-added': 'added a line to the shopping list',
  'shop.line-changed': 'changed a line of the shopping list',
  'shop.line-removed': 'removed a line from the shopping list',
  'shop.line-priced': 'priced a line of the shopping list',
  'shop.item-bought': 'ticked an item bought',
  'shop.item-cut': 'ticked a hose piece cut',
  'shop.item-fitted': 'ticked an item fitted',
  'shop.step-done': 'ticked a procedure step',
  'shop.tick-removed': 'took a tick back',
  'shop.pressure-test': 'recorded a pressure test',
  'shop.fill-recorded': 'recorded the coolant fill',
} as const
export type ShopActivityAction = keyof typeof shopActivityLabels

export const paperSizes = ['a4', 'letter'] as const
export type PaperSize = (typeof paperSizes)[number]
export const buildSheetQuery = z.object({ paper: z.enum(paperSizes, { message: 'Paper is a4 or letter' }).default('a4') })

// ── What the shop routes answer

export interface ShopTick { by: PersonRef | null; at: string }

export interface ShopLineView extends ShoppingLine {
  /** bought (a cut piece: cut) */
  bought: ShopTick | null
  fitted: ShopTick | null
}

export interface ShopPressureTest {
  id: string
  startKpa: number
  endKpa: number
  minutesHeld: number
  passed: boolean
  enteredUnit: (typeof pressureUnits)[number]
  note: string
  by: PersonRef | null
  at: string
}

export interface ShopFill {
  id: string
  volumeL: number
  estimateL: number
  /** taken − estimate, L: clearly less than the estimate means trapped air */
  differenceL: number
  enteredUnit: (typeof fillUnits)[number]
  note: string
  by: PersonRef | null
  at: string
}

export interface ShopFinding {
  key: string
  code: string
  severity: Severity
  message: string
  fix: string
  signOff: { justification: string; by: PersonRef | null; at: string } | null
}

export interface ShopView {
  circuit: { id: string; title: string; kind: 'coolant' | 'fuel'; projectId: string; currentVersion: number }
  project: { id: string; title: string }
  version: number
  savedAt: string
  savedBy: PersonRef | null
  engineVersion: string
  /** the review that approved this version, or null (a draft or a version still in review) */
  approval: { reviewId: string; by: PersonRef | null; at: string; note: string } | null
  reviewStatus: ReviewStatus
  versions: Array<{ version: number; savedAt: string; approved: boolean }>
  document: CircuitDocument
  list: Omit<ShoppingList, 'lines'> & { lines: ShopLineView[] }
  procedure: ProcedureResult
  steps: Record<string, ShopTick>
  pressureTests: ShopPressureTest[]
  fills: ShopFill[]
  /** the report's system volume, L */
  estimateL: number
  charts: { volumeByPart: ChartDatum[]; flowSplit: ChartDatum[] }
  findings: ShopFinding[]
  viewer: { mayRecord: boolean }
}
