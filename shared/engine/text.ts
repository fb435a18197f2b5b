// The report as plain text for people at the bench (the CLI's --format text).
import { fmt, size } from './model'
import type { BranchKind, FlowReport } from './flow/types'
import { fuelTextLines } from './fuel/text'
import type { Report } from './report'

const SEVERITY_WORD = { error: 'ERROR', warning: 'WARNING', note: 'NOTE' } as const

/** What each kind of branch is, in words. */
const BRANCH_WORDS: Record<BranchKind, string> = {
  pump: 'pump', radiator: 'radiator', heater: 'heater', bypass: 'bypass', vent: 'vent line',
  feed: 'pump feed', return: 'main return', run: 'run',
}

function flowLines(name: string, f: FlowReport): string[] {
  if (!f.solved) return [`Flow, thermostat ${name}: ${f.reason}`]
  const lines = [
    `Flow, thermostat ${name} (${fmt(f.temperatureC, 0)} °C, ρ ${fmt(f.fluid.densityKgM3, 1)} kg/m³, μ ${fmt(f.fluid.viscosityPaS * 1000, 3)} mPa·s): pump ${fmt(f.pumpFlowLpm, 1)} L/min, rise ${fmt(f.pumpRiseKpa, 1)} kPa${f.converged ? '' : ' (did not settle)'}`,
    '  Branches, in the order the coolant reaches them (share of the pump flow; the branches leaving a part add up to what reached it):',
  ]
  for (const b of f.branches) {
    lines.push(`    ${BRANCH_WORDS[b.kind].padEnd(11)} ${fmt(b.flowLpm, 1).padStart(7)} L/min ${fmt(b.shareOfPump * 100, 0).padStart(4)} %  ${b.label}${b.tags.length ? ` (${b.tags.join(', ')})` : ''}`)
  }
  lines.push('  Hoses (loss in the hose itself: wall friction and bends):')
  for (const h of f.hoses) {
    if (!h.carriesFlow) continue
    lines.push(`    ${h.tag.padEnd(5)} ${fmt(h.flowLpm, 1).padStart(7)} L/min ${fmt(h.velocityMS, 2).padStart(6)} m/s  Re ${fmt(h.reynolds, 0).padStart(7)}  loss ${fmt(h.headLossKpa, 2)} kPa`)
  }
  lines.push('  Parts (drop from the port coolant enters by to the port it leaves by):')
  for (const p of f.parts) lines.push(`    ${p.label}: ${fmt(p.flowLpm, 1)} L/min through, drop ${fmt(p.dropKpa, 2)} kPa`)
  return lines
}

export function formatReportText(report: Report, title = ''): string {
  const q = report.quantities
  const out: string[] = []
  out.push(`Hosewright check${title ? `: ${title}` : ''} (engine ${report.engineVersion})`)
  out.push(`${report.counts.error} errors, ${report.counts.warning} warnings, ${report.counts.note} notes`, '')
  for (const f of report.findings) {
    out.push(`${SEVERITY_WORD[f.severity]} [${f.code}] ${f.message}`)
    out.push(`    Fix: ${f.fix.text}`)
  }
  out.push('', 'Hoses (cut lengths include the allowance):')
  for (const h of q.hoses) {
    out.push(`  ${h.tag.padEnd(5)} ${size(h.insideDiameterMm)} mm ${h.material}: cut ${h.cutLengthMm} mm (${h.measuredLengthMm !== null ? `measured ${fmt(h.measuredLengthMm, 0)}` : `drawn ${fmt(h.drawnLengthMm, 0)}`} mm) — ${h.fromText} to ${h.toText}`)
  }
  out.push('', 'Hose to buy:')
  for (const t of q.hoseTotals) out.push(`  ${size(t.insideDiameterMm)} mm ${t.material}: ${t.buy.quantity} ${t.buy.unit} (${t.pieces} ${t.pieces === 1 ? 'piece' : 'pieces'}, ${t.cutTotalMm} mm cut) — ${t.rule}`)
  out.push('', 'Clamps:')
  for (const c of q.clampCounts) out.push(`  ${c.count} × ${c.item} ${c.size}`)
  out.push('', 'Fittings:')
  for (const f of q.fittings) out.push(`  ${f.count} × ${f.item} ${f.size}`)
  for (const t of q.thermostats) out.push(`  thermostat ${t.label}: opens ${fmt(t.openingTempC, 0)} °C, fully open ${fmt(t.fullOpenTempC, 0)} °C${t.hasBypass ? ', bypass hole' : ''}`)
  for (const c of q.caps) out.push(`  pressure cap on ${c.label}: ${fmt(c.ratingKpa, 0)} kPa`)
  if (q.fuel) {
    // a fuel circuit: the fuel figures stand where the coolant and its flow solve would
    out.push('', `Fuel in the lines and parts: ${fmt(q.volume.totalL, 2)} L`, '', ...fuelTextLines(q.fuel))
    return out.join('\n') + '\n'
  }
  out.push('', `Coolant volume: ${fmt(q.volume.totalL, 2)} L`)
  if (q.coolant) {
    const c = q.coolant
    out.push(`  mix: ${fmt(c.concentrateL, 2)} L ${c.mix.fluid === 'water' ? 'glycol (none)' : c.mix.fluid} + ${fmt(c.waterL, 2)} L distilled water`)
    out.push(`  freezes at ${fmt(c.freezePointC, 1)} °C (${c.freezePointSource})`)
    out.push(`  boils at ${fmt(c.boilingPointC, 1)} °C under a ${fmt(c.capRatingKpa, 0)} kPa cap (${c.boilingPointSource})`)
    out.push(`  grows by ${fmt(c.expansionL, 2)} L when hot`)
  }
  out.push('', ...flowLines('open', report.flow.open), '', ...flowLines('shut', report.flow.closed))
  return out.join('\n') + '\n'
}
