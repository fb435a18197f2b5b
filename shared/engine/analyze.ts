import type { CircuitDocument } from '../circuit'
import { missingParts, noCirculation, noWarmUpBypass } from './checks/circulation'
import { deadLegs } from './checks/deadLegs'
import { flowFindings } from './checks/flowChecks'
import { fluidFindings } from './checks/fluid'
import { airTraps, fillNotHighest } from './checks/heights'
import { danglingHoses, openPorts, roleConflicts, sizeMismatches } from './checks/structure'
import { buildContext, type AnalysisContext, type Check } from './context'
import { analyzeFuel, withoutSupersededOpenPorts } from './fuel/analyzeFuel'
import { solveState } from './flow/solve'
import { capLines, clampCounts, clampLines, fittingCounts, thermostatLines } from './quantities/parts'
import { hoseLines, hoseTotals } from './quantities/hoses'
import type { Quantities } from './quantities/types'
import { coolantQuantities, systemVolume } from './quantities/volume'
import type { Finding, Report, Severity } from './report'

export const ENGINE_VERSION = '1.0.0'

const LAYOUT_CHECKS: Check[] = [openPorts, danglingHoses, roleConflicts, sizeMismatches, deadLegs, noCirculation, noWarmUpBypass, missingParts, airTraps, fillNotHighest]

const SEVERITY_ORDER: Record<Severity, number> = { error: 0, warning: 1, note: 2 }

function sortFindings(ctx: AnalysisContext, findings: Finding[]): Finding[] {
  const keyed = findings.map((f) => ({ f, severity: SEVERITY_ORDER[f.severity], rank: f.elementIds.length > 0 ? ctx.model.rankOf(f.elementIds[0]!) : -1 }))
  keyed.sort(
    (a, b) =>
      a.severity - b.severity ||
      (a.f.code < b.f.code ? -1 : a.f.code > b.f.code ? 1 : 0) ||
      a.rank - b.rank ||
      (a.f.message < b.f.message ? -1 : a.f.message > b.f.message ? 1 : 0),
  )
  return keyed.map((k) => k.f)
}

export function computeQuantities(ctx: AnalysisContext): Quantities {
  const hoses = hoseLines(ctx)
  const clamps = clampLines(ctx)
  const volume = systemVolume(ctx)
  const coolant = ctx.doc.circuit.settings.coolant
  return {
    hoses,
    hoseTotals: hoseTotals(hoses),
    clamps,
    clampCounts: clampCounts(clamps),
    fittings: fittingCounts(ctx),
    thermostats: thermostatLines(ctx),
    caps: capLines(ctx),
    volume,
    coolant: ctx.doc.circuit.kind === 'coolant' && coolant ? coolantQuantities(coolant, volume.totalL) : null,
  }
}

/**
 * Checks a circuit and works out its quantities and flows. Deterministic: the same circuit gives the
 * same report whatever the order of its elements or the names of its ids (the ids themselves appear
 * in elementIds and fix actions).
 */
export function analyzeCircuit(doc: CircuitDocument): Report {
  const ctx = buildContext(doc)
  let findings: Finding[] = LAYOUT_CHECKS.flatMap((check) => check(ctx))
  const quantities = computeQuantities(ctx)
  findings.push(...fluidFindings(ctx, quantities.coolant))
  const open = solveState(ctx, 'open')
  const closed = solveState(ctx, 'closed')
  findings.push(...flowFindings(ctx, open, closed))
  if (doc.circuit.kind === 'fuel') {
    // fuel checks never run on a coolant circuit, and a coolant report has no fuel block at all
    const fuel = analyzeFuel(ctx)
    findings = withoutSupersededOpenPorts([...findings, ...fuel.findings])
    quantities.fuel = fuel.quantities
  }
  const sorted = sortFindings(ctx, findings)
  const counts = { error: 0, warning: 0, note: 0 }
  for (const f of sorted) counts[f.severity]++
  return { engineVersion: ENGINE_VERSION, findings: sorted, counts, quantities, flow: { open: open.report, closed: closed.report } }
}
