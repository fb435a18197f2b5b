import { describe, expect, it } from 'vitest'
import {
  coolantProperties, darcyPressureDropPerMetre, fitPumpCurve, solveNetwork, STANDARD_GRAVITY, type Network, type NetworkLink, type NetworkResult,
} from '#shared/physics'
import { ladderNetwork } from '../../reference/network-generators'

const water = coolantProperties({ fluid: 'water', percentByVolume: 0 }, 80)
const hose = (id: string, from: string, to: string, lengthM: number, diameterM: number, minorK = 0): NetworkLink => ({
  kind: 'pipe', id, from, to, lengthM, diameterM, roughnessM: 1e-5, minorK,
})
const node = (id: string, elevationM = 0) => ({ id, elevationM })
const flow = (r: NetworkResult, id: string) => r.links.find(l => l.id === id)!.flowLpm

function maxImbalance(net: Network, r: NetworkResult): number {
  const sum = new Map<string, number>()
  const scale = new Map<string, number>()
  net.links.forEach((l, i) => {
    const q = r.links[i]!.flowLpm
    sum.set(l.from, (sum.get(l.from) ?? 0) - q)
    sum.set(l.to, (sum.get(l.to) ?? 0) + q)
    scale.set(l.from, (scale.get(l.from) ?? 0) + Math.abs(q))
    scale.set(l.to, (scale.get(l.to) ?? 0) + Math.abs(q))
  })
  let worst = 0
  for (const [id, s] of sum) worst = Math.max(worst, Math.abs(s) / Math.max(scale.get(id)!, 1e-300))
  return worst
}

describe('single loop: the solution is the Darcy–Weisbach drop', () => {
  // one hose loop, fixed 100 L/min: the pump's pressure rise must equal the worked Darcy–Weisbach drop
  // (check-values §4: 38.1 mm smooth bore at 80 °C, 449.5 Pa/m) plus the fittings' K·ρv²/2
  const net: Network = {
    nodes: [node('tank'), node('out')],
    links: [
      { kind: 'pump', id: 'pump', from: 'tank', to: 'out', pump: { fixedFlowLpm: 100 } },
      { kind: 'pipe', id: 'hose', from: 'out', to: 'tank', lengthM: 3, diameterM: 0.0381, roughnessM: 0, minorK: 1.5 },
    ],
    referenceNode: 'tank', referencePressureKpa: 50,
    fluid: { densityKgM3: 971.83, viscosityPaS: 0.35408e-3, source: 'check-values §4 worked example' },
  }
  it('pressure rise = 3 m × 449.5 Pa/m + 1.5 × 1038.4 Pa', () => {
    const r = solveNetwork(net)
    const expected = (3 * darcyPressureDropPerMetre(100, 0.0381, 0, net.fluid).pressureDropPaPerM + 1.5 * darcyPressureDropPerMetre(100, 0.0381, 0, net.fluid).velocityPressurePa) / 1000
    expect(r.converged).toBe(true)
    expect(r.links[1]!.dropKpa).toBeCloseTo(expected, 9)
    expect(expected).toBeCloseTo((3 * 449.5 + 1.5 * 1038.4) / 1000, 2)
    expect(r.links[0]!.dropKpa).toBeCloseTo(-expected, 9)
    expect(r.nodePressureKpa.tank).toBeCloseTo(50, 12)
    expect(r.links[1]!.frictionFactor!).toBeCloseTo(0.016493, 6)
  })
})

describe('behaviour', () => {
  it('splits flow between parallel hoses so both see the same loss, and conserves it', () => {
    const net: Network = {
      nodes: [node('t', 0.4), node('a'), node('b', 0.3)],
      links: [
        { kind: 'pump', id: 'p', from: 't', to: 'a', pump: { fixedFlowLpm: 80 } },
        hose('wide', 'a', 'b', 1.5, 0.025, 0.8), hose('narrow', 'a', 'b', 0.7, 0.016, 0.3), hose('ret', 'b', 't', 1, 0.032),
      ],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(net)
    expect(flow(r, 'wide') + flow(r, 'narrow')).toBeCloseTo(80, 9)
    expect(r.links[1]!.headLossKpa!).toBeCloseTo(r.links[2]!.headLossKpa!, 8)
    // static head: dropKpa includes ρg(z_to − z_from) = ρg·0.3
    expect(r.links[1]!.dropKpa - r.links[1]!.headLossKpa!).toBeCloseTo((water.densityKgM3 * STANDARD_GRAVITY * 0.3) / 1000, 8)
    expect(maxImbalance(net, r)).toBeLessThan(1e-12)
  })

  it('gives a dead leg zero flow in a few iterations (laminar floor), with its far end at the branch pressure', () => {
    const net: Network = {
      nodes: [node('t'), node('a'), node('b'), node('dead')],
      links: [
        { kind: 'pump', id: 'p', from: 't', to: 'a', pump: { fixedFlowLpm: 40 } },
        hose('ab', 'a', 'b', 1, 0.019), hose('bt', 'b', 't', 1, 0.019),
        hose('leg', 'b', 'dead', 0.5, 0.0095, 2),
        { kind: 'resistance', id: 'capped', from: 'dead', to: 'dead', resistance: { k: 1, diameterM: 0.01 } },
      ],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(net)
    expect(r.converged).toBe(true)
    expect(r.iterations).toBeLessThan(15)
    expect(Math.abs(flow(r, 'leg'))).toBeLessThan(1e-9)
    expect(r.nodePressureKpa.dead).toBeCloseTo(r.nodePressureKpa.b!, 6)
  })

  it('reports a part with no connection to the reference node, without NaN', () => {
    const net: Network = {
      nodes: [node('t'), node('a'), node('x'), node('y')],
      links: [
        { kind: 'pump', id: 'p', from: 't', to: 'a', pump: { fixedFlowLpm: 30 } }, hose('at', 'a', 't', 1, 0.02),
        { kind: 'pump', id: 'q', from: 'x', to: 'y', pump: { curve: [{ flowLpm: 0, headM: 4 }, { flowLpm: 20, headM: 3 }, { flowLpm: 40, headM: 0 }] } },
        hose('yx', 'y', 'x', 2, 0.012),
      ],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(net)
    expect(r.isolatedNodes).toEqual(['x', 'y'])
    expect(r.problems!.map(p => p.kind)).toContain('isolated-nodes')
    expect(r.nodePressureKpa.x).toBeUndefined()
    expect(flow(r, 'yx')).toBeGreaterThan(0) // the separate loop still circulates
    for (const l of r.links) for (const v of [l.flowLpm, l.dropKpa]) expect(Number.isFinite(v)).toBe(true)
  })

  it('a fixed-flow pump with no return path is reported and shown at 0 L/min', () => {
    const net: Network = {
      nodes: [node('t'), node('a'), node('end')],
      links: [{ kind: 'pump', id: 'p', from: 't', to: 'a', pump: { fixedFlowLpm: 50 } }, hose('dead', 'a', 'end', 1, 0.02)],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(net)
    expect(r.converged).toBe(false)
    expect(r.message).toMatch(/no return path/)
    expect(r.problems!.find(p => p.kind === 'no-return-path')!.ids).toEqual(['p'])
    expect(flow(r, 'p')).toBe(0)
    expect(r.isolatedNodes).toContain('p')
    for (const l of r.links) expect(Number.isFinite(l.dropKpa)).toBe(true)
  })

  it('caps the iterations and says so', () => {
    const r = solveNetwork(ladderNetwork({ pipes: 60, seed: 2 }), { maxIterations: 2 })
    expect(r.converged).toBe(false)
    expect(r.iterations).toBe(2)
    expect(r.message).toMatch(/no convergence within 2 iterations/)
  })

  it('reports invalid links and a missing reference node instead of throwing', () => {
    const bad: Network = {
      nodes: [node('t'), node('a')],
      links: [
        { kind: 'pump', id: 'p', from: 't', to: 'a', pump: { fixedFlowLpm: 10 } }, hose('ok', 'a', 't', 1, 0.02),
        hose('zero', 'a', 't', 1, 0), hose('ghost', 'a', 'nowhere', 1, 0.02),
      ],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(bad)
    expect(r.problems!.find(p => p.kind === 'invalid-link')!.ids).toEqual(['zero', 'ghost'])
    expect(flow(r, 'ok')).toBeCloseTo(10, 9)
    const noRef = solveNetwork({ ...bad, referenceNode: 'missing' })
    expect(noRef.converged).toBe(false)
    expect(noRef.problems!.map(p => p.kind)).toContain('no-reference')
    expect(Object.keys(noRef.nodePressureKpa)).toHaveLength(0)
  })

  it('a curve pump runs at the intersection of its quadratic and the system curve', () => {
    const curve = [{ flowLpm: 0, headM: 10 }, { flowLpm: 50, headM: 8 }, { flowLpm: 100, headM: 2 }]
    const net: Network = {
      nodes: [node('t'), node('a')],
      links: [{ kind: 'pump', id: 'p', from: 't', to: 'a', pump: { curve } }, hose('h', 'a', 't', 4, 0.019, 3)],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(net)
    const { c0, c1, c2 } = fitPumpCurve(curve)
    const q = flow(r, 'p') / 60000
    const pumpHead = c0 + c1 * q + c2 * q * q
    expect(-r.links[0]!.headLossKpa! / ((water.densityKgM3 * STANDARD_GRAVITY) / 1000)).toBeCloseTo(pumpHead, 8)
    expect(r.links[1]!.headLossKpa!).toBeCloseTo(-r.links[0]!.headLossKpa!, 8)
  })

  it('fits the quadratic exactly through three points and the customary curve through one', () => {
    const c = fitPumpCurve([{ flowLpm: 100, headM: 2 }, { flowLpm: 0, headM: 10 }, { flowLpm: 50, headM: 8 }])
    for (const [lpm, h] of [[0, 10], [50, 8], [100, 2]] as const) expect(c.c0 + c.c1 * (lpm / 60000) + c.c2 * (lpm / 60000) ** 2).toBeCloseTo(h, 10)
    const one = fitPumpCurve([{ flowLpm: 60, headM: 9 }])
    expect(one.c0).toBeCloseTo(12, 12)
    expect(one.c0 + one.c2 * (120 / 60000) ** 2).toBeCloseTo(0, 10)
  })

  it('handles a zero-length, loss-free link and two pumps in series on one loop', () => {
    const net: Network = {
      nodes: [node('t'), node('a'), node('b'), node('c')],
      links: [
        { kind: 'pump', id: 'p1', from: 't', to: 'a', pump: { curve: [{ flowLpm: 0, headM: 5 }, { flowLpm: 40, headM: 4 }, { flowLpm: 80, headM: 0 }] } },
        { kind: 'pipe', id: 'joint', from: 'a', to: 'b', lengthM: 0, diameterM: 0.02, roughnessM: 0, minorK: 0 },
        { kind: 'pump', id: 'p2', from: 'b', to: 'c', pump: { curve: [{ flowLpm: 0, headM: 5 }, { flowLpm: 40, headM: 4 }, { flowLpm: 80, headM: 0 }] } },
        hose('back', 'c', 't', 6, 0.016, 4),
      ],
      referenceNode: 't', fluid: water,
    }
    const r = solveNetwork(net)
    expect(r.converged).toBe(true)
    expect(flow(r, 'p1')).toBeCloseTo(flow(r, 'p2'), 9)
    expect(Math.abs(r.nodePressureKpa.a! - r.nodePressureKpa.b!)).toBeLessThan(0.01)
  })
})
