// Preparing, filling and bleeding: the steps before the engine runs.
import type { CircuitDocument } from '../circuit'
import type { Report } from '../engine'
import { bleedPoints, componentsOfType, drainPoints, ventLines, type Filler } from './circuitPoints'
import { num, temperatureText, volumeText } from './format'
import type { ProcedureStep } from './procedureTypes'
import { heightText, listText, step, tagsOf } from './procedureText'

const FLUID = { 'ethylene-glycol': 'ethylene glycol', 'propylene-glycol': 'propylene glycol' } as const

export function prepareSteps(doc: CircuitDocument, report: Report): ProcedureStep[] {
  const out: ProcedureStep[] = []
  const c = report.quantities.coolant
  if (c && c.mix.fluid !== 'water') {
    const conc = volumeText(c.concentrateL)
    const water = volumeText(c.waterL)
    out.push(step('prepare', 'step', 'mix',
      `Mix ${conc.metric} (${conc.imperial}) of ${FLUID[c.mix.fluid]} concentrate with ${water.metric} (${water.imperial}) of distilled water: ` +
      `${num(c.mix.percentByVolume)} % by volume. It freezes at about ${temperatureText(c.freezePointC).metric} and boils at about ` +
      `${temperatureText(c.boilingPointC).metric} under the ${num(c.capRatingKpa)} kPa cap.`))
  } else if (c) {
    out.push(step('prepare', 'step', 'mix', `Have ${volumeText(c.waterL).metric} of distilled water ready: the drawing sets a plain water fill, with no freeze protection.`))
  } else {
    out.push(step('prepare', 'check', 'mix', 'The drawing has no coolant settings: use the mix the engine maker gives.'))
  }
  const drains = drainPoints(doc)
  if (drains.length > 0) {
    out.push(step('prepare', 'check', 'drains', `Check that every drain is shut and its plug tight: ${listText(drains.map((d) => d.label))}.`,
      drains.map((d) => d.portId ?? d.componentId)))
  }
  const valves = componentsOfType(doc, 'heater-valve')
  const heaters = componentsOfType(doc, 'heater-core')
  if (valves.length > 0) {
    const shut = valves.filter((v) => v.params.open === false)
    out.push(step('prepare', 'step', 'heater-valve',
      `Open ${listText(valves.map((v) => v.label))} fully so the heater fills and bleeds too` +
      (shut.length > 0 ? ` (${listText(shut.map((v) => v.label))} is drawn shut).` : '.'), valves.map((v) => v.id)))
  }
  if (heaters.length > 0) {
    out.push(step('prepare', 'step', 'heater-control', `Set the heater control to full hot for ${listText(heaters.map((h) => h.label))}.`, heaters.map((h) => h.id)))
  }
  const electric = componentsOfType(doc, 'water-pump').filter((p) => p.params.drive === 'electric')
  if (electric.length > 0) {
    out.push(step('prepare', 'step', 'electric-pump',
      `${listText(electric.map((p) => p.label))} is electric: run it while filling and bleeding as its maker describes, since the engine alone does not turn it.`,
      electric.map((p) => p.id)))
  }
  return out
}

export function fillSteps(doc: CircuitDocument, report: Report, filler: Filler | null): ProcedureStep[] {
  const out: ProcedureStep[] = []
  const datum = doc.circuit.settings.datum
  if (!filler) {
    out.push(step('fill', 'check', 'no-filler', 'The drawing has no filler, cap or tank to fill through: add one to the drawing before filling.'))
    return out
  }
  const ids = [filler.componentId, ...(filler.portId ? [filler.portId] : [])]
  const capText = filler.pressurisedTank ? 'Take the tank cap off and fill the tank' : 'Take the cap off and fill'
  out.push(step('fill', 'step', 'where',
    `${capText} at ${filler.label} (${heightText(filler.zMm)}; heights are measured from: ${datum}).`, ids))
  out.push(step('fill', 'step', 'slowly', 'Pour slowly and steadily, so air can rise ahead of the coolant.', ids, true))
  for (const f of report.findings.filter((x) => x.code === 'fill-not-highest')) {
    out.push(step('fill', 'step', 'raise-filler',
      `${f.message} While filling and bleeding, lift the coolant level above those points: raise the vehicle at the filler end, or fit a spill-free funnel on the filler.`,
      f.elementIds, true))
  }
  return out
}

export function bleedSteps(doc: CircuitDocument, report: Report): ProcedureStep[] {
  const out: ProcedureStep[] = []
  const points = bleedPoints(doc)
  if (points.length > 0) {
    out.push(step('bleed', 'check', 'order',
      'Bleed from the lowest point up: open each bleed point in turn while filling, and close it as soon as coolant runs out with no air in it.', [], true))
    points.forEach((p, i) => {
      out.push(step('bleed', 'step', `open-${p.portId ?? p.componentId}`,
        `${i + 1}. Open ${p.label} (${heightText(p.zMm)}); close it when coolant comes out free of air.`, [p.portId ?? p.componentId]))
    })
  }
  const vents = ventLines(doc)
  if (vents.length > 0) {
    out.push(step('bleed', 'check', 'vent-lines',
      `${listText(vents.map((v) => `${v.label} (${tagsOf(report, [v.hoseId])[0]})`))} ${vents.length > 1 ? 'bleed' : 'bleeds'} into the tank by ${vents.length > 1 ? 'themselves' : 'itself'}: ` +
      'check the vent line is not kinked or pinched.', vents.flatMap((v) => [v.portId!, v.hoseId])))
  }
  if (points.length === 0 && vents.length === 0) {
    out.push(step('bleed', 'check', 'no-bleed', 'The drawing has no bleed screw, bleed valve or vent line: air can leave only through the filler.'))
  }
  for (const f of report.findings.filter((x) => x.code === 'air-trap')) {
    out.push(step('bleed', 'step', `air-trap-${f.elementIds[0] ?? 'point'}`,
      `Still flagged: ${f.message} While filling and again with the engine idling, raise that point or squeeze the hoses beside it so the air moves on to a vent. ` +
      `The lasting fix: ${f.fix.text}`, f.elementIds, true))
  }
  return out
}
