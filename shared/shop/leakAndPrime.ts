// The fuel leak-test-and-prime procedure, generated from the drawing and its report: prime with the
// engine off and check every joint under pressure before anyone cranks it; then the first start.
// Common practice of the trade throughout; the figures are the drawing's own (check-values §7 for the
// pressures).
import type { CircuitDocument } from '../circuit'
import type { Report } from '../engine'
import { fuelCautions, fuelErrorStop } from './fuelCautions'
import { firstStartSteps, leakTestSteps, primeSteps } from './fuelSteps'
import { num } from './format'
import type { FuelProcedure, ProcedureStep } from './procedureTypes'
import { listText, step, tagsOf, uniqueIds } from './procedureText'

function prepareSteps(doc: CircuitDocument, report: Report): ProcedureStep[] {
  const out: ProcedureStep[] = []
  const hoses = report.quantities.hoses
  if (hoses.length > 0) {
    out.push(step('prepare', 'check', 'joints',
      `Before any fuel goes in, go over every joint: each hose pushed fully onto its spigot, past the bead, and each clamp seated square and tight (${listText(hoses.map((h) => h.tag))}).`,
      hoses.map((h) => h.hoseId)))
  }
  const fuel = report.quantities.fuel
  const pressureHoses = new Set((fuel?.lines ?? []).filter((l) => l.side === 'supply' || l.side === 'regulated').map((l) => l.hoseId))
  const wormOnPressure = report.quantities.clamps.filter((c) => c.kind === 'worm-drive' && pressureHoses.has(c.hoseId)).map((c) => c.hoseId)
  if (wormOnPressure.length > 0) {
    out.push(step('prepare', 'check', 'efi-clamps',
      `Hose ${listText(tagsOf(report, [...new Set(wormOnPressure)]))} on the pressure side has worm-drive clamps: their slots can cut into injection hose, and the usual choice there is an EFI clamp with a smooth band.`,
      [...new Set(wormOnPressure)], true))
  }
  const plugged = doc.circuit.components.flatMap((c) => c.ports.filter((p) => p.blocked && c.type !== 'injector').map((p) => ({ c, p })))
  if (plugged.length > 0) {
    out.push(step('prepare', 'check', 'plugs',
      `Check that every plug, cap and valve on a closed port is tight: ${listText(plugged.map(({ c, p }) => `${c.label} › ${p.name}`))}.`,
      plugged.map(({ p }) => p.id)))
  }
  const reg = fuel?.regulator
  if (reg?.reference === 'manifold') {
    out.push(step('prepare', 'check', 'reference',
      `Check the reference hose from ${reg.label} to the intake manifold (after the throttle) is on and clamped at both ends.`, [reg.componentId]))
  }
  out.push(step('prepare', 'step', 'cloths', 'Lay clean absorbent cloth under the joints you will check, so that a drip shows and is caught.', [], true))
  return out
}

function fillSteps(doc: CircuitDocument, report: Report): ProcedureStep[] {
  const tanks = doc.circuit.components.filter((c) => c.type === 'fuel-tank')
  const fuel = report.quantities.fuel
  const fuelName = fuel?.fuel.name ?? 'fuel'
  const lines = report.quantities.volume.totalL
  const out: ProcedureStep[] = []
  for (const t of tanks) {
    const quarter = t.type === 'fuel-tank' ? t.params.capacityL / 4 : 0
    out.push(step('fill', 'step', t.id,
      `Put fresh ${fuelName} in ${t.label}: enough to cover the pump's strainer well, about a quarter of its ${num(t.params.capacityL, 0)} L (${num(quarter, 0)} L).`, [t.id], true))
  }
  if (tanks.length === 0) out.push(step('fill', 'step', 'tank', `Put fresh ${fuelName} in the tank: enough to cover the pump's strainer well.`, [], true))
  out.push(step('fill', 'record', 'lines-volume',
    `Priming takes about ${num(lines, 2)} L from the tank into the lines and parts (the drawing's volume); note the level before and after.`))
  return out
}

export function leakAndPrimeProcedure(doc: CircuitDocument, report: Report): FuelProcedure {
  if (doc.circuit.kind !== 'fuel') throw new Error('the leak-and-prime procedure is for fuel circuits')
  const fuel = report.quantities.fuel
  const reg = fuel?.regulator ?? null
  const regulatorIds = fuel?.parts.filter((p) => p.role === 'regulator').map((p) => p.componentId) ?? []
  const hoseIds = report.quantities.hoses.map((h) => h.hoseId)
  const boosted = reg && reg.reference === 'manifold' && (fuel?.demand?.maxBoostKpa ?? 0) > 0 ? reg.railFullKpa : null
  const steps = uniqueIds([
    ...fuelCautions(regulatorIds),
    ...fuelErrorStop(report),
    ...prepareSteps(doc, report),
    ...fillSteps(doc, report),
    ...primeSteps(report),
    ...leakTestSteps(report),
    ...firstStartSteps(report),
  ])
  return {
    kind: 'fuel-leak-and-prime',
    available: true,
    title: 'Leak test and prime',
    circuitTitle: doc.circuit.title,
    engineVersion: report.engineVersion,
    steps,
    figures: {
      testPressureKpa: reg ? reg.basePressureKpa : null,
      fullBoostPressureKpa: boosted,
      returnStyle: reg?.style === 'return',
      linesVolumeL: report.quantities.volume.totalL,
      jointHoseIds: hoseIds,
    },
  }
}
