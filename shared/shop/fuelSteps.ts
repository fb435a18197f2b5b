// The prime, leak-test and first-start steps of the fuel procedure. Rules of thumb are marked; the
// pressures are the drawing's regulator and boost settings.
import type { Report } from '../engine'
import { pressureText } from './format'
import type { ProcedureStep } from './procedureTypes'
import { listText, step, tagsOf } from './procedureText'

/** "3 bar (300 kPa), 43.5 psi", for the step texts. */
export const pressureWords = (kpa: number): string => {
  const p = pressureText(kpa)
  return `${p.metric}, ${p.imperial}`
}

export function primeSteps(report: Report): ProcedureStep[] {
  const fuel = report.quantities.fuel
  const reg = fuel?.regulator
  const pump = fuel?.pump
  const out: ProcedureStep[] = [
    step('prime', 'step', 'battery', 'Connect the battery again; leave the engine switched off.'),
    step('prime', 'step', 'key-on',
      `Switch the ignition on without cranking, so ${pump ? pump.label : 'the pump'} runs for its few seconds and stops; switch off and on again, 3 to 5 times, ` +
      'until the pump no longer labours and the pressure holds.', pump ? [pump.componentId] : [], true),
  ]
  if (reg) {
    out.push(step('prime', 'check', 'base-pressure',
      `On a gauge at the rail's test valve the pressure settles at the regulator's base pressure, ${pressureWords(reg.basePressureKpa)}, gauge: with the engine off the manifold is at atmosphere, so a referenced regulator reads its base too.`,
      [reg.componentId]))
  } else {
    out.push(step('prime', 'check', 'base-pressure', 'The drawing has no pressure regulator: read the pressure the pump and injector makers call for, and go no further than that.'))
  }
  const returns = (fuel?.lines ?? []).filter((l) => l.side === 'return').map((l) => l.hoseId)
  if (reg?.style === 'return' && returns.length > 0) {
    out.push(step('prime', 'check', 'return-flow',
      `Fuel runs back to the tank through ${listText(tagsOf(report, returns))} whenever the pump runs: you hear or feel it in the return line.`, returns, true))
  }
  return out
}

export function leakTestSteps(report: Report): ProcedureStep[] {
  const out: ProcedureStep[] = []
  const reg = report.quantities.fuel?.regulator
  const at = reg ? ` at ${pressureWords(reg.basePressureKpa)}` : ''
  for (const h of report.quantities.hoses) {
    out.push(step('leak-test', 'check', h.hoseId,
      `With the system primed${at} and the engine off, check ${h.tag}${h.label ? ` (${h.label})` : ''} at both ends, ${h.fromText} and ${h.toText}, and along its length: wipe each joint with a dry cloth; any wet joint fails.`,
      [h.hoseId]))
  }
  out.push(
    step('leak-test', 'check', 'hold',
      'Switch the ignition off and watch the gauge for about 5 minutes: the pressure should hold near the base pressure or fall only slowly. ' +
      'A quick fall with every joint dry points to the pump\'s check valve, the regulator or an injector.', reg ? [reg.componentId] : [], true),
    step('leak-test', 'record', 'pressures', 'Record the pressure at key-on and after 5 minutes, and which joints were checked dry.'),
    step('leak-test', 'step', 'leak',
      'If a joint weeps: relieve the pressure and disconnect the battery (see the cautions), remake the joint, then prime and check again from the start.'),
  )
  return out
}

export function firstStartSteps(report: Report): ProcedureStep[] {
  const fuel = report.quantities.fuel
  const reg = fuel?.regulator
  const boost = fuel?.demand?.maxBoostKpa ?? 0
  const hoses = report.quantities.hoses.map((h) => h.hoseId)
  const out: ProcedureStep[] = [
    step('warm-up', 'step', 'start', 'Only when every joint is dry: start the engine and let it idle. Keep the extinguisher at hand.'),
    step('warm-up', 'check', 'running', `While it idles, check every joint again: ${listText(report.quantities.hoses.map((h) => h.tag))}.`, hoses),
  ]
  if (reg?.reference === 'manifold') {
    out.push(step('warm-up', 'check', 'idle-pressure',
      `At idle the manifold's vacuum takes the rail pressure below the base ${pressureWords(reg.basePressureKpa)} by about the vacuum, typically 50–70 kPa (7–10 psi); ` +
      'pull the reference hose off and plug it, and the pressure comes back up to base.', [reg.componentId], true))
    if (boost > 0) {
      out.push(step('warm-up', 'check', 'boost-pressure',
        `Under boost the rail pressure rises 1:1 with it: at the full ${pressureWords(boost)} of boost expect ${pressureWords(reg.railFullKpa)} (base + boost). Check it on the road or a dynamometer with a gauge the driver can read safely.`,
        [reg.componentId]))
    }
  }
  out.push(
    step('warm-up', 'check', 'hot', 'Once the engine is warm, check every joint once more: hoses soften and clamps settle when hot.', hoses),
    step('warm-up', 'check', 'after-drive', 'Check the joints and clamps again after the first drive and after about 100 km.', hoses, true),
  )
  return out
}
