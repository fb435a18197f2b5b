// What a change between two saved versions does to what the technician buys and fills: each hose's
// cut length, the hose to buy per size, the coolant volume, and the findings that came or went. Both
// reports come from the same engine (analyzeCircuit), so this only compares.
import type { Report, Severity } from '../engine/report'
import type { HoseMaterial } from '../circuit/hose'
import { keyedFindings } from './findingKeys'

export interface HoseCutChange {
  hoseId: string
  tag: string | null
  /** null when the hose is not in that version */
  beforeMm: number | null
  afterMm: number | null
}

export interface HoseTotalChange {
  material: HoseMaterial
  insideDiameterMm: number
  beforeMm: number
  afterMm: number
  buyBefore: { quantity: number; unit: 'm' | 'piece' } | null
  buyAfter: { quantity: number; unit: 'm' | 'piece' } | null
}

export interface FindingRef {
  key: string
  code: string
  severity: Severity
  message: string
}

export interface QuantityChanges {
  hoseCuts: HoseCutChange[]
  hoseTotals: HoseTotalChange[]
  volume: { beforeL: number; afterL: number; deltaL: number }
  findings: { added: FindingRef[]; removed: FindingRef[] }
  /** codes present in one version and not in the other */
  codes: { added: string[]; removed: string[] }
}

const round = (v: number, digits: number) => Number(v.toFixed(digits))

export function quantityChanges(before: Report, after: Report): QuantityChanges {
  const cutsBefore = new Map(before.quantities.hoses.map((h) => [h.hoseId, h]))
  const cutsAfter = new Map(after.quantities.hoses.map((h) => [h.hoseId, h]))
  const hoseCuts: HoseCutChange[] = []
  for (const a of after.quantities.hoses) {
    const b = cutsBefore.get(a.hoseId)
    if (!b || b.cutLengthMm !== a.cutLengthMm) hoseCuts.push({ hoseId: a.hoseId, tag: a.tag, beforeMm: b?.cutLengthMm ?? null, afterMm: a.cutLengthMm })
  }
  for (const b of before.quantities.hoses) {
    if (!cutsAfter.has(b.hoseId)) hoseCuts.push({ hoseId: b.hoseId, tag: null, beforeMm: b.cutLengthMm, afterMm: null })
  }

  const totalKey = (t: { material: string; insideDiameterMm: number }) => `${t.material}|${t.insideDiameterMm}`
  const totalsBefore = new Map(before.quantities.hoseTotals.map((t) => [totalKey(t), t]))
  const totalsAfter = new Map(after.quantities.hoseTotals.map((t) => [totalKey(t), t]))
  const hoseTotals: HoseTotalChange[] = []
  for (const key of new Set([...totalsAfter.keys(), ...totalsBefore.keys()])) {
    const b = totalsBefore.get(key)
    const a = totalsAfter.get(key)
    const beforeMm = b?.cutTotalMm ?? 0
    const afterMm = a?.cutTotalMm ?? 0
    if (beforeMm === afterMm && b?.buy.quantity === a?.buy.quantity) continue
    const ref = (a ?? b)!
    hoseTotals.push({ material: ref.material, insideDiameterMm: ref.insideDiameterMm, beforeMm, afterMm, buyBefore: b?.buy ?? null, buyAfter: a?.buy ?? null })
  }

  const fb = keyedFindings(before)
  const fa = keyedFindings(after)
  const keysBefore = new Set(fb.map((f) => f.key))
  const keysAfter = new Set(fa.map((f) => f.key))
  const ref = (f: (typeof fa)[number]): FindingRef => ({ key: f.key, code: f.code, severity: f.severity, message: f.message })
  const codesBefore = new Set(fb.map((f) => f.code))
  const codesAfter = new Set(fa.map((f) => f.code))

  const beforeL = before.quantities.volume.totalL
  const afterL = after.quantities.volume.totalL
  return {
    hoseCuts,
    hoseTotals,
    volume: { beforeL, afterL, deltaL: round(afterL - beforeL, 6) },
    findings: { added: fa.filter((f) => !keysBefore.has(f.key)).map(ref), removed: fb.filter((f) => !keysAfter.has(f.key)).map(ref) },
    codes: { added: [...codesAfter].filter((c) => !codesBefore.has(c)).sort(), removed: [...codesBefore].filter((c) => !codesAfter.has(c)).sort() },
  }
}
