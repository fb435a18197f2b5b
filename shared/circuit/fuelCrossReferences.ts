import type { CircuitIssue } from './crossReferences'
import type { CircuitDocument } from './document'

/** Fuel checks the schema alone cannot make: settings that belong to the other kind, pump curves in order. */
export function fuelCrossReferenceIssues(doc: CircuitDocument): CircuitIssue[] {
  const issues: CircuitIssue[] = []
  const c = doc.circuit
  if (c.kind === 'coolant' && c.settings.fuel) {
    issues.push({ path: 'circuit.settings.fuel', message: 'A coolant circuit takes no fuel settings' })
  }
  c.components.forEach((comp, ci) => {
    if (comp.type !== 'in-tank-pump' && comp.type !== 'inline-pump') return
    const points = comp.params.curve
    points.forEach((pt, i) => {
      const prev = points[i - 1]
      const base = `circuit.components[${ci}].params.curve[${i}]`
      if (prev && pt.pressureKpa <= prev.pressureKpa) {
        issues.push({ path: `${base}.pressureKpa`, message: 'Curve pressures must rise from point to point' })
      }
      if (prev && pt.flowLph > prev.flowLph) {
        issues.push({ path: `${base}.flowLph`, message: 'Curve flow must not rise with pressure' })
      }
    })
  })
  return issues
}
