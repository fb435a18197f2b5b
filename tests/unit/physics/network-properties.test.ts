// Property-based checks of the network solver on random valid networks (fast-check).

import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { solveNetwork, type Network, type NetworkLink, type NetworkResult } from '#shared/physics'
import { seededRandom, shuffled, WATER_80C } from '../../reference/network-generators'

const BORES = [0.0079, 0.0095, 0.0127, 0.0159, 0.019, 0.0254, 0.0318, 0.0381]

/** A spanning tree over `n` nodes plus random chords, with one pump and some lumped resistances. */
function randomNetwork(seed: number, n: number, chords: number, pumpKind: 'fixed' | 'curve'): Network {
  const random = seededRandom(seed)
  const nodes = Array.from({ length: n }, (_, i) => ({ id: `n${i}`, elevationM: random() * 1.5 }))
  const links: NetworkLink[] = []
  const link = (id: string, a: number, b: number): NetworkLink => {
    const roll = random()
    if (roll < 0.15) return { kind: 'resistance', id, from: `n${a}`, to: `n${b}`, resistance: { k: 0.5 + random() * 8, diameterM: BORES[Math.floor(random() * BORES.length)]! } }
    if (roll < 0.25) return { kind: 'resistance', id, from: `n${a}`, to: `n${b}`, resistance: { dropKpa: 1 + random() * 20, atFlowLpm: 5 + random() * 80 } }
    return {
      kind: 'pipe', id, from: `n${a}`, to: `n${b}`, lengthM: random() * 3, diameterM: BORES[Math.floor(random() * BORES.length)]!,
      roughnessM: random() < 0.3 ? 0 : random() * 5e-5, minorK: random() < 0.5 ? random() * 4 : 0,
    }
  }
  for (let i = 1; i < n; i++) links.push(link(`t${i}`, Math.floor(random() * i), i))
  for (let k = 0; k < chords; k++) {
    const a = Math.floor(random() * n)
    const b = Math.floor(random() * n)
    if (a !== b) links.push(link(`c${k}`, a, b))
  }
  const outlet = 1 + Math.floor(random() * (n - 1))
  const flow = 2 + random() * 120
  links.push(pumpKind === 'fixed'
    ? { kind: 'pump', id: 'pump', from: 'n0', to: `n${outlet}`, pump: { fixedFlowLpm: flow } }
    : { kind: 'pump', id: 'pump', from: 'n0', to: `n${outlet}`, pump: { curve: [{ flowLpm: 0, headM: 3 + random() * 10 }, { flowLpm: flow / 2, headM: 2 + random() }, { flowLpm: flow, headM: random() }] } })
  return { nodes, links, referenceNode: 'n0', referencePressureKpa: random() * 150, fluid: WATER_80C }
}

function nodeImbalances(net: Network, r: NetworkResult): number[] {
  const sum = new Map<string, number>()
  const scale = new Map<string, number>()
  net.links.forEach((l, i) => {
    const q = r.links[i]!.flowLpm
    sum.set(l.from, (sum.get(l.from) ?? 0) - q)
    sum.set(l.to, (sum.get(l.to) ?? 0) + q)
    scale.set(l.from, (scale.get(l.from) ?? 0) + Math.abs(q))
    scale.set(l.to, (scale.get(l.to) ?? 0) + Math.abs(q))
  })
  // relative to the node's own throughput, or to the largest flow in the network at a node that
  // carries (almost) nothing, such as the closed end of a dead leg
  const networkScale = Math.max(...r.links.map(l => Math.abs(l.flowLpm)))
  return [...sum].map(([id, s]) => Math.abs(s) / Math.max(scale.get(id)!, networkScale))
}

const networks = fc.record({
  seed: fc.integer({ min: 1, max: 2 ** 30 }),
  n: fc.integer({ min: 2, max: 40 }),
  chords: fc.integer({ min: 0, max: 25 }),
  pump: fc.constantFrom('fixed' as const, 'curve' as const),
})

describe('network solver properties', () => {
  it('converges and conserves flow at every node to 1e-9 relative', () => {
    fc.assert(fc.property(networks, ({ seed, n, chords, pump }) => {
      const net = randomNetwork(seed, n, chords, pump)
      const r = solveNetwork(net)
      expect(r.converged).toBe(true)
      for (const e of nodeImbalances(net, r)) expect(e).toBeLessThan(1e-9)
      for (const l of r.links) expect(Number.isFinite(l.flowLpm) && Number.isFinite(l.dropKpa)).toBe(true)
    }), { numRuns: 1000 })
  })

  it('gives the same result whatever the order of nodes and links, and whichever way a pipe is drawn', () => {
    fc.assert(fc.property(networks, fc.integer({ min: 1, max: 2 ** 30 }), ({ seed, n, chords, pump }, shuffleSeed) => {
      const net = randomNetwork(seed, n, chords, pump)
      const random = seededRandom(shuffleSeed)
      const flipped = new Set<string>()
      const links = shuffled(net.links, random).map(l => {
        if (l.kind !== 'pump' && random() < 0.5) {
          flipped.add(l.id)
          return { ...l, from: l.to, to: l.from }
        }
        return l
      })
      const other: Network = { ...net, nodes: shuffled(net.nodes, random), links }
      // solved to the rounding floor: at the default stopping tolerance two orderings may stop one
      // Newton step apart, which is a convergence difference, not an ordering one
      const a = solveNetwork(net, { relativeTolerance: 1e-14 })
      const b = solveNetwork(other, { relativeTolerance: 1e-14 })
      const flowsB = new Map(b.links.map(l => [l.id, l.flowLpm]))
      const scale = Math.max(...a.links.map(l => Math.abs(l.flowLpm)))
      for (const l of a.links) {
        const q = flowsB.get(l.id)! * (flipped.has(l.id) ? -1 : 1)
        expect(Math.abs(l.flowLpm - q)).toBeLessThanOrEqual(1e-9 * scale)
      }
      const pScale = Math.max(1, ...Object.values(a.nodePressureKpa).map(Math.abs))
      for (const [id, p] of Object.entries(a.nodePressureKpa)) expect(Math.abs(p - b.nodePressureKpa[id]!)).toBeLessThanOrEqual(1e-9 * pScale)
    }), { numRuns: 1000 })
  })

  it('stopping at EPANET-level convergence (flow change 1e-6) leaves the flows within 1e-6 of the converged ones', () => {
    // the default stops once a full step changes the flows by 1e-6 of their sum; Newton converges
    // quadratically there, so the flows must agree with a solve run to the rounding floor
    fc.assert(fc.property(networks, ({ seed, n, chords, pump }) => {
      const net = randomNetwork(seed, n, chords, pump)
      const fast = solveNetwork(net)
      const tight = solveNetwork(net, { relativeTolerance: 1e-14 })
      expect(fast.converged && tight.converged).toBe(true)
      const scale = Math.max(...tight.links.map(l => Math.abs(l.flowLpm)))
      fast.links.forEach((l, i) => expect(Math.abs(l.flowLpm - tight.links[i]!.flowLpm)).toBeLessThanOrEqual(1e-6 * scale))
      expect(fast.iterations).toBeLessThanOrEqual(tight.iterations)
    }), { numRuns: 500 })
  })

  it('a curve pump delivers forward flow with a head rise, also when its points are convex', () => {
    fc.assert(fc.property(networks, ({ seed, n, chords }) => {
      const net = randomNetwork(seed, n, chords, 'curve')
      const pump = net.links.find(l => l.id === 'pump')!
      if (pump.kind !== 'pump' || !('curve' in pump.pump)) throw new Error('expected a curve pump')
      const r = solveNetwork(net)
      const q = r.links.find(l => l.id === 'pump')!.flowLpm
      expect(q).toBeGreaterThan(0)
      expect(r.links.find(l => l.id === 'pump')!.headLossKpa!).toBeLessThan(0)
    }), { numRuns: 60 })
  })
})
