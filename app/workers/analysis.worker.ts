// Runs the engine off the main thread, so checking a large drawing never stalls a drag. The same
// engine the server runs ('#shared/engine'); the document is parsed first, exactly as a save would be.
import { parseCircuitDocument, type CircuitIssue } from '#shared/circuit'
import { analyzeCircuit, type Report } from '#shared/engine'

export interface AnalysisRequest { seq: number; document: unknown }
export interface AnalysisAnswer { seq: number; report: Report | null; issues: CircuitIssue[]; error?: string; ms: number }

const scope = self as unknown as { onmessage: ((e: MessageEvent<AnalysisRequest>) => void) | null; postMessage: (a: AnalysisAnswer) => void }

scope.onmessage = (event) => {
  const { seq, document } = event.data
  const started = performance.now()
  try {
    const parsed = parseCircuitDocument(document)
    if (!parsed.ok) {
      scope.postMessage({ seq, report: null, issues: parsed.issues, ms: performance.now() - started })
      return
    }
    const report = analyzeCircuit(parsed.document)
    scope.postMessage({ seq, report, issues: [], ms: performance.now() - started })
  } catch (e) {
    scope.postMessage({ seq, report: null, issues: [], error: e instanceof Error ? e.message : String(e), ms: performance.now() - started })
  }
}
