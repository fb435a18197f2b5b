import { computed, ref, useId, watch } from 'vue'
import { useField } from 'vee-validate'
import type { z } from 'zod'
import { parseCircuitDocument, type CircuitDocument } from '#shared/circuit'
import { displaySymbol, formatQuantity, fromDisplay, type Quantity, type UnitPreferences } from '#shared/physics/units'
import { nearestFractionalInch, parseNominalSizeMm } from '#shared/physics/hose-sizes'
import type { UnitPreferences as SessionUnits } from '#shared/schemas/preferences'

/** `hoseSize` is a length that also takes nominal labels ("5/16 in", "1-1/4"); `plain` is shown as stored. */
export type FieldQuantity = Quantity | 'hoseSize' | 'plain'

/** The physics layer also wants a flow unit; people who think in quarts get US gallons a minute. */
export function unitsOf(prefs: SessionUnits): UnitPreferences {
  return { ...prefs, flow: prefs.volume === 'qt' ? 'gal/min' : 'L/min' }
}

const physicalOf = (q: FieldQuantity): Quantity | null => (q === 'plain' ? null : q === 'hoseSize' ? 'length' : q)

// Digits shown in an input: enough that a typed value reads back as typed; the stored value is never rounded by display.
const EDIT_DECIMALS: Record<string, number> = {
  'mm': 2, 'in': 4, 'L': 3, 'qt': 3, '°C': 2, '°F': 2, 'K': 2, 'kPa': 2, 'bar': 4, 'psi': 3, 'L/min': 2, 'gal/min': 3,
}
const trimZeros = (s: string) => (s.includes('.') ? s.replace(/\.?0+$/, '') : s)

/** Stored value → the text put in an input, in the user's unit. */
export function entryText(quantity: FieldQuantity, stored: number | undefined, prefs: UnitPreferences): string {
  if (stored === undefined || !Number.isFinite(stored)) return ''
  const q = physicalOf(quantity)
  if (!q) return String(stored)
  if (quantity === 'hoseSize' && prefs.length === 'in' && stored > 0) {
    // sizes drawn to 0.01 mm (5/8 in as 15.88 mm) still read as their fraction
    const f = nearestFractionalInch(stored)
    if (Math.abs(f.differenceMm) <= 0.0051) return f.label
  }
  const decimals = EDIT_DECIMALS[displaySymbol(q, prefs)] ?? 3
  return trimZeros(formatQuantity(q, stored, prefs, { decimals, bare: true }))
}

/** Stored value → text with its unit, for read-outs: "5/16 in", "1231.9 mm", "15 psi" (the unit's usual decimals). */
export function quantityText(quantity: FieldQuantity, stored: number | undefined, prefs: UnitPreferences, unit = ''): string {
  if (stored === undefined || !Number.isFinite(stored)) return '—'
  const q = physicalOf(quantity)
  if (!q) return unit ? `${stored} ${unit}` : String(stored)
  const fraction = quantity === 'hoseSize' ? entryText(quantity, stored, prefs) : ''
  if (fraction.endsWith(' in')) return fraction
  return `${trimZeros(formatQuantity(q, stored, prefs, { bare: true }))} ${displaySymbol(q, prefs)}`
}

// Unit words a person may type after a number to override their preference for this one entry.
const SUFFIXES: Partial<Record<Quantity, Array<[RegExp, Partial<UnitPreferences>]>>> = {
  volume: [[/^(l|litres?|liters?)$/i, { volume: 'L' }], [/^(qt|quarts?)$/i, { volume: 'qt' }]],
  temperature: [[/^(°?c|deg ?c)$/i, { temperature: 'C' }], [/^(°?f|deg ?f)$/i, { temperature: 'F' }]],
  temperatureDifference: [[/^(k|°?c)$/i, { temperature: 'C' }], [/^(°?f)$/i, { temperature: 'F' }]],
  pressure: [[/^kpa$/i, { pressure: 'kPa' }], [/^bar$/i, { pressure: 'bar' }], [/^psi$/i, { pressure: 'psi' }]],
  flow: [[/^(l\/min|lpm)$/i, { flow: 'L/min' }], [/^(gal\/min|gpm)$/i, { flow: 'gal/min' }]],
}
const NUMBER = /^[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[-+]?\d+)?$/i
// float noise from a unit factor (48.5 × 25.4 = 1231.8999…) is not information; 12 digits keep every real one
const clean = (v: number) => Number(v.toPrecision(12))

export type EntryResult = { ok: true; value: number | undefined } | { ok: false; message: string }

/** Typed text → stored value. Empty text gives `undefined`; the caller's schema decides whether that is allowed. */
export function parseEntry(quantity: FieldQuantity, raw: string, prefs: UnitPreferences): EntryResult {
  const text = raw.trim().replace(',', '.')
  if (text === '') return { ok: true, value: undefined }
  const q = physicalOf(quantity)
  if (NUMBER.test(text)) return { ok: true, value: q ? clean(fromDisplay(q, Number(text), prefs)) : Number(text) }
  if (q === 'length') {
    const negative = text.startsWith('-')
    const mm = parseNominalSizeMm(negative ? text.slice(1) : text)
    if (mm !== null) return { ok: true, value: clean(negative ? -mm : mm) }
    return { ok: false, message: `Type a number in ${displaySymbol('length', prefs)}, or a size such as 5/16 in, 1-1/4 or 8 mm` }
  }
  const m = /^([-+]?(?:\d+(?:\.\d*)?|\.\d+))\s*(.+)$/.exec(text)
  const match = q && m ? SUFFIXES[q]?.find(([re]) => re.test(m[2]!.trim())) : undefined
  if (q && m && match) return { ok: true, value: clean(fromDisplay(q, Number(m[1]), { ...prefs, ...match[1] })) }
  return { ok: false, message: q ? `Type a number in ${displaySymbol(q, prefs)}` : 'Type a number' }
}

const SI_SYMBOL: Partial<Record<Quantity, string>> = { length: 'mm', volume: 'L', temperature: '°C', temperatureDifference: 'K', pressure: 'kPa', flow: 'L/min' }

/** "Must be at most 50000 mm" → "Must be at most 50000 mm (1968.5 in)" when the user works in inches. */
function inUserUnits(message: string, quantity: FieldQuantity, prefs: UnitPreferences): string {
  const q = physicalOf(quantity)
  const si = q ? SI_SYMBOL[q] : undefined
  if (!q || !si || displaySymbol(q, prefs) === si || !message.endsWith(` ${si}`)) return message
  const n = /(-?\d+(?:\.\d+)?) \S+$/.exec(message)
  return n ? `${message} (${formatQuantity(q, Number(n[1]), prefs)})` : message
}

/**
 * Checks a whole new document before it becomes an undo step; the message for `path` (or the first)
 * comes back instead of committing, so a value the model refuses never reaches the document.
 */
export function commitChecked(
  store: { commit: (doc: CircuitDocument, label: string) => void; document?: CircuitDocument },
  doc: CircuitDocument, label: string, path = '',
): string | null {
  // an edit that changes nothing (same document back) is no undo step
  if (doc === store.document) return null
  const parsed = parseCircuitDocument(doc)
  if (!parsed.ok) {
    const own = parsed.issues.find((i) => path !== '' && i.path.startsWith(path)) ?? parsed.issues[0]!
    return own.message
  }
  store.commit(doc, label)
  return null
}

export interface UnitFieldOptions {
  quantity: FieldQuantity
  /** the user's display units (the session store's preferences) */
  units: () => SessionUnits
  /** the stored (SI) value */
  value: () => number | undefined
  /** the model's schema for this one value, e.g. `hose.shape.wallMm` (wrap in .optional() for an optional one) */
  schema: () => z.ZodType
  /** commits the stored value as one undo step; returns a message when the document refuses it */
  apply: (stored: number | undefined) => string | null
}

/**
 * One number input in the user's units. The raw text stays in the input with its message until it is
 * valid; only then is the converted value committed. Enter or leaving the field commits, Escape reverts.
 */
export function useUnitField(options: UnitFieldOptions) {
  const prefs = computed(() => unitsOf(options.units()))
  const symbol = computed(() => {
    const q = physicalOf(options.quantity)
    return q ? displaySymbol(q, prefs.value) : ''
  })
  const stored = computed(() => options.value())
  const shown = () => entryText(options.quantity, stored.value, prefs.value)

  // typed text → the model's schema for the stored value; the first message shows on the field
  function rule(text: string | undefined): true | string {
    const r = parseEntry(options.quantity, text ?? '', prefs.value)
    if (!r.ok) return r.message
    const checked = options.schema().safeParse(r.value)
    if (checked.success) return true
    const message = r.value === undefined ? 'A value is needed here' : checked.error.issues[0]?.message ?? 'Not allowed'
    return inUserUnits(message, options.quantity, prefs.value)
  }
  const field = useField<string>(useId() ?? 'unit-field', rule, {
    initialValue: shown(), standalone: true, validateOnValueUpdate: false,
  })
  /** true once the person typed since the last commit or revert */
  const typed = ref(false)

  // the document (undo, another view) and the unit preference move the text, unless typing is in progress
  watch([stored, prefs], () => {
    if (!typed.value) field.resetField({ value: shown() })
  })

  function onInput(text: string) {
    typed.value = true
    field.setValue(text, false)
  }

  let committing = false
  async function commit() {
    if (!typed.value || committing) return
    committing = true
    try {
      await commitTyped()
    } finally {
      committing = false
    }
  }

  async function commitTyped() {
    const result = await field.validate()
    if (!result.valid) return
    const next = parseEntry(options.quantity, field.value.value, prefs.value)
    if (!next.ok) return
    if (next.value === stored.value) {
      revert()
      return
    }
    const refused = options.apply(next.value)
    if (refused) {
      field.setErrors(inUserUnits(refused, options.quantity, prefs.value))
      return
    }
    typed.value = false
    // the props follow on the next render; show the committed value at once
    field.resetField({ value: entryText(options.quantity, next.value, prefs.value) })
  }

  function revert() {
    typed.value = false
    field.resetField({ value: shown() })
  }

  /** what the typed text comes to in the stored unit, when that differs from the user's unit */
  const conversion = computed(() => {
    const q = physicalOf(options.quantity)
    if (!q || !typed.value) return ''
    const r = parseEntry(options.quantity, field.value.value ?? '', prefs.value)
    if (!r.ok || r.value === undefined) return ''
    const metric = { ...prefs.value, length: 'mm', volume: 'L', temperature: 'C', pressure: 'kPa', flow: 'L/min' } as const
    return displaySymbol(q, metric) === symbol.value ? '' : `= ${formatQuantity(q, r.value, metric, { decimals: 2 })}`
  })

  return { text: field.value, error: field.errorMessage, symbol, prefs, conversion, onInput, commit, revert }
}
