// How fuel moves through a fuel circuit's drawing: walks from a port along hoses and through parts.
// Passive parts (filters, rails, tees, adapters …) pass fuel from the port it enters by to all their
// other open ports; tanks and bulkhead fittings (which open into a tank), pumps, regulators and
// injectors end a walk unless the caller lets it through. The sides of the circuit come from walks:
// - pressure side: from each pump's outlet ports, through a regulator's inlet and feed-on ports (not
//   its outlet ports: by our convention a regulator's ports marked `outlet` are its return);
// - return side: from each regulator's outlet ports;
// - suction side: from an inline pump's inlet ports back to the tank.
import type { ComponentType } from '../../circuit'
import type { AnalysisContext } from '../context'
import type { CompInfo, HoseInfo, PortInfo } from '../model'

export const PUMP_TYPES: ReadonlySet<ComponentType> = new Set(['in-tank-pump', 'inline-pump'])
/** Where fuel goes into (or comes out of) the tank itself. */
export const TANK_TYPES: ReadonlySet<ComponentType> = new Set(['fuel-tank', 'bulkhead-fitting'])
const STOP_TYPES: ReadonlySet<ComponentType> = new Set([...PUMP_TYPES, ...TANK_TYPES, 'fuel-regulator', 'injector'])

export const isPump = (c: CompInfo) => PUMP_TYPES.has(c.comp.type)
export const isTank = (c: CompInfo) => TANK_TYPES.has(c.comp.type)
export const isRegulator = (c: CompInfo) => c.comp.type === 'fuel-regulator'
/** A regulator's return ports: the ones marked `outlet`. */
export const isReturnPort = (p: PortInfo) => p.port.role === 'outlet'

export interface Arrival {
  comp: CompInfo
  /** the port fuel arrives by */
  port: PortInfo
}

export interface Walk {
  /** hoses passed, in the order they were reached */
  hoses: HoseInfo[]
  /** parts fuel passes through (not the ones a walk ends at) */
  through: CompInfo[]
  /** parts a walk ends at, with the port it arrives by */
  reached: Arrival[]
  /** hoses whose far end is on no port */
  freeEnds: HoseInfo[]
}

/**
 * Breadth first from the given ports. `onward` decides, for a part reached by a port, which of its
 * ports the walk goes on from (null: it ends there). By default passive parts pass fuel on through
 * every other open port and the stop types end the walk.
 */
export function walkFrom(
  _ctx: AnalysisContext, starts: readonly PortInfo[], onward: (comp: CompInfo, entered: PortInfo) => PortInfo[] | null = defaultOnward,
): Walk {
  const out: Walk = { hoses: [], through: [], reached: [], freeEnds: [] }
  const seenHose = new Set<HoseInfo>()
  const seenPort = new Set<PortInfo>(starts)
  const throughSet = new Set<CompInfo>()
  const queue: PortInfo[] = [...starts]
  for (let i = 0; i < queue.length; i++) {
    const at = queue[i]!
    const h = at.joined
    if (!h || seenHose.has(h)) continue
    seenHose.add(h)
    out.hoses.push(h)
    const far = h.from.port === at ? h.to : h.from
    if (!far.port) { out.freeEnds.push(h); continue }
    if (seenPort.has(far.port)) continue
    seenPort.add(far.port)
    const comp = far.port.comp
    const next = onward(comp, far.port)
    if (next === null) { out.reached.push({ comp, port: far.port }); continue }
    if (!throughSet.has(comp)) { throughSet.add(comp); out.through.push(comp) }
    for (const p of next) if (!seenPort.has(p)) { seenPort.add(p); queue.push(p) }
  }
  return out
}

/** Passive parts pass fuel to their other open ports; tanks, pumps, regulators and injectors end a walk. */
export function defaultOnward(comp: CompInfo, entered: PortInfo): PortInfo[] | null {
  if (STOP_TYPES.has(comp.comp.type)) return null
  return comp.ports.filter((p) => p !== entered && !p.port.blocked)
}

/** On the pressure side a regulator passes fuel from the port it enters by to its other non-return ports. */
export function pressureOnward(comp: CompInfo, entered: PortInfo): PortInfo[] | null {
  if (!isRegulator(comp)) return defaultOnward(comp, entered)
  if (isReturnPort(entered)) return null
  return comp.ports.filter((p) => p !== entered && !p.port.blocked && !isReturnPort(p))
}

/** A pump's ports fuel leaves by (its outlets) and enters by (the rest), open ones only. */
export const pumpOutlets = (c: CompInfo) => c.ports.filter((p) => p.port.role === 'outlet' && !p.port.blocked)
export const pumpInlets = (c: CompInfo) => c.ports.filter((p) => p.port.role !== 'outlet' && !p.port.blocked)
