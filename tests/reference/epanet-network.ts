// Runs one of our networks through EPANET (epanet-js, the OWA-EPANET toolkit compiled to WASM) for
// comparison. The network is written as EPANET input text with the Darcy–Weisbach head-loss option:
//   Units LPM (lengths m, bores mm, D-W roughness mm), Viscosity relative to EPANET's water at 20 °C
//   (1.1e-5 ft²/s = 1.0219e-6 m²/s, the VISCOS constant of the EPANET sources, from memory; the laminar
//   comparison in the tests would show a wrong value at once).
// Mapping: reference node → reservoir at its head; fixed-flow pump → a withdrawal at its inlet and an
// injection at its outlet (EPANET has no fixed-flow pump); curve pump → pump with a HEAD curve
// (EPANET fits h = A − B·Q^C through three points with the first at Q = 0: use curves that are
// quadratics with no linear term and both agree exactly); lumped K resistance → TCV (setting = K at its
// bore); rated-drop resistance → TCV with the K that gives that drop on a 25 mm bore.
//
// EPANET's head-loss arithmetic works in US units with rounded constants: g = 32.2 ft/s² in the
// Darcy–Weisbach term and 0.02517 (≈ 8/(g·π²)) for minor losses. Measured on a single pipe between two
// reservoirs, its losses are 0.0795 % (friction) and 0.0107 % (minor) below the exact-g values. With
// `matchGravity` (default) we scale lengths by 32.2/32.17405 and K by 8/(32.17405·π²·0.02517) so that
// EPANET computes the exact-g losses and the comparison sees only the solver and the friction law.
// EPANET also refuses a roughness of 0; a smooth wall is written as 1e-6 mm.

import { Project, Workspace, LinkProperty, NodeProperty } from 'epanet-js'
import type { Network } from '../../shared/physics/types'

const EPANET_WATER_KINEMATIC_VISCOSITY = 1.1e-5 * 0.3048 ** 2 // m²/s
const G = 9.80665
const G_FT = G / 0.3048
const LENGTH_SCALE = 32.2 / G_FT
const K_SCALE = 8 / (G_FT * Math.PI ** 2 * 0.02517)

export function toEpanetInput(network: Network, matchGravity = true): string {
  const lengthScale = matchGravity ? LENGTH_SCALE : 1
  const kScale = matchGravity ? K_SCALE : 1
  const rho = network.fluid.densityKgM3
  const nu = network.fluid.viscosityPaS / rho
  const demand = new Map<string, number>()
  const junctions: string[] = []
  const pipes: string[] = []
  const valves: string[] = []
  const pumps: string[] = []
  const curves: string[] = []
  for (const link of network.links) {
    if (link.kind === 'pipe') {
      const roughnessMm = Math.max(link.roughnessM * 1000, 1e-6)
      pipes.push(`${link.id} ${link.from} ${link.to} ${link.lengthM * lengthScale} ${link.diameterM * 1000} ${roughnessMm} ${link.minorK * kScale} Open`)
    } else if (link.kind === 'resistance') {
      const r = link.resistance
      let k: number
      let d: number
      if ('k' in r) {
        k = r.k
        d = r.diameterM
      } else {
        d = 0.025
        const area = (Math.PI / 4) * d * d
        const q = r.atFlowLpm / 60000
        k = ((r.dropKpa * 1000) / (rho * G)) * (2 * G * area * area) / (q * q)
      }
      valves.push(`${link.id} ${link.from} ${link.to} ${d * 1000} TCV ${k * kScale} 0`)
    } else if ('fixedFlowLpm' in link.pump) {
      demand.set(link.from, (demand.get(link.from) ?? 0) + link.pump.fixedFlowLpm)
      demand.set(link.to, (demand.get(link.to) ?? 0) - link.pump.fixedFlowLpm)
    } else {
      pumps.push(`${link.id} ${link.from} ${link.to} HEAD c_${link.id}`)
      for (const p of link.pump.curve) curves.push(`c_${link.id} ${p.flowLpm} ${p.headM}`)
    }
  }
  let reservoir = ''
  for (const node of network.nodes) {
    if (node.id === network.referenceNode) {
      reservoir = `${node.id} ${node.elevationM + ((network.referencePressureKpa ?? 0) * 1000) / (rho * G)}`
    } else {
      junctions.push(`${node.id} ${node.elevationM} ${demand.get(node.id) ?? 0}`)
    }
  }
  return [
    '[TITLE]', 'comparison network',
    '[JUNCTIONS]', ...junctions,
    '[RESERVOIRS]', reservoir,
    '[PIPES]', ...pipes,
    '[VALVES]', ...valves,
    '[PUMPS]', ...pumps,
    '[CURVES]', ...curves,
    '[OPTIONS]', 'Units LPM', 'Headloss D-W', `Viscosity ${nu / EPANET_WATER_KINEMATIC_VISCOSITY}`,
    `Specific Gravity ${rho / 998.2}`, 'Accuracy 0.00001', 'Trials 500', 'Unbalanced Stop',
    '[END]', '',
  ].join('\n')
}

let workspace: Workspace | undefined

async function loadedWorkspace(): Promise<Workspace> {
  if (!workspace) {
    const ws = new Workspace()
    await ws.loadModule()
    workspace = ws
  }
  return workspace
}

export interface EpanetRun {
  /** link id → flow, L/min (only links EPANET models as links) */
  flowLpm: Map<string, number>
  /** node id → head, m */
  headM: Map<string, number>
  /** re-runs the hydraulic solution on the open model (for timing) */
  resolve: () => void
  close: () => void
  version: number
}

/** Opens the network in EPANET and solves it once. */
export async function runEpanet(network: Network, name = 'net', matchGravity = true): Promise<EpanetRun> {
  const ws = await loadedWorkspace()
  ws.writeFile(`${name}.inp`, toEpanetInput(network, matchGravity))
  const model = new Project(ws)
  model.open(`${name}.inp`, `${name}.rpt`, `${name}.out`)
  model.solveH()
  const flowLpm = new Map<string, number>()
  for (const link of network.links) {
    if (link.kind === 'pump' && 'fixedFlowLpm' in link.pump) continue
    flowLpm.set(link.id, model.getLinkValue(model.getLinkIndex(link.id), LinkProperty.Flow))
  }
  const headM = new Map<string, number>()
  for (const node of network.nodes) headM.set(node.id, model.getNodeValue(model.getNodeIndex(node.id), NodeProperty.Head))
  return { flowLpm, headM, resolve: () => model.solveH(), close: () => model.close(), version: ws.version }
}
