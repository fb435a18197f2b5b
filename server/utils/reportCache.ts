import type { Report } from '#shared/engine'

// The engine's reports of saved versions, kept in memory. A version's document never changes (every
// write to a circuit's drawing is a new version: circuitSave.ts), so neither does its report until
// the engine changes, which means a new process. The save computes the report anyway and leaves it
// here, so opening a circuit after a save, or several people reading one version, skip the analysis
// (7–9 ms at 500 parts). Least recently used entries go first; a few large circuits fit.
const MAX_REPORTS = 8
const reports = new Map<string, Report>()

const keyOf = (circuitId: string, version: number, updatedAt: Date) => `${circuitId}:${version}:${updatedAt.getTime()}`

export function rememberReport(circuitId: string, version: number, updatedAt: Date, report: Report) {
  const key = keyOf(circuitId, version, updatedAt)
  reports.delete(key)
  reports.set(key, report)
  while (reports.size > MAX_REPORTS) reports.delete(reports.keys().next().value!)
}

/** The report of a saved version: from memory, or computed (and remembered). */
export function versionReport(circuitId: string, version: number, updatedAt: Date, compute: () => Report): Report {
  const key = keyOf(circuitId, version, updatedAt)
  const known = reports.get(key)
  if (known) {
    reports.delete(key)
    reports.set(key, known)
    return known
  }
  const report = compute()
  rememberReport(circuitId, version, updatedAt, report)
  return report
}
