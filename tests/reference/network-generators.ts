// Deterministic random coolant-like networks for property tests and the flow benchmark:
// a ladder (two rails joined by rungs, like parallel cores and bypasses) closed into a ring through
// a pump, with the expansion tank at the pump inlet.

import type { FluidState, Network, NetworkLink, NetworkNode } from '../../shared/physics/types'

/** Park–Miller minimal standard generator: small, seedable, the same on every machine. */
export function seededRandom(seed: number): () => number {
  let s = seed % 2147483647
  if (s <= 0) s += 2147483646
  return () => {
    s = (s * 16807) % 2147483647
    return (s - 1) / 2147483646
  }
}

export const WATER_80C: FluidState = { densityKgM3: 971.8, viscosityPaS: 0.3541e-3, source: 'IAPWS values at 80 °C (check-values §2)' }

const BORES_M = [0.0127, 0.0159, 0.019, 0.0254, 0.0318, 0.0381]

export interface LadderOptions {
  /** target number of pipes */
  pipes: number
  seed: number
  pump?: 'fixed' | 'curve'
  flowLpm?: number
}

/**
 * Ladder with `rungs` rungs: rails a0…an and b0…bn, rung i joins ai–bi; the pump lifts from the tank
 * node to a0 and bn returns to the tank. Pipes ≈ 3·rungs.
 */
export function ladderNetwork(options: LadderOptions): Network {
  const random = seededRandom(options.seed)
  const rungs = Math.max(2, Math.round(options.pipes / 3))
  const nodes: NetworkNode[] = [{ id: 'tank', elevationM: 1 }]
  const links: NetworkLink[] = []
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!
  for (let i = 0; i <= rungs; i++) {
    nodes.push({ id: `a${i}`, elevationM: random() }, { id: `b${i}`, elevationM: random() })
  }
  const pipe = (id: string, from: string, to: string): NetworkLink => ({
    kind: 'pipe', id, from, to, lengthM: 0.2 + random() * 2, diameterM: pick(BORES_M), roughnessM: 1e-5, minorK: random() < 0.5 ? random() * 2 : 0,
  })
  for (let i = 0; i < rungs; i++) {
    links.push(pipe(`ra${i}`, `a${i}`, `a${i + 1}`), pipe(`rb${i}`, `b${i}`, `b${i + 1}`))
  }
  for (let i = 0; i <= rungs; i++) links.push(pipe(`rung${i}`, `a${i}`, `b${i}`))
  links.push(pipe('return', `b${rungs}`, 'tank'))
  const flow = options.flowLpm ?? 60
  links.push(options.pump === 'curve'
    ? { kind: 'pump', id: 'pump', from: 'tank', to: 'a0', pump: { curve: [{ flowLpm: 0, headM: 12 }, { flowLpm: flow, headM: 9 }, { flowLpm: 2 * flow, headM: 0 }] } }
    : { kind: 'pump', id: 'pump', from: 'tank', to: 'a0', pump: { fixedFlowLpm: flow } })
  return { nodes, links, referenceNode: 'tank', referencePressureKpa: 100, fluid: WATER_80C }
}

/** Fisher–Yates shuffle with the given generator, returning a new array. */
export function shuffled<T>(xs: readonly T[], random: () => number): T[] {
  const out = [...xs]
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1))
    ;[out[i], out[j]] = [out[j]!, out[i]!]
  }
  return out
}

/**
 * Ring main with local cross-links: nodes r0…r(n−1) on a ring, each joined to its neighbour, plus
 * chords to a node at most `reach` places ahead (so the graph stays near-planar, like real plumbing).
 * Pipes ≈ n·(1 + chordShare).
 */
export function ringNetwork(options: LadderOptions & { chordShare?: number; reach?: number }): Network {
  const random = seededRandom(options.seed)
  const share = options.chordShare ?? 0.4
  const reach = options.reach ?? 6
  const n = Math.max(4, Math.round(options.pipes / (1 + share)))
  const nodes: NetworkNode[] = [{ id: 'tank', elevationM: 1 }]
  for (let i = 0; i < n; i++) nodes.push({ id: `r${i}`, elevationM: random() })
  const links: NetworkLink[] = []
  const pipe = (id: string, from: string, to: string): NetworkLink => ({
    kind: 'pipe', id, from, to, lengthM: 0.2 + random() * 2, diameterM: BORES_M[Math.floor(random() * BORES_M.length)]!, roughnessM: 1e-5, minorK: random() < 0.5 ? random() * 2 : 0,
  })
  for (let i = 0; i < n - 1; i++) links.push(pipe(`s${i}`, `r${i}`, `r${i + 1}`))
  let chords = 0
  while (links.length < options.pipes - 1) {
    const a = Math.floor(random() * n)
    const b = Math.min(n - 1, a + 2 + Math.floor(random() * (reach - 1)))
    if (b > a + 1) links.push(pipe(`x${chords++}`, `r${a}`, `r${b}`))
  }
  links.push(pipe('return', `r${n - 1}`, 'tank'))
  const flow = options.flowLpm ?? 60
  links.push(options.pump === 'curve'
    ? { kind: 'pump', id: 'pump', from: 'tank', to: 'r0', pump: { curve: [{ flowLpm: 0, headM: 12 }, { flowLpm: flow, headM: 9 }, { flowLpm: 2 * flow, headM: 0 }] } }
    : { kind: 'pump', id: 'pump', from: 'tank', to: 'r0', pump: { fixedFlowLpm: flow } })
  return { nodes, links, referenceNode: 'tank', referencePressureKpa: 100, fluid: WATER_80C }
}
