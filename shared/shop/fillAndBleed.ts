// The coolant fill-and-bleed procedure, generated from the drawing and its report.
import type { CircuitDocument } from '../circuit'
import type { Report } from '../engine'
import { bleedPoints, componentsOfType, fillers, hosesOn, type Filler } from './circuitPoints'
import { standardCautions, errorStop } from './cautions'
import { prepareSteps, fillSteps, bleedSteps } from './fillSteps'
import { litresToUsQuarts, temperatureText, volumeText } from './format'
import { pressureTestSteps, testPressureKpa } from './pressureTest'
import type { CoolantProcedure, CoolantProcedureFigures, ProcedureStep } from './procedureTypes'
import { listText, step, tagsOf, uniqueIds } from './procedureText'

function layoutOf(filler: Filler | null): CoolantProcedureFigures['layout'] {
  if (!filler) return 'no-filler'
  return filler.pressurisedTank ? 'pressurised-tank' : 'open-filler'
}

function warmUpSteps(doc: CircuitDocument, report: Report, filler: Filler | null): ProcedureStep[] {
  const layout = layoutOf(filler)
  const fillerIds = filler ? [filler.componentId] : []
  const out: ProcedureStep[] = []
  out.push(step('warm-up', 'step', 'start',
    layout === 'pressurised-tank'
      ? `Put the cap on ${filler!.label} loosely, not sealed, so air can still escape; start the engine and let it idle.`
      : layout === 'open-filler'
        ? `Leave ${filler!.label} open, start the engine and let it idle; keep the level up to the filler neck as air comes out.`
        : 'Start the engine and let it idle.',
    fillerIds))
  const stats = report.quantities.thermostats
  if (stats.length > 0) {
    const temps = [...new Set(stats.map((t) => t.openingTempC))].map((c) => { const t = temperatureText(c); return `${t.metric} (${t.imperial})` })
    out.push(step('warm-up', 'step', 'thermostat',
      `Keep it idling until the thermostat opens at its stamped ${listText(temps)}: ${listText(stats.map((t) => t.label))}.`, stats.map((t) => t.componentId)))
    const valved = componentsOfType(doc, 'thermostat').map((t) => t.params.valvedPortId)
    const radiatorHoses = doc.circuit.hoses.filter((h) => valved.includes(h.from.portId ?? '') || valved.includes(h.to.portId ?? '')).map((h) => h.id)
    if (radiatorHoses.length > 0) {
      out.push(step('warm-up', 'check', 'opening',
        `When it opens, hose ${listText(tagsOf(report, radiatorHoses))} on the radiator side warms quickly and the level drops: top up at once.`, radiatorHoses, true))
    }
  } else {
    out.push(step('warm-up', 'step', 'thermostat', 'The drawing has no thermostat: idle until the engine reaches the working temperature its maker gives.'))
  }
  const heaterHoses = hosesOn(doc, new Set(componentsOfType(doc, 'heater-core').map((h) => h.id)))
  if (heaterHoses.length > 0) {
    out.push(step('warm-up', 'step', 'squeeze-heater',
      `Squeeze the heater hoses ${listText(tagsOf(report, heaterHoses))} a few times while it idles, to push trapped air on to the filler.`, heaterHoses, true))
  }
  const points = bleedPoints(doc)
  if (points.length > 0) {
    out.push(step('warm-up', 'step', 'bleed-again',
      `Open the bleed points again in the same order, lowest first, until no more air comes out: ${listText(points.map((p) => p.label))}.`,
      points.map((p) => p.portId ?? p.componentId)))
  }
  out.push(step('warm-up', 'step', 'close',
    layout === 'pressurised-tank'
      ? `Top up ${filler!.label} to the cold mark, fit its cap fully and switch the engine off.`
      : layout === 'open-filler'
        ? `Top up to the neck, fit the cap on ${filler!.label} and switch the engine off.${overflowText(doc)}`
        : 'Switch the engine off.',
    fillerIds))
  return out
}

function overflowText(doc: CircuitDocument): string {
  const bottles = componentsOfType(doc, 'overflow-bottle')
  return bottles.length > 0 ? ` Fill ${listText(bottles.map((b) => b.label))} to the cold mark.` : ''
}

function topUpSteps(report: Report, filler: Filler | null): ProcedureStep[] {
  const v = volumeText(report.quantities.volume.totalL)
  const fillerIds = filler ? [filler.componentId] : []
  return [
    step('top-up', 'step', 'cool', 'Let the engine cool down completely: the cap and the top hose cool to the bare hand before anything is opened.'),
    step('top-up', 'step', 'level',
      filler
        ? `Check the level at ${filler.label} and top up with the same mix to ${filler.pressurisedTank ? 'the cold mark' : 'the neck'}; refit the cap.`
        : 'Check the coolant level and top up with the same mix.',
      fillerIds),
    step('top-up', 'record', 'volume', `Record how much coolant went in. The drawing holds ${v.metric} (${v.imperial}).`),
    step('top-up', 'check', 'volume-short', 'If clearly less went in than the drawing holds, air is still trapped: bleed again.', [], true),
    step('top-up', 'check', 'after-drive', 'Check the level again cold after the first drive and top up once more.', fillerIds, true),
  ]
}

/** The fill, bleed, warm-up, top-up and pressure-test steps for a coolant circuit; cautions first. */
export function fillAndBleedProcedure(document: CircuitDocument, report: Report): CoolantProcedure {
  if (document.circuit.kind !== 'coolant') throw new Error(`a fill-and-bleed procedure is for coolant circuits, not ${document.circuit.kind}`)
  const filler = fillers(document)[0] ?? null
  const test = testPressureKpa(report)
  const steps: ProcedureStep[] = uniqueIds([
    ...standardCautions(report.quantities.caps.map((c) => c.componentId)),
    ...errorStop(report),
    ...prepareSteps(document, report),
    ...fillSteps(document, report, filler),
    ...bleedSteps(document, report),
    ...warmUpSteps(document, report, filler),
    ...topUpSteps(report, filler),
    ...pressureTestSteps(report, filler),
  ])
  return {
    kind: 'coolant-fill-and-bleed',
    available: true,
    title: 'Fill, bleed and pressure test',
    circuitTitle: document.circuit.title,
    engineVersion: report.engineVersion,
    steps,
    figures: {
      fillVolumeL: report.quantities.volume.totalL,
      fillVolumeUsQuarts: litresToUsQuarts(report.quantities.volume.totalL),
      thermostatOpeningC: report.quantities.thermostats.map((t) => t.openingTempC),
      testPressureKpa: test?.kpa ?? null,
      fillerId: filler?.componentId ?? null,
      layout: layoutOf(filler),
      bleedOrder: bleedPoints(document).map((p) => p.portId ?? p.componentId),
    },
  }
}
