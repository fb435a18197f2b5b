// The fuel figures of a report as plain text (the CLI's --format text), beside the coolant ones.
import { fmt } from '../model'
import type { FuelQuantities } from './types'

export function fuelTextLines(f: FuelQuantities): string[] {
  const out = [`Fuel: ${f.fuel.name}, ${fmt(f.fuel.densityKgL, 3)} kg/L (${f.fuel.source})`]
  const d = f.demand
  if (d) {
    out.push(`  demand at ${fmt(d.powerKw, 0)} kW (${fmt(d.powerHp, 0)} hp), ${fmt(d.bsfcGPerKwh, 0)} g/kWh (${fmt(d.bsfcLbPerHpH, 3)} lb/(hp·h)): ${fmt(d.massKgH, 1)} kg/h, ${fmt(d.volumeLph, 1)} L/h`)
  }
  const r = f.regulator
  if (r) {
    out.push(`  regulator ${r.label}: ${r.style}, ${r.reference === 'manifold' ? 'manifold-referenced' : 'not referenced'}; rail ${fmt(r.railIdleKpa, 0)} kPa at base, ${fmt(r.railFullKpa, 0)} kPa at full boost; ${fmt(r.injectorDeltaPFullKpa, 0)} kPa across the injectors`)
  }
  const p = f.pump
  if (p) {
    out.push(`  pump ${p.label}: ${fmt(p.idle.pumpFlowLph, 0)} L/h at ${fmt(p.idle.pumpOutletKpa, 0)} kPa (idle), ${fmt(p.full.pumpFlowLph, 0)} L/h at ${fmt(p.full.pumpOutletKpa, 0)} kPa (full power)` +
      (p.requiredLph !== null ? `; needs ${fmt(p.requiredLph, 0)} L/h with a ${fmt(p.marginPercent, 0)} % margin` : ''))
  }
  const i = f.injectors
  if (i) {
    for (const s of i.sets) out.push(`  injectors ${s.label}: ${s.count} × ${fmt(s.ratedFlowCcMin, 0)} cc/min at ${fmt(s.ratedPressureKpa, 0)} kPa, ${fmt(s.flowAtFullCcMin, 0)} cc/min at full power`)
    if (i.dutyPercent !== null) out.push(`  duty at the target power: ${Number.isFinite(i.dutyPercent) ? `${fmt(i.dutyPercent, 1)} %` : 'more than all the time'}`)
  }
  if (f.returnLph) out.push(`  return: ${fmt(f.returnLph.idle, 0)} L/h at idle, ${fmt(f.returnLph.full, 0)} L/h at full power`)
  out.push('  Lines:')
  for (const l of f.lines) {
    out.push(`    ${l.tag.padEnd(5)} ${l.side.padEnd(9)} ${fmt(l.flowLph, 0).padStart(5)} L/h (${l.at}) ${fmt(l.velocityMS, 2).padStart(5)} m/s (limit ${fmt(l.limitMS, 1)})  drop ${fmt(l.dropKpa, 2)} kPa`)
  }
  out.push(`  ${f.model}`)
  return out
}
