import type { CircuitDocument } from '../circuit'
import { buildCircuitGraph, stateGraph, type CircuitGraph, type StateGraph } from './graph'
import { buildModel, type CircuitModel, type CompInfo } from './model'
import type { Finding, FixAction, Severity } from './report'
import { resolveThresholds, type Thresholds } from './thresholds'

/** What every check reads: the ordered model, the circuit graph with the thermostat open and shut, thresholds. */
export interface AnalysisContext {
  doc: CircuitDocument
  model: CircuitModel
  thresholds: Thresholds
  graph: CircuitGraph
  open: StateGraph
  closed: StateGraph
  pump: CompInfo | undefined
}

export function buildContext(doc: CircuitDocument): AnalysisContext {
  const model = buildModel(doc.circuit)
  const graph = buildCircuitGraph(model)
  const open = stateGraph(graph, new Uint8Array(graph.edges.length))
  // the shut state is a second pass only when the thermostat actually shuts a path
  const closed = graph.shutWhenCold.includes(1) ? stateGraph(graph, graph.shutWhenCold) : open
  return { doc, model, thresholds: resolveThresholds(doc.circuit.settings.thresholds), graph, open, closed, pump: graph.pump }
}

export function makeFinding(
  ctx: AnalysisContext,
  code: string,
  severity: Severity,
  message: string,
  elementIds: string[],
  fixText: string,
  action?: FixAction,
): Finding {
  return { code, severity, message, elementIds: inStableOrder(ctx, elementIds), fix: action ? { text: fixText, action } : { text: fixText } }
}

/** Ids once each, in the report's stable order. */
function inStableOrder(ctx: AnalysisContext, ids: string[]): string[] {
  if (ids.length < 2) return ids
  const ranked = ids.map((id) => ({ id, rank: ctx.model.rankOf(id) }))
  ranked.sort((a, b) => a.rank - b.rank)
  // a known id has a rank of its own, so its repeats sit side by side; ids the model does not know
  // share the last rank and are told apart by a set
  const out: string[] = []
  let unknown: Set<string> | null = null
  for (let i = 0; i < ranked.length; i++) {
    const { id, rank } = ranked[i]!
    if (rank === Number.MAX_SAFE_INTEGER) {
      unknown ??= new Set()
      if (unknown.has(id)) continue
      unknown.add(id)
    } else if (i > 0 && ranked[i - 1]!.id === id) continue
    out.push(id)
  }
  return out
}

export type Check = (ctx: AnalysisContext) => Finding[]
