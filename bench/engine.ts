// Analysis benchmark: npm run bench:engine
// Random valid circuits of about 100, 1 000 and 10 000 parts + hoses (tidy layout, see
// shared/demo/randomCircuit.ts). For each: the median time of analyzeCircuit, and on the same graphs a
// bare graphlib pass (build + alg.components, and alg.components alone) and the flow solve of the
// circuit's network against epanet-js 0.9.0 on the same network. Prints figures; asserts nothing.
import { alg, Graph } from '@dagrejs/graphlib'
import { parseCircuitDocument, type CircuitDocument } from '../shared/circuit'
import { randomCircuit, rungsFor } from '../shared/demo'
import { analyzeCircuit } from '../shared/engine'
import { computeQuantities } from '../shared/engine/analyze'
import { buildContext } from '../shared/engine/context'
import { buildNetwork } from '../shared/engine/flow/network'
import { solveState } from '../shared/engine/flow/solve'
import { coolantProperties, solveNetwork, type Network } from '../shared/physics'
import { runEpanet } from '../tests/reference/epanet-network'

function median(run: () => unknown, minRuns: number, minMs = 400): number {
  for (let i = 0; i < Math.min(5, minRuns); i++) run() // warm the JIT
  const times: number[] = []
  const start = performance.now()
  while (times.length < minRuns || performance.now() - start < minMs) {
    const t = performance.now()
    run()
    times.push(performance.now() - t)
    if (times.length >= 2000) break
  }
  times.sort((a, b) => a - b)
  return times[times.length >> 1]!
}

const ms = (x: number) => `${x.toFixed(x < 1 ? 3 : 2)} ms`

function circuit(elements: number): CircuitDocument {
  const parsed = parseCircuitDocument(randomCircuit({ seed: 2024, rungs: rungsFor(elements), tidy: true }))
  if (!parsed.ok) throw new Error(parsed.issues.map((i) => `${i.path}: ${i.message}`).join('\n'))
  return parsed.document
}

/** EPANET ids may not hold every character ours do; number the nodes and links, and use a fixed-flow pump in both. */
function comparable(net: Network): Network {
  const ids = new Map(net.nodes.map((n, i) => [n.id, `n${i}`]))
  return {
    ...net,
    nodes: net.nodes.map((n) => ({ ...n, id: ids.get(n.id)! })),
    links: net.links.map((l, i) => ({
      ...l, id: `l${i}`, from: ids.get(l.from)!, to: ids.get(l.to)!,
      ...(l.kind === 'pump' ? { pump: { fixedFlowLpm: 100 } } : {}),
    })) as Network['links'],
    referenceNode: ids.get(net.referenceNode)!,
    // a charged system: keeps EPANET from warning about negative gauge pressures; flows do not change
    referencePressureKpa: 200,
  }
}

async function flowFigures(doc: CircuitDocument) {
  const ctx = buildContext(doc)
  const fluid = coolantProperties(doc.circuit.settings.coolant!.mix, 100)
  const net = comparable(buildNetwork(ctx, 'open', fluid).network)
  const ours = median(() => solveNetwork(net), 20)
  const result = solveNetwork(net)
  const epanet = await runEpanet(net, `bench${net.links.length}`)
  const theirs = median(() => epanet.resolve(), 20)
  let worst = 0
  result.links.forEach((l) => {
    const q = epanet.flowLpm.get(l.id)
    if (q !== undefined && Math.abs(q) > 1) worst = Math.max(worst, Math.abs(l.flowLpm - q) / Math.abs(q))
  })
  epanet.close()
  const pipes = net.links.filter((l) => l.kind === 'pipe').length
  return { nodes: net.nodes.length, pipes, ours, theirs, iterations: result.iterations, worst }
}

async function main() {
  console.log(`Hosewright engine benchmark — Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`)
  const rows: Array<{ elements: number; analysis: number; withoutGraphlib: number }> = []
  for (const target of [100, 1000, 10000]) {
    const doc = circuit(target)
    const elements = doc.circuit.components.length + doc.circuit.hoses.length
    const runs = target >= 10000 ? 9 : 40
    const analysis = median(() => analyzeCircuit(doc), runs, target >= 10000 ? 3000 : 1000)
    const withoutGraphlib = median(() => analyzeCircuit(doc, { graphlib: false }), runs, target >= 10000 ? 3000 : 1000)
    const report = analyzeCircuit(doc)
    const ctx = buildContext(doc)
    const topo = ctx.open.topo
    const build = () => {
      const g = new Graph({ directed: false })
      for (const n of topo.nodeNames) g.setNode(n)
      for (const e of topo.edges) g.setEdge(topo.nodeNames[e.v]!, topo.nodeNames[e.w]!)
      return g
    }
    const g = build()
    // graphlib's alg.components recurses once per node and overflows the stack on long chains
    let graphlibComponents: number | null = null
    try { alg.components(g); graphlibComponents = median(() => alg.components(g), runs) } catch { graphlibComponents = null }
    /** The same connected-components pass written as a loop over graphlib's own neighbour lists. */
    const traverse = (graph: Graph) => {
      const seen = new Set<string>()
      let count = 0
      for (const start of graph.nodes()) {
        if (seen.has(start)) continue
        count++
        seen.add(start)
        const stack = [start]
        while (stack.length > 0) for (const w of graph.neighbors(stack.pop()!) ?? []) if (!seen.has(w)) { seen.add(w); stack.push(w) }
      }
      return count
    }
    const graphlibBuild = median(() => build(), runs)
    const graphlibTraversal = median(() => traverse(g), runs)
    const context = median(() => buildContext(doc), runs)
    const quantities = median(() => computeQuantities(ctx), runs)
    const flowOpen = median(() => solveState(ctx, 'open'), runs)
    const flowClosed = median(() => solveState(ctx, 'closed'), runs)
    const flow = await flowFigures(doc)
    rows.push({ elements, analysis, withoutGraphlib })
    console.log(`\n${elements} parts + hoses (${doc.circuit.components.length} parts, ${doc.circuit.hoses.length} hoses; graph ${topo.nodeNames.length} nodes, ${topo.edges.length} edges; ${report.findings.length} findings)`)
    console.log(`  analyzeCircuit median              ${ms(analysis)}`)
    console.log(`  analyzeCircuit, graphlib: false    ${ms(withoutGraphlib)}`)
    console.log(`    of which: model + graph (graphlib) ${ms(context)}, quantities ${ms(quantities)}, flow open ${ms(flowOpen)}, flow shut ${ms(flowClosed)}`)
    console.log(`  graphlib: build the same graph      ${ms(graphlibBuild)}`)
    console.log(`  graphlib: components by traversal   ${ms(graphlibTraversal)} (neighbors() loop)`)
    console.log(`  graphlib: alg.components            ${graphlibComponents === null ? 'stack overflow (recursive)' : ms(graphlibComponents)}`)
    console.log(`  flow solve, ${flow.pipes} hoses / ${flow.nodes} nodes: ours ${ms(flow.ours)} (${flow.iterations} iterations), epanet-js ${ms(flow.theirs)}, largest flow difference ${(flow.worst * 100).toFixed(2)} %`)
  }
  const ratio = rows[2]!.analysis / rows[1]!.analysis
  const ratioBare = rows[2]!.withoutGraphlib / rows[1]!.withoutGraphlib
  console.log(`\nratio 10 000 / 1 000 elements: ${ratio.toFixed(1)} (graphlib: false ${ratioBare.toFixed(1)}) for ${(rows[2]!.elements / rows[1]!.elements).toFixed(1)}× the elements`)
  const small = await flowFigures(circuit(352)) // about 200 hoses
  console.log(`flow solve at ${small.pipes} hoses / ${small.nodes} nodes: ours ${ms(small.ours)}, epanet-js ${ms(small.theirs)} (${(small.ours / small.theirs).toFixed(2)}× epanet-js)`)
}

main().catch((e) => { console.error(e); process.exit(1) })
