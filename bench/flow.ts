// Flow-solver benchmark: our network solver against EPANET 2.3 (epanet-js 0.9.0) on the same random
// ladder and ring networks, in the same process. Run: npx tsx bench/flow.ts
//
// Columns:
//   ours            median wall time of solveNetwork (prepare, order, factor, iterate, report), stopping
//                   at its default: the flows changed by at most 1e-6 of their sum in the last step
//   EPANET solveH   median of Project.solveH() on an already opened model (hydraulics only; its input
//                   asks for its smallest Accuracy, 1e-5, the same test on the sum of flow changes)
//   EPANET open+run median of writing the input text, open, solveH and close (what a caller holding the
//                   network in memory has to do to get flows)
//   ours/solveH, ours/open+run   the ratios
//   it              our Newton iterations / EPANET's
//   Δq CW, Δq SJ    largest link-flow difference to EPANET, as a fraction of the largest flow, with our
//                   Colebrook and with the Swamee–Jain law EPANET uses. These networks have many
//                   low-flow rungs in the laminar and transitional range, where EPANET interpolates
//                   Dunlop's cubic over Re 2000–4000 and we blend over 2300–4000, so some gap remains
//                   even with the same turbulent law.

import { setFlagsFromString } from 'node:v8'
import { runInNewContext } from 'node:vm'
import { Project, Workspace, AnalysisStatistic } from 'epanet-js'
import { solveNetwork, type FrictionLaw, type Network } from '../shared/physics'
import { runEpanet, toEpanetInput } from '../tests/reference/epanet-network'
import { ladderNetwork, ringNetwork } from '../tests/reference/network-generators'

const SIZES = [50, 200, 1000, 5000, 10000]

const swameeJain: FrictionLaw = (re, ed) => {
  const u = ed / 3.7 + 5.74 * re ** -0.9
  const l = Math.log10(u)
  const dl = (-0.9 * 5.74 * re ** -1.9) / (u * Math.LN10)
  return { f: 0.25 / (l * l), dfdRe: (-0.5 * dl) / (l * l * l) }
}

// a full collection before each series, so that no series pays for the garbage of the one before
setFlagsFromString('--expose-gc')
const collectGarbage = runInNewContext('gc') as () => void

function medianMs(run: () => void, repeats: number, warmup: number): number {
  for (let i = 0; i < warmup; i++) run()
  collectGarbage()
  const times: number[] = []
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now()
    run()
    times.push(performance.now() - t0)
  }
  times.sort((a, b) => a - b)
  return times[Math.floor(times.length / 2)]!
}

function largestDifference(net: Network, theirs: Map<string, number>, frictionLaw?: FrictionLaw): number {
  const ours = solveNetwork(net, { frictionLaw })
  let worst = 0
  let scale = 0
  for (const link of ours.links) {
    const q = theirs.get(link.id)
    if (q === undefined) continue
    worst = Math.max(worst, Math.abs(link.flowLpm - q))
    scale = Math.max(scale, Math.abs(q))
  }
  return worst / scale
}

const fmt = (x: number, digits = 3) => x.toFixed(digits).padStart(8)

async function main(): Promise<void> {
  const ws = new Workspace()
  await ws.loadModule()
  // let the JIT settle on the solver's hot code before the first measured series
  const warm = ladderNetwork({ pipes: 200, seed: 1 })
  for (let i = 0; i < 1000; i++) solveNetwork(warm)
  const rows: string[] = []
  const ours1000: Record<string, number> = {}
  const ratios: string[] = []
  rows.push('| network | pipes | nodes | ours (ms) | EPANET solveH (ms) | EPANET open+run (ms) | ours/solveH | ours/open+run | it ours/EPANET | Δq CW | Δq SJ |')
  rows.push('|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|')
  // sizes in rising order for both shapes, so that the small cases do not inherit a large heap
  for (const pipes of SIZES) {
    for (const [name, make] of [['ladder', ladderNetwork], ['ring', ringNetwork]] as const) {
      const net = make({ pipes, seed: 42 })
      const repeats = pipes <= 200 ? 201 : pipes <= 1000 ? 61 : 21
      const warmup = pipes <= 1000 ? 300 : 3
      let iterations = 0
      const ours = medianMs(() => { iterations = solveNetwork(net).iterations }, repeats, warmup)
      const epanet = await runEpanet(net, `bench_${name}_${pipes}`)
      const solveH = medianMs(() => epanet.resolve(), repeats, warmup)
      const inp = toEpanetInput(net)
      const openRun = medianMs(() => {
        ws.writeFile('bench.inp', inp)
        const model = new Project(ws)
        model.open('bench.inp', 'bench.rpt', 'bench.out')
        model.solveH()
        model.close()
      }, Math.min(repeats, 41), Math.min(warmup, 5))
      ws.writeFile('stats.inp', inp)
      const stats = new Project(ws)
      stats.open('stats.inp', 'stats.rpt', 'stats.out')
      stats.solveH()
      const epanetIterations = stats.getStatistic(AnalysisStatistic.Iterations)
      stats.close()
      const dCw = largestDifference(net, epanet.flowLpm)
      const dSj = largestDifference(net, epanet.flowLpm, swameeJain)
      epanet.close()
      if (pipes === 1000) ours1000[name] = ours
      rows.push(`| ${name} | ${net.links.length} | ${net.nodes.length} | ${fmt(ours)} | ${fmt(solveH)} | ${fmt(openRun)} | ${fmt(ours / solveH, 2)} | ${fmt(ours / openRun, 2)} | ${iterations}/${epanetIterations} | ${dCw.toExponential(1)} | ${dSj.toExponential(1)} |`)
      if (pipes === 10000) ratios.push(`| ${name} 10 000 / 1 000 | | | ${fmt(ours / ours1000[name]!, 1)}× | | | | | | | |`)
    }
  }
  console.log(`Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`)
  console.log([...rows, ...ratios].join('\n'))
}

main().catch(e => {
  console.error(e)
  process.exit(1)
})
