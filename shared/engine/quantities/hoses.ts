// Hose lengths, cut lengths and what to buy.
import type { HoseMaterial } from '../../circuit'
import type { AnalysisContext } from '../context'
import { endName } from '../model'
import type { HoseLine, HoseTotal } from './types'

/**
 * How each kind of hose is sold (common practice): heater, silicone and fuel hose (PTFE-lined too) off the roll by the
 * half metre (about the foot the trade also uses); straight radiator hose and hard line by the whole metre.
 */
export const SOLD_BY: Record<HoseMaterial, { stepMm: number; rule: string }> = {
  'j20-r3-heater': { stepMm: 500, rule: 'heater hose is sold off the roll: total rounded up to the next 0.5 m' },
  silicone: { stepMm: 500, rule: 'silicone hose is sold off the roll: total rounded up to the next 0.5 m' },
  'j30-r6': { stepMm: 500, rule: 'fuel hose is sold off the roll: total rounded up to the next 0.5 m' },
  'j30-r7': { stepMm: 500, rule: 'fuel hose is sold off the roll: total rounded up to the next 0.5 m' },
  'j30-r9': { stepMm: 500, rule: 'fuel hose is sold off the roll: total rounded up to the next 0.5 m' },
  'j30-r14': { stepMm: 500, rule: 'fuel hose is sold off the roll: total rounded up to the next 0.5 m' },
  'j30-r10': { stepMm: 500, rule: 'fuel hose is sold off the roll: total rounded up to the next 0.5 m' },
  'ptfe-lined': { stepMm: 500, rule: 'fuel hose is sold off the roll: total rounded up to the next 0.5 m' },
  'j20-r4-radiator': { stepMm: 1000, rule: 'straight radiator hose is sold by the metre: total rounded up to the next whole metre (a moulded bend is one piece per hose)' },
  'hard-line': { stepMm: 1000, rule: 'tube is sold in lengths: total rounded up to the next whole metre' },
}

export function cutLengthMm(baseMm: number, percent: number, perEndMm: number): number {
  // 1e-9 keeps a length that is already whole from being pushed up by float noise.
  return Math.ceil(baseMm * (1 + percent / 100) + 2 * perEndMm - 1e-9)
}

export function hoseLines(ctx: AnalysisContext): HoseLine[] {
  const { percent, perEndMm } = ctx.doc.circuit.settings.allowance
  return ctx.model.hoses.map((h) => ({
    hoseId: h.hose.id,
    tag: h.tag,
    label: h.hose.params.label ?? null,
    fromText: endName(h.from),
    toText: endName(h.to),
    insideDiameterMm: h.hose.insideDiameterMm,
    wallMm: h.hose.wallMm,
    material: h.hose.material,
    drawnLengthMm: h.drawnLengthMm,
    measuredLengthMm: h.hose.measuredLengthMm ?? null,
    baseLengthMm: h.lengthMm,
    cutLengthMm: cutLengthMm(h.lengthMm, percent, perEndMm),
  }))
}

export function hoseTotals(lines: HoseLine[]): HoseTotal[] {
  const groups = new Map<string, HoseLine[]>()
  const boreTexts = new Map<number, string>()
  for (const l of lines) {
    let bore = boreTexts.get(l.insideDiameterMm)
    if (bore === undefined) { bore = l.insideDiameterMm.toFixed(2); boreTexts.set(l.insideDiameterMm, bore) }
    const key = `${l.material}|${bore}`
    const list = groups.get(key)
    if (list) list.push(l)
    else groups.set(key, [l])
  }
  const totals: HoseTotal[] = [...groups.values()].map((ls) => {
    const first = ls[0]!
    const cutTotalMm = ls.reduce((s, l) => s + l.cutLengthMm, 0)
    const sold = SOLD_BY[first.material]
    const metres = (Math.ceil(cutTotalMm / sold.stepMm - 1e-9) * sold.stepMm) / 1000
    return {
      material: first.material,
      insideDiameterMm: first.insideDiameterMm,
      pieces: ls.length,
      tags: ls.map((l) => l.tag),
      cutTotalMm,
      buy: { quantity: metres, unit: 'm' as const },
      rule: sold.rule,
    }
  })
  return totals.sort((a, b) => (a.material < b.material ? -1 : a.material > b.material ? 1 : a.insideDiameterMm - b.insideDiameterMm))
}
