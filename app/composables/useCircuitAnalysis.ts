import type { AnalysisAnswer } from '~/workers/analysis.worker'

const DEBOUNCE_MS = 150

/**
 * Keeps store.report up to date: the engine runs in a Web Worker ~150 ms after each change that
 * counts (never during a drag preview); an answer for an older document is dropped. If the worker
 * cannot start or fails, the same engine runs on the main thread instead. Call once per editor.
 */
export function useCircuitAnalysis() {
  const store = useEditorStore()
  let worker: Worker | null = null
  let workerFailed = false
  let latest = 0
  /** the commit each request was for, so the store knows when its report is current */
  const commitOf = new Map<number, number>()
  let timer: ReturnType<typeof setTimeout> | undefined
  const lastMs = ref(0)

  function accept(answer: AnalysisAnswer) {
    const forCommit = commitOf.get(answer.seq)
    commitOf.delete(answer.seq)
    if (answer.seq !== latest) return // a newer document is on its way
    store.analysing = false
    lastMs.value = answer.ms
    if (answer.error) {
      console.error('Circuit analysis failed:', answer.error)
      return
    }
    store.setReport(answer.report, answer.issues, forCommit)
  }

  function startWorker(): Worker | null {
    if (worker || workerFailed || typeof Worker === 'undefined') return worker
    try {
      worker = new Worker(new URL('../workers/analysis.worker.ts', import.meta.url), { type: 'module' })
      worker.onmessage = (e: MessageEvent<AnalysisAnswer>) => accept(e.data)
      worker.onerror = (e) => {
        e.preventDefault()
        workerFailed = true
        worker?.terminate()
        worker = null
        void runOnMainThread(latest)
      }
    } catch {
      workerFailed = true
      worker = null
    }
    return worker
  }

  async function runOnMainThread(seq: number) {
    const doc = store.rawDocument()
    commitOf.set(seq, store.commitSeq)
    const started = performance.now()
    const [{ parseCircuitDocument }, { analyzeCircuit }] = await Promise.all([import('#shared/circuit'), import('#shared/engine')])
    if (seq !== latest) return
    try {
      const parsed = parseCircuitDocument(doc)
      accept(parsed.ok
        ? { seq, report: analyzeCircuit(parsed.document), issues: [], ms: performance.now() - started }
        : { seq, report: null, issues: parsed.issues, ms: performance.now() - started })
    } catch (e) {
      accept({ seq, report: null, issues: [], error: String(e), ms: performance.now() - started })
    }
  }

  function run() {
    if (!store.loaded) return
    if (store.previewing) return schedule()
    const seq = ++latest
    commitOf.set(seq, store.commitSeq)
    store.analysing = true
    const w = startWorker()
    if (w) w.postMessage({ seq, document: store.rawDocument() })
    else void runOnMainThread(seq)
  }

  function schedule() {
    clearTimeout(timer)
    timer = setTimeout(run, DEBOUNCE_MS)
  }

  // a load comes with the server's report: analyse what changes after it (or a load without one)
  watch(() => [store.loadSeq, store.commitSeq] as const, (now, before) => {
    const isLoad = !before || now[0] !== before[0]
    if (isLoad && store.report) return
    schedule()
  }, { immediate: true })

  onScopeDispose(() => {
    clearTimeout(timer)
    worker?.terminate()
    worker = null
  })

  return { lastMs, analyseNow: run }
}
