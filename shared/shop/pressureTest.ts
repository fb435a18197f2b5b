// The cold pressure test and the cap test. Common practice (check-values §7): cold, at the cap
// rating and not above, no drop over about 2 minutes (some shops 10–15); the cap on an adapter holds
// its rating within about ±1–2 psi.
import type { Report } from '../engine'
import { pressureText } from './format'
import type { ProcedureStep } from './procedureTypes'
import { step } from './procedureText'
import type { Filler } from './circuitPoints'

/** The lowest fitted cap is the first to lift, so the system is tested at its rating. */
export function testPressureKpa(report: Report): { kpa: number; capIds: string[] } | null {
  const caps = report.quantities.caps
  if (caps.length === 0) return null
  const kpa = Math.min(...caps.map((c) => c.ratingKpa))
  return { kpa, capIds: caps.filter((c) => c.ratingKpa === kpa).map((c) => c.componentId) }
}

export function pressureTestSteps(report: Report, filler: Filler | null): ProcedureStep[] {
  const test = testPressureKpa(report)
  const at = filler ? filler.label : 'the filler'
  const fillerIds = filler ? [filler.componentId, ...(filler.portId ? [filler.portId] : [])] : []
  const out: ProcedureStep[] = [
    step('pressure-test', 'step', 'cold', `With the engine cold, take the cap off ${at} and fit the pressure tester with the adapter for that neck.`, fillerIds),
  ]
  if (!test) {
    out.push(step('pressure-test', 'check', 'no-cap',
      'The drawing has no pressure cap, so there is no rating to test at: use the test pressure the engine maker gives, and never more than the weakest part is rated for.'))
    return out
  }
  const p = pressureText(test.kpa)
  out.push(
    step('pressure-test', 'step', 'pump',
      `Pump the system to the cap rating, ${p.metric}, ${p.imperial}, gauge, and not above it.`, test.capIds),
    step('pressure-test', 'check', 'hold',
      'Hold the pressure and watch the gauge: it should not drop over about 2 minutes (some shops hold it 10–15 minutes).', [], true),
    step('pressure-test', 'check', 'pass',
      'Pass: the gauge holds and no joint, hose, bleed screw or drain weeps. Any drop fails: find the leak, put it right and test again. ' +
      'A drop with no leak to be seen points inside the engine: go by the engine maker\'s data.', [], true),
    step('pressure-test', 'step', 'cap',
      `Test the cap itself on the tester with its adapter: it should hold about its rating, ${p.imperial}, within about ±1–2 psi, and not far above.`,
      test.capIds, true),
    step('pressure-test', 'record', 'readings',
      'Record the test pressure, the hold time, the gauge reading at the end and the cap\'s result, then refit the cap.', test.capIds),
  )
  return out
}
