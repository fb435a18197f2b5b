// Differences between two circuit documents, for the editor's conflict dialog and for review.
// Parts and hoses are matched by id; each changed element lists its changed leaf fields.
import type { Component } from './component'
import type { CircuitDocument } from './document'
import type { Hose } from './hose'

/** One changed value. `path` is dotted; arrays of elements with ids use `[id]`, e.g. `ports[engine-inlet].blocked`. */
export interface FieldChange {
  path: string
  before: unknown
  after: unknown
}

export interface ElementRef {
  id: string
  /** what a person calls it: the part label, or the hose label or its ends */
  label: string
}

export interface ElementChange extends ElementRef {
  changes: FieldChange[]
}

export interface ElementDiff {
  added: ElementRef[]
  removed: ElementRef[]
  changed: ElementChange[]
}

export interface CircuitDiff {
  parts: ElementDiff
  hoses: ElementDiff
  /** inside circuit.settings, paths relative to it */
  settings: FieldChange[]
  /** title, notes and kind */
  circuit: FieldChange[]
}

type Plain = Record<string, unknown>
const isPlain = (v: unknown): v is Plain => typeof v === 'object' && v !== null && !Array.isArray(v)
const hasId = (v: unknown): v is Plain & { id: string } => isPlain(v) && typeof v.id === 'string'

function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((v, i) => sameValue(v, b[i]))
  if (isPlain(a) && isPlain(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)])
    for (const k of keys) if (!sameValue(a[k], b[k])) return false
    return true
  }
  return false
}

const join = (prefix: string, key: string) => (prefix === '' ? key : `${prefix}.${key}`)

/**
 * Leaf changes from `before` to `after`. A missing key and an undefined value are the same. Arrays whose
 * items all carry ids (ports) are matched by id, so a reordering is no change; other arrays (route
 * points, curve points) are one value each.
 */
export function fieldChanges(before: unknown, after: unknown, prefix = ''): FieldChange[] {
  const out: FieldChange[] = []
  walk(before, after, prefix, out)
  return out
}

function walk(before: unknown, after: unknown, path: string, out: FieldChange[]): void {
  if (isPlain(before) && isPlain(after)) {
    const keys = [...Object.keys(before), ...Object.keys(after).filter((k) => !(k in before))]
    for (const k of keys) walk(before[k], after[k], join(path, k), out)
    return
  }
  if (Array.isArray(before) && Array.isArray(after) && before.every(hasId) && after.every(hasId)
    && (before.length > 0 || after.length > 0)) {
    const afterById = new Map(after.map((v) => [v.id, v]))
    const beforeIds = new Set(before.map((v) => v.id))
    for (const b of before) walk(b, afterById.get(b.id), `${path}[${b.id}]`, out)
    for (const a of after) if (!beforeIds.has(a.id)) walk(undefined, a, `${path}[${a.id}]`, out)
    return
  }
  if (!sameValue(before, after)) out.push({ path, before, after })
}

/** "Label › port name" for a hose end, or "free end". */
function endText(doc: CircuitDocument, portId: string | null): string {
  if (portId === null) return 'free end'
  for (const c of doc.circuit.components) {
    const p = c.ports.find((q) => q.id === portId)
    if (p) return `${c.label || c.id} › ${p.name || p.id}`
  }
  return portId
}

export function partLabel(part: Component): string {
  return part.label.trim() || part.id
}

/** The hose's own label, or its two ends in words. */
export function hoseLabel(doc: CircuitDocument, hose: Hose): string {
  const own = hose.params.label?.trim()
  if (own) return own
  return `${endText(doc, hose.from.portId)} → ${endText(doc, hose.to.portId)}`
}

function elementDiff<T extends { id: string }>(
  before: readonly T[], after: readonly T[], labelBefore: (e: T) => string, labelAfter: (e: T) => string,
): ElementDiff {
  const beforeById = new Map(before.map((e) => [e.id, e]))
  const afterIds = new Set(after.map((e) => e.id))
  const added: ElementRef[] = []
  const changed: ElementChange[] = []
  for (const a of after) {
    const b = beforeById.get(a.id)
    if (!b) {
      added.push({ id: a.id, label: labelAfter(a) })
      continue
    }
    if (b === a) continue
    const changes = fieldChanges(b, a)
    if (changes.length > 0) changed.push({ id: a.id, label: labelAfter(a), changes })
  }
  const removed = before.filter((b) => !afterIds.has(b.id)).map((b) => ({ id: b.id, label: labelBefore(b) }))
  return { added, removed, changed }
}

/** What changed from `before` to `after`. Element order is `after`'s for added and changed, `before`'s for removed. */
export function diffCircuits(before: CircuitDocument, after: CircuitDocument): CircuitDiff {
  const b = before.circuit
  const a = after.circuit
  return {
    parts: elementDiff(b.components, a.components, partLabel, partLabel),
    hoses: elementDiff(b.hoses, a.hoses, (h) => hoseLabel(before, h), (h) => hoseLabel(after, h)),
    settings: b.settings === a.settings ? [] : fieldChanges(b.settings, a.settings),
    circuit: fieldChanges({ kind: b.kind, title: b.title, notes: b.notes }, { kind: a.kind, title: a.title, notes: a.notes }),
  }
}

export interface DiffCounts {
  added: number
  removed: number
  changed: number
  settings: number
}

export function diffCounts(d: CircuitDiff): DiffCounts {
  return {
    added: d.parts.added.length + d.hoses.added.length,
    removed: d.parts.removed.length + d.hoses.removed.length,
    changed: d.parts.changed.length + d.hoses.changed.length + d.circuit.length,
    settings: d.settings.length,
  }
}

export function isEmptyDiff(d: CircuitDiff): boolean {
  const c = diffCounts(d)
  return c.added + c.removed + c.changed + c.settings === 0
}
