import type { CircuitDocument } from '../circuit'
import { buildTopoGraph, edgeClasses, mainPump, type EdgeClasses, type TopoGraph } from './graph'
import { buildModel, type CircuitModel, type CompInfo } from './model'
import type { Finding, FixAction, Severity } from './report'
import { resolveThresholds, type Thresholds } from './thresholds'

export interface StateGraph {
  topo: TopoGraph
  classes: EdgeClasses
  /** per edge: not there in this state */
  removed: readonly boolean[]
}

/** What every check reads: the ordered model, the graph with the thermostat open and shut, thresholds. */
export interface AnalysisContext {
  doc: CircuitDocument
  model: CircuitModel
  thresholds: Thresholds
  open: StateGraph
  closed: StateGraph
  pump: CompInfo | undefined
}

export interface AnalyzeOptions {
  /**
   * Build the graphlib graph of the circuit (default true). The checks themselves run on index arrays
   * built alongside it, so the report is the same either way; leaving graphlib out saves its build
   * time, which is most of the graph cost on large circuits (see docs/engine.md, Figures).
   */
  graphlib?: boolean
}

export function buildContext(doc: CircuitDocument, options: AnalyzeOptions = {}): AnalysisContext {
  const model = buildModel(doc.circuit)
  const topo = buildTopoGraph(model, options.graphlib !== false)
  const none = new Array<boolean>(topo.edges.length).fill(false)
  const closedRemoved = topo.shutWhenCold
  return {
    doc,
    model,
    thresholds: resolveThresholds(doc.circuit.settings.thresholds),
    open: { topo, classes: edgeClasses(topo), removed: none },
    closed: closedRemoved.some(Boolean) ? { topo, classes: edgeClasses(topo, closedRemoved), removed: closedRemoved } : { topo, classes: edgeClasses(topo), removed: none },
    pump: mainPump(model),
  }
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
  const ids = [...new Set(elementIds)].sort((a, b) => ctx.model.rankOf(a) - ctx.model.rankOf(b))
  return { code, severity, message, elementIds: ids, fix: action ? { text: fixText, action } : { text: fixText } }
}

export type Check = (ctx: AnalysisContext) => Finding[]
