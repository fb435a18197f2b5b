import type { CircuitDocument } from './document'
import { fuelCrossReferenceIssues } from './fuelCrossReferences'

export interface CircuitIssue {
  /** where in the document, e.g. circuit.hoses[3].to.portId */
  path: string
  message: string
}

/**
 * Checks that the schema alone cannot make: ids unique across parts, ports and hoses; hose ends on ports
 * that exist; one hose end per port; settings a kind needs; values that must agree with each other.
 */
export function crossReferenceIssues(doc: CircuitDocument): CircuitIssue[] {
  const issues: CircuitIssue[] = []
  const c = doc.circuit
  const seen = new Map<string, string>()
  const portOwner = new Map<string, number>()
  const claim = (id: string, path: string) => {
    const first = seen.get(id)
    if (first !== undefined) issues.push({ path, message: `Id "${id}" is already used at ${first}` })
    else seen.set(id, path)
  }

  c.components.forEach((comp, ci) => {
    claim(comp.id, `circuit.components[${ci}].id`)
    comp.ports.forEach((p, pi) => {
      claim(p.id, `circuit.components[${ci}].ports[${pi}].id`)
      if (!portOwner.has(p.id)) portOwner.set(p.id, ci)
    })
    if (comp.type === 'thermostat') {
      const base = `circuit.components[${ci}].params`
      if (!comp.ports.some((p) => p.id === comp.params.valvedPortId)) {
        issues.push({ path: `${base}.valvedPortId`, message: `"${comp.params.valvedPortId}" is not a port of this thermostat` })
      }
      if (comp.params.fullOpenTempC <= comp.params.openingTempC) {
        issues.push({ path: `${base}.fullOpenTempC`, message: 'Full-open temperature must be above the opening temperature' })
      }
    }
  })

  const joinedBy = new Map<string, string>()
  c.hoses.forEach((h, hi) => {
    claim(h.id, `circuit.hoses[${hi}].id`)
    for (const endName of ['from', 'to'] as const) {
      const end = h[endName]
      const path = `circuit.hoses[${hi}].${endName}`
      if (end.portId === null) {
        if (!end.point) issues.push({ path: `${path}.point`, message: 'A free hose end needs a point' })
        continue
      }
      if (end.point) issues.push({ path: `${path}.point`, message: 'A hose end on a port takes its position from the port; remove the point' })
      const owner = portOwner.get(end.portId)
      if (owner === undefined) {
        issues.push({ path: `${path}.portId`, message: `No port has the id "${end.portId}"` })
        continue
      }
      const other = joinedBy.get(end.portId)
      if (other !== undefined) {
        issues.push({ path: `${path}.portId`, message: `Port "${end.portId}" already has a hose at ${other}` })
      } else joinedBy.set(end.portId, `${path}.portId`)
      const port = c.components[owner]?.ports.find((p) => p.id === end.portId)
      if (port?.blocked) issues.push({ path: `${path}.portId`, message: `Port "${end.portId}" is blocked; unblock it or move the hose` })
    }
  })

  if (c.kind === 'coolant' && !c.settings.coolant) {
    issues.push({ path: 'circuit.settings.coolant', message: 'A coolant circuit needs coolant settings' })
  }
  if (c.kind === 'fuel' && c.settings.coolant) {
    issues.push({ path: 'circuit.settings.coolant', message: 'A fuel circuit takes no coolant settings' })
  }
  const pump = c.settings.coolant?.pump
  if (pump?.mode === 'curve') {
    pump.points.forEach((pt, i) => {
      const prev = pump.points[i - 1]
      if (prev && pt.flowLpm <= prev.flowLpm) {
        issues.push({ path: `circuit.settings.coolant.pump.points[${i}].flowLpm`, message: 'Curve flows must rise from point to point' })
      }
      if (prev && pt.headM > prev.headM) {
        issues.push({ path: `circuit.settings.coolant.pump.points[${i}].headM`, message: 'Curve head must not rise with flow' })
      }
    })
  }
  issues.push(...fuelCrossReferenceIssues(doc))
  return issues
}
