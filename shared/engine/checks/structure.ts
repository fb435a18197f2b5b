// Checks on single ports and hoses: open ports, free hose ends, ports joined the wrong way, size misfits.
import { distanceMm } from '../../circuit'
import { makeFinding, type AnalysisContext, type Check } from '../context'
import { endName, fmt, hoseName, portName, size, type HoseEndInfo, type HoseInfo, type PortInfo } from '../model'
import type { Finding } from '../report'
import { hoseFit, nominalBoreFor } from '../sizes'

/** A free hose end this close to an open port is offered a one-click join. */
const JOIN_SNAP_MM = 100

export const openPorts: Check = (ctx) =>
  ctx.model.ports
    .filter((p) => !p.port.blocked && !p.joined)
    .map((p) =>
      makeFinding(
        ctx, 'open-port', 'error',
        `${portName(p)} (${size(p.port.spigotOdMm)} mm spigot) is open: no hose on it and no plug or cap. Coolant will pour out here.`,
        [p.port.id, p.comp.comp.id],
        `Fit a blanking cap for a ${size(p.port.spigotOdMm)} mm spigot, or join a hose to it.`,
        { type: 'block-port', portId: p.port.id },
      ),
    )

function nearestOpenPort(ctx: AnalysisContext, end: HoseEndInfo): PortInfo | null {
  let best: PortInfo | null = null
  let bestD = JOIN_SNAP_MM
  for (const p of ctx.model.ports) {
    if (p.port.blocked || p.joined) continue
    const d = distanceMm(p.world, end.point)
    if (d <= bestD && (best === null || d < bestD)) { best = p; bestD = d }
  }
  return best
}

export const danglingHoses: Check = (ctx) => {
  const out: Finding[] = []
  for (const h of ctx.model.hoses) {
    for (const end of [h.from, h.to]) {
      if (end.port) continue
      const near = nearestOpenPort(ctx, end)
      out.push(
        makeFinding(
          ctx, 'dangling-hose', 'error',
          `The ${end.name === 'from' ? 'first' : 'second'} end of ${hoseName(h)} is on no port (${endName(end)}).`,
          [h.hose.id],
          near ? `Join it to ${portName(near)}, ${fmt(distanceMm(near.world, end.point))} mm away.` : 'Join the end to a port, or remove the hose.',
          near ? { type: 'join-hose-end', hoseId: h.hose.id, end: end.name, portId: near.port.id } : undefined,
        ),
      )
    }
  }
  return out
}

/** Outlet joined to outlet, inlet to inlet: the drawing says coolant meets head-on. */
export const roleConflicts: Check = (ctx) => {
  const out: Finding[] = []
  for (const h of ctx.model.hoses) {
    const a = h.from.port
    const b = h.to.port
    if (!a || !b) continue
    const ra = a.port.role
    const rb = b.port.role
    if ((ra === 'outlet' || ra === 'inlet') && ra === rb) {
      out.push(
        makeFinding(
          ctx, 'direction-conflict', 'warning',
          `${hoseName(h)} joins two ${ra}s: ${portName(a)} and ${portName(b)}. Coolant cannot flow ${ra === 'outlet' ? 'out of both' : 'into both'}.`,
          [h.hose.id, a.port.id, b.port.id],
          `Move one end of ${h.tag} to ${ra === 'outlet' ? 'an inlet' : 'an outlet'}, or check the port roles on the parts.`,
        ),
      )
    }
  }
  return out
}

function misfitFinding(ctx: AnalysisContext, h: HoseInfo, end: HoseEndInfo, port: PortInfo): Finding | null {
  const rule = { looseMm: ctx.thresholds.fitLooseMm, stretchPercent: ctx.thresholds.fitStretchPercent }
  const bore = h.hose.insideDiameterMm
  const od = port.port.spigotOdMm
  const fit = hoseFit(bore, od, rule)
  if (fit === 'fits') return null
  const other = end.name === 'from' ? h.to.port : h.from.port
  const suited = nominalBoreFor(od, rule)
  const bothFit = suited !== null && (!other || hoseFit(suited, other.port.spigotOdMm, rule) === 'fits')
  const problem =
    fit === 'loose'
      ? `is ${size(bore - od)} mm bigger than the ${size(od)} mm spigot of ${portName(port)}: it would be clamped down onto it and leak`
      : `is ${size(od - bore)} mm smaller than the ${size(od)} mm spigot of ${portName(port)}: more than the ${fmt(rule.stretchPercent, 0)} % a hose can be stretched`
  const fixText = bothFit
    ? `Use ${size(suited!)} mm bore hose for ${h.tag}.`
    : `Fit a reducer or use a stepped hose: ${size(bore)} mm bore to ${size(od)} mm spigot${suited ? ` (a ${size(suited)} mm bore fits that spigot)` : ''}.`
  return makeFinding(
    ctx, 'size-mismatch', 'warning',
    `The ${size(bore)} mm bore of ${hoseName(h)} ${problem}.`,
    [h.hose.id, port.port.id],
    fixText,
    bothFit
      ? { type: 'set-hose-bore', hoseId: h.hose.id, insideDiameterMm: suited! }
      : { type: 'add-reducer', hoseId: h.hose.id, end: end.name, hoseBoreMm: bore, spigotOdMm: od },
  )
}

export const sizeMismatches: Check = (ctx) => {
  const out: Finding[] = []
  for (const h of ctx.model.hoses) {
    if (h.hose.material === 'hard-line') continue
    for (const end of [h.from, h.to]) {
      if (!end.port) continue
      const f = misfitFinding(ctx, h, end, end.port)
      if (f) out.push(f)
    }
  }
  return out
}
