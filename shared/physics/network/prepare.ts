// Everything the Newton iteration needs that does not change between steps: link laws, which links
// can carry a defined flow, head-connected groups, fixed heads, the numbering of unknown heads and
// the sparsity pattern of the node matrix.

import { STANDARD_GRAVITY } from '../units'
import type { Network, NetworkProblem } from '../types'
import { linkLaw, type LinkLaw } from './link-models'
import { takeInts, takeReals } from './scratch'
import { pumpsWithoutReturnPath, UnionFind, type FixedFlowLink } from './topology'

// a local copy: a module binding can cost a getter call per use in some module loaders
const G = STANDARD_GRAVITY

export interface PreparedNetwork {
  laws: Array<LinkLaw | null>
  from: Int32Array
  to: Int32Array
  /** head of every node relative to the reference head, for fixed nodes; NaN for unknowns */
  fixedHead: Float64Array
  /** absolute head of the reference node, m */
  referenceHead: number
  /** index of each node's head among the unknowns, −1 for fixed nodes */
  unknown: Int32Array
  unknownCount: number
  /** links whose flow the iteration solves (pipes, resistances, curve pumps) */
  solvedLinks: number[]
  /** off-diagonal node-matrix entries (edgeI[k], edgeJ[k]) of the solved links, and each link's entry (−1: none) */
  edgeI: Int32Array
  edgeJ: Int32Array
  edgeOfLink: Int32Array
  fixedFlows: FixedFlowLink[]
  switchedOff: Set<number>
  /** fixed node of each head-connected group (the reference node for its own group) */
  datumOf: Map<number, number>
  componentOf: Int32Array
  refComponent: number
  elevation: Float64Array
  isolatedNodes: string[]
  invalid: string[]
  problems: NetworkProblem[]
}

/** Its typed arrays are in the scratch space (scratch.ts): the caller holds a mark and releases it. */
export function prepareNetwork(network: Network): PreparedNetwork {
  const { densityKgM3: rho, viscosityPaS: mu } = network.fluid
  const problems: NetworkProblem[] = []
  const nodeCount = network.nodes.length
  const nodeIndex = new Map<string, number>()
  const elevation = takeReals(nodeCount)
  network.nodes.forEach((n, i) => {
    nodeIndex.set(n.id, i)
    elevation[i] = Number.isFinite(n.elevationM) ? n.elevationM : 0
  })

  // Link laws; links that cannot carry a defined flow are reported and left out.
  const linkCount = network.links.length
  const laws: Array<LinkLaw | null> = new Array(linkCount).fill(null)
  const from = takeInts(linkCount).fill(-1)
  const to = takeInts(linkCount).fill(-1)
  const invalid: string[] = []
  const invalidReasons: string[] = []
  const adjusted: Array<[string, string]> = []
  for (let i = 0; i < linkCount; i++) {
    const link = network.links[i]!
    const a = nodeIndex.get(link.from)
    const b = nodeIndex.get(link.to)
    const law = a === undefined || b === undefined ? `${link.kind} ${link.id}: joins a node that is not in the network` : linkLaw(link, rho, mu)
    if (typeof law === 'string') {
      invalid.push(link.id)
      invalidReasons.push(law)
      continue
    }
    laws[i] = law
    from[i] = a!
    to[i] = b!
    if (law.kind === 'pump-curve' && law.adjusted) adjusted.push([link.id, law.adjusted])
  }
  if (invalid.length) problems.push({ kind: 'invalid-link', ids: invalid, message: invalidReasons.join('; ') })
  if (adjusted.length) problems.push({ kind: 'pump-curve', ids: adjusted.map(a => a[0]), message: adjusted.map(a => a[1]).join('; ') })

  // Head-connected groups: pipes, resistances and curve pumps tie the heads of their ends together.
  const groups = new UnionFind(nodeCount)
  const fixedFlows: FixedFlowLink[] = []
  for (let i = 0; i < linkCount; i++) {
    const law = laws[i]
    if (!law) continue
    if (law.kind === 'fixed-flow') fixedFlows.push({ index: i, from: from[i]!, to: to[i]!, flow: law.flow })
    else groups.union(from[i]!, to[i]!)
  }
  const componentOf = takeInts(nodeCount)
  for (let v = 0; v < nodeCount; v++) componentOf[v] = groups.find(v)

  const switchedOff = pumpsWithoutReturnPath(componentOf, fixedFlows)
  if (switchedOff.size) {
    const ids = [...switchedOff].sort((a, b) => a - b).map(i => network.links[i]!.id)
    const many = ids.length > 1
    problems.push({
      kind: 'no-return-path', ids,
      message: `fixed-flow pump${many ? 's' : ''} ${ids.join(', ')} ha${many ? 've' : 's'} no return path for the flow; shown as 0 L/min`,
    })
  }

  // Fixed heads: the reference node, and a local datum in each group that does not contain it. Heads are
  // carried relative to the reference head, which keeps their magnitudes (and rounding) small.
  const refIndex = nodeIndex.get(network.referenceNode)
  if (refIndex === undefined) {
    problems.push({ kind: 'no-reference', ids: [network.referenceNode], message: `reference node ${network.referenceNode} is not in the network` })
  }
  const refComponent = refIndex === undefined ? -1 : componentOf[refIndex]!
  const fixedHead = takeReals(nodeCount).fill(Number.NaN)
  const datumOf = new Map<number, number>()
  let referenceHead = 0
  if (refIndex !== undefined) {
    referenceHead = elevation[refIndex]! + ((network.referencePressureKpa ?? 0) * 1000) / (rho * G)
    fixedHead[refIndex] = 0
    datumOf.set(refComponent, refIndex)
  }
  const isolatedNodes: string[] = []
  for (let v = 0; v < nodeCount; v++) {
    const c = componentOf[v]!
    if (c === refComponent) continue
    isolatedNodes.push(network.nodes[v]!.id)
    if (!datumOf.has(c)) {
      datumOf.set(c, v)
      fixedHead[v] = elevation[v]! - referenceHead // gauge 0 at the local datum
    }
  }
  if (isolatedNodes.length && refIndex !== undefined) {
    problems.push({
      kind: 'isolated-nodes', ids: [...isolatedNodes],
      message: `${isolatedNodes.length} node(s) have no connection to the reference node ${network.referenceNode}: no pressure level`,
    })
  }

  const unknown = takeInts(nodeCount).fill(-1)
  let unknownCount = 0
  for (let v = 0; v < nodeCount; v++) if (Number.isNaN(fixedHead[v]!)) unknown[v] = unknownCount++

  const solvedLinks: number[] = []
  const edgeI = takeInts(linkCount)
  const edgeJ = takeInts(linkCount)
  let edgeCount = 0
  const edgeOfLink = takeInts(linkCount).fill(-1)
  for (let i = 0; i < linkCount; i++) {
    const law = laws[i]
    if (!law || law.kind === 'fixed-flow') continue
    solvedLinks.push(i)
    const a = unknown[from[i]!]!
    const b = unknown[to[i]!]!
    if (a >= 0 && b >= 0 && a !== b) {
      edgeOfLink[i] = edgeCount
      edgeI[edgeCount] = a
      edgeJ[edgeCount++] = b
    }
  }
  return {
    laws, from, to, fixedHead, referenceHead, unknown, unknownCount, solvedLinks,
    edgeI: edgeI.subarray(0, edgeCount), edgeJ: edgeJ.subarray(0, edgeCount), edgeOfLink, fixedFlows, switchedOff,
    datumOf, componentOf, refComponent, elevation, isolatedNodes, invalid, problems,
  }
}

/** Starting flows: 1 m/s in every bore (as EPANET starts at 1 ft/s), the stated flow of fixed pumps. */
export function initialFlows(prepared: PreparedNetwork): Float64Array {
  const flows = takeReals(prepared.laws.length)
  prepared.laws.forEach((law, i) => {
    if (!law) return
    switch (law.kind) {
      case 'fixed-flow': flows[i] = prepared.switchedOff.has(i) ? 0 : law.flow; break
      case 'pipe': flows[i] = law.area; break
      case 'quadratic': flows[i] = law.diameterM ? (Math.PI / 4) * law.diameterM * law.diameterM : 1e-4; break
      case 'pump-curve': flows[i] = law.designFlow; break
    }
  })
  return flows
}
