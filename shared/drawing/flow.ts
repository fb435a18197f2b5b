// The flow overlay: for each hose of a solved state, an arrow at the middle of its drawn length
// pointing the way the coolant goes, with L/min and m/s.
import type { FlowReport } from '../engine/flow/types'
import { pointAlong } from './hoseGeometry'
import type { ViewScene } from './scene'

export interface FlowMark {
  hoseId: string
  u: number
  v: number
  /** direction of flow on the plane, radians */
  angle: number
  flowLpm: number
  velocityMS: number
  /** false when the flow is below solver noise or the hose is on a branch that leads nowhere */
  moving: boolean
  label: string
}

/** Flows under 0.1 L/min are solver noise (docs/engine.md, direction-conflict). */
const NOISE_LPM = 0.1

const figure = (v: number, decimals: number) => v.toFixed(decimals)

export function flowLabel(flowLpm: number, velocityMS: number): string {
  const q = Math.abs(flowLpm)
  if (q < NOISE_LPM) return 'no flow'
  return `${figure(q, q < 10 ? 1 : 0)} L/min · ${figure(velocityMS, 2)} m/s`
}

export function flowMarks(scene: ViewScene, flow: FlowReport): FlowMark[] {
  if (!flow.solved) return []
  const marks: FlowMark[] = []
  for (const hf of flow.hoses) {
    const geom = scene.hoses.get(hf.hoseId)
    if (!geom) continue
    const mid = pointAlong(geom.flat, 0.5)
    if (!mid) continue
    const moving = hf.carriesFlow && Math.abs(hf.flowLpm) >= NOISE_LPM
    marks.push({
      hoseId: hf.hoseId, u: mid.u, v: mid.v, angle: hf.flowLpm >= 0 ? mid.angle : mid.angle + Math.PI,
      flowLpm: hf.flowLpm, velocityMS: hf.velocityMS, moving, label: flowLabel(hf.flowLpm, hf.velocityMS),
    })
  }
  return marks
}
