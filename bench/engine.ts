// Analysis benchmark: npm run bench:engine
// Random valid circuits of about 100, 1 000 and 10 000 parts + hoses (tidy layout, see
// shared/demo/randomCircuit.ts). For each: the median time of analyzeCircuit (the full report:
// findings, quantities, both flow solves) and of its main pieces, and the flow solve of the circuit's
// network against epanet-js 0.9.0 on the same network, both its solve alone and load + solve. Prints
// figures; asserts nothing.
import { setFlagsFromString } from 'node:v8'
import { runInNewContext } from 'node:vm'
import { Project, Workspace } from 'epanet-js'
import { parseCircuitDocument, type CircuitDocument } from '../shared/circuit'
import { randomCircuit, rungsFor } from '../shared/demo'
import { analyzeCircuit } from '../shared/engine'
import { computeQuantities } from '../shared/engine/analyze'
import { buildLoopTree } from '../shared/engine/checks/loopTree'
import { buildContext } from '../shared/engine/context'
import { buildNetwork } from '../shared/engine/flow/network'
import { solveState } from '../shared/engine/flow/solve'
import { coolantProperties, solveNetwork, type Network } from '../shared/physics'
import { runEpanet, toEpanetInput } from '../tests/reference/epanet-network'

// a full collection before each series, so that no series pays for the garbage of the one before
setFlagsFromString('--expose-gc')
const collectGarbage = runInNewContext('gc') as () => void

function median(run: () => unknown, minRuns: number, minMs = 400): number {
  for (let i = 0; i < Math.min(5, minRuns); i++) run() // warm the JIT
  collectGarbage()
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

async function flowFigures(doc: CircuitDocument, ws: Workspace) {
  const ctx = buildContext(doc)
  const fluid = coolantProperties(doc.circuit.settings.coolant!.mix, 100)
  const net = comparable(buildNetwork(ctx, 'open', fluid).network)
  const ours = median(() => solveNetwork(net), 40)
  const result = solveNetwork(net)
  const epanet = await runEpanet(net, `bench${net.links.length}`)
  const solveOnly = median(() => epanet.resolve(), 40)
  const inp = toEpanetInput(net)
  const loadAndSolve = median(() => {
    ws.writeFile('bench.inp', inp)
    const model = new Project(ws)
    model.open('bench.inp', 'bench.rpt', 'bench.out')
    model.solveH()
    model.close()
  }, 20)
  let worst = 0
  result.links.forEach((l) => {
    const q = epanet.flowLpm.get(l.id)
    if (q !== undefined && Math.abs(q) > 1) worst = Math.max(worst, Math.abs(l.flowLpm - q) / Math.abs(q))
  })
  epanet.close()
  const pipes = net.links.filter((l) => l.kind === 'pipe').length
  return { nodes: net.nodes.length, pipes, ours, solveOnly, loadAndSolve, iterations: result.iterations, worst }
}

async function main() {
  const ws = new Workspace()
  await ws.loadModule()
  console.log(`Hosewright engine benchmark — Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`)
  const rows: Array<{ elements: number; analysis: number }> = []
  for (const target of [100, 1000, 10000]) {
    const doc = circuit(target)
    const elements = doc.circuit.components.length + doc.circuit.hoses.length
    const big = target >= 10000
    const analysis = median(() => analyzeCircuit(doc), big ? 15 : 60, big ? 4000 : 1500)
    const report = analyzeCircuit(doc)
    const ctx = buildContext(doc)
    const tree = buildLoopTree(ctx, ctx.open.classOf[ctx.graph.partNode[ctx.pump!.rank]!]!)
    const runs = big ? 15 : 60
    const context = median(() => buildContext(doc), runs)
    const quantities = median(() => computeQuantities(ctx), runs)
    const flowOpen = median(() => solveState(ctx, 'open'), runs)
    const flowClosed = median(() => solveState(ctx, 'closed'), runs)
    const flow = await flowFigures(doc, ws)
    rows.push({ elements, analysis })
    console.log(`\n${elements} parts + hoses (${doc.circuit.components.length} parts, ${doc.circuit.hoses.length} hoses; part graph ${ctx.graph.nodes.length} nodes, ${ctx.graph.edges.length} edges; loop tree in graphlib ${tree.nodeCount()} nodes, ${tree.edgeCount()} edges; ${report.findings.length} findings)`)
    console.log(`  analyzeCircuit median              ${ms(analysis)}`)
    console.log(`    of which: model + graph + loop classes ${ms(context)}, quantities ${ms(quantities)}, flow open ${ms(flowOpen)}, flow shut ${ms(flowClosed)}`)
    console.log(`  flow solve, ${flow.pipes} hoses / ${flow.nodes} nodes: ours ${ms(flow.ours)} (${flow.iterations} iterations); epanet-js solve ${ms(flow.solveOnly)}, load + solve ${ms(flow.loadAndSolve)}; largest flow difference ${(flow.worst * 100).toFixed(2)} %`)
  }
  const ratio = rows[2]!.analysis / rows[1]!.analysis
  console.log(`\nratio 10 000 / 1 000 elements: ${ratio.toFixed(1)} for ${(rows[2]!.elements / rows[1]!.elements).toFixed(1)}× the elements`)
  const small = await flowFigures(circuit(352), ws) // about 200 hoses
  console.log(`flow solve at ${small.pipes} hoses / ${small.nodes} nodes: ours ${ms(small.ours)} (${small.iterations} iterations); epanet-js solve ${ms(small.solveOnly)} (ours ${(small.ours / small.solveOnly).toFixed(2)}×), load + solve ${ms(small.loadAndSolve)} (ours ${(small.ours / small.loadAndSolve).toFixed(2)}×)`)
}

main().catch((e) => { console.error(e); process.exit(1) })
