// Flow splits against EPANET 2.3 (epanet-js 0.9.0, WASM) on the same networks.
// EPANET's Darcy–Weisbach option uses Swamee–Jain (1976) for the turbulent friction factor where we
// solve Colebrook exactly; on these networks that moves the split by under 0.5 %. Given Swamee–Jain
// through SolveOptions.frictionLaw, our solver must match EPANET to its own convergence accuracy.

import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { coolantProperties, massToVolumePercent, solveNetwork, type FrictionLaw, type Network, type NetworkLink } from '#shared/physics'
import { runEpanet, type EpanetRun } from '../../reference/epanet-network'
import { ladderNetwork, WATER_80C } from '../../reference/network-generators'

/** Swamee–Jain (1976): f = 0.25/[log10(ε/3.7D + 5.74/Re^0.9)]² (check-values §4), with its slope. */
const swameeJain: FrictionLaw = (re, ed) => {
  const u = ed / 3.7 + 5.74 * re ** -0.9
  const l = Math.log10(u)
  const dl = (-0.9 * 5.74 * re ** -1.9) / (u * Math.LN10)
  return { f: 0.25 / (l * l), dfdRe: (-0.5 * dl) / (l * l * l) }
}

const water80 = coolantProperties({ fluid: 'water', percentByVolume: 0 }, 80)
const hose = (id: string, from: string, to: string, lengthM: number, diameterM: number, minorK = 0): NetworkLink => ({
  kind: 'pipe', id, from, to, lengthM, diameterM, roughnessM: 1e-5, minorK,
})

const twoParallel: Network = {
  nodes: [{ id: 'tank', elevationM: 0.5 }, { id: 'out', elevationM: 0 }, { id: 'join', elevationM: 0.2 }],
  links: [
    { kind: 'pump', id: 'pump', from: 'tank', to: 'out', pump: { fixedFlowLpm: 100 } },
    hose('h25', 'out', 'join', 2, 0.0254),
    hose('h16', 'out', 'join', 1.2, 0.0159),
    hose('back', 'join', 'tank', 1, 0.0318),
  ],
  referenceNode: 'tank', referencePressureKpa: 100, fluid: water80,
}

const threeParallel: Network = {
  ...twoParallel,
  links: [...twoParallel.links, hose('h19', 'out', 'join', 3.5, 0.019)],
}

// Engine loop with a heater branch: curve pump from the tank (at the pump inlet) to the block,
// block → radiator (rated drop) → back; block → heater core (K) → back.
const heaterLoop: Network = {
  nodes: [
    { id: 'inlet', elevationM: 0.3 }, { id: 'block', elevationM: 0.4 }, { id: 'thermo', elevationM: 0.7 },
    { id: 'radIn', elevationM: 0.8 }, { id: 'radOut', elevationM: 0.2 }, { id: 'heatIn', elevationM: 0.9 }, { id: 'heatOut', elevationM: 0.9 },
  ],
  links: [
    { kind: 'pump', id: 'pump', from: 'inlet', to: 'block', pump: { curve: [{ flowLpm: 0, headM: 14 }, { flowLpm: 80, headM: 10.5 }, { flowLpm: 160, headM: 0 }] } },
    hose('blockOut', 'block', 'thermo', 0.3, 0.0381, 1.2),
    hose('upper', 'thermo', 'radIn', 0.6, 0.0381, 0.4),
    { kind: 'resistance', id: 'radiator', from: 'radIn', to: 'radOut', resistance: { dropKpa: 12, atFlowLpm: 90 } },
    hose('lower', 'radOut', 'inlet', 0.7, 0.0381, 0.6),
    hose('heaterFeed', 'block', 'heatIn', 1.8, 0.0159, 0.9),
    { kind: 'resistance', id: 'heaterCore', from: 'heatIn', to: 'heatOut', resistance: { k: 6, diameterM: 0.0159 } },
    hose('heaterReturn', 'heatOut', 'inlet', 2.1, 0.0159, 0.5),
  ],
  referenceNode: 'inlet', referencePressureKpa: 90, fluid: water80,
}

// Minor losses dominate: short hoses with bends, expansions and a valve-like resistance, in a two-loop mesh.
const minorLossMesh: Network = {
  nodes: ['t', 'a', 'b', 'c', 'd'].map((id, i) => ({ id, elevationM: i * 0.1 })),
  links: [
    { kind: 'pump', id: 'pump', from: 't', to: 'a', pump: { fixedFlowLpm: 70 } },
    hose('ab', 'a', 'b', 0.4, 0.0254, 3.5),
    hose('ac', 'a', 'c', 0.3, 0.019, 1.8),
    hose('bc', 'b', 'c', 0.5, 0.0159, 2.4),
    hose('bd', 'b', 'd', 0.6, 0.0254, 0.9),
    { kind: 'resistance', id: 'cd', from: 'c', to: 'd', resistance: { k: 4.5, diameterM: 0.019 } },
    hose('dt', 'd', 't', 0.8, 0.0318, 1.5),
  ],
  referenceNode: 't', fluid: water80,
}

// Cold 50/50 EG at low flow: every branch laminar for both programs (Re < 2000), where both use 64/Re,
// so this also checks the viscosity conversion to EPANET's relative viscosity.
const eg50cold = coolantProperties({ fluid: 'ethylene-glycol', percentByVolume: massToVolumePercent('ethylene-glycol', 50) }, 0)
const laminarSplit: Network = {
  ...twoParallel,
  links: [
    { kind: 'pump', id: 'pump', from: 'tank', to: 'out', pump: { fixedFlowLpm: 3 } },
    hose('h10', 'out', 'join', 1.5, 0.0095),
    hose('h08', 'out', 'join', 0.8, 0.0079),
    hose('back', 'join', 'tank', 1, 0.0127),
  ],
  fluid: eg50cold,
}

const cases: Array<[string, Network]> = [
  ['two parallel hoses fed a fixed 100 L/min', twoParallel],
  ['three parallel hoses fed a fixed 100 L/min', threeParallel],
  ['engine loop with a heater branch and a curve pump', heaterLoop],
  ['two-loop mesh dominated by minor losses', minorLossMesh],
  ['laminar split of cold 50 % glycol', laminarSplit],
]
// all links turbulent (Re > 9000), so the friction law is the only modelling difference
const ladders: Array<[string, Network]> = [
  ['ladder of 60 hoses with a curve pump', ladderNetwork({ pipes: 60, seed: 11, pump: 'curve' })],
  ['ladder of 90 hoses with a fixed-flow pump', ladderNetwork({ pipes: 90, seed: 5, flowLpm: 150 })],
]

function maxRelativeFlowDifference(net: Network, theirs: EpanetRun, frictionLaw?: FrictionLaw): number {
  const ours = solveNetwork(net, { frictionLaw })
  expect(ours.converged).toBe(true)
  let worst = 0
  for (const link of ours.links) {
    const q = theirs.flowLpm.get(link.id)
    if (q === undefined) continue // fixed-flow pumps are demands in EPANET
    worst = Math.max(worst, Math.abs(link.flowLpm - q) / Math.abs(q))
  }
  return worst
}

describe('network flow split against epanet-js 0.9.0 (EPANET 2.3, Darcy–Weisbach)', () => {
  const runs = new Map<string, EpanetRun>()
  beforeAll(async () => {
    for (const [name, net] of [...cases, ...ladders]) runs.set(name, await runEpanet(net, name.replace(/\W+/g, '_')))
  })
  afterAll(() => runs.forEach(r => r.close()))

  it('runs the EPANET 2.3 engine', () => {
    expect(runs.get(cases[0]![0])!.version).toBeGreaterThanOrEqual(20300)
  })

  it.each(cases)('%s: every link flow within 0.5 % (our Colebrook vs EPANET\u2019s Swamee–Jain)', (name, net) => {
    expect(maxRelativeFlowDifference(net, runs.get(name)!)).toBeLessThan(0.005)
  })

  // EPANET stops at a relative flow change of 1e-5 (its smallest Accuracy setting)
  it.each([...cases, ...ladders])('%s: with the same friction law (Swamee–Jain) every link flow within 2e-5', (name, net) => {
    expect(maxRelativeFlowDifference(net, runs.get(name)!, swameeJain)).toBeLessThan(2e-5)
  })

  it('laminar case: all Re < 2000 (64/Re for both) and the head losses agree to 0.01 %, which checks the viscosity conversion', () => {
    const ours = solveNetwork(laminarSplit)
    const theirs = runs.get(cases[4]![0])!
    for (const link of ours.links.filter(l => l.id !== 'pump')) expect(link.reynolds!).toBeLessThan(2000)
    const rhoG = (eg50cold.densityKgM3 * 9.80665) / 1000
    const ourLoss = (ours.nodePressureKpa.out! - ours.nodePressureKpa.join!) / rhoG + (0 - 0.2)
    const theirLoss = theirs.headM.get('out')! - theirs.headM.get('join')!
    expect(ourLoss).toBeGreaterThan(0.05)
    expect(Math.abs(ourLoss - theirLoss)).toBeLessThan(1e-4 * theirLoss)
  })

  it('heater loop: pump operating point and node heads agree (heads within 1 cm)', () => {
    const ours = solveNetwork(heaterLoop)
    const theirs = runs.get(cases[2]![0])!
    const rhoG = (water80.densityKgM3 * 9.80665) / 1000
    for (const node of heaterLoop.nodes) {
      const ourHead = (ours.nodePressureKpa[node.id]!) / rhoG + node.elevationM
      expect(Math.abs(ourHead - theirs.headM.get(node.id)!)).toBeLessThan(0.01)
    }
  })

  it('the shared ladder generator uses the same fluid as the benchmark', () => {
    expect(ladderNetwork({ pipes: 30, seed: 1 }).fluid).toBe(WATER_80C)
  })
})
